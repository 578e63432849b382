// One scanner confirmation: bin → item/lot → quantity, checked against the line with the same
// rules the handheld uses. Wrong bin, item or lot, or more than the line still needs, is refused
// and changes nothing. A short pick closes the line with the shortfall and why; "not in the bin" also
// asks for a count of that bin.
import type { EntityManager } from 'typeorm'
import { checkConfirmationScans } from '../../../shared/picking/pickScan.js'
import type { PickConfirmAnswer, PickConfirmInput } from '../../../shared/schemas/picking.js'
import { Bin } from '../../entities/Bin.js'
import { Item } from '../../entities/Item.js'
import { Lot } from '../../entities/Lot.js'
import { PickConfirmation, PickList, PickListLine } from '../../entities/PickList.js'
import { AppError, problem } from '../../errors.js'
import { audit } from '../auditService.js'
import { isDuplicateKey } from '../../db/transaction.js'
import type { StockActor } from '../stock/stockLedger.js'
import { requestCountForShortPick } from '../counts/countShortPick.js'
import { countOrderPick } from '../sales/fulfilment.js'
import { lockPickList, requireStatus } from './pickListLocks.js'

const PROBLEM_TEXT: Record<string, string> = {
  unreadable: 'That scan could not be read.',
  not_a_bin: 'That is not a bin label: scan the bin first.',
  not_an_item: 'That is not an item label.',
  wrong_bin: 'Wrong bin for this line.',
  wrong_item: 'Wrong item for this line.',
  wrong_lot: 'Wrong lot for this line.',
}

export function confirmationAnswer(c: PickConfirmation, line: PickListLine, listStatus: string, replayed: boolean): PickConfirmAnswer {
  return {
    confirmationId: c.id, lineId: line.id, confirmedQty: line.confirmedQty, shortQty: line.shortQty,
    remaining: line.qty - line.confirmedQty - line.shortQty, listStatus, replayed,
  }
}

async function checkScans(em: EntityManager, line: PickListLine, input: PickConfirmInput): Promise<void> {
  const [bin, item, lot] = await Promise.all([
    em.findOneByOrFail(Bin, { id: line.binId }),
    em.findOneByOrFail(Item, { id: line.itemId }),
    line.lotId === null ? Promise.resolve(null) : em.findOneByOrFail(Lot, { id: line.lotId }),
  ])
  const target = { binCode: bin.code, sku: item.sku, gtin: item.gtin, lotCode: lot?.code ?? null }
  const check = checkConfirmationScans(input, target, input.qty)
  if (!check.ok) {
    const expected = check.problem === 'wrong_bin' ? ` Go to ${bin.code}.` : check.problem === 'wrong_lot' ? ` Take lot ${lot?.code}.` : check.problem === 'wrong_item' ? ` This line is ${item.sku}.` : ''
    throw AppError.conflict(check.problem, `${PROBLEM_TEXT[check.problem]}${check.scanned ? ` Scanned: ${check.scanned}.` : ''}${expected} Nothing was recorded.`)
  }
}

/** A retry of a confirmation already stored (same key): its answer again, nothing added. */
async function replay(em: EntityManager, pickListId: number, clientKey: string): Promise<PickConfirmAnswer | null> {
  const earlier = await em.findOneBy(PickConfirmation, { clientKey })
  if (!earlier) return null
  if (earlier.pickListId !== pickListId) throw AppError.unprocessable('idempotency_key_reused', 'This Idempotency-Key was already used for another pick list.')
  const line = await em.findOneByOrFail(PickListLine, { id: earlier.lineId })
  const list = await lockPickList(em, pickListId)
  return confirmationAnswer(earlier, line, list.status, true)
}

export async function confirmPick(em: EntityManager, actor: StockActor, pickListId: number, input: PickConfirmInput, clientKey: string): Promise<PickConfirmAnswer> {
  const earlier = await replay(em, pickListId, clientKey)
  if (earlier) return earlier
  const list = await lockPickList(em, pickListId)
  requireStatus(list, ['released', 'picking'], 'pick')
  const line = await em.findOne(PickListLine, { where: { id: input.lineId, pickListId }, lock: { mode: 'pessimistic_write' } })
  if (!line) throw AppError.badRequest('line_not_on_list', 'That line is not on this pick list.', { fields: { lineId: problem('line_not_on_list') } })
  await checkScans(em, line, input)
  const remaining = line.qty - line.confirmedQty - line.shortQty
  if (input.qty > remaining) {
    throw AppError.conflict('over_pick', `Only ${remaining} left to pick on this line; ${input.qty} is too many. Nothing was recorded.`, { params: { left: remaining, qty: input.qty } })
  }
  const shortQty = input.shortReason ? remaining - input.qty : 0
  if (input.shortReason && shortQty === 0 && input.qty === 0) throw AppError.conflict('nothing_to_close_short', 'This line has nothing left to close short.')
  const confirmation = await em.save(em.create(PickConfirmation, {
    pickListId, lineId: line.id, qty: input.qty, shortQty, shortReason: shortQty > 0 ? input.shortReason! : null, clientKey,
    binScan: input.binScan, itemScan: input.itemScan ?? null, lotScan: input.lotScan ?? null,
    scannedAt: input.scannedAt ? new Date(input.scannedAt) : null, confirmedBy: actor.userId, moveId: null, issuedAt: null,
  })).catch((err: unknown) => {
    // The same key sent at once by another session: that one wins; a retry of this one replays it.
    if (isDuplicateKey(err)) throw AppError.conflict('duplicate_confirmation', 'This confirmation is already being recorded; it will show in a moment.')
    throw err
  })
  // Not in the bin: the bin is counted, so the stock figures catch up with the shelf.
  if (shortQty > 0 && input.shortReason === 'not_found') {
    await requestCountForShortPick(em, actor, { pickListId, pickListLineId: line.id, binId: line.binId, itemId: line.itemId, lotId: line.lotId })
  }
  line.confirmedQty += input.qty
  line.shortQty += shortQty
  await em.update(PickListLine, { id: line.id }, { confirmedQty: line.confirmedQty, shortQty: line.shortQty })
  await countOrderPick(em, line, input.qty)
  if (list.status === 'released') {
    list.status = 'picking'
    list.startedBy = actor.userId
    list.startedAt = new Date()
    await audit(em, actor, 'pick_list.start', 'pick_list', list.id)
  }
  // update() also sets updated_at, so pollers see a change even when the status stays.
  await em.update(PickList, { id: list.id }, { status: list.status, startedBy: list.startedBy, startedAt: list.startedAt })
  return confirmationAnswer(confirmation, line, list.status, false)
}
