// Builds the Express app. API tests import this and run it in-process against a real database.
import { createHash } from 'node:crypto'
import { existsSync } from 'node:fs'
import path from 'node:path'
import express from 'express'
import expressStaticGzip from 'express-static-gzip'
import session from 'express-session'
import type { Logger } from 'pino'
import type { DataSource } from 'typeorm'
import type { AppConfig } from './config.js'
import type { AppContext } from './context.js'
import { apiNotFound, errorMiddleware } from './http/errorMiddleware.js'
import { csrfGuard } from './http/csrf.js'
import { pageHtml } from './http/pagePreloads.js'
import { requestLog } from './http/requestLog.js'
import { securityHeaders } from './http/securityHeaders.js'
import { createSessionStore } from './db/sessionStore.js'
import { closePreparedReads } from './db/prepared.js'
import { buildRouters } from './routes/index.js'
import { absoluteTimeout, configurePassport, passportOnRequestPrototype, renewWhenDue } from './http/session.js'
import { costReplacer } from './services/costVisibility.js'
import { costAccess, jsonWithCostAccess } from './http/costAccess.js'
import { PAYMENT_WEBHOOK_PATH } from './routes/payments.js'
import { createPayProvider } from './services/payments/payProvider.js'
import { cardSettlement, closeCancelledCardIn } from './services/sales/cardDeposits.js'
import { SignInThrottle } from './services/signInThrottle.js'
import { createLogger } from './logger.js'

export const SESSION_COOKIE = 'lumenyard.sid'
export const clientDist = process.env.LUMENYARD_CLIENT_DIST ?? path.resolve(import.meta.dirname, '..', 'dist')

export interface AppDeps {
  config: AppConfig
  ds: DataSource
  /** The replica's DataSource for reports (ctx.readDs); the primary when absent. */
  readDs?: DataSource
  logger?: Logger
  /** The built client to serve (default: dist/, or LUMENYARD_CLIENT_DIST). */
  clientDist?: string
}

export interface BuiltApp {
  app: express.Express
  ctx: AppContext
  close(): Promise<void>
}

/**
 * Middleware run one after another as a single layer of the app: one match of its path for all of them, instead of
 * one per middleware. A middleware that throws passes its error on, as Express would.
 */
function inOrder(...handlers: express.RequestHandler[]): express.RequestHandler {
  return (req, res, next) => {
    let i = 0
    const step = (err?: unknown): void => {
      if (err) return next(err)
      if (i === handlers.length) return next()
      try {
        void handlers[i++](req, res, step)
      } catch (thrown) {
        next(thrown)
      }
    }
    step()
  }
}

/**
 * The built client: the .br or .gz file the build wrote beside each asset when the browser takes it, file
 * names with a content hash cached for a year, index.html for every other path (the client's router).
 */
/**
 * The built client's files (hashed assets cached for a year, pre-compressed .br/.gz served as they are).
 * Mounted ahead of the session: a cold page load asks for some ninety files, and each used to read the
 * session row and its user first, for a file anyone may fetch. API paths skip it without touching the disk.
 */
function clientFiles(dist: string): express.RequestHandler {
  const files = expressStaticGzip(dist, {
    enableBrotli: true,
    orderPreference: ['br', 'gz'],
    index: false,
    serveStatic: {
      setHeaders: (res, file) => {
        const hashed = file.startsWith(path.join(dist, 'assets') + path.sep)
        res.setHeader('Cache-Control', hashed ? 'public, max-age=31536000, immutable' : 'no-cache')
      },
    },
  })
  return (req, res, next) => (req.path === '/api' || req.path.startsWith('/api/') ? next() : files(req, res, next))
}

/**
 * Any other address outside the API is a page of the client: its index.html (after the API's routes), naming the
 * files that page needs so the browser fetches them beside the entry (http/pagePreloads.ts).
 */
function clientPages(dist: string): express.RequestHandler {
  const router = express.Router()
  const htmlFor = pageHtml(dist)
  // Only a visitor with a session cookie gets the page's links: anyone else is sent on to sign in, and
  // fetching the page's code would only hold up the sign-in page's own.
  const hasSession = (req: express.Request) => (req.headers.cookie ?? '').includes(`${SESSION_COOKIE}=`)
  router.get('/{*splat}', (req, res) => {
    const html = htmlFor(req.path, hasSession(req) ? { query: req.query } : undefined)
    // Its own validator (the app's automatic ETag is off, see createApp): a revisit gets 304 while the page is unchanged.
    const tag = `W/"${createHash('sha1').update(html).digest('base64url')}"`
    res.set({ 'Cache-Control': 'no-cache', ETag: tag }).type('html').send(html)
  })
  return router
}

