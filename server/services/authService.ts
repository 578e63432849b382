import bcrypt from 'bcryptjs'
import type { DataSource } from 'typeorm'
import type { SessionUser } from '../../shared/schemas/auth.js'
import { rolesTransformer, User } from '../entities/User.js'
import { sessionUserColumns, userReadWithSession, type SessionUserRow } from '../db/sessionStore.js'
import { toSessionUser } from './userService.js'

// Compared against when the user name is unknown, so timing doesn't tell which names exist.
const DUMMY_HASH = bcrypt.hashSync('lumenyard-no-such-user', 12)

export interface SessionRef {
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

/** The active user with this name and password, or null; an unknown name costs the same time as a wrong password. */
export async function verifyCredentials(ds: DataSource, username: string, password: string): Promise<User | null> {
  const user = await ds.getRepository(User).findOneBy({ username: username.trim().toLowerCase() })
  const ok = await bcrypt.compare(password, user?.passwordHash ?? DUMMY_HASH)
  return user && ok && user.active ? user : null
}

/** What a session stores of its user: the id and the epoch that signing out everywhere bumps. */
export const sessionRefOf = (user: User): SessionRef => ({ id: user.id, epoch: user.sessionEpoch })

/**
 * The session's user as it is now, or false: a deactivated account or a bumped epoch ends the session. The
 * session store reads that row in the same query as the session (server/db/sessionStore.ts); `sessionData` is
 * the session's passport entry it was read with.
 */
export async function sessionUserFor(ds: DataSource, ref: SessionRef, sessionData: object | undefined): Promise<SessionUser | false> {
  const read = userReadWithSession(sessionData)
  const row = read !== undefined ? read : await userRowById(ds, ref?.id)
  if (!row || !row.active || Number(row.session_epoch) !== ref.epoch) return false
  return sessionUserOf(row)
}

export type { SessionUser }
