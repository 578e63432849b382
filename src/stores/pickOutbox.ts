// The handheld's outbox, shared by the pick screen, the outbox page and the warehouse landing: every
// confirmation is written to the device first (with the Idempotency-Key made when the picker
// confirmed), then sent in the order it was made. No connection: it waits, and goes out on the
// browser's online event or the next retry. Signed out: it waits for the same person to sign in
// again. The server refusing it: it stays, marked refused with the reason, until retried or
// discarded (a discard is recorded on the server). A resend of the same key is answered from the
// server's record, so nothing is ever counted twice.
import { defineStore } from 'pinia'
import { computed, ref, watch } from 'vue'
import type { PickConfirmAnswer, PickConfirmInput, PickDiscardAnswer, PickDiscardReason } from '@shared/schemas/picking'
import { isApiError, type ApiError } from '@/api/client'
import { newIdempotencyKey } from '@/api/idempotencyKey'
import { pickingApi } from '@/api/picking'
import { pickDevice, toStorable, type OutboxItem } from '@/composables/picking/pickDevice'
import { useSessionStore } from './session'

export type OutboxEvent =
  | { kind: 'acknowledged'; item: OutboxItem; answer: PickConfirmAnswer }
  | { kind: 'refused'; item: OutboxItem }
  | { kind: 'discarded'; item: OutboxItem }

export interface NewConfirmation {
  pickListId: number
  listNumber: string
  warehouseId: number | null
  body: PickConfirmInput
  label: OutboxItem['label']
}

const RETRY_MS = 5000
const REPORT_DELAY_MS = 1500
const DEVICE_KEY = 'lumenyard.deviceId'

/** This browser's own random id, for its outbox reports. */
function deviceId(): string {
  try {
    const known = localStorage.getItem(DEVICE_KEY)
    if (known) return known
    const made = newIdempotencyKey()
    localStorage.setItem(DEVICE_KEY, made)
    return made
  } catch {
    return newIdempotencyKey() // no storage: a new id for this page
  }
}

let lastSeq = 0
const nextSeq = () => (lastSeq = Math.max(Date.now() * 1000, lastSeq + 1))

/** Answers worth waiting out (busy, a fault, the same key still being recorded), not refusals. */
const transient = (err: ApiError) => err.status >= 500 || err.status === 429 || err.code === 'duplicate_confirmation' || err.code === 'idempotency_in_progress'

