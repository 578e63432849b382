import { computed, ref, watch, type Ref } from 'vue'
import { useI18n } from 'vue-i18n'
import { computeCounterBill, saveBlockers, type ComputeAnswer, type CounterBill } from '@shared/counter/counterBill'
import type { CounterCatalog, LineAvailability } from '@shared/schemas/counter'
import { takeoffSchema, type Takeoff } from '@shared/schemas/takeoff'
import type { LengthUnit } from '@shared/units'
import { api } from '@/api/client'
import { fieldProblems } from '@/components/counter/takeoffText'

const COMPUTE_DELAY_MS = 150
const STOCK_DELAY_MS = 900

/**
 * The bill as the user types: the shared computation runs in the browser a moment after each change;
 * stock per warehouse follows from the server a little later (it needs the database). The schema's
 * limits refuse an impossible takeoff (an opening of 20,000 in, say) before anything is laid out, so
 * the page never stalls; field problems come back in the user's language and unit. While a length
 * field holds text it cannot read (`unreadable` > 0), the bill keeps its last figures and says they are stale.
 */
export function useTakeoffBill(takeoff: Ref<Takeoff>, catalog: Ref<CounterCatalog | null>, unit: Ref<LengthUnit>, unreadable: Ref<number>) {
  const { t, te } = useI18n()
  const bill = ref<CounterBill | null>(null)
  const errors = ref<Record<string, string>>({})
  const blockers = ref<string[]>([])
  const availability = ref<Map<number, LineAvailability>>(new Map())
  const invalid = ref(false)
  const stale = computed(() => invalid.value || unreadable.value > 0)
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
      errors.value = fieldProblems(parsed.error, unit.value, t, te)
      invalid.value = true
      return
    }
    errors.value = {}
    invalid.value = false
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
