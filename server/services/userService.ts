import bcrypt from 'bcryptjs'
import type { DataSource } from 'typeorm'
import type {
  ProfileUpdateInput,
  SessionUser,
  UserCreateInput,
  UserSummary,
  UserUpdateInput,
} from '../../shared/schemas/auth.js'
import { User } from '../entities/User.js'
import { AppError, problem } from '../errors.js'
import { inTransaction, isDuplicateKey } from '../db/transaction.js'
import { audit, type AuditActor } from './auditService.js'

const BCRYPT_ROUNDS = 12

export const hashPassword = (password: string) => bcrypt.hash(password, BCRYPT_ROUNDS)

export function toSessionUser(u: User): SessionUser {
  return {
    id: u.id,
    username: u.username,
    displayName: u.displayName,
    roles: u.roles,
    unitPreference: u.unitPreference,
    weightUnit: u.weightUnit,
    locale: u.locale,
  }
}

export function toSummary(u: User): UserSummary {
  return {
    id: u.id,
    username: u.username,
    displayName: u.displayName,
    email: u.email,
    roles: u.roles,
    active: u.active,
    lastSignInAt: u.lastSignInAt ? u.lastSignInAt.toISOString() : null,
    createdAt: u.createdAt.toISOString(),
  }
}

export async function listUsers(ds: DataSource): Promise<UserSummary[]> {
  const users = await ds.getRepository(User).find({ order: { username: 'ASC' } })
  return users.map(toSummary)
}

async function findUser(ds: DataSource, id: number): Promise<User> {
  const user = await ds.getRepository(User).findOneBy({ id })
  if (!user) throw AppError.notFound('user_not_found', 'That user was not found.')
  return user
}

export async function createUser(ds: DataSource, actor: AuditActor, input: UserCreateInput): Promise<UserSummary> {
  const passwordHash = await hashPassword(input.password)
  try {
    return await inTransaction(ds, async (em) => {
      const user = em.create(User, {
        username: input.username,
        displayName: input.displayName,
        email: input.email || null,
        roles: [...new Set(input.roles)],
        passwordHash,
        active: true,
      })
      await em.save(user)
      await audit(em, actor, 'user.create', 'user', user.id, { username: user.username, roles: user.roles })
      return toSummary(user)
    })
  } catch (err) {
    if (isDuplicateKey(err)) {
      throw AppError.conflict('username_taken', 'That user name is taken.', { fields: { username: problem('username_taken') } })
    }
    throw err
  }
}

/** Ends every session of a user: the epoch check refuses old cookies, and the rows go too. */
async function endSessions(ds: DataSource, userId: number): Promise<void> {
  await ds.query(
    `DELETE FROM sessions WHERE JSON_VALUE(data, '$.passport.user.id') = ?`,
    [userId],
  )
}

export async function updateUser(
  ds: DataSource,
  actor: AuditActor,
  id: number,
  input: UserUpdateInput,
): Promise<UserSummary> {
  if (actor.userId === id && input.active === false) {
    throw AppError.conflict('cannot_deactivate_self', 'You cannot deactivate your own account.')
  }
  if (actor.userId === id && input.roles && !input.roles.includes('admin')) {
    throw AppError.conflict('cannot_drop_own_admin', 'You cannot remove the admin role from your own account.')
  }
  const result = await inTransaction(ds, async (em) => {
    const user = await em.findOne(User, { where: { id }, lock: { mode: 'pessimistic_write' } })
    if (!user) throw AppError.notFound('user_not_found', 'That user was not found.')
    const endsSessions = (input.active === false && user.active) || (input.roles !== undefined)
    const rolesBefore = [...user.roles].sort()
    if (input.displayName !== undefined) user.displayName = input.displayName
    if (input.email !== undefined) user.email = input.email || null
    if (input.roles !== undefined) user.roles = [...new Set(input.roles)]
    if (input.active !== undefined) user.active = input.active
    if (endsSessions) user.sessionEpoch += 1
    await em.save(user)
    await audit(em, actor, 'user.update', 'user', id, input)
    const rolesAfter = [...user.roles].sort()
    if (rolesAfter.join() !== rolesBefore.join()) await audit(em, actor, 'user.roles', 'user', id, { from: rolesBefore, to: rolesAfter })
    return { user, endsSessions }
  })
  if (result.endsSessions) await endSessions(ds, id)
  return toSummary(result.user)
}

export async function resetPassword(ds: DataSource, actor: AuditActor, id: number, password: string): Promise<void> {
  await findUser(ds, id)
  const passwordHash = await hashPassword(password)
  await inTransaction(ds, async (em) => {
    await em.increment(User, { id }, 'sessionEpoch', 1)
    await em.update(User, { id }, { passwordHash })
    await audit(em, actor, 'user.reset-password', 'user', id)
  })
  await endSessions(ds, id)
}

/** Stamps a successful sign-in. */
export async function recordSignIn(ds: DataSource, userId: number): Promise<void> {
  await ds.getRepository(User).update({ id: userId }, { lastSignInAt: new Date() })
}

/** The signed-in person's own row (for renewing their session after a password change). */
export function ownUser(ds: DataSource, userId: number): Promise<User> {
  return ds.getRepository(User).findOneByOrFail({ id: userId })
}

export async function updateProfile(ds: DataSource, userId: number, input: ProfileUpdateInput): Promise<SessionUser> {
  const user = await findUser(ds, userId)
  if (input.displayName !== undefined) user.displayName = input.displayName
  if (input.unitPreference !== undefined) user.unitPreference = input.unitPreference
  if (input.weightUnit !== undefined) user.weightUnit = input.weightUnit
  if (input.locale !== undefined) user.locale = input.locale
  await ds.getRepository(User).save(user)
  return toSessionUser(user)
}

export async function changePassword(
  ds: DataSource,
  actor: AuditActor & { userId: number },
  currentPassword: string,
  newPassword: string,
): Promise<number> {
  const user = await findUser(ds, actor.userId)
  if (!(await bcrypt.compare(currentPassword, user.passwordHash))) {
    throw AppError.badRequest('current_password_wrong', 'The current password is not right.', { fields: { currentPassword: problem('current_password_wrong') } })
  }
  const passwordHash = await hashPassword(newPassword)
  return inTransaction(ds, async (em) => {
    await em.update(User, { id: user.id }, { passwordHash, sessionEpoch: user.sessionEpoch + 1 })
    await audit(em, actor, 'user.change-password', 'user', user.id)
    return user.sessionEpoch + 1
  })
}
