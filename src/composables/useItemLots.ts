import { ref, watch, type Ref } from 'vue'
import type { LotLevelsAnswer } from '@shared/schemas/stockViews'
import { stockApi } from '@/api/stock'

/** The chosen item's lots and where they lie, for the lot picker and for "on hand here" figures. */
export function useItemLots(itemId: Ref<number | null>) {
  const levels = ref<LotLevelsAnswer | null>(null)

  async function reload(): Promise<void> {
    const id = itemId.value
    levels.value = id ? await stockApi.lotLevels(id).catch(() => null) : null
  }
  watch(itemId, reload, { immediate: true })

  /** On hand and reserved of the item in one bin, for one lot (null: kept without a lot). */
  function inBin(binId: number | null, lotId: number | null): { onHand: number; reserved: number } {
    const lot = levels.value?.lots.find((l) => l.lotId === lotId)
    const place = lot?.places.find((p) => p.binId === binId)
    return { onHand: place?.onHand ?? 0, reserved: place?.reserved ?? 0 }
  }

  /** The one lot with stock in the bin when nothing without a lot lies there: the picker's sensible default. */
  function soleLotIn(binId: number | null): number | null {
    if (!binId || inBin(binId, null).onHand > 0) return null
    const here = (levels.value?.lots ?? []).filter((l) => l.lotId !== null && l.places.some((p) => p.binId === binId && p.onHand > 0))
    return here.length === 1 ? here[0].lotId : null
  }

  return { levels, reload, inBin, soleLotIn }
}
