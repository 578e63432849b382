// The request side of signing in and out (passport on the request and its session); who may sign in and how a
// session's user is read stay in services/authService.ts.
import type { Express, NextFunction, Request, Response } from 'express'
import passport from 'passport'
import passportRequest from 'passport/lib/http/request.js'
import { Strategy as LocalStrategy } from 'passport-local'
import type { DataSource } from 'typeorm'
import type { SessionUser } from '../../shared/schemas/auth.js'
import type { User } from '../entities/User.js'
import { renewalDue } from '../db/sessionStore.js'
import { AppError } from '../errors.js'
import { sessionRefOf, sessionUserFor, verifyCredentials, type SessionRef } from '../services/authService.js'

export function configurePassport(ds: DataSource): passport.PassportStatic {
  const pp = new passport.Passport()
  pp.use(
    new LocalStrategy(async (username, password, done) => {
      try {
        const user = await verifyCredentials(ds, username, password)
        done(null, user ?? false)
      } catch (err) {
        done(err)
      }
    }),
  )
  pp.serializeUser((user, done) => done(null, sessionRefOf(user as unknown as User)))
  // Each request checks the user's current row (services/authService.ts, sessionUserFor).
  pp.deserializeUser(async (req: Request, ref: SessionRef, done: (err: unknown, user?: SessionUser | false) => void) => {
    try {
      done(null, await sessionUserFor(ds, ref, req.session?.passport))
    } catch (err) {
      done(err)
    }
  })
  return pp as unknown as passport.PassportStatic
}

/**
 * passport's session middleware (passport 0.7, lib/middleware/authenticate.js) assigns seven properties to every
 * request before it reads the session: logIn and login, logOut and logout, isAuthenticated, isUnauthenticated and
 * `_sessionManager`, always the same values. Added to an Express request that already carries some forty
 * properties, they were the largest single allocation of a signed-in scan (about 12 KB of its 117 KB, V8's sampling
 * heap profiler with collected objects counted): garbage the young generation has to sweep on every request.
 * Here they are defined once on the app's request prototype, as accessors: passport's reads get the same functions
 * and session manager, its assignments of those same values change nothing, and any other value assigned becomes
 * the request's own property, as a plain assignment would make it.
 */
export function passportOnRequestPrototype(app: Express, pp: passport.PassportStatic): void {
  const values: Record<string, unknown> = {
    logIn: passportRequest.logIn,
    login: passportRequest.logIn,
    logOut: passportRequest.logOut,
    logout: passportRequest.logOut,
    isAuthenticated: passportRequest.isAuthenticated,
    isUnauthenticated: passportRequest.isUnauthenticated,
    _sessionManager: (pp as unknown as { _sm: unknown })._sm,
  }
  for (const [name, value] of Object.entries(values)) {
    Object.defineProperty(app.request, name, {
      configurable: true,
      get: () => value,
      set(this: Request, assigned: unknown) {
        if (assigned !== value) Object.defineProperty(this, name, { value: assigned, writable: true, configurable: true, enumerable: true })
      },
    })
  }
}

/** Verifies the password with the local strategy, then signs in on a fresh session id. */
export function authenticate(pp: passport.PassportStatic, req: Request, res: Response): Promise<User | null> {
  return new Promise((resolve, reject) => {
    const next: NextFunction = (err?: unknown) => (err ? reject(err) : resolve(null))
    pp.authenticate('local', { session: false }, (err: unknown, user: User | false) => {
      if (err) return reject(err)
      resolve(user || null)
    })(req, res, next)
  })
}

export function logIn(req: Request, user: User): Promise<void> {
  return new Promise((resolve, reject) => {
    req.logIn(user as unknown as Express.User, (err) => (err ? reject(err) : resolve()))
  })
}

export function logOut(req: Request): Promise<void> {
  return new Promise((resolve, reject) => {
    req.logOut((err) => {
      if (err) return reject(err)
      req.session.destroy((e) => (e ? reject(e) : resolve()))
    })
  })
}

/**
 * The idle timeout without a signed cookie on every answer: a signed-in session's row and cookie are renewed
 * together, at most once a minute. When renewal is due the session is marked changed, so express-session writes
 * the row (with the new expiry) and sends the cookie again; any other answer carries no cookie (`rolling` is off).
 */
export function renewWhenDue() {
  return (req: Request, _res: Response, next: NextFunction) => {
    const sess = req.session
    if (sess?.passport?.user && renewalDue(sess)) sess.renewedAt = Date.now()
    next()
  }
}

/** Absolute session lifetime, on top of the idle timeout the session's renewals give. */
export function absoluteTimeout(maxHours: number) {
  return (req: Request, _res: Response, next: NextFunction) => {
    const started = req.session?.signedInAt
    if (!req.user || !started || Date.now() - started <= maxHours * 3_600_000) return next()
    logOut(req)
      .catch(() => undefined)
      .then(() => next(AppError.unauthenticated('session_ended', 'Your session has ended. Please sign in again.')))
  }
}
