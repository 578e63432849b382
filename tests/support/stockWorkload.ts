// A conservation workload for the stock API, modelled on the bank workload of Jepsen's consistency tests
// (source: Jepsen, "bank" test: concurrent transfers between accounts while readers check that the total
// is conserved in every snapshot). Here the accounts are balance rows: concurrent clients receive, issue,
// move between bins, ship and put away transfers and confirm pick lines, one bin of one item is hot, and
// readers take consistent snapshots while it runs. Every request carries an Idempotency-Key (IETF draft
// "The Idempotency-Key HTTP Header Field"); some are sent again with the same key and body.
// The checks never use the service under test to compute an expected value: totals come from what the
// clients were told (acknowledged = 2xx), the ledger from the stock_moves rows.
import { randomUUID } from 'node:crypto'
import supertest from 'supertest'
import type { DataSource } from 'typeorm'
import { CSRF, TEST_PASSWORD, type ApiHarness } from './apiHarness.js'
import { insertId, tagOf } from './fixtureRows.js'

export interface WorkloadFixture {
  tag: string
  items: { hot: number; lotted: number }
  lotId: number
  w1: { id: number; bins: { hot: number; a: number; b: number; c: number } }
  w2: { id: number; bins: { d: number; e: number } }
  /** Units received when the fixture was made, per item. */
  seed: Record<number, number>
  pickLists: { id: number; lines: { id: number; itemId: number; sku: string; binCode: string; qty: number }[] }[]
}

/** A seeded generator (mulberry32), so a failing run can be replayed with its seed. */
export function seededRandom(seed: number): () => number {
  let a = seed | 0
  return () => {
    a = (a + 0x6d2b79f5) | 0
    let t = Math.imul(a ^ (a >>> 15), 1 | a)
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296
  }
}

/** Signed-in clients against a URL; a few users share their sessions round-robin (a sign-in costs a bcrypt check). */
export async function signedInClients(h: Pick<ApiHarness, 'user'>, url: string, role: 'warehouse' | 'counter', n: number, users = 4, prefix = 'load'): Promise<supertest.Agent[]> {
  const cookies: string[] = []
  for (let i = 1; i <= users; i++) {
    const username = `${prefix}-${role}-${i}`
    await h.user(username, [role])
    const res = await supertest(url).post('/api/session').set(CSRF).send({ username, password: TEST_PASSWORD })
    if (res.status !== 200) throw new Error(`sign-in of ${username} failed: ${res.status} ${JSON.stringify(res.body)}`)
    cookies.push((res.headers['set-cookie'] as unknown as string[]).map((c) => c.split(';')[0]).join('; '))
  }
  return Array.from({ length: n }, (_, i) => supertest.agent(url).set('Cookie', cookies[i % users]).set(CSRF))
}

/**
 * Two warehouses, two items (one without lots whose bin H is the hot bin, one with a lot), stock received
 * through the API, and released pick lists to confirm during the run.
 */
