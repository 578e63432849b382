// Pick lists under load, on a real listening server and MariaDB: 20 scanners confirming lines of
// one list at once (exact totals, no over-pick, ledger = balances after completion), two counters
// racing for the last units (exactly one wins, the other gets 409 and nothing is kept), and one
// confirmation sent twice at once (recorded once). Bounded loops; the invariant check follows the
// bank-style totals workload of the Jepsen consistency tests (jepsen-io/jepsen, "bank" workload).
import type { Server } from 'node:http'
import { randomUUID } from 'node:crypto'
import supertest from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { CSRF, TEST_PASSWORD, startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import { countRows, fxBom, fxItem, fxWarehouse, ledgerMismatches, receive, tagOf } from '../support/pickFixtures.js'

let h: ApiHarness
let server: Server
let url: string
beforeAll(async () => {
  h = await startApiHarness()
  server = await new Promise((resolve) => { const s = h.built.app.listen(0, '127.0.0.1', () => resolve(s)) })
  const a = server.address()
  url = `http://127.0.0.1:${typeof a === 'object' && a ? a.port : 0}`
})
afterAll(async () => {
  await new Promise<void>((resolve) => { server?.close(() => resolve()); server?.closeAllConnections() })
  await h?.close()
})

/** Signed-in clients on the listening server: each sign-in costs a bcrypt check, so a few users share their sessions. */
async function clients(role: 'warehouse' | 'counter', n: number, users = 4): Promise<supertest.Agent[]> {
  const cookies: string[] = []
  for (let i = 1; i <= users; i++) {
    const username = `pick-${role}-${i}`
    await h.user(username, [role])
    const res = await supertest(url).post('/api/session').set(CSRF).send({ username, password: TEST_PASSWORD })
    cookies.push((res.headers['set-cookie'] as unknown as string[]).map((c) => c.split(';')[0]).join('; '))
  }
  return Array.from({ length: n }, (_, i) => supertest.agent(url).set('Cookie', cookies[i % users]).set(CSRF))
}

describe('20 scanners on one pick list', () => {
  it('confirms every unit exactly once, refuses over-picks, and completes with ledger = balances', async () => {
    const tag = tagOf()
    const codes = ['A-01-1', 'A-02-1', 'A-03-1', 'B-01-1', 'B-02-1', 'B-03-1', 'C-01-1', 'C-02-1']
    const wh = await fxWarehouse(h.ds, `Q${tag}`, codes, { aisleOrder: 'A,B,C' })
    const items = []
    for (const [i, code] of codes.entries()) items.push({ ...(await fxItem(h.ds, `CC${i}-${tag}`, { family: 'spacer' })), binId: wh.bins[code], binCode: code })
    const [admin] = await clients('warehouse', 1, 1)
    await receive(admin, wh.id, items.map((it) => ({ itemId: it.id, binId: it.binId, qty: 30 })))
    const bom = await fxBom(h.ds, tag, items.map((it) => ({ itemId: it.id, qty: 15 })))
    const counter = (await clients('counter', 1, 1))[0]
    const made = await counter.post('/api/pick-lists').send({ bomId: bom.bomId, warehouseId: wh.id, release: true })
    expect(made.status).toBe(201)
    const id = made.body.ids[0]
    const lines = (await counter.get(`/api/pick-lists/${id}`)).body.lines as { id: number; sku: string; binCode: string }[]

    const scanners = await clients('warehouse', 20)
    const statuses: Record<number, number> = {}
    const done = new Set<number>()
    await Promise.all(scanners.map(async (agent, s) => {
      // Each scanner walks the lines from its own start, 3 units a time, at most 40 tries.
      for (let attempt = 0, li = s % lines.length; attempt < 40 && done.size < lines.length; attempt++) {
        const line = lines[li]
        if (done.has(line.id)) { li = (li + 1) % lines.length; continue }
        const res = await agent.post(`/api/pick-lists/${id}/confirmations`).set('Idempotency-Key', randomUUID())
          .send({ lineId: line.id, binScan: `B:${line.binCode}`, itemScan: line.sku, qty: 3 })
        statuses[res.status] = (statuses[res.status] ?? 0) + 1
        if (res.status === 201 && res.body.remaining < 3) {
          if (res.body.remaining === 0) done.add(line.id)
          else await agent.post(`/api/pick-lists/${id}/confirmations`).set('Idempotency-Key', randomUUID())
            .send({ lineId: line.id, binScan: `B:${line.binCode}`, itemScan: line.sku, qty: res.body.remaining })
        } else if (res.status === 409) {
          expect(res.body.error.code).toBe('over_pick')
          li = (li + 1) % lines.length
        } else expect(res.status).toBe(201)
      }
    }))
    expect(Object.keys(statuses).filter((k) => k !== '201' && k !== '409')).toEqual([])
    const rows = await h.ds.query('SELECT id, qty, confirmed_qty FROM pick_list_lines WHERE pick_list_id = ?', [id])
    expect(rows.map((r: { confirmed_qty: number }) => r.confirmed_qty)).toEqual(rows.map(() => 15))
    const [sum] = await h.ds.query('SELECT SUM(qty) AS qty FROM pick_confirmations WHERE pick_list_id = ?', [id])
    expect(Number(sum.qty)).toBe(120)

    const completed = await scanners[0].post(`/api/pick-lists/${id}/complete`).send({})
    expect(completed.status).toBe(200)
    expect(completed.body.issued).toBe(120)
    expect(completed.body.moves).toBe(await countRows(h.ds, 'pick_confirmations', 'pick_list_id = ?', [id]))
    const [moves] = await h.ds.query(`SELECT COUNT(*) AS n, SUM(qty) AS qty FROM stock_moves WHERE doc_type = 'pick_list' AND doc_id = ?`, [id])
    expect(Number(moves.qty)).toBe(-120)
    expect(Number(moves.n)).toBe(completed.body.moves)
    expect(await ledgerMismatches(h.ds, items.map((i) => i.id))).toEqual([])
    const left = await h.ds.query('SELECT SUM(on_hand) AS on_hand, SUM(reserved) AS reserved FROM stock_balances WHERE item_id IN (?)', [items.map((i) => i.id)])
    expect(left[0]).toEqual({ on_hand: String(8 * 15), reserved: '0' })
  })
})

describe('two counters and the last units', () => {
  it('lets exactly one reserve them; the other gets a clear 409 and keeps nothing (3 rounds)', async () => {
    const [a, b] = await clients('counter', 2, 2)
    const receiver = (await clients('warehouse', 1, 1))[0]
    for (let round = 0; round < 3; round++) {
      const tag = tagOf()
      const wh = await fxWarehouse(h.ds, `R${tag}`, ['A-01-1'])
      const item = await fxItem(h.ds, `LAST-${tag}`, { matchLot: true })
      await receive(receiver, wh.id, [{ itemId: item.id, binId: wh.bins['A-01-1'], qty: 10 }])
      const jobs = [await fxBom(h.ds, tag, [{ itemId: item.id, qty: 10 }]), await fxBom(h.ds, tag, [{ itemId: item.id, qty: 10 }])]
      const answers = await Promise.all([a, b].map((agent, i) => agent.post('/api/pick-lists').send({ bomId: jobs[i].bomId, warehouseId: wh.id })))
      const won = answers.filter((r) => r.status === 201)
      const lost = answers.filter((r) => r.status === 409)
      expect(won).toHaveLength(1)
      expect(lost).toHaveLength(1)
      expect(['stock_taken', 'nothing_to_pick']).toContain(lost[0].body.error.code)
      expect(lost[0].body.error.message.length).toBeGreaterThan(20)
      const loserBom = jobs[answers.indexOf(lost[0])].bomId
      expect(await countRows(h.ds, 'pick_lists', 'bom_id = ?', [loserBom])).toBe(0)
      const [bal] = await h.ds.query('SELECT on_hand, reserved FROM stock_balances WHERE item_id = ?', [item.id])
      expect(bal).toEqual({ on_hand: 10, reserved: 10 })
      expect(await ledgerMismatches(h.ds, [item.id])).toEqual([])
    }
  })
})

describe('one confirmation sent twice at once', () => {
  it('is recorded once, whichever request arrives first', async () => {
    const tag = tagOf()
    const wh = await fxWarehouse(h.ds, `D${tag}`, ['A-01-1'])
    const item = await fxItem(h.ds, `DUP-${tag}`, { family: 'spacer' })
    const [crew] = await clients('warehouse', 1, 1)
    await receive(crew, wh.id, [{ itemId: item.id, binId: wh.bins['A-01-1'], qty: 20 }])
    const bom = await fxBom(h.ds, tag, [{ itemId: item.id, qty: 20 }])
    const [counter] = await clients('counter', 1, 1)
    const id = (await counter.post('/api/pick-lists').send({ bomId: bom.bomId, warehouseId: wh.id, release: true })).body.ids[0]
    const lineId = (await counter.get(`/api/pick-lists/${id}`)).body.lines[0].id
    const key = randomUUID()
    const body = { lineId, binScan: 'B:A-01-1', itemScan: item.sku, qty: 5 }
    const twice = await Promise.all([0, 1].map(() => crew.post(`/api/pick-lists/${id}/confirmations`).set('Idempotency-Key', key).send(body)))
    expect(twice.every((r) => r.status === 201 || r.status === 409)).toBe(true)
    expect(twice.some((r) => r.status === 201)).toBe(true)
    expect(await countRows(h.ds, 'pick_confirmations', 'pick_list_id = ?', [id])).toBe(1)
    const [line] = await h.ds.query('SELECT confirmed_qty FROM pick_list_lines WHERE id = ?', [lineId])
    expect(line.confirmed_qty).toBe(5)
  })
})
