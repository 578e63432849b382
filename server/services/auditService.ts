import type { DataSource, EntityManager } from 'typeorm'
import type { AuditAction } from '../../shared/audit/auditKinds.js'
import { AuditEntry } from '../entities/AuditEntry.js'

export interface AuditActor {
  userId: number | null
  ip?: string | null
}

/**
 * Records an action in the caller's transaction, so the change and its record land together. The action is
 * one of the audit trail's known actions (shared/audit/auditKinds.ts), so the trail can word and filter it.
 */
export async function audit(
  em: EntityManager,
  actor: AuditActor,
  action: AuditAction,
  entity: string,
  entityId: string | number | null,
  detail?: unknown,
): Promise<void> {
  await em.insert(AuditEntry, {
    userId: actor.userId,
    ip: actor.ip ?? null,
    action,
    entity,
    entityId: entityId === null ? null : String(entityId),
    detail: detail === undefined ? null : JSON.stringify(detail),
  })
}

export type SignInOutcome = 'session.sign_in' | 'session.sign_in_failed' | 'session.sign_in_refused' | 'session.sign_out'

/**
 * A sign-in attempt (or a sign-out) on its own: nothing else changes with it. A failed attempt for a
 * known user name is filed under that person, so the admin finds it by person; the name as typed is kept
 * (at most 60 characters), never the password.
 */
export async function auditSignIn(
  ds: DataSource,
  outcome: SignInOutcome,
  who: { username: string; userId?: number | null; ip?: string | null },
  detail?: Record<string, unknown>,
): Promise<void> {
  const username = who.username.trim().toLowerCase().slice(0, 60)
  let userId = who.userId ?? null
  if (userId === null && username) {
    const [row] = (await ds.query('SELECT id FROM users WHERE username = ?', [username])) as { id: number }[]
    userId = row ? Number(row.id) : null
  }
  await audit(ds.manager, { userId, ip: who.ip ?? null }, outcome, 'user', userId, { username, ...detail })
}
