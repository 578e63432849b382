// The ledger page's filters: what the form holds, the query the server reads, and the address bar
// (itemId, binId, warehouseId) so a link from an item or a bin opens the ledger already filtered.
import type { LocationQuery } from 'vue-router'
import type { MoveType } from '@shared/catalog'
import type { QueryValues } from '@/api/stock'

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

/** Midnight starting a local day, as an instant; the server keeps times in UTC. */
export function localDayStart(day: string, plusDays = 0): string {
  const [y, m, d] = day.split('-').map(Number)
  return new Date(y, m - 1, d + plusDays).toISOString()
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

/**
 * Days the export covers when no dates are chosen: a whole year of a busy yard is past the export's limit
 * (a quarter at most), so an export with no dates takes the last 90 days instead of being refused.
 */
export const DEFAULT_EXPORT_DAYS = 90

/** The dates an export sends: the chosen ones, else the last DEFAULT_EXPORT_DAYS local days up to today. */
export function exportDates(f: LedgerFilterModel, today: Date): { from: string; to: string; defaulted: boolean } {
  if (f.dates) return { from: localDayStart(f.dates[0]), to: localDayStart(f.dates[1], 1), defaulted: false }
  const start = new Date(today.getFullYear(), today.getMonth(), today.getDate() - (DEFAULT_EXPORT_DAYS - 1))
  const end = new Date(today.getFullYear(), today.getMonth(), today.getDate() + 1)
  return { from: start.toISOString(), to: end.toISOString(), defaulted: true }
}
