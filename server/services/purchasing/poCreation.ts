// Three ways a purchase order starts: from the reorder suggestions the buyer accepted (one PO per
// vendor and ship-to warehouse), from a job's made-to-order lines (shower bases, tied to the job),
// or typed by hand. Every PO starts as a draft.
import { In, type EntityManager } from 'typeorm'
import type { PoFromSuggestionsInput, PoManualInput } from '../../../shared/schemas/purchasing.js'
import { packsFor } from '../../../shared/purchasing/poMoney.js'
import { PurchaseSuggestion } from '../../entities/PurchaseOrder.js'
import { Vendor } from '../../entities/Vendor.js'
import { AppError, type FieldProblems, problem } from '../../errors.js'
import type { AuditActor } from '../auditService.js'
import { addDays, addToOpenDraft, insertPo, leadDays, loadItems, preferredVendors, vendorItemsFor, type NewPoLine } from './poWrite.js'

async function lockSuggestions(em: EntityManager, ids: number[]): Promise<PurchaseSuggestion[]> {
  const rows = await em.find(PurchaseSuggestion, { where: { id: In(ids) }, lock: { mode: 'pessimistic_write' }, order: { id: 'ASC' } })
  const missing = ids.filter((id) => !rows.some((r) => r.id === id))
  if (missing.length) throw AppError.notFound('suggestions_missing', `Suggestion ${missing.join(', ')} was not found.`, { params: { ids: missing.map(String) } })
  const taken = rows.filter((r) => r.status !== 'accepted')
  if (taken.length) {
    const ids = taken.map((r) => String(r.id))
    throw AppError.conflict('suggestions_taken', `Suggestion ${ids.join(', ')} is already ordered or dismissed.`, { params: { ids } })
  }
  return rows
}

/** Group key: vendor and ship-to warehouse. */
function groupSuggestions(rows: PurchaseSuggestion[], vendorOf: (s: PurchaseSuggestion) => number) {
  const groups = new Map<string, { vendorId: number; warehouseId: number; rows: PurchaseSuggestion[] }>()
  for (const s of rows) {
    const key = `${vendorOf(s)}:${s.warehouseId}`
    const g = groups.get(key) ?? { vendorId: vendorOf(s), warehouseId: s.warehouseId, rows: [] }
    g.rows.push(s)
    groups.set(key, g)
  }
  return [...groups.values()]
}

async function orderGroup(em: EntityManager, actor: AuditActor, g: { vendorId: number; warehouseId: number; rows: PurchaseSuggestion[] }) {
  const vendor = await em.findOneByOrFail(Vendor, { id: g.vendorId })
  const itemIds = [...new Set(g.rows.map((s) => s.itemId))]
  const [items, priced] = await Promise.all([loadItems(em, itemIds), vendorItemsFor(em, g.vendorId, itemIds)])
  const unpriced = itemIds.filter((id) => !priced.has(id)).map((id) => items.get(id)!.sku)
  if (unpriced.length) {
    throw AppError.conflict('vendor_no_price', `${vendor.name} has no price for ${unpriced.join(', ')}: add it to the vendor's items first.`, { params: { vendor: vendor.name, skus: unpriced } })
  }
  const lines: NewPoLine[] = itemIds.map((itemId) => {
    const vi = priced.get(itemId)!
    const wanted = g.rows.filter((s) => s.itemId === itemId).reduce((sum, s) => sum + s.qty, 0)
    return {
      itemId, vendorSku: vi.vendorSku, description: items.get(itemId)!.name, packQty: vi.packQty,
      packsOrdered: packsFor(wanted, vi.packQty, vi.minOrderQty), unitCost: vi.unitCost,
    }
  })
  const head = { vendorId: g.vendorId, warehouseId: g.warehouseId, expectedDate: addDays(leadDays(vendor, [...priced.values()])) }
  const { po, lineIds } = (await addToOpenDraft(em, actor, head, lines, 'suggestions')) ?? (await insertPo(em, actor, head, lines, 'suggestions'))
  for (const s of g.rows) {
    await em.update(PurchaseSuggestion, { id: s.id }, { status: 'ordered', poLineId: lineIds[itemIds.indexOf(s.itemId)], vendorId: g.vendorId })
  }
  return po.id
}

/** Accepted suggestions → the draft PO of each vendor and warehouse (the open one, else a new one); the suggestions become 'ordered'. */
export async function createFromSuggestions(em: EntityManager, actor: AuditActor, input: PoFromSuggestionsInput): Promise<number[]> {
  const rows = await lockSuggestions(em, [...new Set(input.suggestionIds)])
  const preferred = await preferredVendors(em, rows.filter((s) => !s.vendorId).map((s) => s.itemId))
  const orphan = rows.filter((s) => !s.vendorId && !preferred.has(s.itemId))
  if (orphan.length) {
    const items = await loadItems(em, orphan.map((s) => s.itemId))
    const skus = [...items.values()].map((i) => i.sku)
    throw AppError.conflict('no_vendor_sells', `No vendor sells ${skus.join(', ')}: add a vendor item first.`, { params: { skus } })
  }
  const ids: number[] = []
  for (const g of groupSuggestions(rows, (s) => s.vendorId ?? preferred.get(s.itemId)!.vendorId)) ids.push(await orderGroup(em, actor, g))
  return ids
}

/** Lines typed by the buyer; pack, cost and vendor SKU default to the vendor's item. */
export async function createManual(em: EntityManager, actor: AuditActor, input: PoManualInput): Promise<number> {
  const lines = await manualLines(em, input.vendorId, input.lines)
  let expectedDate = input.expectedDate ?? null
  const vendor = await em.findOneBy(Vendor, { id: input.vendorId })
  if (!expectedDate && vendor) {
    const priced = await vendorItemsFor(em, vendor.id, lines.map((l) => l.itemId))
    expectedDate = addDays(leadDays(vendor, lines.map((l) => priced.get(l.itemId))))
  }
  const { po } = await insertPo(em, actor, { ...input, expectedDate, jobId: null }, lines, 'manual')
  return po.id
}

export async function manualLines(em: EntityManager, vendorId: number, input: PoManualInput['lines']): Promise<NewPoLine[]> {
  const ids = input.map((l) => l.itemId)
  const [items, priced] = await Promise.all([loadItems(em, ids), vendorItemsFor(em, vendorId, ids)])
  const fields: FieldProblems = {}
  input.forEach((l, i) => {
    if (!items.has(l.itemId)) fields[`lines.${i}.itemId`] = problem('item_not_in_catalog')
    else if (!l.unitCost && !priced.has(l.itemId)) fields[`lines.${i}.unitCost`] = problem('vendor_price_missing')
  })
  if (Object.keys(fields).length) throw AppError.badRequest('lines_need_attention', 'Some lines need attention.', { fields })
  return input.map((l) => {
    const vi = priced.get(l.itemId)
    return {
      itemId: l.itemId, vendorSku: vi?.vendorSku ?? null, description: l.description ?? items.get(l.itemId)!.name,
      packQty: l.packQty ?? vi?.packQty ?? 1, packsOrdered: l.packsOrdered, unitCost: l.unitCost ?? vi!.unitCost,
    }
  })
}
