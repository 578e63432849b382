// Builds the Express app. API tests import this and run it in-process against a real database.
import { existsSync } from 'node:fs'
import path from 'node:path'
import express from 'express'
import session from 'express-session'
import MySQLStoreFactory from 'express-mysql-session'
import helmet from 'helmet'
import mysql from 'mysql2/promise'
import { pinoHttp } from 'pino-http'
import type { Logger } from 'pino'
import type { DataSource } from 'typeorm'
import type { AppConfig } from './config.js'
import type { AppContext } from './context.js'
import { apiNotFound, errorMiddleware } from './http/errorMiddleware.js'
import { csrfGuard } from './http/csrf.js'
import { buildRouters } from './routes/index.js'
import { absoluteTimeout, configurePassport } from './services/authService.js'
import { SignInThrottle } from './services/signInThrottle.js'
import { createLogger } from './logger.js'

export const SESSION_COOKIE = 'lumenyard.sid'
export const clientDist = process.env.LUMENYARD_CLIENT_DIST ?? path.resolve(import.meta.dirname, '..', 'dist')

export interface AppDeps {
  config: AppConfig
  ds: DataSource
  logger?: Logger
}

export interface BuiltApp {
  app: express.Express
  ctx: AppContext
  close(): Promise<void>
}

function sessionStore(config: AppConfig) {
  const MySQLStore = MySQLStoreFactory(session)
  const pool = mysql.createPool({
    host: config.db.host,
    port: config.db.port,
    user: config.db.user,
    password: config.db.password,
    database: config.db.database,
    connectionLimit: 10,
  })
  const store = new MySQLStore(
    { createDatabaseTable: false, clearExpired: true, checkExpirationInterval: 15 * 60_000, expiration: config.session.maxHours * 3_600_000 },
    pool as never,
  )
  return { store, close: async () => { await store.close() ; await pool.end().catch(() => undefined) } }
}

function securityHeaders() {
  return helmet({
    contentSecurityPolicy: {
      useDefaults: false,
      directives: {
        defaultSrc: ["'self'"],
        scriptSrc: ["'self'"],
        styleSrc: ["'self'", "'unsafe-inline'"], // component libraries set inline styles
        imgSrc: ["'self'", 'data:', 'blob:'],
        fontSrc: ["'self'", 'data:'],
        connectSrc: ["'self'"],
        mediaSrc: ["'self'", 'data:', 'blob:'],
        workerSrc: ["'self'", 'blob:'],
        objectSrc: ["'none'"],
        baseUri: ["'self'"],
        formAction: ["'self'"],
        frameAncestors: ["'none'"],
      },
    },
    strictTransportSecurity: false, // set by the TLS-terminating proxy in production
  })
}

export function createApp(deps: AppDeps): BuiltApp {
  const { config, ds } = deps
  const logger = deps.logger ?? createLogger(config.logLevel)
  const pp = configurePassport(ds)
  const ctx: AppContext = {
    config,
    ds,
    logger,
    passport: pp,
    throttle: new SignInThrottle(config.signin),
  }
  const app = express()
  app.disable('x-powered-by')
  if (config.session.trustProxy) app.set('trust proxy', 1)
  app.use(securityHeaders())
  app.use(
    pinoHttp({
      logger,
      autoLogging: { ignore: (req) => !req.url?.startsWith('/api') },
      // One short line per request: no headers (cookies), no bodies (passwords).
      serializers: {
        req: (req: { id: unknown; method: string; url: string }) => ({ id: req.id, method: req.method, url: req.url }),
        res: (res: { statusCode: number }) => ({ status: res.statusCode }),
      },
    }),
  )
  app.use(express.json({ limit: '1mb' }))

  const { store, close: closeStore } = sessionStore(config)
  app.use(
    session({
      name: SESSION_COOKIE,
      secret: config.session.secret,
      store,
      resave: false,
      saveUninitialized: false,
      rolling: true, // the idle timeout restarts on every request
      cookie: {
        httpOnly: true,
        sameSite: 'lax',
        secure: config.session.secureCookies,
        maxAge: config.session.idleMinutes * 60_000,
      },
    }),
  )
  app.use(pp.initialize())
  app.use(pp.session())
  app.use(absoluteTimeout(config.session.maxHours))
  const origins = config.publicUrl ? [new URL(config.publicUrl).origin] : []
  app.use('/api', csrfGuard(() => origins))
  app.use('/api', (_req, res, next) => {
    res.set('Cache-Control', 'no-store')
    next()
  })
  for (const { prefix, router } of buildRouters(ctx)) app.use('/api' + prefix, router)
  app.use('/api', apiNotFound)

  if (existsSync(clientDist)) {
    app.use(express.static(clientDist, { index: false, maxAge: '1h' }))
    app.get('/{*splat}', (_req, res) => res.sendFile(path.join(clientDist, 'index.html'), { dotfiles: 'allow' }))
  }
  app.use(errorMiddleware)

  return {
    app,
    ctx,
    close: async () => {
      await closeStore()
    },
  }
}