export async function createWorkloadFixture(ds: DataSource, warehouse: supertest.Agent, counter: supertest.Agent, pickLists = 3): Promise<WorkloadFixture> {
  const tag = tagOf()
  const item = (sku: string) => insertId(ds, `INSERT INTO items (sku, name, family, stock_unit, cost) VALUES (?, ?, 'glass_block', 'each', 0)`, [sku, `Load test block ${sku}`])
  const hot = await item(`LDH-${tag}`)
  const lotted = await item(`LDL-${tag}`)
  const lotId = await insertId(ds, 'INSERT INTO lots (item_id, code, received_at) VALUES (?, ?, CURRENT_DATE)', [lotted, `LD${tag}`])
  const wh = async (code: string, bins: string[]) => {
    const id = await insertId(ds, 'INSERT INTO warehouses (code, name) VALUES (?, ?)', [code, `Load yard ${code}`])
    const out: number[] = []
    for (const b of bins) out.push(await insertId(ds, `INSERT INTO bins (warehouse_id, code, kind) VALUES (?, ?, 'storage')`, [id, b]))
    return { id, out }
  }
  const a = await wh(`LA${tag}`, ['H-01-1', 'A-01-1', 'B-01-1', 'C-01-1'])
  const b = await wh(`LB${tag}`, ['D-01-1', 'E-01-1'])
  const fx: WorkloadFixture = {
    tag, items: { hot, lotted }, lotId,
    w1: { id: a.id, bins: { hot: a.out[0], a: a.out[1], b: a.out[2], c: a.out[3] } },
    w2: { id: b.id, bins: { d: b.out[0], e: b.out[1] } },
    seed: { [hot]: 0, [lotted]: 0 },
    pickLists: [],
  }
  const seedLines = [
    { itemId: hot, binId: fx.w1.bins.hot, lotId: null, qty: 120 },
    { itemId: hot, binId: fx.w1.bins.a, lotId: null, qty: 80 },
    { itemId: hot, binId: fx.w1.bins.b, lotId: null, qty: 60 },
    { itemId: lotted, binId: fx.w1.bins.a, lotId, qty: 90 },
    { itemId: lotted, binId: fx.w1.bins.c, lotId, qty: 90 },
  ]
  const res = await warehouse.post('/api/stock/receipts').set('Idempotency-Key', randomUUID())
    .send({ warehouseId: fx.w1.id, lines: seedLines.map((l) => ({ ...l, unitCost: '3.20' })) })
  if (res.status !== 201) throw new Error(`seed receipt failed: ${res.status} ${JSON.stringify(res.body)}`)
  for (const l of seedLines) fx.seed[l.itemId] += l.qty
  for (let p = 0; p < pickLists; p++) {
    const customerId = await insertId(ds, 'INSERT INTO customers (code, name) VALUES (?, ?)', [`LD${tag}${p}`, `Load test mason ${tag} ${p}`])
    const jobId = await insertId(ds, 'INSERT INTO jobs (customer_id, name) VALUES (?, ?)', [customerId, `Load test wall ${p}`])
    const bomId = await insertId(ds, 'INSERT INTO boms (job_id, revision) VALUES (?, 1)', [jobId])
    await ds.query(`INSERT INTO bom_lines (bom_id, line_no, item_id, description, qty, unit, made_to_order) VALUES (?, 1, ?, 'blocks', 12, 'each', 0), (?, 2, ?, 'blocks', 8, 'each', 0)`, [bomId, hot, bomId, lotted])
    const made = await counter.post('/api/pick-lists').set('Idempotency-Key', randomUUID()).send({ bomId, warehouseId: fx.w1.id, release: true })
    if (made.status !== 201) throw new Error(`pick list failed: ${made.status} ${JSON.stringify(made.body)}`)
    for (const id of made.body.ids as number[]) {
      const detail = await counter.get(`/api/pick-lists/${id}`)
      fx.pickLists.push({ id, lines: (detail.body.lines as { id: number; itemId: number; sku: string; binCode: string; qty: number }[]).map((l) => ({ id: l.id, itemId: l.itemId, sku: l.sku, binCode: l.binCode, qty: l.qty })) })
    }
  }
  return fx
}

export interface SentRequest { path: string; body: object; key: string; status: number; response: unknown; replayed: boolean }

export interface WorkloadStats {
  seed: number
  requests: number
  byStatus: Record<number, number>
  acked: { receipts: number; receiptUnits: number; issues: number; issueUnits: number; moves: number; transfers: number; putAways: number; confirmations: number; completions: number; pickUnits: number }
  /** Moving requests acknowledged for the first time (each wrote one batch of moves). */
  firstAcks: number
  /** Ledger batches written by pick completions (one per confirmation issued). */
  completionBatches: number
  replays: { sent: number; sameAnswer: number; differentAnswer: string[] }
  snapshots: { taken: number; violations: string[] }
  serverErrors: string[]
  ms: number
}

interface Bounds { ackedIn: number; startedIn: number; ackedOut: number; startedOut: number }

