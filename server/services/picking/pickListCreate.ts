// Makes pick lists from a saved bill of materials in one transaction: plan, lists and lines,
// reservations (reserved up, available down), shortage choices. If another counter reserved the
// same units first, the whole transaction is refused with 409 and nothing is kept.
import type { EntityManager } from 'typeorm'
import type { PickCreateInput } from '../../../shared/schemas/picking.js'
import { PickList, PickListLine, PickShortage } from '../../entities/PickList.js'
import { AppError } from '../../errors.js'
import { reserve } from '../stock/stockReservations.js'
import type { StockActor } from '../stock/stockLedger.js'
import { applyChoices, proposeTransfers } from './pickShortageChoices.js'
import { planPick, type AllocatedLine } from './pickPlanning.js'
import { audit } from '../auditService.js'

export const PICK_DOC = 'pick_list'

async function insertList(em: EntityManager, actor: StockActor, input: PickCreateInput, base: { bomId: number; jobId: number }, warehouseId: number): Promise<PickList> {
  const now = new Date()
  return em.save(em.create(PickList, {
    ...base, warehouseId, status: input.release ? 'released' : 'draft', note: input.note ?? null, createdBy: actor.userId,
    releasedBy: input.release ? actor.userId : null, releasedAt: input.release ? now : null,
  }))
}

async function reserveLines(em: EntityManager, actor: StockActor, list: PickList, allocated: AllocatedLine[]): Promise<void> {
  if (!allocated.length) return
  const lines = await em.save(allocated.map((a) => em.create(PickListLine, {
    pickListId: list.id, bomLineId: a.bomLineId, itemId: a.itemId, substituteForItemId: a.substituteForItemId,
    binId: a.binId, lotId: a.lotId, qty: a.qty, confirmedQty: 0, shortQty: 0, issuedQty: 0,
  })))
  await reserve(em, actor, {
    doc: { docType: PICK_DOC, docId: list.id },
    lines: lines.map((l) => ({ itemId: l.itemId, binId: l.binId, lotId: l.lotId, qty: l.qty, docLineId: l.id })),
  })
}

/** A reservation refused for lack of stock means someone took it since the plan was read. */
function stockTaken(err: unknown): never {
  if (err instanceof AppError && err.code === 'insufficient_stock') {
    throw AppError.conflict('stock_taken', `The stock changed while this pick list was being made: ${err.message} Nothing was reserved; look at the plan again.`)
  }
  throw err
}

export async function createPickLists(em: EntityManager, actor: StockActor, input: PickCreateInput): Promise<{ ids: number[] }> {
  const { plan, pool } = await planPick(em, input, { locking: true })
  const outcome = await applyChoices(em, actor, plan, pool, input.shortages)
  const main = plan.ctx.warehouse.id
  const byWarehouse = new Map<number, AllocatedLine[]>()
  for (const a of [...plan.allocated, ...outcome.lines]) byWarehouse.set(a.warehouseId, [...(byWarehouse.get(a.warehouseId) ?? []), a])
  if (!byWarehouse.size && !outcome.transfers.length) {
    throw AppError.conflict('nothing_to_pick', `Nothing of this bill of materials is left to pick at ${plan.ctx.warehouse.name}: choose another warehouse, split, or transfer.`, { params: { warehouse: plan.ctx.warehouse.name } })
  }
  const base = { bomId: plan.ctx.bom.id, jobId: plan.ctx.job.id }
  const ids: number[] = []
  try {
    // The chosen warehouse's list first: it carries the shortages and transfer proposals. A split
    // whose chosen warehouse has nothing, and nothing short, makes no empty list there.
    if (byWarehouse.has(main) || outcome.transfers.length || outcome.shortages.length) {
      const mainList = await insertList(em, actor, input, base, main)
      ids.push(mainList.id)
      await reserveLines(em, actor, mainList, byWarehouse.get(main) ?? [])
      await proposeTransfers(em, actor, mainList.id, main, outcome.transfers)
      if (outcome.shortages.length) await em.insert(PickShortage, outcome.shortages.map((s) => ({ ...s, pickListId: mainList.id })))
    }
    for (const [warehouseId, lines] of byWarehouse) {
      if (warehouseId === main) continue
      const list = await insertList(em, actor, input, base, warehouseId)
      ids.push(list.id)
      await reserveLines(em, actor, list, lines)
    }
  } catch (err) {
    stockTaken(err)
  }
  for (const id of ids) await audit(em, actor, 'pick_list.create', 'pick_list', id, { bomId: base.bomId, jobId: base.jobId })
  return { ids }
}
