import { defineStore } from 'pinia'
import { computed, ref, shallowRef } from 'vue'
import type { Place } from '@shared/schemas/stockViews'
import { stockApi } from '@/api/stock'
import { resetOnSignOut } from './areaReset'

/**
 * Warehouses and their bins as the stock, label and counter screens pick from them. Each page loads again when
 * it opens (a bin added on the warehouses screen shows on the next page) and shows the last list meanwhile.
 */
export const useWarehousesStore = defineStore('warehouses', () => {
  const places = shallowRef<Place[]>([])
  const error = ref('')
  let generation = 0

  async function load(): Promise<void> {
    const asked = generation
    try {
      const got = await stockApi.places()
      if (asked !== generation) return
      places.value = got
      error.value = ''
    } catch (err) {
      if (asked === generation) error.value = (err as Error).message
    }
  }

  const active = computed(() => places.value.filter((w) => w.active))

  function reset(): void {
    generation++
    places.value = []
    error.value = ''
  }
  resetOnSignOut(reset)

  return { places, error, active, load, reset }
})
