// A line closed short stays short (on the handheld, the sheet and the list's progress) until someone
// settles it: a recount found the units after all (they go back on the line, to be picked), the buyer
// orders them (a backorder for purchasing), or another item of the same kind is picked instead (a
// substitute line, allocated and held at once). Each settles part or all of what is still open, in one
// transaction after the list's lock, and is written on the audit trail.
import type { EntityManager } from 'typeorm'
import type { PickShortResolveAnswer, PickShortResolveInput } from '../../../shared/schemas/picking.js'
import { Bom } from '../../entities/Bom.js'
import { Item } from '../../entities/Item.js'
import { Job } from '../../entities/Customer.js'
import { PickList, PickListLine, PickShortage } from '../../entities/PickList.js'
import { PurchaseSuggestion } from '../../entities/PurchaseOrder.js'
import { Warehouse } from '../../entities/Warehouse.js'
import { AppError, problem } from '../../errors.js'
import { audit } from '../auditService.js'
import { reserve } from '../stock/stockReservations.js'
import type { StockActor } from '../stock/stockLedger.js'
import { PICK_DOC } from './pickListCreate.js'
import { lockPickList, pickNumber, requireStatus } from './pickListLocks.js'
import { StockPool } from './pickPlanning.js'

/** Short units of a line not settled yet by a backorder or a substitute. */
async function openShort(em: EntityManager, line: PickListLine): Promise<number> {
  const [row] = (await em.query('SELECT COALESCE(SUM(qty), 0) AS qty FROM pick_shortages WHERE pick_list_line_id = ?', [line.id])) as { qty: string }[]
  return line.shortQty - Number(row.qty)
}

async function backorder(em: EntityManager, actor: StockActor, list: PickList, line: PickListLine, item: Item, qty: number): Promise<Partial<PickShortage>> {
  if (list.bomId === null || list.jobId === null) {
    throw AppError.conflict('order_backorder_automatic', 'Short lines of a sales order are backordered when its pick list is completed.')
  }
  const [warehouse, bom] = await Promise.all([em.findOneByOrFail(Warehouse, { id: list.warehouseId }), em.findOneByOrFail(Bom, { id: list.bomId })])
  const job = await em.findOneByOrFail(Job, { id: list.jobId })
  const suggestion = await em.save(em.create(PurchaseSuggestion, {
    itemId: item.id, warehouseId: list.warehouseId, vendorId: null, qty, status: 'accepted', source: 'backorder', poLineId: null,
    explanation: `Backorder: ${qty} ${item.stockUnit} of ${item.sku} short when picking ${pickNumber(list.id)} for job "${job.name}" (bill of materials ${bom.id} rev ${bom.revision}) at ${warehouse.code}.`,
    acceptedBy: actor.userId,
  }))
  return { action: 'backorder', suggestionId: suggestion.id }
}

/** The substitute is allocated in the list's warehouse like any line (oldest lot first, one lot where one covers it) and held now. */
async function substitute(em: EntityManager, actor: StockActor, list: PickList, line: PickListLine, item: Item, qty: number, subId: number): Promise<{ row: Partial<PickShortage>; lineIds: number[] }> {
  const sub = await em.findOneBy(Item, { id: subId })
  if (!sub || sub.id === item.id || !sub.active || sub.madeToOrder || sub.family !== item.family || sub.stockUnit !== item.stockUnit) {
    const params = { sku: item.sku }
    throw AppError.badRequest('substitute_not_fit', `That item cannot stand in for ${item.sku}.`, { params, fields: { substituteItemId: problem('substitute_not_fit', params) } })
  }
  const got = await new StockPool(em).take(sub.id, list.warehouseId, qty, sub.matchLot)
  if (got.allocated < qty) {
    throw AppError.conflict('substitute_short', `Only ${got.allocated} ${sub.stockUnit} of ${sub.sku} are free here; ${qty} were asked. Nothing was changed.`, { params: { sku: sub.sku } })
  }
  const lines = await em.save(got.lines.map((l) => em.create(PickListLine, {
    pickListId: list.id, bomLineId: line.bomLineId, salesOrderLineId: line.salesOrderLineId, itemId: sub.id, substituteForItemId: line.substituteForItemId ?? line.itemId,
    binId: Number(l.binId), lotId: l.lotId === null ? null : Number(l.lotId), qty: l.qty, confirmedQty: 0, shortQty: 0, issuedQty: 0,
  })))
  await reserve(em, actor, {
    doc: { docType: PICK_DOC, docId: list.id },
    lines: lines.map((l) => ({ itemId: l.itemId, binId: l.binId, lotId: l.lotId, qty: l.qty, docLineId: l.id })),
  }).catch((err: unknown) => {
    if (err instanceof AppError && err.code === 'insufficient_stock') throw AppError.conflict('substitute_short', `${sub.sku} was taken meanwhile. Nothing was changed.`, { params: { sku: sub.sku } })
    throw err
  })
  return { row: { action: 'substitute', substituteItemId: sub.id }, lineIds: lines.map((l) => l.id) }
}

export async function resolveShort(em: EntityManager, actor: StockActor, pickListId: number, input: PickShortResolveInput): Promise<PickShortResolveAnswer> {
  const list = await lockPickList(em, pickListId)
  // A backorder can still be placed for a list already completed; units to pick need an open list.
  requireStatus(list, input.action === 'backorder' ? ['released', 'picking', 'picked'] : ['released', 'picking'], 'settle')
  const line = await em.findOne(PickListLine, { where: { id: input.lineId, pickListId }, lock: { mode: 'pessimistic_write' } })
  if (!line) throw AppError.badRequest('line_not_on_list', 'That line is not on this pick list.', { fields: { lineId: problem('line_not_on_list') } })
  const open = await openShort(em, line)
  if (open <= 0) throw AppError.conflict('short_settled', 'Nothing on this line is short any more.')
  if (input.qty > open) throw AppError.badRequest('short_at_most', `Only ${open} are short on this line.`, { params: { max: open }, fields: { qty: problem('at_most', { max: open }) } })
  const item = await em.findOneByOrFail(Item, { id: line.itemId })
  let addedLineIds: number[] = []
  if (input.action === 'recount') {
    line.shortQty -= input.qty
    await em.update(PickListLine, { id: line.id }, { shortQty: line.shortQty })
  } else {
    let row: Partial<PickShortage>
    if (input.action === 'backorder') row = await backorder(em, actor, list, line, item, input.qty)
    else ({ row, lineIds: addedLineIds } = await substitute(em, actor, list, line, item, input.qty, input.substituteItemId!))
    await em.insert(PickShortage, {
      pickListId: list.id, bomLineId: line.bomLineId, pickListLineId: line.id, itemId: line.itemId, qty: input.qty,
      suggestionId: null, substituteItemId: null, fromWarehouseId: null, createdBy: actor.userId, ...row,
    })
  }
  await em.update(PickList, { id: list.id }, { status: list.status }) // updated_at moves, so pollers read it again
  await audit(em, actor, 'pick_line.short_resolve', 'pick_list', list.id, {
    lineId: line.id, itemId: line.itemId, action: input.action, qty: input.qty, substituteItemId: input.substituteItemId ?? null, addedLineIds,
  })
  const resolved = line.shortQty - (await openShort(em, line))
  return {
    lineId: line.id, action: input.action, qty: input.qty, shortQty: line.shortQty, shortResolvedQty: resolved,
    remaining: line.qty - line.confirmedQty - line.shortQty, addedLineIds,
  }
}
