import type { EntityManager } from 'typeorm'
import { AuditEntry } from '../entities/AuditEntry.js'

export interface AuditActor {
  userId: number | null
  ip?: string | null
}

/** Records an action in the caller's transaction, so the change and its record land together. */
export async function audit(
  em: EntityManager,
  actor: AuditActor,
  action: string,
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
