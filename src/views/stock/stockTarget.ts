// Where a stock form points: warehouse, bin(s), item and lot; filled by hand, from the address, or
// by scanning a label (a bin label picks the bin, and its warehouse; an item or lot label the item).
import type { LocationQuery } from 'vue-router'
import type { LookupAnswer } from '@shared/schemas/stockViews'
import type { StockPlaces } from '@/composables/useStockPlaces'

export interface StockTarget {
  warehouseId: number | null
  binId: number | null
  /** Bin moves only: where the units go. */
  toBinId: number | null
  itemId: number | null
  lotId: number | null
}

const idOf = (v: unknown) => (typeof v === 'string' && /^\d+$/.test(v) ? Number(v) : null)

export function targetFromQuery(q: LocationQuery, places: StockPlaces): StockTarget {
  const binId = idOf(q.binId) ?? idOf(q.fromBinId)
  return {
    warehouseId: places.warehouseOfBin(binId)?.id ?? idOf(q.warehouseId) ?? places.warehouses.value[0]?.id ?? null,
    binId, toBinId: null, itemId: idOf(q.itemId), lotId: null,
  }
}

/**
 * Applies a scan. Bins: the first empty bin slot in `slots` order (a move takes "from", then "to");
 * a bin of another warehouse switches the form there. Returns true when the warehouse changed.
 */
export function applyScan(t: StockTarget, a: LookupAnswer, slots: ('binId' | 'toBinId')[] = ['binId']): boolean {
  if (a.item) {
    t.itemId = a.item.id
    t.lotId = a.lot?.id ?? null
  }
  if (!a.bin) return false
  const switched = t.warehouseId !== a.bin.warehouseId
  if (switched) {
    t.warehouseId = a.bin.warehouseId
    t.binId = null
    t.toBinId = null
  }
  const slot = slots.find((s) => t[s] === null) ?? slots[slots.length - 1]
  t[slot] = a.bin.id
  return switched
}
