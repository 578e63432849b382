// Fuzzing with fast-check against the real app and MariaDB:
//   1. model-based command sequences on the stock API (valid and invalid receipts, issues, bin moves,
//      adjustments, transfers), each answer and the fixture's balances checked against a model;
//   2. random bodies for every write route in the route table.
// Both: no answer is 5xx, and a fingerprint of the stock tables is unchanged by every refused request.
// source: fast-check model-based testing (fc.commands / fc.asyncModelRun); OWASP ASVS 5.0 V2.2.1 (input
// is validated against expected structure and ranges; bad input is refused, not half-applied).
// LUMENYARD_FUZZ_SEED replays a run; the runs and the seed are printed.
import { randomUUID } from 'node:crypto'
import fc from 'fast-check'
import type supertest from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { routeTable } from '../../server/http/routeTable.js'
import { CSRF, TEST_PASSWORD, startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import { createStockFixture, type StockFixture } from '../support/stockFixtures.js'

const SEED = Number(process.env.LUMENYARD_FUZZ_SEED) || Date.now() % 1_000_000
let h: ApiHarness
let fx: StockFixture
let agent: supertest.Agent
let fuzzUserId: number
beforeAll(async () => {
  h = await startApiHarness()
  fx = await createStockFixture(h.ds)
  // A user of this file's own, so the fingerprint can follow every row it writes.
  const username = `fuzz-${fx.tag}`
  fuzzUserId = (await h.user(username, ['admin', 'counter', 'warehouse', 'buyer'])).id
  agent = h.agent()
  const signIn = await agent.post('/api/session').set(CSRF).send({ username, password: TEST_PASSWORD })
  expect(signIn.status).toBe(200)
})
afterAll(() => h?.close())

/**
 * What a refused request must leave untouched: every row of the fixture's own item, warehouses and bins, and every
 * row the fuzzing user wrote anywhere (ledger, reservations, transfers, idempotency records). Each set is read as a
 * count and a sum of row CRCs, so a changed, added or removed row changes the fingerprint. Scoped to the fuzz's
 * own rows because other API test files write to the same tables while this one runs. Every stock change goes
 * through a ledger row that carries its user (the ledger equals the balances), so a half-applied refusal that
 * touched a demo item still shows as a new row of the fuzzing user.
 */
async function stockFingerprint(): Promise<string> {
  const wh = fx.warehouses.map((w) => w.id)
  const sets: [string, string, string, unknown[]][] = [
    ['stock_balances', 'id, item_id, warehouse_id, bin_id, lot_id, on_hand, reserved', 'item_id = ? OR warehouse_id IN (?)', [fx.itemId, wh]],
    ['stock_reservations', 'id, balance_id, item_id, bin_id, lot_id, qty, doc_type, doc_id', 'item_id = ? OR warehouse_id IN (?) OR user_id = ?', [fx.itemId, wh, fuzzUserId]],
    ['item_warehouses', 'item_id, warehouse_id, avg_cost, min_qty', 'item_id = ? OR warehouse_id IN (?)', [fx.itemId, wh]],
    ['lots', 'id, item_id, code, vendor_id', 'item_id = ?', [fx.itemId]],
    ['bins', 'id, warehouse_id, code, kind, active', 'warehouse_id IN (?)', [wh]],
    ['transfers', 'id, from_warehouse_id, to_warehouse_id, shipped_by, received_by, received_at', 'from_warehouse_id IN (?) OR to_warehouse_id IN (?) OR shipped_by = ? OR received_by = ?', [wh, wh, fuzzUserId, fuzzUserId]],
    ['transfer_lines', 'id, transfer_id, item_id, lot_id, from_bin_id, received_qty', 'item_id = ?', [fx.itemId]],
    ['stock_moves', 'id, move_type, item_id, warehouse_id, bin_id, lot_id, unit_cost', 'item_id = ? OR warehouse_id IN (?) OR user_id = ?', [fx.itemId, wh, fuzzUserId]],
    ['idempotency_records', 'user_id, idem_key, request_hash, response_status', 'user_id = ?', [fuzzUserId]],
  ]
  // One round trip for all the sets (the fuzz reads the fingerprint twice per request, hundreds of times).
  const sql = sets.map(([table, cols, where]) => `SELECT '${table}' AS t, COUNT(*) AS n, COALESCE(SUM(CRC32(CONCAT_WS('|', ${cols}))), 0) AS s FROM ${table} WHERE ${where}`).join(' UNION ALL ')
  const rows = (await h.ds.query(sql, sets.flatMap(([, , , params]) => params))) as { t: string; n: string; s: string }[]
  return rows.map((r) => `${r.t}:${r.n}:${r.s}`).join(',')
}

// ---------------------------------------------------------------- 1. model-based sequences
type Bin = 'A1' | 'A2' | 'A3'
interface Model { onHand: Record<Bin, number>; avgKnown: boolean }
interface Real { refused: number; requests: number; serverErrors: string[] }

const BINS: Bin[] = ['A1', 'A2', 'A3']
const qtyArb = fc.oneof({ arbitrary: fc.integer({ min: 1, max: 40 }), weight: 6 }, { arbitrary: fc.constantFrom(0, -3, 1.5, 1e9, Number.MAX_SAFE_INTEGER + 2), weight: 1 })

async function send(path: string, body: unknown, real: Real): Promise<{ status: number; fingerprintKept: boolean | null }> {
  const before = await stockFingerprint()
  const res = await agent.post(path).set(CSRF).set('Idempotency-Key', randomUUID()).send(body as object)
  real.requests++
  if (res.status >= 500) real.serverErrors.push(`${res.status} ${path} ${JSON.stringify(body)} → ${JSON.stringify(res.body)}`)
  if (res.status < 400) return { status: res.status, fingerprintKept: null }
  real.refused++
  return { status: res.status, fingerprintKept: (await stockFingerprint()) === before }
}

const validQty = (q: number) => Number.isSafeInteger(q) && q > 0 && q <= 1_000_000

class Receive implements fc.AsyncCommand<Model, Real> {
  constructor(readonly bin: Bin, readonly qty: number, readonly cost: string) {}
  check = () => true
  async run(m: Model, r: Real) {
    const res = await send('/api/stock/receipts', { warehouseId: fx.warehouses[0].id, lines: [{ itemId: fx.itemId, binId: fx.bins[this.bin], qty: this.qty, unitCost: this.cost }] }, r)
    const ok = validQty(this.qty) && /^\d{1,8}(\.\d{1,4})?$/.test(this.cost)
    expect(res.status, this.toString()).toBe(ok ? 201 : 400)
    if (ok) m.onHand[this.bin] += this.qty
    else expect(res.fingerprintKept, this.toString()).toBe(true)
    await expectBalances(m)
  }
  toString = () => `receive ${this.qty} @ ${this.cost} into ${this.bin}`
}

class Issue implements fc.AsyncCommand<Model, Real> {
  constructor(readonly bin: Bin, readonly qty: number) {}
  check = () => true
  async run(m: Model, r: Real) {
    const res = await send('/api/stock/issues', { lines: [{ itemId: fx.itemId, binId: fx.bins[this.bin], lotId: null, qty: this.qty }] }, r)
    const expected = !validQty(this.qty) ? 400 : this.qty > m.onHand[this.bin] ? 409 : 201
    expect(res.status, this.toString()).toBe(expected)
    if (expected === 201) m.onHand[this.bin] -= this.qty
    else expect(res.fingerprintKept, this.toString()).toBe(true)
    await expectBalances(m)
  }
  toString = () => `issue ${this.qty} from ${this.bin}`
}

class Move implements fc.AsyncCommand<Model, Real> {
  constructor(readonly from: Bin, readonly to: Bin, readonly qty: number) {}
  check = () => true
  async run(m: Model, r: Real) {
    const res = await send('/api/stock/bin-moves', { itemId: fx.itemId, lotId: null, fromBinId: fx.bins[this.from], toBinId: fx.bins[this.to], qty: this.qty }, r)
    const expected = !validQty(this.qty) || this.from === this.to ? 400 : this.qty > m.onHand[this.from] ? 409 : 201
    expect(res.status, this.toString()).toBe(expected)
    if (expected === 201) { m.onHand[this.from] -= this.qty; m.onHand[this.to] += this.qty }
    else expect(res.fingerprintKept, this.toString()).toBe(true)
    await expectBalances(m)
  }
  toString = () => `move ${this.qty} ${this.from}→${this.to}`
}

class Adjust implements fc.AsyncCommand<Model, Real> {
  constructor(readonly bin: Bin, readonly delta: number, readonly reason: string) {}
  check = () => true
  async run(m: Model, r: Real) {
    const res = await send('/api/stock/adjustments', { itemId: fx.itemId, binId: fx.bins[this.bin], lotId: null, delta: this.delta, reason: this.reason }, r)
    // source for the reason rules: the adjustment form's own rules (found adds, damaged and written off remove).
    const shapeOk = Number.isSafeInteger(this.delta) && this.delta !== 0 && Math.abs(this.delta) <= 1_000_000 && ['counted', 'found', 'damaged', 'written_off'].includes(this.reason)
      && !(this.reason === 'found' && this.delta < 0) && !((this.reason === 'damaged' || this.reason === 'written_off') && this.delta > 0)
    const expected = !shapeOk ? 400 : m.onHand[this.bin] + this.delta < 0 ? 409 : 201
    expect(res.status, this.toString()).toBe(expected)
    if (expected === 201) m.onHand[this.bin] += this.delta
    else expect(res.fingerprintKept, this.toString()).toBe(true)
    await expectBalances(m)
  }
  toString = () => `adjust ${this.bin} by ${this.delta} (${this.reason})`
}

class UnknownPlace implements fc.AsyncCommand<Model, Real> {
  constructor(readonly kind: 'bin' | 'item' | 'lot') {}
  check = () => true
  async run(m: Model, r: Real) {
    const line = { itemId: this.kind === 'item' ? 999_999_999 : fx.itemId, binId: this.kind === 'bin' ? 999_999_999 : fx.bins.A1, lotId: this.kind === 'lot' ? 999_999_999 : null, qty: 1 }
    const res = await send('/api/stock/issues', { lines: [line] }, r)
    expect([404, 409], this.toString()).toContain(res.status)
    expect(res.fingerprintKept, this.toString()).toBe(true)
    await expectBalances(m)
  }
  toString = () => `issue from an unknown ${this.kind}`
}

async function expectBalances(m: Model) {
  const rows = (await h.ds.query('SELECT bin_id, on_hand FROM stock_balances WHERE item_id = ? AND lot_id IS NULL', [fx.itemId])) as { bin_id: number; on_hand: number }[]
  for (const bin of BINS) expect(rows.find((r) => r.bin_id === fx.bins[bin])?.on_hand ?? 0, `on hand in ${bin}`).toBe(m.onHand[bin])
}

const binArb = fc.constantFrom<Bin>(...BINS)
const commands = [
  fc.tuple(binArb, qtyArb, fc.oneof({ arbitrary: fc.constantFrom('2.50', '0', '12.3456'), weight: 5 }, { arbitrary: fc.constantFrom('-1', '1.23456', 'abc', '1e3'), weight: 1 })).map(([b, q, c]) => new Receive(b, q, c)),
  fc.tuple(binArb, qtyArb).map(([b, q]) => new Issue(b, q)),
  fc.tuple(binArb, binArb, qtyArb).map(([f, t, q]) => new Move(f, t, q)),
  fc.tuple(binArb, fc.oneof(fc.integer({ min: -30, max: 30 }), fc.constantFrom(0, 2.5, 2_000_000)), fc.constantFrom('counted', 'found', 'damaged', 'written_off', 'stolen')).map(([b, d, r]) => new Adjust(b, d, r)),
  fc.constantFrom<'bin' | 'item' | 'lot'>('bin', 'item', 'lot').map((k) => new UnknownPlace(k)),
]

describe('fuzzing the stock API', () => {
  it('runs model-based command sequences: answers as the model says, never 5xx, refusals change nothing', async () => {
    const real: Real = { refused: 0, requests: 0, serverErrors: [] }
    let runs = 0
    // Each run starts from the bins' current balances, so runs need no clean-up between them.
    await fc.assert(
      fc.asyncProperty(fc.commands(commands, { size: 'large', maxCommands: 16 }), async (cmds) => {
        runs++
        const rows = (await h.ds.query('SELECT bin_id, on_hand FROM stock_balances WHERE item_id = ? AND lot_id IS NULL', [fx.itemId])) as { bin_id: number; on_hand: number }[]
        const onHand = Object.fromEntries(BINS.map((b) => [b, rows.find((r) => r.bin_id === fx.bins[b])?.on_hand ?? 0])) as Record<Bin, number>
        await fc.asyncModelRun(() => ({ model: { onHand, avgKnown: true }, real }), cmds)
      }),
      { seed: SEED, numRuns: 10, endOnFailure: true },
    )
    console.log(`fuzz model (seed ${SEED}): ${runs} runs, ${real.requests} requests, ${real.refused} refused, ${real.serverErrors.length} answered 5xx`)
    expect(real.serverErrors).toEqual([])
    expect(real.refused).toBeGreaterThan(5)
  })

  it('sends random bodies to every write route: never 5xx, refusals change nothing', async () => {
    const writes = routeTable.filter((r) => r.method !== 'get' && !(r.path === '/api/session' && r.method === 'delete'))
    const field = fc.constantFrom('itemId', 'binId', 'lotId', 'qty', 'lines', 'warehouseId', 'fromBinId', 'toBinId', 'unitCost', 'delta', 'reason', 'name', 'sku', 'status',
      'password', 'username', 'bomId', 'release', 'lineId', 'binScan', 'itemScan', 'acceptShort', 'fromWarehouseId', 'toWarehouseId', 'vendorId', 'note', 'roles', 'active', 'code')
    const value = fc.oneof(fc.integer(), fc.double(), fc.string({ maxLength: 30 }), fc.constant(null), fc.boolean(), fc.constantFrom('=cmd|\' /C calc\'!A1', '1e309', '<script>', '__proto__', '-0'))
    const body = fc.oneof(
      fc.jsonValue({ maxDepth: 3 }),
      fc.dictionary(field, value, { maxKeys: 6 }),
      fc.dictionary(field, fc.oneof(value, fc.array(fc.dictionary(field, value, { maxKeys: 5 }), { maxLength: 3 })), { maxKeys: 6 }),
    )
    // Ids that exist nowhere or are malformed: the fuzz never reaches a demo record that other tests read.
    const param = fc.constantFrom('999999999', '0', '-1', 'abc', '1e3', '%00')
    let requests = 0
    let accepted = 0
    const serverErrors: string[] = []
    const changed: string[] = []
    for (const route of writes) {
      const samples = fc.sample(fc.tuple(body, param), { seed: SEED + requests, numRuns: 4 })
      for (const [b, p] of samples) {
        const url = route.path.replace(/:[A-Za-z]+/g, p)
        const before = await stockFingerprint()
        const res = await agent[route.method](url).set(CSRF).set('Content-Type', 'application/json').send(JSON.stringify(b))
        requests++
        if (res.status >= 500) serverErrors.push(`${res.status} ${route.method.toUpperCase()} ${url} ${JSON.stringify(b).slice(0, 200)} → ${JSON.stringify(res.body)}`)
        if (res.status < 400) { accepted++; continue }
        if ((await stockFingerprint()) !== before) changed.push(`${route.method.toUpperCase()} ${url} → ${res.status}`)
      }
    }
    console.log(`fuzz bodies (seed ${SEED}): ${writes.length} write routes, ${requests} requests, ${accepted} accepted, ${serverErrors.length} answered 5xx, ${changed.length} refusals changed stock`)
    expect(serverErrors).toEqual([])
    expect(changed).toEqual([])
    expect(writes.length).toBeGreaterThan(40)
  }, 180_000) // four requests to each of the (growing number of) write routes, each between two fingerprints
})
