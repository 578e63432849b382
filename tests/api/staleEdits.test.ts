// Feature: two edit screens opened on the same record (two tabs, two clerks). Each save carries the version its
// screen loaded; the first save wins, the second (made on the older version) is refused with 409 changed_meanwhile
// and writes nothing (the row is read back from MariaDB); a save on the version read after it succeeds; a save
// without the version is a bad request.
// source: Berenson et al., "A Critique of ANSI SQL Isolation Levels" (SIGMOD 1995), phenomenon P4 "Lost Update":
// a write based on a stale read must not overwrite another transaction's committed write.
// source: RFC 9110 §15.5.10 (409 Conflict: the request conflicts with the current state of the target resource).
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type supertest from 'supertest'
import { CSRF, startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import { createCounterFixture, createCustomerAndJob, openingTakeoff, type CounterFixture } from '../support/counterFixtures.js'
import { countRows } from '../support/fixtureRows.js'
import { createSalesFixture, type SalesFixture } from '../support/salesFixtures.js'

let h: ApiHarness
let counter: supertest.Agent
let fx: CounterFixture
let sales: SalesFixture

beforeAll(async () => {
  h = await startApiHarness()
  counter = await h.as('counter')
  fx = await createCounterFixture(h.ds)
  sales = await createSalesFixture(h.ds)
})
afterAll(() => h?.close())

const row = async (sql: string, id: number) => (await h.ds.query(sql, [id]))[0]

describe('a takeoff saved from two tabs', () => {
  let takeoffId: number
  const IN = 25.4 // mm per inch (source: NIST SP 811 appendix B, exact by definition)

  beforeAll(async () => {
    const { jobId } = await createCustomerAndJob(h.ds, `S${fx.tag}`)
    const created = await counter.post(`/api/jobs/${jobId}/takeoffs`).set(CSRF).send({ name: 'Stair wall', input: openingTakeoff(fx) })
    expect(created.status, JSON.stringify(created.body)).toBe(201)
    takeoffId = created.body.id
  })

  it('keeps the first save and refuses the second made on the same loaded version (409), writing nothing', async () => {
    const tabA = (await counter.get(`/api/takeoffs/${takeoffId}`)).body
    const tabB = (await counter.get(`/api/takeoffs/${takeoffId}`)).body
    expect(tabB.version).toBe(tabA.version)
    const wide = openingTakeoff(fx, { name: 'Stair wall, tab A', segments: [{ kind: 'straight', lengthMm: 96 * IN }] })
    const first = await counter.put(`/api/takeoffs/${takeoffId}`).set(CSRF).send({ version: tabA.version, name: 'Stair wall A', input: wide })
    expect(first.status, JSON.stringify(first.body)).toBe(200)
    expect(first.body.version).toBe(tabA.version + 1)
    const audits = await countRows(h.ds, 'audit_entries', "action = 'takeoff.update' AND entity_id = ?", [String(takeoffId)])

    const narrow = openingTakeoff(fx, { name: 'Stair wall, tab B', segments: [{ kind: 'straight', lengthMm: 24 * IN }] })
    const second = await counter.put(`/api/takeoffs/${takeoffId}`).set(CSRF).send({ version: tabB.version, name: 'Stair wall B', input: narrow })
    expect(second.status).toBe(409)
    expect(second.body.error).toMatchObject({ code: 'changed_meanwhile', params: { name: 'Stair wall A' } })

    const stored = await row('SELECT name, version, input_json AS inputJson FROM takeoffs WHERE id = ?', takeoffId)
    expect(stored.name).toBe('Stair wall A')
    expect(Number(stored.version)).toBe(tabA.version + 1)
    expect(JSON.parse(stored.inputJson).walls[0].name).toBe('Stair wall, tab A')
    expect(await countRows(h.ds, 'audit_entries', "action = 'takeoff.update' AND entity_id = ?", [String(takeoffId)])).toBe(audits)
  })

  it('takes a save made on the version read after the other tab saved', async () => {
    const fresh = (await counter.get(`/api/takeoffs/${takeoffId}`)).body
    const again = await counter.put(`/api/takeoffs/${takeoffId}`).set(CSRF).send({ version: fresh.version, name: 'Stair wall B', input: fresh.input })
    expect(again.status, JSON.stringify(again.body)).toBe(200)
    expect((await row('SELECT name FROM takeoffs WHERE id = ?', takeoffId)).name).toBe('Stair wall B')
  })

  it('refuses a save without the version as a bad request, and a bill saved with a stale takeoff, writing nothing', async () => {
    const before = await row('SELECT name, version FROM takeoffs WHERE id = ?', takeoffId)
    const bare = await counter.put(`/api/takeoffs/${takeoffId}`).set(CSRF).send({ name: 'No version', input: openingTakeoff(fx) })
    expect(bare.status).toBe(400)
    expect(bare.body.error.fields.version).toBeTruthy()
    const { jobId } = (await counter.get(`/api/takeoffs/${takeoffId}`)).body
    const boms = await countRows(h.ds, 'boms', 'takeoff_id = ?', [takeoffId])
    const staleBill = await counter.post(`/api/jobs/${jobId}/boms`).set(CSRF).send({ takeoffId, input: openingTakeoff(fx), version: Number(before.version) - 1 })
    expect(staleBill.status).toBe(409)
    expect(staleBill.body.error.code).toBe('changed_meanwhile')
    const noVersionBill = await counter.post(`/api/jobs/${jobId}/boms`).set(CSRF).send({ takeoffId, input: openingTakeoff(fx) })
    expect(noVersionBill.status).toBe(400)
    expect(await countRows(h.ds, 'boms', 'takeoff_id = ?', [takeoffId])).toBe(boms)
    expect(await row('SELECT name, version FROM takeoffs WHERE id = ?', takeoffId)).toEqual(before)
  })
})

describe('a draft quote saved from two tabs', () => {
  let quoteId: number

  beforeAll(async () => {
    const created = await counter.post('/api/quotes').set(CSRF).send({ customerId: sales.customerId, warehouseId: sales.warehouseId, lines: [{ itemId: sales.block.id, qty: 10 }] })
    expect(created.status, JSON.stringify(created.body)).toBe(201)
    quoteId = created.body.id
  })

  const lineQtys = async () =>
    (await h.ds.query('SELECT qty FROM quote_lines WHERE quote_id = ? ORDER BY line_no', [quoteId])).map((r: { qty: unknown }) => Number(r.qty))

  it('keeps the first save and refuses the second made on the same loaded version (409), writing nothing', async () => {
    const tabA = (await counter.get(`/api/quotes/${quoteId}`)).body
    const tabB = (await counter.get(`/api/quotes/${quoteId}`)).body
    const first = await counter.put(`/api/quotes/${quoteId}`).set(CSRF)
      .send({ version: tabA.version, warehouseId: sales.warehouseId, notes: 'Tab A', lines: [{ itemId: sales.block.id, qty: 40 }] })
    expect(first.status, JSON.stringify(first.body)).toBe(200)
    expect(first.body.version).toBe(tabA.version + 1)
    const second = await counter.put(`/api/quotes/${quoteId}`).set(CSRF)
      .send({ version: tabB.version, warehouseId: sales.warehouseId, notes: 'Tab B', lines: [{ itemId: sales.block.id, qty: 5 }, { itemId: sales.base.id, qty: 1 }] })
    expect(second.status).toBe(409)
    expect(second.body.error).toMatchObject({ code: 'changed_meanwhile', params: { name: tabA.number } })
    expect(await lineQtys()).toEqual([40])
    const stored = await row('SELECT notes, version FROM quotes WHERE id = ?', quoteId)
    expect(stored).toMatchObject({ notes: 'Tab A' })
    expect(Number(stored.version)).toBe(tabA.version + 1)
  })

  it('takes a save made on the version read after the other tab saved; refuses one without a version', async () => {
    const fresh = (await counter.get(`/api/quotes/${quoteId}`)).body
    const bare = await counter.put(`/api/quotes/${quoteId}`).set(CSRF).send({ warehouseId: sales.warehouseId, lines: [{ itemId: sales.block.id, qty: 7 }] })
    expect(bare.status).toBe(400)
    expect(bare.body.error.fields.version).toBeTruthy()
    expect(await lineQtys()).toEqual([40])
    const again = await counter.put(`/api/quotes/${quoteId}`).set(CSRF)
      .send({ version: fresh.version, warehouseId: sales.warehouseId, notes: 'Tab B', lines: [{ itemId: sales.block.id, qty: 5 }, { itemId: sales.base.id, qty: 1 }] })
    expect(again.status, JSON.stringify(again.body)).toBe(200)
    expect(await lineQtys()).toEqual([5, 1])
  })
})

describe('a contractor account changed from two screens', () => {
  let customerId: number

  beforeAll(async () => {
    const created = await counter.post('/api/customers').set(CSRF).send({ code: `SE-${fx.tag}`, name: 'Harbour Glassworks' })
    expect(created.status, JSON.stringify(created.body)).toBe(201)
    customerId = created.body.id
  })

  it('keeps the first change, refuses the second made on the same loaded version (409) and one without a version (400)', async () => {
    const screenA = (await counter.get(`/api/customers/${customerId}`)).body
    const screenB = (await counter.get(`/api/customers/${customerId}`)).body
    const first = await counter.patch(`/api/customers/${customerId}`).set(CSRF).send({ version: screenA.version, phone: '555-0142' })
    expect(first.status, JSON.stringify(first.body)).toBe(200)
    const second = await counter.patch(`/api/customers/${customerId}`).set(CSRF).send({ version: screenB.version, phone: '555-0199', active: false })
    expect(second.status).toBe(409)
    expect(second.body.error).toMatchObject({ code: 'changed_meanwhile', params: { name: 'Harbour Glassworks' } })
    const bare = await counter.patch(`/api/customers/${customerId}`).set(CSRF).send({ phone: '555-0100' })
    expect(bare.status).toBe(400)
    const stored = await row('SELECT phone, active, version FROM customers WHERE id = ?', customerId)
    expect(stored.phone).toBe('555-0142')
    expect(Number(stored.active)).toBe(1)
    expect(Number(stored.version)).toBe(screenA.version + 1)
    const again = await counter.patch(`/api/customers/${customerId}`).set(CSRF).send({ version: first.body.version, phone: '555-0199' })
    expect(again.status).toBe(200)
    expect((await row('SELECT phone FROM customers WHERE id = ?', customerId)).phone).toBe('555-0199')
  })
})

describe('a job changed from two screens', () => {
  let jobId: number

  beforeAll(async () => {
    jobId = (await createCustomerAndJob(h.ds, `J${fx.tag}`)).jobId
  })

  it('keeps the first change, refuses the second made on the same loaded version (409) and one without a version (400)', async () => {
    const screenA = (await counter.get(`/api/jobs/${jobId}`)).body
    const screenB = (await counter.get(`/api/jobs/${jobId}`)).body
    const first = await counter.patch(`/api/jobs/${jobId}`).set(CSRF).send({ version: screenA.version, siteAddress: '14 Quarry Lane' })
    expect(first.status, JSON.stringify(first.body)).toBe(200)
    const second = await counter.patch(`/api/jobs/${jobId}`).set(CSRF).send({ version: screenB.version, siteAddress: '90 Mill Road', status: 'cancelled' })
    expect(second.status).toBe(409)
    expect(second.body.error).toMatchObject({ code: 'changed_meanwhile', params: { name: screenA.name } })
    expect((await counter.patch(`/api/jobs/${jobId}`).set(CSRF).send({ status: 'cancelled' })).status).toBe(400)
    const stored = await row('SELECT site_address AS siteAddress, status, version FROM jobs WHERE id = ?', jobId)
    expect(stored).toMatchObject({ siteAddress: '14 Quarry Lane', status: 'open' })
    expect(Number(stored.version)).toBe(screenA.version + 1)
    const again = await counter.patch(`/api/jobs/${jobId}`).set(CSRF).send({ version: first.body.version, siteAddress: '90 Mill Road' })
    expect(again.status).toBe(200)
    expect((await row('SELECT site_address AS siteAddress FROM jobs WHERE id = ?', jobId)).siteAddress).toBe('90 Mill Road')
  })
})
