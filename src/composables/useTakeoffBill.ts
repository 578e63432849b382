import { computed, onBeforeUnmount, ref, toRaw, watch, type Ref } from 'vue'
import { useI18n } from 'vue-i18n'
import { billBlockers, computeCounterBill, type CounterBill } from '@shared/counter/counterBill'
import type { CounterCatalog, LineAvailability } from '@shared/schemas/counter'
import { takeoffSchema, type Takeoff } from '@shared/schemas/takeoff'
import type { Caution } from '@shared/takeoff/cautions'
import type { LengthUnit } from '@shared/units'
import { counterApi } from '@/api/counter'
import { fieldProblems } from '@/components/counter/takeoffText'
import type { BillReply, BillRequest } from '@/workers/takeoffBill.worker'

const COMPUTE_DELAY_MS = 150
const STOCK_DELAY_MS = 900
const WORKING_NOTE_MS = 400

/**
 * The bill as the user types: the shared computation runs in a worker a moment after each change (only the
 * answer to the latest change is kept, so typing never waits for a large takeoff); stock per warehouse
 * follows from the server a little later (it needs the database). The schema's limits refuse an impossible
 * takeoff (an opening of 20,000 in, say) before anything is laid out; field problems come back in the
 * user's language and unit. While a length field holds text it cannot read (`unreadable` > 0) the bill keeps
 * its last figures and says they are stale; while a change is being computed (`computing`) the bill waits
 * to be saved, and a long computation says it is working (`working`).
 */
export function useTakeoffBill(takeoff: Ref<Takeoff>, catalog: Ref<CounterCatalog | null>, unit: Ref<LengthUnit>, unreadable: Ref<number>) {
  const { t, te } = useI18n()
  const bill = ref<CounterBill | null>(null)
  const errors = ref<Record<string, string>>({})
  const blockers = ref<Caution[]>([])
  const availability = ref<Map<number, LineAvailability>>(new Map())
  const invalid = ref(false)
  const computing = ref(false)
  /** A change waits for its computation (the short pause after typing): the bill on screen is already out of date. */
  const queued = ref(false)
  const busy = computed(() => queued.value || computing.value)
  /** A computation running long enough to say so (a large takeoff): not every keystroke flickers a note. */
  const working = ref(false)
  const stale = computed(() => invalid.value || unreadable.value > 0)
  let computeTimer: ReturnType<typeof setTimeout> | undefined
  let stockTimer: ReturnType<typeof setTimeout> | undefined
  let stockAbort: AbortController | undefined
  let worker: Worker | undefined
  let latest = 0
  /** The takeoff of the request in flight, for the stock figures that follow its answer. */
  const pending = new Map<number, Takeoff>()
  let workingTimer: ReturnType<typeof setTimeout> | undefined
  watch(computing, (on) => {
    clearTimeout(workingTimer)
    if (on) workingTimer = setTimeout(() => (working.value = true), WORKING_NOTE_MS)
    else working.value = false
  })

  async function refreshStock(input: Takeoff) {
    stockAbort?.abort()
    stockAbort = new AbortController()
    try {
      const answer = await counterApi.compute({ takeoff: input, unit: unit.value }, stockAbort.signal)
      availability.value = new Map(answer.availability.map((a) => [a.itemId, a]))
    } catch {
      // Stock figures are a convenience here; the saved bill reads them again.
    }
  }

  function answered(reply: BillReply, input: Takeoff) {
    if (reply.id !== latest) return
    computing.value = false
    if (!reply.ok) {
      errors.value = { _: reply.message }
      invalid.value = true
      return
    }
    bill.value = reply.bill
    blockers.value = reply.blockers
    clearTimeout(stockTimer)
    stockTimer = setTimeout(() => refreshStock(input), STOCK_DELAY_MS)
  }

  function computeOff(request: BillRequest) {
    if (typeof Worker === 'undefined') {
      const computed = computeCounterBill(request.takeoff, request.catalog, request.unit)
      answered({ id: request.id, ok: true, bill: computed, blockers: billBlockers(computed) }, request.takeoff)
      return
    }
    if (!worker) {
      worker = new Worker(new URL('../workers/takeoffBill.worker.ts', import.meta.url), { type: 'module' })
      worker.addEventListener('message', (e: MessageEvent<BillReply>) => answered(e.data, pending.get(e.data.id) as Takeoff))
    }
    pending.clear()
    pending.set(request.id, request.takeoff)
    worker.postMessage(request)
  }

  function recompute() {
    queued.value = false
    if (!catalog.value) return
    const parsed = takeoffSchema.safeParse(takeoff.value)
    latest++
    if (!parsed.success) {
      errors.value = fieldProblems(parsed.error, unit.value, t, te)
      invalid.value = true
      computing.value = false
      return
    }
    errors.value = {}
    invalid.value = false
    computing.value = true
    // Plain data across the thread boundary: the parsed takeoff is a fresh object, the catalog its raw self.
    computeOff({ id: latest, takeoff: parsed.data, catalog: toRaw(catalog.value), unit: unit.value })
  }

  watch([takeoff, catalog, unit], () => {
    clearTimeout(computeTimer)
    queued.value = !!catalog.value
    computeTimer = setTimeout(recompute, COMPUTE_DELAY_MS)
  }, { deep: true, immediate: true })

  onBeforeUnmount(() => {
    clearTimeout(computeTimer)
    clearTimeout(stockTimer)
    clearTimeout(workingTimer)
    stockAbort?.abort()
    worker?.terminate()
  })

  return { bill, errors, blockers, availability, stale, computing, busy, working }
}
