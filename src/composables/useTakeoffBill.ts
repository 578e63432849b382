import { ref, watch, type Ref } from 'vue'
import { computeCounterBill, saveBlockers, type ComputeAnswer, type CounterBill } from '@shared/counter/counterBill'
import type { CounterCatalog, LineAvailability } from '@shared/schemas/counter'
import { takeoffSchema, type Takeoff } from '@shared/schemas/takeoff'
import type { LengthUnit } from '@shared/units'
import { api } from '@/api/client'
import { fieldErrorsFromZod } from '@/i18n/errorText'

const COMPUTE_DELAY_MS = 150
const STOCK_DELAY_MS = 900

/**
 * The bill as the user types: the shared computation runs in the browser a moment after each change;
 * stock per warehouse follows from the server a little later (it needs the database).
 */
export function useTakeoffBill(takeoff: Ref<Takeoff>, catalog: Ref<CounterCatalog | null>, unit: Ref<LengthUnit>) {
  const bill = ref<CounterBill | null>(null)
  const errors = ref<Record<string, string>>({})
  const blockers = ref<string[]>([])
  const availability = ref<Map<number, LineAvailability>>(new Map())
  const stale = ref(false)
  let computeTimer: ReturnType<typeof setTimeout> | undefined
  let stockTimer: ReturnType<typeof setTimeout> | undefined
  let stockAbort: AbortController | undefined

  async function refreshStock(input: Takeoff) {
    stockAbort?.abort()
    stockAbort = new AbortController()
    try {
      const answer = await api.post<ComputeAnswer>('/takeoffs/compute', { takeoff: input, unit: unit.value }, { signal: stockAbort.signal })
      availability.value = new Map(answer.availability.map((a) => [a.itemId, a]))
    } catch {
      // Stock figures are a convenience here; the saved bill reads them again.
    }
  }

  function recompute() {
    if (!catalog.value) return
    const parsed = takeoffSchema.safeParse(takeoff.value)
    if (!parsed.success) {
      errors.value = fieldErrorsFromZod(parsed.error)
      stale.value = true
      return
    }
    errors.value = {}
    stale.value = false
    bill.value = computeCounterBill(parsed.data, catalog.value, unit.value)
    blockers.value = saveBlockers(bill.value)
    clearTimeout(stockTimer)
    stockTimer = setTimeout(() => refreshStock(parsed.data), STOCK_DELAY_MS)
  }

  watch([takeoff, catalog, unit], () => {
    clearTimeout(computeTimer)
    computeTimer = setTimeout(recompute, COMPUTE_DELAY_MS)
  }, { deep: true, immediate: true })

  return { bill, errors, blockers, availability, stale, recompute }
}
