// The stock service under parallel load, over real HTTP: many warehouse clients issuing, moving and
// transferring against the same few balances at once, then the ledger checked against the balances.
// The invariants are those of a bank: nothing goes negative, the ledger explains every balance, stock
// is conserved (source: the "bank" workload of the Jepsen consistency tests, jepsen-io/jepsen).
// Idempotency-Key behaviour follows the IETF draft "The Idempotency-Key HTTP Header Field".
import { randomUUID } from 'node:crypto'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type supertest from 'supertest'
import { applyReceipt, EMPTY_COST_STATE } from '../../shared/inventory/movingAverage.js'
import { reserve } from '../../server/services/stock/stockReservations.js'
import { startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import {
  createItem, createStockFixture, ledgerCount, listen, warehouseClients, type Listening, type StockFixture,
} from '../support/stockFixtures.js'

let h: ApiHarness
let net: Listening
let clients: supertest.Agent[]
let fx: StockFixture

beforeAll(async () => {
  h = await startApiHarness()
  net = await listen(h)
  clients = await warehouseClients(h, net.url, 30)
  fx = await createStockFixture(h.ds)
})
afterAll(async () => {
  await net?.close()
  await h?.close()
})

interface Answer { status: number; body: Record<string, unknown>; replayed: boolean }

async function post(client: supertest.Agent, path: string, body: object, key: string = randomUUID()): Promise<Answer> {
  const res = await client.post(path).set('Idempotency-Key', key).send(body)
  return { status: res.status, body: res.body, replayed: res.headers['idempotent-replayed'] === 'true' }
}

/** A small deterministic generator (mulberry32), so a failing run can be replayed. */
function random(seed: number) {
  let a = seed
  return () => {
    a = (a + 0x6d2b79f5) | 0
    let t = Math.imul(a ^ (a >>> 15), 1 | a)
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296
  }
}

async function balancesOf(itemId: number) {
  return h.ds.query(
    `SELECT b.id, b.bin_id, b.lot_id, b.on_hand, b.reserved,
            (SELECT COALESCE(SUM(m.qty), 0) FROM stock_moves m
              WHERE m.item_id = b.item_id AND m.bin_id = b.bin_id AND m.lot_id <=> b.lot_id) AS ledger,
            (SELECT COALESCE(SUM(r.qty), 0) FROM stock_reservations r WHERE r.balance_id = b.id) AS held
       FROM stock_balances b WHERE b.item_id = ?`,
    [itemId],
  ) as Promise<{ id: number; bin_id: number; lot_id: number | null; on_hand: number; reserved: number; ledger: string; held: string }[]>
}

async function expectLedgerExplainsBalances(itemId: number) {
  const rows = await balancesOf(itemId)
  for (const r of rows) {
    expect(r.on_hand, `balance ${r.id}`).toBeGreaterThanOrEqual(0)
    expect(r.reserved, `balance ${r.id}`).toBeGreaterThanOrEqual(0)
    expect(r.reserved, `balance ${r.id}`).toBeLessThanOrEqual(r.on_hand)
    expect(Number(r.ledger), `ledger of balance ${r.id}`).toBe(r.on_hand)
    expect(Number(r.held), `reservations of balance ${r.id}`).toBe(r.reserved)
  }
  // And no ledger group without a balance row.
  const [orphans] = await h.ds.query(
    `SELECT COUNT(*) AS n FROM (SELECT m.bin_id, m.lot_id FROM stock_moves m WHERE m.item_id = ? GROUP BY m.bin_id, m.lot_id) g
      WHERE NOT EXISTS (SELECT 1 FROM stock_balances b WHERE b.item_id = ? AND b.bin_id = g.bin_id AND b.lot_id <=> g.lot_id)`,
    [itemId, itemId],
  )
  expect(Number(orphans.n)).toBe(0)
  return rows
}

const INITIAL = { A1: 120, A2: 60, A3: 80 }

type Op = () => Promise<{ answer: Answer; issued: number; transferId?: number }>

function planOps(rand: () => number): Op[] {
  const ops: Op[] = []
  const pick = <T>(xs: T[]) => xs[Math.floor(rand() * xs.length)]
  for (let c = 0; c < clients.length; c++) {
    const client = clients[c]
    for (let k = 0; k < 6; k++) {
      const roll = rand()
      const qty = 1 + Math.floor(rand() * 5)
      if (roll < 0.4) {
        const bin = pick(['A1', 'A2', 'A3'] as const)
        const lotId = bin === 'A3' ? null : fx.lotId
        ops.push(async () => {
          const answer = await post(client, '/api/stock/issues', { lines: [{ itemId: fx.itemId, binId: fx.bins[bin], lotId, qty }] })
          return { answer, issued: answer.status === 201 ? qty : 0 }
        })
      } else if (roll < 0.75) {
        const [from, to] = rand() < 0.5 ? ['A1', 'A2'] : ['A2', 'A1']
        ops.push(async () => ({
          answer: await post(client, '/api/stock/bin-moves', { itemId: fx.itemId, lotId: fx.lotId, fromBinId: fx.bins[from], toBinId: fx.bins[to], qty }),
          issued: 0,
        }))
      } else {
        const from = pick(['A1', 'A2'])
        ops.push(async () => {
          const answer = await post(client, '/api/stock/transfers', {
            fromWarehouseId: fx.warehouses[0].id, toWarehouseId: fx.warehouses[1].id,
            lines: [{ itemId: fx.itemId, lotId: fx.lotId, fromBinId: fx.bins[from], qty }],
          })
          const transfer = answer.body.transfer as { id: number } | undefined
          return { answer, issued: 0, transferId: answer.status === 201 ? transfer?.id : undefined }
        })
      }
    }
  }
  return ops
}

/** Three copies of one issue under one key, sent at the same moment by one user (keys are per user). */
function replayGroup(i: number): () => Promise<Answer[]> {
  const key = `replay-${fx.tag}-${i}`
  const body = { lines: [{ itemId: fx.itemId, binId: fx.bins.A3, lotId: null, qty: 1 }] }
  // Clients i, i+6 and i+12 share user i (warehouseClients hands out six sign-ins round-robin).
  return () => Promise.all([0, 6, 12].map((j) => post(clients[i + j], '/api/stock/issues', body, key)))
}

describe('parallel clients against the same balances', () => {
  it('keeps every balance explained by the ledger, refuses only with 409 and applies replays once', async () => {
    const receipt = await post(clients[0], '/api/stock/receipts', {
      warehouseId: fx.warehouses[0].id,
      lines: [
        { itemId: fx.itemId, binId: fx.bins.A1, lotId: fx.lotId, qty: INITIAL.A1, unitCost: '4.50' },
        { itemId: fx.itemId, binId: fx.bins.A2, lotId: fx.lotId, qty: INITIAL.A2, unitCost: '4.50' },
        { itemId: fx.itemId, binId: fx.bins.A3, qty: INITIAL.A3, unitCost: '4.50' },
      ],
    })
    expect(receipt.status).toBe(201)
    // A pick list holds 15 in A1: issues may not take them.
    await h.ds.transaction((em) => reserve(em, { userId: null }, {
      doc: { docType: 'test_hold', docId: 1 }, lines: [{ itemId: fx.itemId, binId: fx.bins.A1, lotId: fx.lotId, qty: 15 }],
    }))
    const ops = planOps(random(20240611))
    const groups = Array.from({ length: 6 }, (_, i) => replayGroup(i))
    const [results, replays] = await Promise.all([Promise.all(ops.map((op) => op())), Promise.all(groups.map((g) => g()))])

    const statuses = results.map((r) => r.answer.status)
    const unexpected = results.filter((r) => r.answer.status !== 201 && r.answer.status !== 409)
    expect(unexpected.map((r) => `${r.answer.status} ${JSON.stringify(r.answer.body)}`)).toEqual([])
    expect(statuses.filter((s) => s === 201).length).toBeGreaterThan(ops.length / 3)

    // Replays: one answer per key, the same status and body three times, applied once.
    let replayIssued = 0
    for (const group of replays) {
      expect(new Set(group.map((a) => a.status)).size).toBe(1)
      expect(group[1].body).toEqual(group[0].body)
      expect(group[2].body).toEqual(group[0].body)
      if (group[0].status === 201) {
        expect(group.filter((a) => a.replayed).length).toBe(2)
        const [row] = await h.ds.query('SELECT COUNT(*) AS n FROM stock_moves WHERE batch_id = ?', [group[0].body.batchId])
        expect(Number(row.n)).toBe(1)
        replayIssued += 1
      } else {
        expect(group[0].status).toBe(409)
      }
    }

    // Put away every shipped transfer, each by two people at once: one wins, the other gets 409.
    const transferIds = results.map((r) => r.transferId).filter((id): id is number => id !== undefined)
    expect(transferIds.length).toBeGreaterThan(0)
    const receives = await Promise.all(transferIds.map(async (id, i) => {
      const [{ id: lineId, qty }] = await h.ds.query('SELECT id, qty FROM transfer_lines WHERE transfer_id = ?', [id])
      const body = { lines: [{ lineId, toBinId: fx.bins.B1, qty }] }
      return Promise.all([post(clients[i % 30], `/api/stock/transfers/${id}/receive`, body), post(clients[(i + 7) % 30], `/api/stock/transfers/${id}/receive`, body)])
    }))
    for (const pair of receives) expect(pair.map((a) => a.status).sort()).toEqual([200, 409])

    const rows = await expectLedgerExplainsBalances(fx.itemId)
    const issued = results.reduce((n, r) => n + r.issued, 0) + replayIssued
    const total = rows.reduce((n, r) => n + r.on_hand, 0)
    expect(total).toBe(INITIAL.A1 + INITIAL.A2 + INITIAL.A3 - issued)
    const reservedA1 = rows.find((r) => r.bin_id === fx.bins.A1 && r.lot_id === fx.lotId)!
    expect(reservedA1.reserved).toBe(15)
    // Each success wrote its own batch: the initial receipt + successes + replays applied once + put-aways.
    const [batches] = await h.ds.query('SELECT COUNT(DISTINCT batch_id) AS n FROM stock_moves WHERE item_id = ?', [fx.itemId])
    expect(Number(batches.n)).toBe(1 + statuses.filter((s) => s === 201).length + replayIssued + transferIds.length)
  })

  it('refuses the same key with another body (422) and writes nothing for it', async () => {
    const bin = fx.bins.A4
    expect((await post(clients[0], '/api/stock/receipts', {
      warehouseId: fx.warehouses[0].id, lines: [{ itemId: fx.itemId, binId: bin, qty: 20, unitCost: '4.50' }],
    })).status).toBe(201)
    const key = `reuse-${fx.tag}`
    const line = (qty: number) => ({ lines: [{ itemId: fx.itemId, binId: bin, lotId: null, qty }] })
    // Keys belong to one user (the draft scopes them to the client): clients 1, 7, 13, 19 share one sign-in.
    const first = await post(clients[1], '/api/stock/issues', line(1), key)
    expect(first.status).toBe(201)
    const before = await ledgerCount(h.ds)
    const other = await post(clients[7], '/api/stock/issues', line(2), key)
    expect(other.status).toBe(422)
    expect(other.body.error).toMatchObject({ code: 'idempotency_key_reused' })
    expect(await ledgerCount(h.ds)).toBe(before)

    // Sent at the same moment: one applies, the other is refused, whichever came first.
    const key2 = `reuse2-${fx.tag}`
    const both = await Promise.all([post(clients[13], '/api/stock/issues', line(1), key2), post(clients[19], '/api/stock/issues', line(3), key2)])
    expect(both.map((a) => a.status).sort()).toEqual([201, 422])
    const [bal] = await h.ds.query('SELECT on_hand FROM stock_balances WHERE item_id = ? AND bin_id = ? AND lot_id IS NULL', [fx.itemId, bin])
    const applied = both[0].status === 201 ? 1 : 3
    expect(bal.on_hand).toBe(20 - 1 - applied)
    await expectLedgerExplainsBalances(fx.itemId)
  })
})

describe('first use of a new lot or warehouse by many at once', () => {
  it('receives one new lot code from 12 clients at once into one lot, and ships 12 first transfers into a fresh warehouse', async () => {
    const lotCode = `N${fx.tag}`
    const receipts = await Promise.all(clients.slice(0, 12).map((c, i) => post(c, '/api/stock/receipts', {
      warehouseId: fx.warehouses[0].id, lines: [{ itemId: fx.itemId, binId: i % 2 ? fx.bins.A4 : fx.bins.A5, lotCode, qty: 5, unitCost: '4.50' }],
    })))
    expect(receipts.map((r) => r.status)).toEqual(Array(12).fill(201))
    const lots = await h.ds.query('SELECT id FROM lots WHERE item_id = ? AND code = ?', [fx.itemId, lotCode])
    expect(lots).toHaveLength(1)
    // A warehouse no transfer went to yet: its transit bin is made by whichever request comes first.
    const fresh = await h.ds.query(`INSERT INTO warehouses (code, name) VALUES (?, 'Fresh test yard')`, [`F${fx.tag}`])
    const freshId = Number(fresh.insertId)
    const shipped = await Promise.all(clients.slice(12, 24).map((c, i) => post(c, '/api/stock/transfers', {
      fromWarehouseId: fx.warehouses[0].id, toWarehouseId: freshId,
      lines: [{ itemId: fx.itemId, lotId: lots[0].id, fromBinId: i % 2 ? fx.bins.A4 : fx.bins.A5, qty: 1 }],
    })))
    expect(shipped.map((r) => r.status)).toEqual(Array(12).fill(201))
    const [transit] = await h.ds.query(`SELECT COUNT(*) AS n FROM bins WHERE warehouse_id = ? AND kind = 'transit'`, [freshId])
    expect(Number(transit.n)).toBe(1)
    await expectLedgerExplainsBalances(fx.itemId)
  })
})

describe('100 issues of one unit against a balance of 10', () => {
  it('lets exactly 10 through (201) and refuses 90 with 409', async () => {
    const bin = fx.bins.A5
    const receipt = await post(clients[0], '/api/stock/receipts', {
      warehouseId: fx.warehouses[0].id, lines: [{ itemId: fx.itemId, binId: bin, qty: 10, unitCost: '4.50' }],
    })
    expect(receipt.status).toBe(201)
    const body = { lines: [{ itemId: fx.itemId, binId: bin, lotId: null, qty: 1 }] }
    const answers = await Promise.all(Array.from({ length: 100 }, (_, i) => post(clients[i % clients.length], '/api/stock/issues', body)))
    const count = (s: number) => answers.filter((a) => a.status === s).length
    expect(count(201)).toBe(10)
    expect(count(409)).toBe(90)
    for (const a of answers.filter((x) => x.status === 409)) expect((a.body.error as { code: string }).code).toBe('insufficient_stock')
    const [bal] = await h.ds.query('SELECT on_hand FROM stock_balances WHERE item_id = ? AND bin_id = ? AND lot_id IS NULL', [fx.itemId, bin])
    expect(bal.on_hand).toBe(0)
    await expectLedgerExplainsBalances(fx.itemId)
  })
})

describe('moving-average cost through the API', () => {
  // The rule is shared/inventory/movingAverage.ts, unit-tested against Weygandt, Kimmel & Kieso,
  // Accounting Principles (inventory chapter, moving-average example, from memory): 100 @ 10 then
  // 200 @ 11 → 3,200 / 300 = 10.6667 at our 4-place rounding.
  const expected = applyReceipt(applyReceipt(EMPTY_COST_STATE, 100, '10.00').after, 200, '11.00').after.averageCost

  async function averageOf(itemId: number, warehouseId: number): Promise<string> {
    const [row] = await h.ds.query('SELECT avg_cost FROM item_warehouses WHERE item_id = ? AND warehouse_id = ?', [itemId, warehouseId])
    return row.avg_cost
  }

  it('blends two receipts as the shared rule does', async () => {
    expect(expected).toBe('10.6667')
    const itemId = await createItem(h.ds, `AVG-${fx.tag}`)
    const wh = fx.warehouses[0].id
    for (const [qty, unitCost] of [[100, '10.00'], [200, '11.00']] as const) {
      const res = await post(clients[0], '/api/stock/receipts', { warehouseId: wh, lines: [{ itemId, binId: fx.bins.A1, qty, unitCost }] })
      expect(res.status).toBe(201)
    }
    expect(await averageOf(itemId, wh)).toBe(expected)
  })

  it('blends two lines of one receipt the same way, and carries the average with a transfer', async () => {
    const itemId = await createItem(h.ds, `AVG2-${fx.tag}`)
    const [w1, w2] = fx.warehouses.map((w) => w.id)
    const res = await post(clients[0], '/api/stock/receipts', {
      warehouseId: w1,
      lines: [{ itemId, binId: fx.bins.A1, qty: 100, unitCost: '10.00' }, { itemId, binId: fx.bins.A2, qty: 200, unitCost: '11.00' }],
    })
    expect(res.status).toBe(201)
    expect(await averageOf(itemId, w1)).toBe(expected)
    const shipped = await post(clients[1], '/api/stock/transfers', {
      fromWarehouseId: w1, toWarehouseId: w2, lines: [{ itemId, lotId: null, fromBinId: fx.bins.A1, qty: 30 }],
    })
    expect(shipped.status).toBe(201)
    // Nothing was in the receiving warehouse, so it takes the shipped cost (applyReceipt on an empty state).
    expect(await averageOf(itemId, w2)).toBe(applyReceipt(EMPTY_COST_STATE, 30, expected).after.averageCost)
    expect(await averageOf(itemId, w1)).toBe(expected) // shipping out leaves the average unchanged
  })
})
