// The handheld's outbox: every confirmation is stored in IndexedDB first (with the Idempotency-Key
// made when the picker confirmed), then sent in the order it was made. When the server can't be
// reached it waits and tries again on the browser's online event and on a timer; a resend of the
// same key is answered from the server's record, so nothing is ever issued twice.
import { onBeforeUnmount, onMounted, ref } from 'vue'
import { openDB, type DBSchema, type IDBPDatabase } from 'idb'
import type { PickConfirmAnswer, PickConfirmInput } from '@shared/schemas/picking'
import { isApiError } from '@/api/client'
import { newIdempotencyKey, pickingApi } from '@/api/picking'

export interface QueuedConfirmation {
  key: string
  /** Order of making, across reloads. */
  seq: number
  pickListId: number
  body: PickConfirmInput
  label: { sku: string; binCode: string }
  state: 'waiting' | 'rejected'
  error?: string
  errorCode?: string
  attempts: number
}

interface PickQueueDb extends DBSchema {
  confirmations: { key: string; value: QueuedConfirmation; indexes: { byList: [number, number] } }
}

let dbPromise: Promise<IDBPDatabase<PickQueueDb>> | null = null
function db() {
  dbPromise ??= openDB<PickQueueDb>('lumenyard-picking', 1, {
    upgrade(d) {
      d.createObjectStore('confirmations', { keyPath: 'key' }).createIndex('byList', ['pickListId', 'seq'])
    },
  })
  return dbPromise
}

let lastSeq = 0
const nextSeq = () => (lastSeq = Math.max(Date.now() * 1000, lastSeq + 1))

const RETRY_MS = 5000

export interface QueueEvents {
  sent(answer: PickConfirmAnswer, item: QueuedConfirmation): void
  rejected(item: QueuedConfirmation): void
}

export function useConfirmQueue(pickListId: number, events: QueueEvents) {
  const items = ref<QueuedConfirmation[]>([])
  /** False after a send failed for lack of a connection, until one succeeds again. */
  const reachable = ref(true)
  const sending = ref(false)
  let timer: ReturnType<typeof setInterval> | undefined

  async function load() {
    const rows = await (await db()).getAllFromIndex('confirmations', 'byList', IDBKeyRange.bound([pickListId, 0], [pickListId, Infinity]))
    items.value = rows
  }

  /** Sends one; true to go on with the next. */
  async function sendOne(item: QueuedConfirmation): Promise<boolean> {
    try {
      const answer = await pickingApi.confirm(pickListId, item.body, item.key)
      await (await db()).delete('confirmations', item.key)
      items.value = items.value.filter((i) => i.key !== item.key)
      reachable.value = true
      events.sent(answer, item)
      return true
    } catch (err) {
      if (!isApiError(err) || err.status === 0) { reachable.value = false; return false }
      // Busy, signed out or a server fault: keep it and try again later, in order.
      if (err.status >= 500 || err.status === 401 || err.status === 429) return false
      const rejected: QueuedConfirmation = { ...item, state: 'rejected', error: err.message, errorCode: err.code, attempts: item.attempts + 1 }
      await (await db()).put('confirmations', rejected)
      items.value = items.value.map((i) => (i.key === item.key ? rejected : i))
      reachable.value = true
      events.rejected(rejected)
      return true
    }
  }

  async function flush() {
    if (sending.value) return
    sending.value = true
    try {
      for (const item of [...items.value].sort((a, b) => a.seq - b.seq)) {
        if (item.state !== 'waiting') continue
        if (!(await sendOne(item))) break
      }
    } finally {
      sending.value = false
    }
  }

  /** Stores a new confirmation (its key made now) and tries to send it. */
  async function add(body: PickConfirmInput, label: QueuedConfirmation['label']) {
    const item: QueuedConfirmation = { key: newIdempotencyKey(), seq: nextSeq(), pickListId, body, label, state: 'waiting', attempts: 0 }
    await (await db()).put('confirmations', item)
    items.value = [...items.value, item]
    void flush()
    return item
  }

  async function discard(key: string) {
    await (await db()).delete('confirmations', key)
    items.value = items.value.filter((i) => i.key !== key)
  }

  const onOnline = () => void flush()
  onMounted(async () => {
    await load()
    window.addEventListener('online', onOnline)
    timer = setInterval(() => { if (items.value.some((i) => i.state === 'waiting')) void flush() }, RETRY_MS)
    void flush()
  })
  onBeforeUnmount(() => {
    clearInterval(timer)
    window.removeEventListener('online', onOnline)
  })

  return { items, reachable, sending, add, flush, discard }
}
