// Sessions in MariaDB through express-mysql-session, with two changes that keep a signed-in read from
// writing and from asking the database twice:
// - the session row and its user's current row are read in one query; passport's deserializeUser takes
//   that row (services/authService.ts), so deactivation and the session epoch still end a session
//   on the very next request;
// - the row's expiry (the idle timeout) is pushed forward at most once a minute instead of on every
//   request, so a read no longer commits and waits on a log flush. The idle timeout therefore ends a
//   session between `idle − 1 min` and `idle` after the last request; the absolute timeout is unchanged.
//   The cookie follows the row: it is signed and sent again only when the row is written (`renewWhenDue`,
//   http/session.ts), not on every answer.
import session from 'express-session'
import MySQLStoreFactory from 'express-mysql-session'
import mysql, { type RowDataPacket } from 'mysql2/promise'
import type { AppConfig } from '../config.js'
import type { SessionUser } from '../../shared/schemas/auth.js'

export const TOUCH_EVERY_MS = 60_000

/** The users columns a request needs, as read with the session (snake_case, roles as stored). */
export interface SessionUserRow {
  id: number
  username: string
  display_name: string
  roles: string | null
  unit_preference: SessionUser['unitPreference']
  weight_unit: SessionUser['weightUnit']
  locale: SessionUser['locale']
  active: number
  session_epoch: number
}

export const sessionUserColumns = (alias: string) =>
  ['id', 'username', 'display_name', 'roles', 'unit_preference', 'weight_unit', 'locale', 'active', 'session_epoch'].map((c) => `${alias}.${c}`).join(', ')

interface Loaded {
  /** When the row's expiry was last written, in ms (its expiry less the idle timeout). */
  touchedAt: number
  user: SessionUserRow | null
}

type Callback<T = unknown> = (err?: unknown, value?: T) => void
type SessionData = session.SessionData

/** What the store read with a session, keyed by the session's `passport` object (req.session shares it). */
const loaded = new WeakMap<object, Loaded>()

/**
 * Whether this session's idle timeout is due to be pushed forward: its row was last written over a minute ago,
 * or the store read no record of when (a session without a signed-in user).
 */
export function renewalDue(sess: Partial<SessionData>, now = Date.now()): boolean {
  const seen = sess.passport ? loaded.get(sess.passport) : undefined
  return !seen || now - seen.touchedAt >= TOUCH_EVERY_MS
}

/** The user row read together with this session, if the store read one. */
export function userReadWithSession(passportData: object | undefined): SessionUserRow | null | undefined {
  return passportData ? loaded.get(passportData)?.user : undefined
}

export function createSessionStore(config: AppConfig): { store: session.Store; close(): Promise<void> } {
  const MySQLStore = MySQLStoreFactory(session)
  const pool = mysql.createPool({
    host: config.db.host,
    port: config.db.port,
    user: config.db.user,
    password: config.db.password,
    database: config.db.database,
    connectionLimit: 10,
    trace: false, // no stack captured before every session read (see db/dataSource.ts)
  })
  const store = new MySQLStore(
    { createDatabaseTable: false, clearExpired: true, checkExpirationInterval: 15 * 60_000, expiration: config.session.maxHours * 3_600_000 },
    pool as never,
  )
  const idleMs = config.session.idleMinutes * 60_000
  // The read every signed-in request makes, as a prepared statement (each pooled connection prepares it once):
  // MariaDB then skips parsing and planning it from its text, about a quarter of the statement's cost there.
  const readSql = `SELECT s.data AS session_data, s.expires AS session_expires, ${sessionUserColumns('u')}
         FROM sessions s LEFT JOIN users u ON u.id = CAST(JSON_VALUE(s.data, '$.passport.user.id') AS UNSIGNED)
        WHERE s.session_id = ?`

  const get = (sid: string, done: Callback<SessionData | null>) => {
    pool.execute<RowDataPacket[]>(readSql, [sid]).then(([rows]) => {
      const row = rows[0]
      if (!row || Number(row.session_expires) * 1000 < Date.now()) return done(null, null)
      const data = JSON.parse(String(row.session_data)) as SessionData
      if (data.passport) {
        loaded.set(data.passport, {
          touchedAt: Number(row.session_expires) * 1000 - idleMs,
          user: row.id === null ? null : (row as unknown as SessionUserRow),
        })
      }
      done(null, data)
    }, done)
  }

  // No `touch`: express-session then never asks whether an unchanged session needs one (a third hash of the session
  // on every answer). A signed-in session's idle timeout moves by a save instead: renewWhenDue (http/session.ts)
  // changes the session once a minute, and express-session writes the row and sends the cookie. A session without
  // a signed-in user is never stored (saveUninitialized is off, and signing out destroys the row).
  Object.assign(store, { get, touch: undefined }) // express-session calls `get` with a callback
  return { store, close: async () => { await store.close(); await pool.end().catch(() => undefined) } }
}
