// What the counter chose for each shortage when making the list: leave it open, backorder it for
// the buyer, transfer it in from another warehouse, or pick a substitute item instead.
import type { EntityManager } from 'typeorm'
import type { PickCreateInput } from '../../../shared/schemas/picking.js'
import { Item } from '../../entities/Item.js'
import { PickShortage, PickTransferProposal } from '../../entities/PickList.js'
import { PurchaseSuggestion } from '../../entities/PurchaseOrder.js'
import { AppError, problem } from '../../errors.js'
import { reserve } from '../stock/stockReservations.js'
import type { StockActor } from '../stock/stockLedger.js'
import { loadWarehouse } from './pickPlanContext.js'
import type { AllocatedLine, Plan, ShortLine, StockPool } from './pickPlanning.js'

type Choice = PickCreateInput['shortages'][number]

export interface ChoiceOutcome {
  /** Substitute lines to add to the main list. */
  lines: AllocatedLine[]
  /** Shortage rows to record once the main list exists. */
  shortages: Omit<PickShortage, 'id' | 'pickListId' | 'createdAt'>[]
  /** Stock to reserve in other warehouses once the main list exists. */
  transfers: { short: ShortLine; fromWarehouseId: number; lines: AllocatedLine[] }[]
}

async function substituteItem(em: EntityManager, short: ShortLine, itemId: number, index: number): Promise<Item> {
  const item = await em.findOneBy(Item, { id: itemId })
  if (!item || item.id === short.item.id || !item.active || item.madeToOrder) {
    const params = { sku: short.item.sku }
    throw AppError.badRequest('substitute_not_fit', `That item cannot stand in for ${short.item.sku}.`, { params, fields: { [`shortages.${index}.substituteItemId`]: problem('substitute_not_fit', params) } })
  }
  return item
}

/** Applies each choice to its shortage; the plan's warehouse pool is used, so nothing is taken twice. */
export async function applyChoices(em: EntityManager, actor: StockActor, plan: Plan, pool: StockPool, choices: Choice[]): Promise<ChoiceOutcome> {
  const out: ChoiceOutcome = { lines: [], shortages: [], transfers: [] }
  const main = plan.ctx.warehouse
  for (const short of plan.shortages) {
    const index = choices.findIndex((c) => c.bomLineId === short.bomLine.id)
    const choice: Choice = index >= 0 ? choices[index] : { bomLineId: short.bomLine.id, action: 'leave' }
    let rest = short.shortage
    const base = { bomLineId: short.bomLine.id, pickListLineId: null, itemId: short.item.id, createdBy: actor.userId, suggestionId: null, substituteItemId: null, fromWarehouseId: null }
    if (choice.action === 'substitute') {
      const sub = await substituteItem(em, short, choice.substituteItemId!, index)
      const got = await pool.take(sub.id, main.id, rest, sub.matchLot)
      for (const l of got.lines) {
        out.lines.push({ bomLineId: short.bomLine.id, itemId: sub.id, substituteForItemId: short.item.id, warehouseId: main.id, binId: Number(l.binId), binCode: l.binCode, lotId: l.lotId === null ? null : Number(l.lotId), lotCode: l.lotCode, qty: l.qty })
      }
      if (got.allocated > 0) out.shortages.push({ ...base, qty: got.allocated, action: 'substitute', substituteItemId: sub.id })
      rest -= got.allocated
    } else if (choice.action === 'transfer') {
      if (choice.fromWarehouseId === main.id) throw AppError.badRequest('pick_transfer_same_warehouse', 'Transfer from another warehouse.', { fields: { [`shortages.${index}.fromWarehouseId`]: problem('pick_transfer_same_warehouse') } })
      const from = await loadWarehouse(em, choice.fromWarehouseId!, `shortages.${index}.fromWarehouseId`)
      const got = await pool.take(short.item.id, from.id, rest, short.item.matchLot)
      const lines = got.lines.map((l) => ({ bomLineId: short.bomLine.id, itemId: short.item.id, substituteForItemId: null, warehouseId: from.id, binId: Number(l.binId), binCode: l.binCode, lotId: l.lotId === null ? null : Number(l.lotId), lotCode: l.lotCode, qty: l.qty }))
      if (got.allocated > 0) {
        out.transfers.push({ short, fromWarehouseId: from.id, lines })
        out.shortages.push({ ...base, qty: got.allocated, action: 'transfer', fromWarehouseId: from.id })
      }
      rest -= got.allocated
    } else if (choice.action === 'backorder') {
      const suggestion = await em.save(em.create(PurchaseSuggestion, {
        itemId: short.item.id, warehouseId: main.id, vendorId: null, qty: rest, status: 'accepted', source: 'backorder', poLineId: null,
        explanation: `Backorder: ${rest} ${short.item.stockUnit} of ${short.item.sku} short for job "${plan.ctx.job.name}" (bill of materials ${plan.ctx.bom.id} rev ${plan.ctx.bom.revision}, line ${short.bomLine.lineNo}) at ${main.code}.`,
        acceptedBy: actor.userId,
      }))
      out.shortages.push({ ...base, qty: rest, action: 'backorder', suggestionId: suggestion.id })
      rest = 0
    }
    if (rest > 0) out.shortages.push({ ...base, qty: rest, action: 'leave' })
  }
  return out
}

/** Reserves the transfer stock at its source under the main list (doc 'pick_transfer'), one proposal per bin and lot. */
export async function proposeTransfers(em: EntityManager, actor: StockActor, pickListId: number, toWarehouseId: number, transfers: ChoiceOutcome['transfers']): Promise<void> {
  for (const t of transfers) {
    const proposals = await em.save(t.lines.map((l) => em.create(PickTransferProposal, {
      pickListId, bomLineId: l.bomLineId, itemId: l.itemId, lotId: l.lotId, fromWarehouseId: t.fromWarehouseId, fromBinId: l.binId,
      toWarehouseId, qty: l.qty, status: 'proposed', transferId: null, createdBy: actor.userId,
    })))
    await reserve(em, actor, {
      doc: { docType: 'pick_transfer', docId: pickListId },
      lines: proposals.map((p) => ({ itemId: p.itemId, binId: p.fromBinId, lotId: p.lotId, qty: p.qty, docLineId: p.id })),
    })
  }
}