/**
 * The API's routers, reached by the address's first segment (`/stock` of /api/stock/lookup): one map lookup, and
 * only the routers under that prefix look at the request, in the order listed, instead of every router's mount
 * path being tried in turn. Matched without regard to case, as Express matches paths.
 */
function byFirstSegment(routers: { prefix: string; router: express.Router }[]): express.RequestHandler {
  const groups = new Map<string, express.Router>()
  for (const { prefix } of routers) {
    const key = prefix.toLowerCase()
    if (!/^\/[^/]+$/.test(key)) throw new Error(`router prefix ${prefix}: one path segment expected`)
    if (!groups.has(key)) groups.set(key, express.Router().use(prefix, ...routers.filter((r) => r.prefix.toLowerCase() === key).map((r) => r.router)))
  }
  return (req, res, next) => {
    const url = req.url
    let end = 1
    while (end < url.length && url[end] !== '/' && url[end] !== '?') end++
    const group = groups.get(url.slice(0, end).toLowerCase())
    if (!group) return next()
    group(req, res, next)
  }
}

/** A body parser only where a body may come: a GET or HEAD goes past without the parser's checks. */
function withBodyOnly(parser: express.RequestHandler): express.RequestHandler {
  return (req, res, next) => (req.method === 'GET' || req.method === 'HEAD' ? next() : parser(req, res, next))
}

export function createApp(deps: AppDeps): BuiltApp {
  const { config, ds } = deps
  const logger = deps.logger ?? createLogger(config.logLevel)
  const pp = configurePassport(ds)
  const pay = createPayProvider(config.pay)
  const ctx: AppContext = {
    config,
    ds,
    readDs: deps.readDs ?? ds,
    logger,
    passport: pp,
    throttle: new SignInThrottle(config.signin, config.db),
    pay,
    payEventHandlers: { 'payment_intent.succeeded': cardSettlement(pay), 'payment_intent.canceled': closeCancelledCardIn },
  }
  const app = express()
  passportOnRequestPrototype(app, pp)
  app.disable('x-powered-by')
  // No automatic ETag: it hashed every API answer, which is never cached (no-store); the client's pages set their own.
  app.set('etag', false)
  // Every JSON answer leaves out the costs its caller may not see (services/costVisibility.ts).
  app.set('json replacer', costReplacer)
  jsonWithCostAccess(app)
  if (config.session.trustProxy) app.set('trust proxy', 1)
  app.use(securityHeaders())
  const dist = deps.clientDist ?? clientDist
  const hasClient = existsSync(dist)
  if (hasClient) app.use(clientFiles(dist))
  app.use(requestLog(app, logger))
  // The provider signs the exact bytes it sends: its webhook keeps the raw body (the JSON parser then skips it).
  app.use(PAYMENT_WEBHOOK_PATH, express.raw({ type: () => true, limit: '256kb' }))
  app.use(withBodyOnly(express.json({ limit: '1mb' })))
  // Compression is mounted by the route table on each route but the scanner's short answers (http/routeTable.ts).

  const { store, close: closeStore } = createSessionStore(config)
  const origins = config.publicUrl ? [new URL(config.publicUrl).origin] : []
  // Sessions for the API only (a page address is answered with index.html whoever asks, see clientPages), and the
  // API's edge as one layer: the session and its user, the timeouts, CSRF, no-store, and the caller's cost access.
  app.use(
    '/api',
    inOrder(
      session({
        name: SESSION_COOKIE,
        secret: config.session.secret,
        store,
        resave: false,
        saveUninitialized: false,
        // The idle timeout restarts with the row and the cookie together, at most once a minute (renewWhenDue below,
        // db/sessionStore.ts), rather than a freshly signed cookie on every answer.
        rolling: false,
        cookie: {
          httpOnly: true,
          sameSite: 'lax',
          secure: config.session.secureCookies,
          maxAge: config.session.idleMinutes * 60_000,
        },
      }),
      renewWhenDue(),
      // No pp.initialize(): since passport 0.6 its session strategy's own middleware puts logIn, logOut and
      // isAuthenticated on the request, so initialize() only set them a second time on every request.
      pp.session(),
      absoluteTimeout(config.session.maxHours),
      // The webhook carries no cookie and no app header; its provider signature is its proof (routes/payments.ts).
      csrfGuard(() => origins, [PAYMENT_WEBHOOK_PATH]),
      (_req, res, next) => {
        res.setHeader('Cache-Control', 'no-store')
        next()
      },
      costAccess(ds),
    ),
  )
  app.use('/api', byFirstSegment(buildRouters(ctx)))
  app.use('/api', apiNotFound)

  if (hasClient) app.use(clientPages(dist))
  app.use(errorMiddleware)

  return {
    app,
    ctx,
    close: async () => {
      await closeStore()
      await closePreparedReads(ds)
      await ctx.throttle.close()
    },
  }
}
