import { ref } from 'vue'
import type { CounterCatalog } from '@shared/schemas/counter'
import { api } from '@/api/client'

const cached = ref<CounterCatalog | null>(null)
let pending: Promise<CounterCatalog> | null = null

/** The takeoff editor's catalog (blocks, role → item mapping, rules, waste), loaded once per visit. */
export function useCounterCatalog() {
  async function load(force = false): Promise<CounterCatalog> {
    if (cached.value && !force) return cached.value
    pending ??= api.get<CounterCatalog>('/takeoffs/catalog').finally(() => (pending = null))
    cached.value = await pending
    return cached.value
  }
  return { catalog: cached, load }
}
