// A cycle count from opening to close, through the API on the real MariaDB: blind entry, a pick made
// while a bin is being counted (snapshot + moves since give the right variance), review rules (no
// self-approval, reviewer roles), a recount, the adjustment through the stock service (Idempotency-Key),
// history and accuracy. Quantities are worked by hand beside each check.
import supertest from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { CountDetail, HandheldCount } from '../../shared/schemas/counts.js'
import { CSRF, TEST_PASSWORD, startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import { balanceOf, countRows, fxItem, fxLot, fxWarehouse, ledgerMismatches, receive, tagOf, type FxItem, type FxWarehouse } from '../support/pickFixtures.js'

let h: ApiHarness
let crew: supertest.Agent
let crewB: supertest.Agent
let admin: supertest.Agent
let buyer: supertest.Agent

async function signIn(username: string): Promise<supertest.Agent> {
  await h.user(username, ['warehouse'])
  const agent = supertest.agent(h.built.app)
  const res = await agent.post('/api/session').set(CSRF).send({ username, password: TEST_PASSWORD })
  if (res.status !== 200) throw new Error(`sign-in of ${username} failed`)
  return agent
}

beforeAll(async () => {
  h = await startApiHarness()
  crew = await h.as('warehouse')
  crewB = await signIn('count-crew-b')
  admin = await h.as('admin')
  buyer = await h.as('buyer')
})
afterAll(async () => {
  await admin?.put('/api/counts/settings').set(CSRF).send({ reviewerRoles: [] })
  await h?.close()
})

const post = (agent: supertest.Agent, path: string, body: object, key?: string) => {
  const req = agent.post(path).set(CSRF)
  return (key ? req.set('Idempotency-Key', key) : req).send(body)
}
const handheld = async (agent: supertest.Agent, id: number) => (await agent.get(`/api/counts/${id}/handheld`)).body as HandheldCount
const detail = async (agent: supertest.Agent, id: number) => (await agent.get(`/api/counts/${id}`)).body as CountDetail

describe('a count of three bins with a pick during the count, a recount and approval', () => {
  let wh: FxWarehouse
  let block: FxItem
  let spacer: FxItem
  let lot1: number
  let countId: number
  const tag = tagOf()

  beforeAll(async () => {
    wh = await fxWarehouse(h.ds, `K${tag}`, ['A-01-1', 'A-02-1', 'A-03-1', 'B-01-1'])
    block = await fxItem(h.ds, `CB-${tag}`, { matchLot: true })
    spacer = await fxItem(h.ds, `CS-${tag}`, { family: 'spacer' })
    lot1 = await fxLot(h.ds, block.id, `L1${tag}`, '2026-03-02')
    // Every receipt at 2.50 a unit (pickFixtures.receive), so the moving average is 2.5000 for both items.
    await receive(crew, wh.id, [
      { itemId: block.id, binId: wh.bins['A-01-1'], lotId: lot1, qty: 40 },
      { itemId: spacer.id, binId: wh.bins['A-02-1'], qty: 500 },
    ])
  })

  it('opens a count of a list of bins; the handheld shows the bins and no quantity', async () => {
    const res = await post(crew, '/api/counts', { warehouseId: wh.id, scope: 'bins', binIds: [wh.bins['A-03-1'], wh.bins['A-01-1'], wh.bins['A-02-1']] })
    expect(res.status).toBe(201)
    countId = res.body.id
    const view = await handheld(crew, countId)
    expect(view.bins.map((b) => b.binCode)).toEqual(['A-01-1', 'A-02-1', 'A-03-1'])
    expect(view.current).toBeNull()
    expect(JSON.stringify(view)).not.toMatch(/expected|snapshot|onHand|variance/i)
  })

  it('a pick during the count: snapshot 40, 5 issued meanwhile, 33 counted → expected 35, variance −2', async () => {
    expect((await post(crew, `/api/counts/${countId}/bins/start`, { binScan: 'B:A-01-1' })).status).toBe(200)
    // Picking is never frozen: 5 leave the bin while it is being counted.
    const issue = await post(crew, '/api/stock/issues', { lines: [{ itemId: block.id, binId: wh.bins['A-01-1'], lotId: lot1, qty: 5 }] })
    expect(issue.status).toBe(201)
    const entry = await post(crew, `/api/counts/${countId}/entries`, { binId: wh.bins['A-01-1'], itemId: block.id, lotCode: `L1${tag}`, qty: 33 }, `entry-${tag}-1`)
    expect(entry.status).toBe(200)
    const view = await handheld(crew, countId)
    expect(view.current?.entered).toEqual([expect.objectContaining({ sku: block.sku, lotCode: `L1${tag}`, qty: 33 })])
    expect(view.current?.asked).toEqual([]) // a whole-bin count names nothing in the bin
    const finish = await post(crew, `/api/counts/${countId}/bins/${wh.bins['A-01-1']}/finish`, {})
    expect(finish.body).toMatchObject({ lines: 1, differences: 1, closed: false })

    const d = await detail(admin, countId)
    const line = d.lines.find((l) => l.itemId === block.id)!
    // By hand: 40 + (−5) = 35 expected; 33 − 35 = −2. Against the frozen snapshot it would wrongly be −7.
    expect(line).toMatchObject({ status: 'counted', snapshotQty: 40, movesSince: -5, expectedQty: 35, countedQty: 33, variance: -2 })
    // −2 × 2.50 = −5.00
    expect(line.varianceValue).toBe('-5.00')
    expect(d.movesDuring[line.id]).toEqual([expect.objectContaining({ moveType: 'issue', qty: -5 })])
  })

  it('a counter who is not a reviewer sees the count but none of the ledger figures', async () => {
    const d = await detail(crew, countId)
    const line = d.lines.find((l) => l.itemId === block.id)!
    expect(line).toMatchObject({ countedQty: 33, expectedQty: null, snapshotQty: null, variance: null })
    expect(d.canReview).toBe(false)
  })

  it('counts the second bin right and finds an item in the empty third bin', async () => {
    await post(crew, `/api/counts/${countId}/bins/start`, { binScan: 'A-02-1' }).expect(200)
    await post(crew, `/api/counts/${countId}/entries`, { binId: wh.bins['A-02-1'], itemId: spacer.id, qty: 500 }).expect(200)
    expect((await post(crew, `/api/counts/${countId}/bins/${wh.bins['A-02-1']}/finish`, {})).body).toMatchObject({ differences: 0 })
    await post(crew, `/api/counts/${countId}/bins/start`, { binScan: 'B:A-03-1' }).expect(200)
    await post(crew, `/api/counts/${countId}/entries`, { binId: wh.bins['A-03-1'], itemId: block.id, lotCode: `L1${tag}`, qty: 4 }).expect(200)
    await post(crew, `/api/counts/${countId}/bins/${wh.bins['A-03-1']}/finish`, {}).expect(200)
    const d = await detail(admin, countId)
    expect(d.lines.find((l) => l.itemId === spacer.id)).toMatchObject({ status: 'matched', variance: 0 })
    // Nothing was there: snapshot 0, counted 4, variance +4.
    expect(d.lines.find((l) => l.binId === wh.bins['A-03-1'])).toMatchObject({ source: 'found', status: 'counted', snapshotQty: 0, variance: 4 })
  })

  it('reviewers: only the roles the admin chose, and never the person who counted', async () => {
    const d = await detail(admin, countId)
    const minus = d.lines.find((l) => l.variance === -2)!
    const notChosen = await post(crew, `/api/counts/${countId}/review`, { decisions: [{ lineId: minus.id, action: 'approve' }] })
    expect(notChosen.status).toBe(403)
    expect(notChosen.body.error.code).toBe('count_reviewer_role')
    const buyerTry = await post(buyer, `/api/counts/${countId}/review`, { decisions: [{ lineId: minus.id, action: 'approve' }] })
    expect(buyerTry.body.error.code).toBe('count_reviewer_role')
    await admin.put('/api/counts/settings').set(CSRF).send({ reviewerRoles: ['warehouse'] }).expect(200)
    const self = await post(crew, `/api/counts/${countId}/review`, { decisions: [{ lineId: minus.id, action: 'approve' }] })
    expect(self.status).toBe(403)
    expect(self.body.error.code).toBe('count_self_approval')
    expect(await countRows(h.ds, 'stock_moves', "doc_type = 'cycle_count' AND doc_id = ?", [countId])).toBe(0)
  })

  it('another warehouse person approves: one count move, replayed by its Idempotency-Key, never twice', async () => {
    const d = await detail(crewB, countId)
    const minus = d.lines.find((l) => l.variance === -2)!
    const key = `review-${tag}`
    const first = await post(crewB, `/api/counts/${countId}/review`, { decisions: [{ lineId: minus.id, action: 'approve', note: 'Two broken, swept up' }] }, key)
    expect(first.status).toBe(200)
    expect(first.body).toMatchObject({ approved: 1, recounts: 0, closed: false })
    const again = await post(crewB, `/api/counts/${countId}/review`, { decisions: [{ lineId: minus.id, action: 'approve', note: 'Two broken, swept up' }] }, key)
    expect(again.status).toBe(200)
    expect(again.headers['idempotent-replayed']).toBe('true')
    const moves = await h.ds.query("SELECT move_type, qty, reason, doc_line_id FROM stock_moves WHERE doc_type = 'cycle_count' AND doc_id = ?", [countId])
    expect(moves).toEqual([{ move_type: 'count', qty: -2, reason: 'counted', doc_line_id: minus.id }])
    // 40 received − 5 issued − 2 counted short = 33, what the counter found.
    expect(await balanceOf(h.ds, block.id, wh.bins['A-01-1'])).toEqual({ onHand: 33, reserved: 0 })
  })

  it('a recount of the found line: a new attempt, the bin back on the list, named on the handheld', async () => {
    const found = (await detail(admin, countId)).lines.find((l) => l.binId === wh.bins['A-03-1'])!
    const res = await post(admin, `/api/counts/${countId}/review`, { decisions: [{ lineId: found.id, action: 'recount', note: 'Check the lot label' }] })
    expect(res.body).toMatchObject({ recounts: 1, closed: false })
    const d = await detail(admin, countId)
    expect(d.lines.filter((l) => l.binId === wh.bins['A-03-1']).map((l) => [l.attempt, l.status])).toEqual([[1, 'recounted'], [2, 'waiting']])
    expect(d.bins.find((b) => b.binId === wh.bins['A-03-1'])?.status).toBe('waiting')

    await post(crewB, `/api/counts/${countId}/bins/start`, { binScan: 'B:A-03-1' }).expect(200)
    const view = await handheld(crewB, countId)
    expect(view.current?.asked).toEqual([expect.objectContaining({ sku: block.sku, lotCode: `L1${tag}` })])
    await post(crewB, `/api/counts/${countId}/entries`, { binId: wh.bins['A-03-1'], itemId: block.id, lotCode: `L1${tag}`, qty: 4 }).expect(200)
    await post(crewB, `/api/counts/${countId}/bins/${wh.bins['A-03-1']}/finish`, {}).expect(200)
    const recounted = (await detail(admin, countId)).lines.find((l) => l.binId === wh.bins['A-03-1'] && l.attempt === 2)!
    expect(recounted).toMatchObject({ status: 'counted', variance: 4, countedBy: 'Test count-crew-b' })
    const approve = await post(admin, `/api/counts/${countId}/review`, { decisions: [{ lineId: recounted.id, action: 'approve' }] })
    expect(approve.body).toMatchObject({ approved: 1, closed: true })
    expect(await balanceOf(h.ds, block.id, wh.bins['A-03-1'])).toEqual({ onHand: 4, reserved: 0 })
    expect(await ledgerMismatches(h.ds, [block.id, spacer.id])).toEqual([])
  })

  it('keeps the history per bin and item, and accuracy by warehouse and month', async () => {
    const history = await admin.get(`/api/counts/history?binId=${wh.bins['A-03-1']}`)
    expect(history.body.map((r: { attempt: number; status: string }) => [r.attempt, r.status])).toEqual([[2, 'approved'], [1, 'recounted']])
    const byItem = await admin.get(`/api/counts/history?itemId=${spacer.id}`)
    expect(byItem.body).toEqual([expect.objectContaining({ binCode: 'A-02-1', status: 'matched', variance: 0 })])

    const today = new Date().toISOString().slice(0, 10)
    const acc = await admin.get(`/api/counts/accuracy?from=${today}&to=${today}&warehouseId=${wh.id}`)
    // Lines that stand: −2 (approved), 0 (matched), +4 (approved): 1 right of 3.
    // Values at 2.50: −5.00 and +10.00 → off 15.00, net +5.00.
    expect(acc.body).toEqual([{
      warehouseId: wh.id, warehouseCode: wh.code, month: today.slice(0, 7), linesCounted: 3, linesRight: 1, accuracy: 1 / 3, valueOff: '15.00', valueNet: '5.00',
    }])
    // The warehouse crew does not see costs (admin setting off): no values.
    const crewAcc = await crew.get(`/api/counts/accuracy?from=${today}&to=${today}&warehouseId=${wh.id}`)
    expect(crewAcc.body[0]).not.toHaveProperty('valueOff')
    const audits = await h.ds.query("SELECT action FROM audit_entries WHERE entity = 'cycle_count' AND entity_id = ? ORDER BY id", [String(countId)])
    expect(audits.map((a: { action: string }) => a.action)).toEqual(['count.open', 'count.review', 'count.review', 'count.review', 'count.close'])
  })
})

describe('refusals change nothing', () => {
  let wh: FxWarehouse
  let other: FxWarehouse
  let item: FxItem
  let countId: number
  const tag = tagOf()

  beforeAll(async () => {
    wh = await fxWarehouse(h.ds, `R${tag}`, ['A-01-1', 'A-02-1'])
    other = await fxWarehouse(h.ds, `Q${tag}`, ['A-01-1'])
    item = await fxItem(h.ds, `CR-${tag}`, { family: 'grout' })
    await receive(crew, wh.id, [{ itemId: item.id, binId: wh.bins['A-01-1'], qty: 12 }])
    countId = (await post(crew, '/api/counts', { warehouseId: wh.id, scope: 'aisle', aisle: 'a' })).body.id
  })

  it('refuses bins of another warehouse, an empty aisle, and bad numbers', async () => {
    const before = await countRows(h.ds, 'cycle_counts')
    const stray = await post(crew, '/api/counts', { warehouseId: wh.id, scope: 'bins', binIds: [other.bins['A-01-1']] })
    expect([stray.status, stray.body.error.code]).toEqual([400, 'count_bin_not_in_warehouse'])
    const aisle = await post(crew, '/api/counts', { warehouseId: wh.id, scope: 'aisle', aisle: 'Z' })
    expect([aisle.status, aisle.body.error.code]).toEqual([422, 'count_aisle_empty'])
    const noScope = await post(crew, '/api/counts', { warehouseId: wh.id, scope: 'short_pick' })
    expect(noScope.status).toBe(400)
    expect(await countRows(h.ds, 'cycle_counts')).toBe(before)

    await post(crew, `/api/counts/${countId}/bins/start`, { binScan: 'B:A-01-1' }).expect(200)
    for (const qty of [-1, 1.5, '1e9', 'x']) {
      const bad = await post(crew, `/api/counts/${countId}/entries`, { binId: wh.bins['A-01-1'], itemId: item.id, qty })
      expect(bad.status, String(qty)).toBe(400)
      expect(bad.body.error.fields).toHaveProperty('qty')
    }
    const notStarted = await post(crew, `/api/counts/${countId}/entries`, { binId: wh.bins['A-02-1'], itemId: item.id, qty: 1 })
    expect(notStarted.body.error.code).toBe('count_bin_not_started')
    expect(await countRows(h.ds, 'count_lines', 'count_id = ? AND counted_qty IS NOT NULL', [countId])).toBe(0)
  })

  it('a bin someone else is counting is taken over only when asked', async () => {
    const taken = await post(crewB, `/api/counts/${countId}/bins/start`, { binScan: 'B:A-01-1' })
    expect([taken.status, taken.body.error.code]).toEqual([409, 'count_bin_taken'])
    await post(crewB, `/api/counts/${countId}/bins/start`, { binScan: 'B:A-01-1', takeOver: true }).expect(200)
    const late = await post(crew, `/api/counts/${countId}/entries`, { binId: wh.bins['A-01-1'], itemId: item.id, qty: 12 })
    expect(late.body.error.code).toBe('count_bin_taken')
  })

  it('cancelling (admin only) leaves stock alone', async () => {
    expect((await post(crew, `/api/counts/${countId}/cancel`, { reason: 'x' })).status).toBe(403)
    expect((await post(admin, `/api/counts/${countId}/cancel`, {})).status).toBe(400)
    const res = await post(admin, `/api/counts/${countId}/cancel`, { reason: 'Aisle closed for relining' })
    expect(res.status).toBe(200)
    expect(await countRows(h.ds, 'count_lines', "count_id = ? AND status <> 'cancelled'", [countId])).toBe(0)
    expect(await balanceOf(h.ds, item.id, wh.bins['A-01-1'])).toEqual({ onHand: 12, reserved: 0 })
    const after = await post(crewB, `/api/counts/${countId}/entries`, { binId: wh.bins['A-01-1'], itemId: item.id, qty: 12 })
    expect([after.status, after.body.error.code]).toEqual([409, 'count_not_open'])
  })
})

describe('two counts of one bin', () => {
  it('approving the second variance after the first corrected the record is refused: it would apply twice', async () => {
    const tag = tagOf()
    const wh = await fxWarehouse(h.ds, `T${tag}`, ['A-01-1'])
    const item = await fxItem(h.ds, `CT-${tag}`, { family: 'anchor' })
    await receive(crew, wh.id, [{ itemId: item.id, binId: wh.bins['A-01-1'], qty: 20 }])
    const open = async () => (await post(crew, '/api/counts', { warehouseId: wh.id, scope: 'bins', binIds: [wh.bins['A-01-1']] })).body.id as number
    const [x, y] = [await open(), await open()]
    // Both counters find 17 of the 20 on record: both see a variance of −3.
    for (const [agent, id] of [[crew, x], [crewB, y]] as const) {
      await post(agent, `/api/counts/${id}/bins/start`, { binScan: 'B:A-01-1' }).expect(200)
      await post(agent, `/api/counts/${id}/entries`, { binId: wh.bins['A-01-1'], itemId: item.id, qty: 17 }).expect(200)
      await post(agent, `/api/counts/${id}/bins/${wh.bins['A-01-1']}/finish`, {}).expect(200)
    }
    const lineOf = async (id: number) => (await detail(admin, id)).lines[0]
    expect((await lineOf(y)).variance).toBe(-3)
    await post(admin, `/api/counts/${x}/review`, { decisions: [{ lineId: (await lineOf(x)).id, action: 'approve' }] }).expect(200)
    const second = await post(admin, `/api/counts/${y}/review`, { decisions: [{ lineId: (await lineOf(y)).id, action: 'approve' }] })
    expect([second.status, second.body.error.code]).toEqual([409, 'count_line_stale'])
    // 20 − 3 = 17, once.
    expect(await balanceOf(h.ds, item.id, wh.bins['A-01-1'])).toEqual({ onHand: 17, reserved: 0 })
  })
})

describe('items due by ABC class', () => {
  it('plans the items due and counts only them', async () => {
    const tag = tagOf()
    const wh = await fxWarehouse(h.ds, `D${tag}`, ['A-01-1', 'A-02-1'])
    const a = await fxItem(h.ds, `DA-${tag}`, { family: 'sealant' })
    const b = await fxItem(h.ds, `DB-${tag}`, { family: 'sealant' })
    await receive(crew, wh.id, [{ itemId: a.id, binId: wh.bins['A-01-1'], qty: 10 }, { itemId: b.id, binId: wh.bins['A-01-1'], qty: 3 }])
    const plan = await crew.get(`/api/counts/due?warehouseId=${wh.id}`)
    expect(plan.status).toBe(200)
    // Two stocked items never counted, neither used: both class C, both due.
    expect(plan.body.classes.find((c: { abcClass: string }) => c.abcClass === 'C')).toMatchObject({ items: 2, due: 2, intervalDays: 180 })
    const res = await post(crew, '/api/counts', { warehouseId: wh.id, scope: 'abc_due', classes: ['C'], limit: 1 })
    expect(res.status).toBe(201)
    const id = res.body.id
    const [counted] = await h.ds.query('SELECT item_id FROM count_items WHERE count_id = ?', [id])
    const other = counted.item_id === a.id ? b : a
    await post(crew, `/api/counts/${id}/bins/start`, { binScan: 'B:A-01-1' }).expect(200)
    expect((await handheld(crew, id)).current?.asked.map((x) => x.itemId)).toEqual([counted.item_id])
    const stray = await post(crew, `/api/counts/${id}/entries`, { binId: wh.bins['A-01-1'], itemId: other.id, qty: 1 })
    expect(stray.body.error.code).toBe('count_item_not_asked')
    const none = await post(crew, '/api/counts', { warehouseId: wh.id, scope: 'abc_due', classes: ['A'] })
    expect([none.status, none.body.error.code]).toEqual([422, 'count_nothing_due'])
  })
})
