// Idempotency-Key on stock requests, against the real app and MariaDB.
// source: IETF httpapi draft "The Idempotency-Key HTTP Header Field" (draft-ietf-httpapi-idempotency-key-header):
// the server keeps the first result under the key and answers a retry with it; a key reused with another
// request payload is refused with 422; the request fingerprint is the server's choice (here: the request
// as its schema parsed it).
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import { countRows } from '../support/fixtureRows.js'
import { createStockFixture, type StockFixture } from '../support/stockFixtures.js'

let h: ApiHarness
let fx: StockFixture
beforeAll(async () => {
  h = await startApiHarness()
  fx = await createStockFixture(h.ds)
})
afterAll(() => h?.close())

/** JSON text of an array nested `depth` levels deep: walking it recursively overflows the stack long before 1 MB. */
const deepJson = (depth: number) => '['.repeat(depth) + ']'.repeat(depth)

describe('the key fingerprint is taken of the parsed request', () => {
  it('answers a deep body in a field the schema strips like any other request, not 500', async () => {
    const agent = await h.as('warehouse')
    const body = { warehouseId: fx.warehouses[0].id, lines: [{ itemId: fx.itemId, binId: fx.bins.A1, qty: 4, unitCost: '2.00' }] }
    const key = `deep-${fx.tag}`
    const raw = JSON.stringify(body).replace(/}$/, `,"extra":${deepJson(60_000)}}`)
    const first = await agent.post('/api/stock/receipts').set('X-Lumenyard-Request', '1').set('Idempotency-Key', key).set('Content-Type', 'application/json').send(raw)
    expect(first.status).toBe(201)
    const moves = await countRows(h.ds, 'stock_moves', 'item_id = ?', [fx.itemId])
    // The same request with other stripped fields is the same request: replayed, nothing written.
    const again = await agent.post('/api/stock/receipts').set('X-Lumenyard-Request', '1').set('Idempotency-Key', key)
      .send({ ...body, extra: 'something else', more: [1, 2, 3] })
    expect(again.status).toBe(201)
    expect(again.headers['idempotent-replayed']).toBe('true')
    expect(again.body).toEqual(first.body)
    expect(await countRows(h.ds, 'stock_moves', 'item_id = ?', [fx.itemId])).toBe(moves)
  })

  it('refuses the key with another quantity (422) and writes nothing', async () => {
    const agent = await h.as('warehouse')
    const key = `qty-${fx.tag}`
    const line = (qty: number) => ({ warehouseId: fx.warehouses[0].id, lines: [{ itemId: fx.itemId, binId: fx.bins.A2, qty, unitCost: '2.00' }] })
    expect((await agent.post('/api/stock/receipts').set('X-Lumenyard-Request', '1').set('Idempotency-Key', key).send(line(3))).status).toBe(201)
    const moves = await countRows(h.ds, 'stock_moves', 'item_id = ?', [fx.itemId])
    const other = await agent.post('/api/stock/receipts').set('X-Lumenyard-Request', '1').set('Idempotency-Key', key).send(line(5))
    expect(other.status).toBe(422)
    expect(other.body.error.code).toBe('idempotency_key_reused')
    expect(await countRows(h.ds, 'stock_moves', 'item_id = ?', [fx.itemId])).toBe(moves)
  })
})
