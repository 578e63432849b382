// What the handheld keeps on the device, in IndexedDB: confirmations waiting to be sent (the outbox)
// and the pick lists opened on it (so scans are still checked with no connection). Everything that
// goes in passes through toStorable, the one serialiser at this boundary: a JSON copy, so a Vue
// reactive proxy, a function or a class instance can never reach IndexedDB (structured clone refuses
// proxies with DataCloneError).
import { openDB, type DBSchema, type IDBPDatabase } from 'idb'
// Relative (not @shared) so the unit tests, which run outside Vite, can import this module too.
import type { PickConfirmInput, PickListDetail } from '../../../shared/schemas/picking.js'

export type OutboxState = 'waiting' | 'refused'

export interface OutboxRefusal {
  status: number
  code: string
  /** The server's own words (English), kept for the log; the screen shows the code's message. */
  message: string
}

/** One confirmation on the device, from the moment it is made until the server acknowledges it. */
export interface OutboxItem {
  /** Its Idempotency-Key, made when the picker confirmed. */
  key: string
  /** Order of making, across reloads and lists. */
  seq: number
  pickListId: number
  listNumber: string
  /** The list's warehouse, for the device's outbox report. */
  warehouseId: number | null
  /** Who made it: only they send it (a colleague signing in on the same device does not). */
  userId: number | null
  userName: string
  body: PickConfirmInput
  label: { sku: string; binCode: string; lotCode: string | null; stockUnit: string }
  state: OutboxState
  refusal: OutboxRefusal | null
  attempts: number
}

/** A pick list as last read from the server, for working without a connection. */
export interface CachedList {
  id: number
  savedAt: string
  detail: PickListDetail
}

interface PickDeviceSchema extends DBSchema {
  confirmations: { key: string; value: OutboxItem; indexes: { byList: [number, number] } }
  lists: { key: number; value: CachedList }
}

/** Plain data, whatever came in: the one way into IndexedDB. */
export function toStorable<T>(value: T): T {
  const text = JSON.stringify(value)
  if (text === undefined) throw new TypeError('Nothing storable was given.')
  return JSON.parse(text) as T
}

const DB_NAME = 'lumenyard-picking'
let dbPromise: Promise<IDBPDatabase<PickDeviceSchema>> | null = null

function db(): Promise<IDBPDatabase<PickDeviceSchema>> {
  dbPromise ??= openDB<PickDeviceSchema>(DB_NAME, 2, {
    upgrade(d, oldVersion) {
      if (oldVersion < 1) d.createObjectStore('confirmations', { keyPath: 'key' }).createIndex('byList', ['pickListId', 'seq'])
      if (oldVersion < 2) d.createObjectStore('lists', { keyPath: 'id' })
    },
  })
  return dbPromise
}

/** An item stored by an earlier version ('rejected', a free-text error) in today's shape. */
function upgraded(raw: OutboxItem & { error?: string; errorCode?: string }): OutboxItem {
  if ((raw.state as string) !== 'rejected') return raw
  return { ...raw, state: 'refused', refusal: { status: 409, code: raw.errorCode ?? 'conflict', message: raw.error ?? '' } }
}

export const pickDevice = {
  async confirmations(): Promise<OutboxItem[]> {
    const rows = await (await db()).getAll('confirmations')
    return rows.map(upgraded).sort((a, b) => a.seq - b.seq)
  },
  async putConfirmation(item: OutboxItem): Promise<OutboxItem> {
    const plain = toStorable(item)
    await (await db()).put('confirmations', plain)
    return plain
  },
  async deleteConfirmation(key: string): Promise<void> {
    await (await db()).delete('confirmations', key)
  },
  async list(id: number): Promise<CachedList | undefined> {
    return (await db()).get('lists', id)
  },
  async putList(detail: PickListDetail, savedAt = new Date().toISOString()): Promise<void> {
    await (await db()).put('lists', toStorable({ id: detail.id, savedAt, detail }))
  },
  async deleteList(id: number): Promise<void> {
    await (await db()).delete('lists', id)
  },
}
