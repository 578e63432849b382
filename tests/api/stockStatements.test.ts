// How many SQL statements and commits one stock issue costs, counted by MariaDB itself: the app runs on a
// pool of one connection, so that connection's session counters (Questions, Com_commit) cover every
// statement the app's DataSource sends. The session row is read through its own pool and is not counted.
// source: MariaDB Knowledge Base, "Server Status Variables" (Questions: statements sent by the client,
// SHOW STATUS included; Com_commit: COMMIT statements) — the counters are the server's, not ours.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { startApiHarness, CSRF, type ApiHarness } from '../support/apiHarness.js'
import { createStockFixture, type StockFixture } from '../support/stockFixtures.js'

let h: ApiHarness
let fx: StockFixture

async function counters(): Promise<{ questions: number; commits: number }> {
  const rows: { Variable_name: string; Value: string }[] = await h.ds.query(
    "SHOW SESSION STATUS WHERE Variable_name IN ('Questions', 'Com_commit')",
  )
  const value = (name: string) => Number(rows.find((r) => r.Variable_name === name)?.Value)
  return { questions: value('Questions'), commits: value('Com_commit') }
}

/** Statements between two readings, less the second reading's own SHOW (measured on an empty interval). */
async function measure(work: () => Promise<void>): Promise<{ statements: number; commits: number }> {
  const idle0 = await counters()
  const idle1 = await counters()
  const readingCost = idle1.questions - idle0.questions
  const before = await counters()
  await work()
  const after = await counters()
  return { statements: after.questions - before.questions - readingCost, commits: after.commits - before.commits }
}

beforeAll(async () => {
  h = await startApiHarness({}, { pool: 1 })
  fx = await createStockFixture(h.ds)
  await h.ds.query('INSERT INTO stock_balances (item_id, warehouse_id, bin_id, lot_id, on_hand, reserved) VALUES (?, ?, ?, NULL, 50, 0)', [
    fx.itemId, fx.warehouses[0].id, fx.bins.A1,
  ])
})
afterAll(async () => {
  await h?.close()
})

describe('statements per stock issue', () => {
  it('issues one line with an Idempotency-Key in at most 8 statements and one commit', async () => {
    const agent = await h.as('warehouse')
    const body = { lines: [{ itemId: fx.itemId, binId: fx.bins.A1, lotId: null, qty: 3 }] }
    // A first issue warms what the app caches once per process (nothing of it is per request).
    const warm = await agent.post('/api/stock/issues').set(CSRF).set('Idempotency-Key', `stmt-warm-${fx.tag}`).send(body)
    expect(warm.status).toBe(201)
    let status = 0
    const counted = await measure(async () => {
      const res = await agent.post('/api/stock/issues').set(CSRF).set('Idempotency-Key', `stmt-${fx.tag}`).send(body)
      status = res.status
    })
    expect(status).toBe(201)
    // The issue really happened: 50 − 3 − 3 left (checked in the table, not in the answer).
    const [bal] = await h.ds.query('SELECT on_hand FROM stock_balances WHERE item_id = ? AND bin_id = ?', [fx.itemId, fx.bins.A1])
    expect(Number(bal.on_hand)).toBe(44)
    // The least a hand-written transaction for this needs (common practice): START TRANSACTION; INSERT the
    // key's record; one read of the bin, item and cost row; SELECT … FOR UPDATE of the balance; UPDATE the
    // balance; INSERT the ledger row; UPDATE the key's record with the answer; COMMIT = 8. The admin setting
    // that says whether the crew sees costs is read once per process and kept a while (the warm-up read it),
    // not once per request. An ORM re-read of an inserted row, a second commit, the setting read per request,
    // or the bin, item and cost row looked up one by one each push it over (the code before this test ran 13).
    expect(counted.commits).toBe(1)
    expect(counted.statements).toBeLessThanOrEqual(8)
  })
})