/** Runs the workload: `clients` warehouse agents, `opsPerClient` operations each, readers snapshotting meanwhile. */
export async function runWorkload(ds: DataSource, fx: WorkloadFixture, clients: supertest.Agent[], opts: { seed: number; opsPerClient: number; readers?: number }): Promise<WorkloadStats> {
  const rand = seededRandom(opts.seed)
  const stats: WorkloadStats = {
    seed: opts.seed, requests: 0, byStatus: {},
    acked: { receipts: 0, receiptUnits: 0, issues: 0, issueUnits: 0, moves: 0, transfers: 0, putAways: 0, confirmations: 0, completions: 0, pickUnits: 0 },
    firstAcks: 0, completionBatches: 0,
    replays: { sent: 0, sameAnswer: 0, differentAnswer: [] }, snapshots: { taken: 0, violations: [] }, serverErrors: [], ms: 0,
  }
  // Per item: units in and out, acknowledged and started (in flight or done), for the snapshot bounds.
  const bounds = new Map<number, Bounds>([fx.items.hot, fx.items.lotted].map((id) => [id, { ackedIn: 0, startedIn: 0, ackedOut: 0, startedOut: 0 }]))
  const started = Date.now()

  async function send(client: supertest.Agent, path: string, body: object, key: string = randomUUID()): Promise<SentRequest> {
    const res = await client.post(path).set('Idempotency-Key', key).send(body)
    stats.requests++
    stats.byStatus[res.status] = (stats.byStatus[res.status] ?? 0) + 1
    if (res.status >= 500) stats.serverErrors.push(`${res.status} ${path} ${JSON.stringify(res.body)}`)
    return { path, body, key, status: res.status, response: res.body, replayed: res.headers['idempotent-replayed'] === 'true' }
  }

  const w1Bins = [fx.w1.bins.hot, fx.w1.bins.hot, fx.w1.bins.a, fx.w1.bins.b, fx.w1.bins.c]
  const pickFrom = <T>(xs: readonly T[]) => xs[Math.floor(rand() * xs.length)]
  // The lotted item lives in bins A and C with its lot; the hot item anywhere in W1 without a lot.
  const place = () => {
    if (rand() < 0.7) return { itemId: fx.items.hot, binId: pickFrom(w1Bins), lotId: null as number | null }
    return { itemId: fx.items.lotted, binId: pickFrom([fx.w1.bins.a, fx.w1.bins.c]), lotId: fx.lotId as number | null }
  }

  type Plan = (client: supertest.Agent, mine: SentRequest[]) => Promise<void>
  const receipt: Plan = async (client, mine) => {
    const p = place()
    const qty = 1 + Math.floor(rand() * 6)
    const b = bounds.get(p.itemId)!
    b.startedIn += qty
    const r = await send(client, '/api/stock/receipts', { warehouseId: fx.w1.id, lines: [{ ...p, qty, unitCost: (2 + rand() * 3).toFixed(2) }] })
    if (r.status === 201) { b.ackedIn += qty; stats.acked.receipts++; stats.acked.receiptUnits += qty; stats.firstAcks++ }
    mine.push(r)
  }
  const issue: Plan = async (client, mine) => {
    const p = place()
    const qty = 1 + Math.floor(rand() * 6)
    const b = bounds.get(p.itemId)!
    b.startedOut += qty
    const r = await send(client, '/api/stock/issues', { lines: [{ ...p, qty }] })
    if (r.status === 201) { b.ackedOut += qty; stats.acked.issues++; stats.acked.issueUnits += qty; stats.firstAcks++ }
    mine.push(r)
  }
  const move: Plan = async (client, mine) => {
    const p = place()
    const to = p.lotId ? (p.binId === fx.w1.bins.a ? fx.w1.bins.c : fx.w1.bins.a) : pickFrom(w1Bins.filter((x) => x !== p.binId))
    const r = await send(client, '/api/stock/bin-moves', { itemId: p.itemId, lotId: p.lotId, fromBinId: p.binId, toBinId: to, qty: 1 + Math.floor(rand() * 4) })
    if (r.status === 201) { stats.acked.moves++; stats.firstAcks++ }
    mine.push(r)
  }
  const transfer: Plan = async (client, mine) => {
    const p = place()
    const qty = 1 + Math.floor(rand() * 3)
    const r = await send(client, '/api/stock/transfers', { fromWarehouseId: fx.w1.id, toWarehouseId: fx.w2.id, lines: [{ itemId: p.itemId, lotId: p.lotId, fromBinId: p.binId, qty }] })
    mine.push(r)
    if (r.status !== 201) return
    stats.acked.transfers++
    stats.firstAcks++
    const lineId = (r.response as { lines: { id: number }[] }).lines[0].id
    const transferId = (r.response as { transfer: { id: number } }).transfer.id
    const put = await send(client, `/api/stock/transfers/${transferId}/receive`, { lines: [{ lineId, toBinId: pickFrom([fx.w2.bins.d, fx.w2.bins.e]), qty }] })
    if (put.status === 200) { stats.acked.putAways++; stats.firstAcks++ }
    mine.push(put)
  }
  const confirm: Plan = async (client, mine) => {
    const list = pickFrom(fx.pickLists)
    const line = pickFrom(list.lines)
    const r = await send(client, `/api/pick-lists/${list.id}/confirmations`, { lineId: line.id, binScan: `B:${line.binCode}`, itemScan: line.sku, qty: 1 + Math.floor(rand() * 3) })
    if (r.status === 201) stats.acked.confirmations++
    mine.push(r)
  }
  const replay: Plan = async (client, mine) => {
    const earlier = mine.filter((m) => !m.replayed && m.status < 300)
    if (!earlier.length) return
    const first = pickFrom(earlier)
    const again = await send(client, first.path, first.body, first.key)
    stats.replays.sent++
    const same = again.status === first.status && JSON.stringify(again.response) === JSON.stringify(first.response) && again.replayed
    if (same) stats.replays.sameAnswer++
    else stats.replays.differentAnswer.push(`${first.path} ${first.status} → ${again.status} replayed=${again.replayed}`)
  }
  const mix: [number, Plan][] = [[0.3, receipt], [0.55, issue], [0.7, move], [0.8, transfer], [0.9, confirm], [1, replay]]
  const plans = clients.map(() => Array.from({ length: opts.opsPerClient }, () => { const roll = rand(); return mix.find(([p]) => roll < p)![1] }))

  let running = true
  async function reader(): Promise<void> {
    while (running) {
      const before = new Map([...bounds].map(([id, b]) => [id, { ...b }]))
      const qr = ds.createQueryRunner()
      try {
        await qr.query('START TRANSACTION WITH CONSISTENT SNAPSHOT')
        const totals = (await qr.query('SELECT item_id, SUM(on_hand) AS on_hand, SUM(on_hand < 0 OR reserved < 0 OR reserved > on_hand) AS bad FROM stock_balances WHERE item_id IN (?) GROUP BY item_id', [[fx.items.hot, fx.items.lotted]])) as { item_id: number; on_hand: string; bad: string }[]
        const ledger = (await qr.query('SELECT item_id, SUM(qty) AS qty FROM stock_moves WHERE item_id IN (?) GROUP BY item_id', [[fx.items.hot, fx.items.lotted]])) as { item_id: number; qty: string }[]
        await qr.query('COMMIT')
        const after = new Map([...bounds].map(([id, b]) => [id, { ...b }]))
        stats.snapshots.taken++
        for (const t of totals) {
          const id = Number(t.item_id)
          const total = Number(t.on_hand)
          const lo = fx.seed[id] + before.get(id)!.ackedIn - after.get(id)!.startedOut - pickCeiling(fx, id)
          const hi = fx.seed[id] + after.get(id)!.startedIn - before.get(id)!.ackedOut
          if (Number(t.bad) > 0) stats.snapshots.violations.push(`snapshot ${stats.snapshots.taken}: ${t.bad} balance(s) of item ${id} negative or over-reserved`)
          if (total < lo || total > hi) stats.snapshots.violations.push(`snapshot ${stats.snapshots.taken}: item ${id} total ${total} outside [${lo}, ${hi}]`)
          const l = ledger.find((x) => Number(x.item_id) === id)
          if (Number(l?.qty ?? 0) !== total) stats.snapshots.violations.push(`snapshot ${stats.snapshots.taken}: item ${id} ledger ${l?.qty} ≠ balances ${total}`)
        }
      } finally {
        await qr.release()
      }
      await new Promise((r) => setTimeout(r, 50))
    }
  }
  const readers = Array.from({ length: opts.readers ?? 2 }, () => reader())
  await Promise.all(clients.map(async (client, c) => {
    const mine: SentRequest[] = []
    for (const plan of plans[c]) await plan(client, mine)
  }))
  // Pick lists are completed at the end (partial where lines are open): their issues are acknowledged too.
  for (const list of fx.pickLists) {
    const r = await send(clients[0], `/api/pick-lists/${list.id}/complete`, { acceptShort: true })
    if (r.status === 200) {
      const body = r.response as { issued: number; moves: number }
      stats.acked.completions++
      stats.acked.pickUnits += body.issued
      stats.completionBatches += body.moves
    }
  }
  running = false
  await Promise.all(readers)
  stats.ms = Date.now() - started
  return stats
}

