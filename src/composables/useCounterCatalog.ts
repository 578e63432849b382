import { storeToRefs } from 'pinia'
import { useCatalogStore } from '@/stores/catalog'

/** The takeoff editor's catalog (blocks, role → item mapping, rules, waste), from the catalog store. */
export function useCounterCatalog() {
  const store = useCatalogStore()
  const { catalog } = storeToRefs(store)
  return { catalog, load: store.load }
}
