// Completing a pick list issues the stock: one pickReserved per confirmation (ledger move 'pick',
// doc_type 'pick_list'), gives back what was not picked, and adds what was issued to the bill of
// materials' picked_qty. Lines nobody finished stop it, unless the caller accepts them as short.
import type { EntityManager } from 'typeorm'
import { Bom } from '../../entities/Bom.js'
import { PickConfirmation, PickList, PickListLine } from '../../entities/PickList.js'
import { StockReservation } from '../../entities/StockReservation.js'
import { AppError } from '../../errors.js'
import { audit } from '../auditService.js'
import { lockDocumentBalances, pickReserved, releaseReservations } from '../stock/stockReservations.js'
import { completeOrderPick } from '../sales/fulfilment.js'
import type { StockActor } from '../stock/stockLedger.js'
import { PICK_DOC } from './pickListCreate.js'
import { lockPickList, pickNumber, requireStatus } from './pickListLocks.js'

export interface CompletionResult {
  issued: number
  moves: number
  closedShort: number
  released: number
}

/** Lines with units neither confirmed nor closed short: closed short as 'not_picked', or refused. */
async function closeOpenLines(em: EntityManager, actor: StockActor, list: PickList, lines: PickListLine[], acceptShort: boolean): Promise<number> {
  const open = lines.filter((l) => l.qty - l.confirmedQty - l.shortQty > 0)
  if (!open.length) return 0
  if (!acceptShort) {
    const units = open.reduce((a, l) => a + l.qty - l.confirmedQty - l.shortQty, 0)
    throw AppError.conflict('lines_open', `${open.length} line(s) of ${pickNumber(list.id)} still have ${units} unit(s) to pick: finish them, or complete it as a partial pick.`)
  }
  let closed = 0
  for (const line of open) {
    const rest = line.qty - line.confirmedQty - line.shortQty
    await em.insert(PickConfirmation, {
      pickListId: list.id, lineId: line.id, qty: 0, shortQty: rest, shortReason: 'not_picked', clientKey: `complete:${list.id}:${line.id}`,
      binScan: '', itemScan: null, lotScan: null, scannedAt: null, confirmedBy: actor.userId, moveId: null, issuedAt: null,
    })
    line.shortQty += rest
    closed += rest
    await em.update(PickListLine, { id: line.id }, { shortQty: line.shortQty })
  }
  return closed
}

async function issueConfirmation(em: EntityManager, actor: StockActor, list: PickList, line: PickListLine, c: PickConfirmation): Promise<string> {
  const reservation = await em.findOneBy(StockReservation, { docType: PICK_DOC, docId: list.id, docLineId: line.id })
  if (!reservation) throw AppError.conflict('reservation_missing', `The stock held for a line of ${pickNumber(list.id)} is gone; it cannot be issued.`)
  const applied = await pickReserved(em, actor, {
    reservationId: reservation.id, qty: c.qty, doc: { docType: PICK_DOC, docId: list.id, docLineId: line.id }, note: `confirmation ${c.id}`,
  })
  return applied.moves[0].id
}

export async function completePickList(em: EntityManager, actor: StockActor, id: number, opts: { acceptShort: boolean }): Promise<CompletionResult> {
  // Same lock order as making a list from this bill of materials: the bill of materials, then the list.
  const unlocked = await em.findOneBy(PickList, { id })
  if (!unlocked) throw AppError.notFound('pick_list_not_found', 'That pick list was not found.')
  if (unlocked.bomId !== null) await em.findOne(Bom, { where: { id: unlocked.bomId }, lock: { mode: 'pessimistic_write' } })
  const list = await lockPickList(em, id)
  requireStatus(list, ['released', 'picking'], 'complete')
  const lines = await em.find(PickListLine, { where: { pickListId: list.id }, order: { id: 'ASC' }, lock: { mode: 'pessimistic_write' } })
  const closedShort = await closeOpenLines(em, actor, list, lines, opts.acceptShort)
  // A sales order's list issues nothing: the picked units wait, held, for the order's handover ticket.
  if (list.salesOrderId !== null) return { issued: 0, moves: 0, closedShort, released: (await completeOrderPick(em, actor, list, lines)).released }
  // Locking reads see every confirmation committed before the list lock was granted, not an older snapshot.
  const confirmations = await em.find(PickConfirmation, { where: { pickListId: list.id }, order: { id: 'ASC' }, lock: { mode: 'pessimistic_write' } })
  await lockDocumentBalances(em, { docType: PICK_DOC, docId: list.id })
  const issuedByBomLine = new Map<number, number>()
  let moves = 0
  for (const c of confirmations) {
    if (c.qty === 0 || c.moveId !== null) continue
    const line = lines.find((l) => l.id === c.lineId)!
    const moveId = await issueConfirmation(em, actor, list, line, c)
    await em.update(PickConfirmation, { id: c.id }, { moveId, issuedAt: new Date() })
    line.issuedQty += c.qty
    if (line.bomLineId !== null) issuedByBomLine.set(line.bomLineId, (issuedByBomLine.get(line.bomLineId) ?? 0) + c.qty)
    moves++
  }
  for (const line of lines) await em.update(PickListLine, { id: line.id }, { issuedQty: line.issuedQty })
  const released = await releaseReservations(em, actor, { docType: PICK_DOC, docId: list.id })
  for (const [bomLineId, qty] of [...issuedByBomLine].sort((a, b) => a[0] - b[0])) {
    await em.query('UPDATE bom_lines SET picked_qty = picked_qty + ? WHERE id = ?', [qty, bomLineId])
  }
  await em.update(PickList, { id: list.id }, { status: 'picked', pickedBy: actor.userId, pickedAt: new Date() })
  const issued = [...issuedByBomLine.values()].reduce((a, b) => a + b, 0)
  await audit(em, actor, 'pick_list.picked', 'pick_list', list.id, { issued, moves, closedShort })
  return { issued, moves, closedShort, released }
}
