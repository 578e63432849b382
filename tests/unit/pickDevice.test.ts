// The handheld's one serialiser at the IndexedDB boundary (src/composables/picking/pickDevice.ts):
// a Vue reactive object goes in, plain data comes out, and IndexedDB takes it.
// source: HTML Living Standard, StructuredSerializeInternal: a value with internal slots other than
// [[Prototype]] and [[Extensible]] (a Proxy has [[ProxyHandler]] and [[ProxyTarget]]) throws a
// "DataCloneError" DOMException. IndexedDB stores values by structured clone (W3C Indexed Database
// API 3.0, "store a record into an object store"); fake-indexeddb (npm) implements that API in Node.
import 'fake-indexeddb/auto'
import { openDB } from 'idb'
import { isProxy, isReactive, reactive } from 'vue'
import { describe, expect, it } from 'vitest'
import { pickDevice, toStorable, type OutboxItem } from '../../src/composables/picking/pickDevice.js'
import type { PickListDetail } from '../../shared/schemas/picking.js'

const plainItem = (): OutboxItem => ({
  key: '3f0c5a52-6f7e-4f47-9b0e-2c1d9e8a7b61', seq: 1_780_000_000_000_001, pickListId: 7, listNumber: 'PL-00007', warehouseId: 2,
  userId: 3, userName: 'Tomás Reyes',
  body: { lineId: 21, binScan: 'B:A-02-1', itemScan: 'SP-14', lotScan: null, qty: 5, shortReason: null, scannedAt: '2026-03-02T14:05:00.000Z' },
  label: { sku: 'SP-14', binCode: 'A-02-1', lotCode: null, stockUnit: 'each' },
  state: 'waiting', refusal: null, attempts: 0,
})

describe('the outbox serialiser', () => {
  it('turns a reactive object (nested proxies included) into plain data with the same values', () => {
    const item = reactive(plainItem())
    expect(isReactive(item.body)).toBe(true) // nested objects come back as proxies too
    const out = toStorable(item)
    expect(isProxy(out)).toBe(false)
    expect(isProxy(out.body)).toBe(false)
    expect(isProxy(out.label)).toBe(false)
    expect(out).toEqual(plainItem())
    expect(() => structuredClone(item)).toThrow(expect.objectContaining({ name: 'DataCloneError' }))
    expect(structuredClone(out)).toEqual(plainItem())
  })

  it('drops what plain data cannot hold, instead of failing later in IndexedDB', () => {
    const odd = reactive({ ...plainItem(), extra: () => 1, missing: undefined })
    const out = toStorable(odd) as OutboxItem & { extra?: unknown }
    expect('extra' in out).toBe(false)
    expect('missing' in out).toBe(false)
  })
})

describe('the device store', () => {
  it('stores a reactive outbox item that IndexedDB itself refuses, and reads back plain data', async () => {
    // The same put without the serialiser: IndexedDB's structured clone refuses the proxy.
    const raw = await openDB('unit-raw', 1, { upgrade: (d) => { d.createObjectStore('s', { keyPath: 'key' }) } })
    await expect(raw.put('s', reactive(plainItem()))).rejects.toMatchObject({ name: 'DataCloneError' })
    raw.close()

    const item = reactive(plainItem())
    item.state = 'refused'
    item.refusal = { status: 409, code: 'over_pick', message: 'Only 0 left to pick on this line.' }
    await pickDevice.putConfirmation(item)
    const [back] = await pickDevice.confirmations()
    expect(isProxy(back)).toBe(false)
    expect(back).toEqual({ ...plainItem(), state: 'refused', refusal: { status: 409, code: 'over_pick', message: 'Only 0 left to pick on this line.' } })
    await pickDevice.deleteConfirmation(item.key)
    expect(await pickDevice.confirmations()).toEqual([])
  })

  it('keeps a reactive pick list as the device copy', async () => {
    const detail = reactive({ id: 7, number: 'PL-00007', lines: [{ id: 21, binCode: 'A-02-1', sku: 'SP-14', remaining: 12 }] }) as unknown as PickListDetail
    await pickDevice.putList(detail, '2026-03-02T14:00:00.000Z')
    const copy = await pickDevice.list(7)
    expect(copy).toEqual({ id: 7, savedAt: '2026-03-02T14:00:00.000Z', detail: { id: 7, number: 'PL-00007', lines: [{ id: 21, binCode: 'A-02-1', sku: 'SP-14', remaining: 12 }] } })
    expect(isProxy(copy?.detail.lines)).toBe(false)
  })

  it('reads a confirmation stored by the earlier version as refused, with its code', async () => {
    const old = await openDB('lumenyard-picking', 2)
    await old.put('confirmations', { ...plainItem(), key: 'old-key-0001', state: 'rejected', errorCode: 'wrong_status', error: 'cancelled' })
    const [back] = await pickDevice.confirmations()
    expect(back).toMatchObject({ key: 'old-key-0001', state: 'refused', refusal: { code: 'wrong_status' } })
    await pickDevice.deleteConfirmation('old-key-0001')
  })
})
