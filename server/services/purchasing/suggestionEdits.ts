// An accepted suggestion is the buyer's intent, not yet an order: its quantity can be changed, or it can be
// dismissed, until a purchase order takes it up ('ordered'). Each change is audited.
import type { EntityManager } from 'typeorm'
import type { SuggestionUpdateInput } from '../../../shared/schemas/purchasing.js'
import { PurchaseSuggestion } from '../../entities/PurchaseOrder.js'
import { AppError } from '../../errors.js'
import { audit, type AuditActor } from '../auditService.js'

async function lockOpen(em: EntityManager, id: number): Promise<PurchaseSuggestion> {
  const s = await em.findOne(PurchaseSuggestion, { where: { id }, lock: { mode: 'pessimistic_write' } })
  if (!s) throw AppError.notFound('suggestion_not_found', 'That suggestion was not found.')
  if (s.status === 'ordered') throw AppError.conflict('suggestion_ordered', 'That suggestion is already on a purchase order: change the order instead.')
  if (s.status !== 'accepted') throw AppError.conflict('suggestion_dismissed', 'That suggestion was dismissed.')
  return s
}

export async function updateSuggestion(em: EntityManager, actor: AuditActor, id: number, input: SuggestionUpdateInput): Promise<void> {
  const s = await lockOpen(em, id)
  await em.update(PurchaseSuggestion, { id }, { qty: input.qty })
  await audit(em, actor, 'suggestion.update', 'purchase_suggestion', id, { itemId: s.itemId, warehouseId: s.warehouseId, qty: { from: s.qty, to: input.qty } })
}

export async function dismissSuggestion(em: EntityManager, actor: AuditActor, id: number): Promise<void> {
  const s = await lockOpen(em, id)
  await em.update(PurchaseSuggestion, { id }, { status: 'dismissed' })
  await audit(em, actor, 'suggestion.dismiss', 'purchase_suggestion', id, { itemId: s.itemId, warehouseId: s.warehouseId, qty: s.qty })
}
