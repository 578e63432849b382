import bcrypt from 'bcryptjs'
import type { Request, Response, NextFunction } from 'express'
import passport from 'passport'
import { Strategy as LocalStrategy } from 'passport-local'
import type { DataSource } from 'typeorm'
import type { SessionUser } from '../../shared/schemas/auth.js'
import { rolesTransformer, User } from '../entities/User.js'
import { sessionUserColumns, userReadWithSession, type SessionUserRow } from '../db/sessionStore.js'
import { AppError } from '../errors.js'
import { toSessionUser } from './userService.js'

// Compared against when the user name is unknown, so timing doesn't tell which names exist.
const DUMMY_HASH = bcrypt.hashSync('lumenyard-no-such-user', 12)

interface SessionRef {
  id: number
  epoch: number
}

async function userRowById(ds: DataSource, id: number | undefined): Promise<SessionUserRow | null> {
  if (!id) return null
  const [row] = await ds.query(`SELECT ${sessionUserColumns('u')} FROM users u WHERE u.id = ?`, [id])
  return row ?? null
}

function sessionUserOf(row: SessionUserRow): SessionUser {
  return toSessionUser({
    id: row.id, username: row.username, displayName: row.display_name, roles: rolesTransformer.from(row.roles),
    unitPreference: row.unit_preference, weightUnit: row.weight_unit, locale: row.locale,
  } as User)
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
  // Each request checks the user's current row: a deactivated account or a bumped epoch ends the session.
  // The session store reads that row in the same query as the session (server/db/sessionStore.ts).
  pp.deserializeUser(async (req: Request, ref: SessionRef, done: (err: unknown, user?: SessionUser | false) => void) => {
    try {
      const read = userReadWithSession(req.session?.passport)
      const row = read !== undefined ? read : await userRowById(ds, ref?.id)
      if (!row || !row.active || Number(row.session_epoch) !== ref.epoch) return done(null, false)
      done(null, sessionUserOf(row))
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
      return next(AppError.unauthenticated('session_ended', 'Your session has ended. Please sign in again.'))
    }
    next()
  }
}

export type { SessionUser }
