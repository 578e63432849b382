import bcrypt from 'bcryptjs'
import type { Request, Response, NextFunction } from 'express'
import passport from 'passport'
import { Strategy as LocalStrategy } from 'passport-local'
import type { DataSource } from 'typeorm'
import type { SessionUser } from '../../shared/schemas/auth.js'
import { User } from '../entities/User.js'
import { AppError } from '../errors.js'
import { toSessionUser } from './userService.js'

// Compared against when the user name is unknown, so timing doesn't tell which names exist.
const DUMMY_HASH = bcrypt.hashSync('lumenyard-no-such-user', 12)

interface SessionRef {
  id: number
  epoch: number
}

export function configurePassport(ds: DataSource): passport.PassportStatic {
  const pp = new passport.Passport()
  pp.use(
    new LocalStrategy(async (username, password, done) => {
      try {
        const user = await ds.getRepository(User).findOneBy({ username: username.trim().toLowerCase() })
        const ok = await bcrypt.compare(password, user?.passwordHash ?? DUMMY_HASH)
        if (!user || !ok || !user.active) return done(null, false)
        done(null, user)
      } catch (err) {
        done(err)
      }
    }),
  )
  pp.serializeUser((user, done) => {
    const u = user as unknown as User
    done(null, { id: u.id, epoch: u.sessionEpoch } satisfies SessionRef)
  })
  // Each request re-reads the user: a deactivated account or a bumped epoch ends the session.
  pp.deserializeUser(async (ref: SessionRef, done) => {
    try {
      const user = await ds.getRepository(User).findOneBy({ id: ref?.id })
      if (!user || !user.active || user.sessionEpoch !== ref.epoch) return done(null, false)
      done(null, toSessionUser(user))
    } catch (err) {
      done(err)
    }
  })
  return pp as unknown as passport.PassportStatic
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

/** Absolute session lifetime, on top of the idle timeout the rolling cookie gives. */
export function absoluteTimeout(maxHours: number) {
  return async (req: Request, _res: Response, next: NextFunction) => {
    const started = req.session?.signedInAt
    if (req.user && started && Date.now() - started > maxHours * 3_600_000) {
      await logOut(req).catch(() => undefined)
      return next(AppError.unauthenticated('Your session has ended. Please sign in again.'))
    }
    next()
  }
}

export type { SessionUser }
