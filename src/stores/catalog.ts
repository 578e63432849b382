import { defineStore } from 'pinia'
import { ref, shallowRef } from 'vue'
import type { CounterCatalog } from '@shared/schemas/counter'
import { counterApi } from '@/api/counter'
import { resetOnSignOut } from './areaReset'

/**
 * The catalog the takeoff editor and the takeoff settings share (blocks, role → item mapping, rules, waste,
 * site figures): loaded once, again after a settings change (load(true)), emptied on sign-out.
 */
export const useCatalogStore = defineStore('catalog', () => {
  const catalog = shallowRef<CounterCatalog | null>(null)
  const loading = ref(false)
  let pending: Promise<CounterCatalog> | null = null
  /** Bumped by reset: an answer asked for before a sign-out is not kept after it. */
  let generation = 0

  async function load(force = false): Promise<CounterCatalog> {
    if (catalog.value && !force) return catalog.value
    const asked = generation
    if (!pending) {
      loading.value = true
      pending = counterApi.catalog().finally(() => {
        pending = null
        loading.value = false
      })
    }
    const got = await pending
    if (asked === generation) catalog.value = got
    return got
  }

  function reset(): void {
    generation++
    pending = null
    catalog.value = null
    loading.value = false
  }
  resetOnSignOut(reset)

  return { catalog, loading, load, reset }
})
