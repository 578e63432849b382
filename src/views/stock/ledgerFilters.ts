// The ledger page's filters: what the form holds, the query the server reads, and the address bar
// (itemId, binId, warehouseId) so a link from an item or a bin opens the ledger already filtered.
import type { LocationQuery } from 'vue-router'
import type { MoveType } from '@shared/catalog'
import type { QueryValues } from '@/api/stock'
import { localDayStart } from '@shared/schemas/stockViews'

export interface LedgerFilterModel {
  itemId: number | null
  warehouseId: number | null
  binId: number | null
  lotId: number | null
  moveType: MoveType[]
  /** Local days, YYYY-MM-DD, both included. */
  dates: [string, string] | null
  docType: string
  docId: string
}

const idOf = (v: unknown) => (typeof v === 'string' && /^\d+$/.test(v) ? Number(v) : null)

export function filtersFromQuery(q: LocationQuery): LedgerFilterModel {
  return { itemId: idOf(q.itemId), warehouseId: idOf(q.warehouseId), binId: idOf(q.binId), lotId: null, moveType: [], dates: null, docType: '', docId: '' }
}

export function filtersToQuery(f: LedgerFilterModel): Record<string, string> {
  const out: Record<string, string> = {}
  if (f.itemId) out.itemId = String(f.itemId)
  if (f.warehouseId) out.warehouseId = String(f.warehouseId)
  if (f.binId) out.binId = String(f.binId)
  return out
}

export function serverFilters(f: LedgerFilterModel): QueryValues {
  return {
    itemId: f.itemId, warehouseId: f.warehouseId, binId: f.binId, lotId: f.lotId, moveType: f.moveType,
    docType: f.docType.trim() || undefined, docId: /^\d+$/.test(f.docId.trim()) ? f.docId.trim() : undefined,
    from: f.dates ? localDayStart(f.dates[0]) : undefined,
    to: f.dates ? localDayStart(f.dates[1], 1) : undefined,
  }
}

export function blankFilters(): LedgerFilterModel {
  return { itemId: null, warehouseId: null, binId: null, lotId: null, moveType: [], dates: null, docType: '', docId: '' }
}


/** Documents a move can belong to, offered by name in the filter (the stored kind is never shown or typed). */
export const LEDGER_DOC_KINDS = ['purchase_order', 'pick_list', 'pick_transfer', 'transfer', 'job', 'cycle_count', 'data_import', 'sales_order', 'order_picked', 'handover_ticket', 'sales_return'] as const