export const usePickOutboxStore = defineStore('pickOutbox', () => {
  const session = useSessionStore()
  const items = ref<OutboxItem[]>([])
  const loaded = ref(false)
  /** False after a request found no connection, until one gets through again. */
  const reachable = ref(typeof navigator === 'undefined' || navigator.onLine)
  /** A send was answered 401: waiting for the person to sign in again. */
  const signedOut = ref(false)
  const sending = ref(false)
  const listeners = new Set<(e: OutboxEvent) => void>()

  const isMine = (i: OutboxItem) => i.userId === null || i.userId === session.user?.id
  const waiting = computed(() => items.value.filter((i) => i.state === 'waiting'))
  const refused = computed(() => items.value.filter((i) => i.state === 'refused'))
  /** For the warehouse landing and any device status: how many confirmations wait on this device. */
  const waitingCount = computed(() => waiting.value.length)
  const forList = (pickListId: number) => items.value.filter((i) => i.pickListId === pickListId)

  const emit = (e: OutboxEvent) => listeners.forEach((l) => l(e))
  function subscribe(listener: (e: OutboxEvent) => void): () => void {
    listeners.add(listener)
    return () => listeners.delete(listener)
  }

  let loading: Promise<void> | null = null
  function load(): Promise<void> {
    loading ??= pickDevice.confirmations().then((rows) => {
      items.value = rows
      loaded.value = true
    })
    return loading
  }

  function replace(key: string, next: OutboxItem | null) {
    items.value = next ? items.value.map((i) => (i.key === key ? next : i)) : items.value.filter((i) => i.key !== key)
  }

  function noteReachable(ok: boolean) {
    reachable.value = ok
    if (ok) signedOut.value = false
  }

  async function acknowledge(item: OutboxItem, answer: PickConfirmAnswer) {
    await pickDevice.deleteConfirmation(item.key)
    replace(item.key, null)
    emit({ kind: 'acknowledged', item, answer })
  }

  async function refuse(item: OutboxItem, err: ApiError) {
    const next = await pickDevice.putConfirmation({
      ...toStorable(item), state: 'refused', refusal: { status: err.status, code: err.code, message: err.message }, attempts: item.attempts + 1,
    })
    replace(item.key, next)
    emit({ kind: 'refused', item: next })
  }

  /** Sends one; false to stop (no connection, signed out, the server busy) and try again later. */
  async function sendOne(item: OutboxItem): Promise<boolean> {
    try {
      const answer = await pickingApi.confirm(item.pickListId, item.body, item.key)
      noteReachable(true)
      await acknowledge(item, answer)
      return true
    } catch (err) {
      if (!isApiError(err)) {
        console.error(err)
        return false
      }
      if (err.status === 0) {
        reachable.value = false
        return false
      }
      reachable.value = true
      if (err.status === 401) {
        signedOut.value = true
        return false
      }
      if (transient(err)) return false
      await refuse(item, err)
      return true
    }
  }

  async function sendWaiting(): Promise<void> {
    await load()
    if (!session.user) return
    for (const item of waiting.value.filter(isMine)) {
      // Discarded or refused meanwhile: skip it.
      if (!items.value.some((i) => i.key === item.key && i.state === 'waiting')) continue
      if (!(await sendOne(item))) return
    }
  }

  let running: Promise<void> | null = null
  let again = false
  /**
   * Sends what waits, oldest first; one run at a time. A call during a run (a new confirmation, the
   * connection back, a sign-in) makes it go round once more, whatever stopped the run before.
   */
  function flush(): Promise<void> {
    if (running) {
      again = true
      return running
    }
    sending.value = true
    running = (async () => {
      try {
        do {
          again = false
          await sendWaiting()
        } while (again)
      } finally {
        sending.value = false
        running = null
      }
    })()
    return running
  }

  /** Keeps a new confirmation on the device first, then tries to send it. */
  async function add(c: NewConfirmation): Promise<OutboxItem> {
    await load()
    const stored = await pickDevice.putConfirmation({
      key: newIdempotencyKey(), seq: nextSeq(), pickListId: c.pickListId, listNumber: c.listNumber, warehouseId: c.warehouseId,
      userId: session.user?.id ?? null, userName: session.user?.displayName ?? '', body: c.body, label: c.label,
      state: 'waiting', refusal: null, attempts: 0,
    })
    items.value = [...items.value, stored]
    void flush()
    return stored
  }

  /** A refused confirmation goes back in line (after the reason was dealt with, or the server was wrong). */
  async function retry(key: string): Promise<void> {
    const item = items.value.find((i) => i.key === key)
    if (!item || item.state !== 'refused') return
    replace(key, await pickDevice.putConfirmation({ ...toStorable(item), state: 'waiting', refusal: null }))
    await flush()
  }

  /**
   * Drops a confirmation from the device, with why; the server records it first. When the server
   * had it already, nothing is dropped there: it counts as acknowledged. Throws when the server
   * can't be reached (the item stays).
   */
  async function discard(key: string, reason: PickDiscardReason, note: string | null): Promise<PickDiscardAnswer | null> {
    if (running) await running // never discard what is being sent this very moment
    const item = items.value.find((i) => i.key === key)
    if (!item) return null
    const answer = await pickingApi.discard(item.pickListId, {
      clientKey: item.key, lineId: item.body.lineId, qty: item.body.qty, shortReason: item.body.shortReason ?? null,
      refusedCode: item.refusal?.code ?? null, reason, note,
    }, `discard-${item.key}`)
    noteReachable(true)
    if (answer.discarded) {
      await pickDevice.deleteConfirmation(item.key)
      replace(item.key, null)
      emit({ kind: 'discarded', item })
    } else await acknowledge(item, answer.recorded)
    return answer
  }

  // The warehouse's start page shows work that exists only on devices: tell the server how much waits here.
  let lastReport = ''
  let reportTimer: ReturnType<typeof setTimeout> | undefined
  async function report(): Promise<void> {
    if (!session.user || !loaded.value) return
    const mineWaiting = waiting.value.filter(isMine)
    const body = {
      waiting: mineWaiting.length,
      refused: refused.value.filter(isMine).length,
      oldestWaitingAt: mineWaiting.map((i) => i.body.scannedAt).filter((at): at is string => !!at).sort()[0] ?? null,
      warehouseId: (mineWaiting[0] ?? refused.value[0])?.warehouseId ?? null,
    }
    const signature = JSON.stringify([session.user.id, body])
    if (signature === lastReport) return
    try {
      await pickingApi.reportOutbox(deviceId(), body)
      lastReport = signature
    } catch {
      // offline or signed out: the next change or retry reports again
    }
  }
  const scheduleReport = () => {
    clearTimeout(reportTimer)
    reportTimer = setTimeout(() => void report(), REPORT_DELAY_MS)
  }
  watch(() => [waiting.value.length, refused.value.length, reachable.value, session.user?.id], scheduleReport)

  if (typeof window !== 'undefined') {
    window.addEventListener('online', () => void flush())
    window.addEventListener('offline', () => { reachable.value = false })
    setInterval(() => {
      if (!running && waiting.value.some(isMine)) void flush()
    }, RETRY_MS)
  }
  // Signed in again (after the session ended, on the sign-in page or over the page): what waited goes out now.
  watch(() => [session.user?.id, session.resumes] as const, ([id]) => {
    if (id === undefined) return
    signedOut.value = false
    void flush()
  })

  return {
    items, loaded, reachable, signedOut, sending, waiting, refused, waitingCount,
    isMine, forList, subscribe, load, noteReachable, add, flush, retry, discard,
  }
})
