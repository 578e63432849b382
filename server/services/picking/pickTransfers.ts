// Ships what another warehouse holds for a pick list: the hold is given back and the same units
// go out at once through shipTransfer (into the picking warehouse's transit bin), one transaction.
import type { EntityManager } from 'typeorm'
import { PickTransferProposal } from '../../entities/PickList.js'
import { AppError } from '../../errors.js'
import { releaseReservations } from '../stock/stockReservations.js'
import { shipTransfer } from '../stock/stockTransfers.js'
import type { StockActor } from '../stock/stockLedger.js'
import { lockPickList, pickNumber, requireStatus } from './pickListLocks.js'

export async function shipProposedTransfer(em: EntityManager, actor: StockActor, pickListId: number, fromWarehouseId: number): Promise<{ transferId: number; qty: number }> {
  const list = await lockPickList(em, pickListId)
  requireStatus(list, ['draft', 'released', 'picking', 'picked'], 'ship')
  const proposals = await em.find(PickTransferProposal, {
    where: { pickListId, fromWarehouseId, status: 'proposed' }, order: { id: 'ASC' }, lock: { mode: 'pessimistic_write' },
  })
  if (!proposals.length) {
    throw AppError.conflict('nothing_to_ship', `No transfer from that warehouse is waiting to ship for ${pickNumber(pickListId)}.`)
  }
  for (const p of proposals) await releaseReservations(em, actor, { docType: 'pick_transfer', docId: pickListId, docLineId: p.id })
  const { transfer } = await shipTransfer(em, actor, {
    fromWarehouseId, toWarehouseId: list.warehouseId,
    lines: proposals.map((p) => ({ itemId: p.itemId, lotId: p.lotId, fromBinId: p.fromBinId, qty: p.qty })),
    note: `For pick list ${pickNumber(pickListId)}`,
  })
  await em.update(PickTransferProposal, { pickListId, fromWarehouseId, status: 'proposed' }, { status: 'shipped', transferId: transfer.id, shippedBy: actor.userId, shippedAt: new Date() })
  return { transferId: transfer.id, qty: proposals.reduce((a, p) => a + p.qty, 0) }
}
