// Release and cancel: who and when on the list itself. Cancelling gives back everything the list
// holds (its reservations and the stock held in other warehouses for proposed transfers).
import type { EntityManager } from 'typeorm'
import { PickTransferProposal } from '../../entities/PickList.js'
import { releaseReservations } from '../stock/stockReservations.js'
import type { StockActor } from '../stock/stockLedger.js'
import { audit } from '../auditService.js'
import { PICK_DOC } from './pickListCreate.js'
import { lockPickList, requireStatus } from './pickListLocks.js'

export async function releasePickList(em: EntityManager, actor: StockActor, id: number): Promise<void> {
  const list = await lockPickList(em, id)
  requireStatus(list, ['draft'], 'release')
  list.status = 'released'
  list.releasedBy = actor.userId
  list.releasedAt = new Date()
  await em.save(list)
  await audit(em, actor, 'pick_list.release', 'pick_list', list.id)
}

export async function cancelPickList(em: EntityManager, actor: StockActor, id: number, reason: string | null): Promise<{ released: number }> {
  const list = await lockPickList(em, id)
  requireStatus(list, ['draft', 'released', 'picking'], 'cancel')
  let released = await releaseReservations(em, actor, { docType: PICK_DOC, docId: list.id })
  released += await releaseReservations(em, actor, { docType: 'pick_transfer', docId: list.id })
  await em.update(PickTransferProposal, { pickListId: list.id, status: 'proposed' }, { status: 'cancelled' })
  list.status = 'cancelled'
  list.cancelledBy = actor.userId
  list.cancelledAt = new Date()
  list.cancelReason = reason
  await em.save(list)
  await audit(em, actor, 'pick_list.cancel', 'pick_list', list.id, { reason, released })
  return { released }
}
