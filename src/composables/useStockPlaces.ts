import { computed, ref } from 'vue'
import type { Place, PlaceBin } from '@shared/schemas/stockViews'
import { stockApi } from '@/api/stock'

/** Warehouses and their bins for the stock screens' pickers, loaded once per page. */
export function useStockPlaces() {
  const places = ref<Place[]>([])
  const error = ref('')

  async function load(): Promise<void> {
    try {
      places.value = await stockApi.places()
      error.value = ''
    } catch (err) {
      error.value = (err as Error).message
    }
  }

  const warehouses = computed(() => places.value.filter((w) => w.active))

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
