import { storeToRefs } from 'pinia'
import type { Place, PlaceBin } from '@shared/schemas/stockViews'
import { useWarehousesStore } from '@/stores/warehouses'

/** Warehouses and their bins for the stock screens' pickers (the warehouses store), loaded again per page. */
export function useStockPlaces() {
  const store = useWarehousesStore()
  const { places, error, active: warehouses } = storeToRefs(store)
  const load = store.load

  /** Bins of a warehouse in use; storage only leaves out transit bins (stock there is on its way). */
  function binsOf(warehouseId: number | null | undefined, opts: { storageOnly?: boolean } = {}): PlaceBin[] {
    const w = places.value.find((p) => p.id === warehouseId)
    return (w?.bins ?? []).filter((b) => b.active && (!opts.storageOnly || b.kind !== 'transit'))
  }

  function warehouseOfBin(binId: number | null | undefined): Place | undefined {
    return places.value.find((w) => w.bins.some((b) => b.id === binId))
  }

  function binCode(binId: number | null | undefined): string {
    return warehouseOfBin(binId)?.bins.find((b) => b.id === binId)?.code ?? ''
  }

  return { places, error, load, warehouses, binsOf, warehouseOfBin, binCode }
}

export type StockPlaces = ReturnType<typeof useStockPlaces>