/** The most the fixture's pick lists can issue of an item: their lines' quantities (bounds a completion in flight). */
function pickCeiling(fx: WorkloadFixture, itemId: number): number {
  return fx.pickLists.reduce((n, l) => n + l.lines.filter((x) => x.itemId === itemId).reduce((m, x) => m + x.qty, 0), 0)
}

export interface ConservationReport { violations: string[]; figures: Record<string, number | string> }

/**
 * After the run: every balance explained by its ledger, none negative, totals = seed + acknowledged receipts
 * − acknowledged issues − acknowledged picks, and as many ledger batches as acknowledged operations (so no
 * Idempotency-Key made two moves).
 */
export async function checkConservation(ds: DataSource, fx: WorkloadFixture, stats: WorkloadStats): Promise<ConservationReport> {
  const ids = [fx.items.hot, fx.items.lotted]
  const violations: string[] = []
  const rows = (await ds.query(
    `SELECT sb.id, sb.item_id, sb.on_hand, sb.reserved,
            (SELECT COALESCE(SUM(m.qty), 0) FROM stock_moves m WHERE m.item_id = sb.item_id AND m.bin_id = sb.bin_id AND IFNULL(m.lot_id, 0) = sb.lot_key) AS ledger,
            (SELECT COALESCE(SUM(r.qty), 0) FROM stock_reservations r WHERE r.balance_id = sb.id) AS held
       FROM stock_balances sb WHERE sb.item_id IN (?)`, [ids])) as { id: number; item_id: number; on_hand: number; reserved: number; ledger: string; held: string }[]
  for (const r of rows) {
    if (r.on_hand < 0 || r.reserved < 0 || r.reserved > r.on_hand) violations.push(`balance ${r.id}: on hand ${r.on_hand}, reserved ${r.reserved}`)
    if (Number(r.ledger) !== Number(r.on_hand)) violations.push(`balance ${r.id}: ledger ${r.ledger} ≠ on hand ${r.on_hand}`)
    if (Number(r.held) !== Number(r.reserved)) violations.push(`balance ${r.id}: reservations ${r.held} ≠ reserved ${r.reserved}`)
  }
  const total = rows.reduce((n, r) => n + Number(r.on_hand), 0)
  const seed = ids.reduce((n, id) => n + fx.seed[id], 0)
  const expected = seed + stats.acked.receiptUnits - stats.acked.issueUnits - stats.acked.pickUnits
  if (total !== expected) violations.push(`total on hand ${total} ≠ seed ${seed} + receipts ${stats.acked.receiptUnits} − issues ${stats.acked.issueUnits} − picks ${stats.acked.pickUnits} = ${expected}`)
  const [batches] = (await ds.query('SELECT COUNT(DISTINCT batch_id) AS n FROM stock_moves WHERE item_id IN (?)', [ids])) as { n: string }[]
  // The seed receipt wrote one batch; each first acknowledgement one; each issued pick confirmation one.
  const expectedBatches = 1 + stats.firstAcks + stats.completionBatches
  if (Number(batches.n) !== expectedBatches) violations.push(`ledger batches ${batches.n} ≠ 1 seed + ${stats.firstAcks} acknowledged + ${stats.completionBatches} pick moves = ${expectedBatches}`)
  if (stats.replays.differentAnswer.length) violations.push(...stats.replays.differentAnswer.map((d) => `replay answered differently: ${d}`))
  violations.push(...stats.snapshots.violations, ...stats.serverErrors)
  return {
    violations,
    figures: {
      seed: stats.seed, requests: stats.requests, ms: stats.ms, 'requests/s': Math.round((stats.requests * 1000) / Math.max(1, stats.ms)),
      ...Object.fromEntries(Object.entries(stats.byStatus).map(([s, n]) => [`status ${s}`, n])),
      ...stats.acked, replays: stats.replays.sent, snapshots: stats.snapshots.taken, 'total on hand': total, expected, 'ledger batches': Number(batches.n),
    },
  }
}

export async function innodbDeadlocks(ds: DataSource): Promise<number> {
  const [row] = (await ds.query("SHOW GLOBAL STATUS LIKE 'Innodb_deadlocks'")) as { Value: string }[]
  return Number(row?.Value ?? 0)
}
