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

/**
 * One record's two edit screens: both load the same version; the first save wins and moves the record to the next
 * version, the second (made on the older one) is refused with 409 changed_meanwhile naming the record and writes
 * nothing (read back from MariaDB), a save without the version is a 400, and a save on the version read after the
 * first succeeds.
 */
interface StaleTrial {
  /** Who edits the record. */
  role: 'admin' | 'buyer'
  /**
   * Makes the record; answers its id and save address, how a screen reads its version, how the refusal names it, and
   * what every save sends besides its changes (a PUT sends the whole record).
   */
  make: (agent: supertest.Agent) => Promise<{ id: number; path: string; read: () => Promise<number>; name: string; whole?: Record<string, unknown> }>
  method: 'patch' | 'put'
  /** The two screens' changes. */
  tabA: Record<string, unknown>
  tabB: Record<string, unknown>
  /** The changed columns and the version, read straight from the table (`?` is the record's id). */
  stored: string
  /** What the stored columns hold after tab A's save, and after tab B's save on the fresh version. */
  afterA: Record<string, unknown>
  afterB: Record<string, unknown>
}

function staleTrial(title: string, trial: StaleTrial) {
  describe(title, () => {
    it('keeps the first change, refuses the second made on the same loaded version (409) and one without a version (400)', async () => {
      const agent = await h.as(trial.role)
      const { path, read, name, id, whole } = await trial.make(agent)
      const save = (body: Record<string, unknown>) => agent[trial.method](path).set(CSRF).send({ ...whole, ...body })
      const screenA = await read()
      const screenB = await read()
      const first = await save({ ...trial.tabA, version: screenA })
      expect(first.status, JSON.stringify(first.body)).toBe(200)
      expect(await read()).toBe(screenA + 1)
      const second = await save({ ...trial.tabB, version: screenB })
      expect(second.status).toBe(409)
      expect(second.body.error).toMatchObject({ code: 'changed_meanwhile', params: { name } })
      const bare = await save(trial.tabB)
      expect(bare.status).toBe(400)
      expect(bare.body.error.fields.version).toBeTruthy()
      const { version, ...columns } = await row(trial.stored, id)
      expect(columns).toEqual(trial.afterA)
      expect(Number(version)).toBe(screenA + 1)
      const again = await save({ ...trial.tabB, version: await read() })
      expect(again.status, JSON.stringify(again.body)).toBe(200)
      const { version: last, ...now } = await row(trial.stored, id)
      expect(now).toEqual(trial.afterB)
      expect(Number(last)).toBe(screenA + 2)
    })
  })
}

const created = async (res: supertest.Response) => {
  expect(res.status, JSON.stringify(res.body)).toBe(201)
  return res.body as { id: number }
}

staleTrial('a catalog item changed from two screens', {
  role: 'admin',
  method: 'patch',
  make: async (admin) => {
    const sku = `SE-${fx.tag}`
    const { id } = await created(await admin.post('/api/items').set(CSRF)
      .send({ sku, name: 'Clear sealant', family: 'sealant', stockUnit: 'each', cost: '6.2500', listPrice: '11.50', cartridgeMl: '300' }))
    return { id, name: sku, path: `/api/items/${id}`, read: async () => (await admin.get(`/api/items/${id}`)).body.item.version }
  },
  tabA: { listPrice: '12.25' },
  tabB: { listPrice: '9.99', name: 'Grey sealant' },
  stored: 'SELECT name, list_price AS listPrice, version FROM items WHERE id = ?',
  afterA: { name: 'Clear sealant', listPrice: '12.25' },
  afterB: { name: 'Grey sealant', listPrice: '9.99' },
})

staleTrial('a vendor changed from two screens', {
  role: 'buyer',
  method: 'patch',
  make: async (buyer) => {
    const { id } = await created(await buyer.post('/api/vendors').set(CSRF).send({ code: `SEV${fx.tag}`, name: 'Tidewater Block Supply' }))
    return { id, name: 'Tidewater Block Supply', path: `/api/vendors/${id}`, read: async () => (await buyer.get(`/api/vendors/${id}`)).body.version }
  },
  tabA: { leadTimeDays: 10 },
  tabB: { leadTimeDays: 30, terms: 'Net 60' },
  stored: 'SELECT lead_time_days AS leadTimeDays, terms, version FROM vendors WHERE id = ?',
  afterA: { leadTimeDays: 10, terms: null },
  afterB: { leadTimeDays: 30, terms: 'Net 60' },
})

staleTrial('what a vendor sells, changed from two screens', {
  role: 'buyer',
  method: 'patch',
  make: async (buyer) => {
    const vendor = await created(await buyer.post('/api/vendors').set(CSRF).send({ code: `SEI${fx.tag}`, name: 'Saltmarsh Glass' }))
    const { id } = await created(await buyer.post(`/api/vendors/${vendor.id}/items`).set(CSRF)
      .send({ itemId: sales.block.id, vendorSku: 'SM-0808', packQty: 8, minOrderQty: 8, unitCost: '7.2000' }))
    const read = async () => ((await buyer.get(`/api/vendors/${vendor.id}/items`)).body as { id: number; version: number }[]).find((l) => l.id === id)!.version
    return { id, name: 'SM-0808', path: `/api/vendors/${vendor.id}/items/${id}`, read }
  },
  tabA: { unitCost: '7.0500' },
  tabB: { unitCost: '6.5000', packQty: 10 },
  stored: 'SELECT unit_cost AS unitCost, pack_qty AS packQty, version FROM vendor_items WHERE id = ?',
  afterA: { unitCost: '7.0500', packQty: 8 },
  afterB: { unitCost: '6.5000', packQty: 10 },
})

staleTrial('a warehouse changed from two screens', {
  role: 'admin',
  method: 'patch',
  make: async (admin) => {
    const code = `W${fx.tag}`.slice(0, 10)
    const { id } = await created(await admin.post('/api/warehouses').set(CSRF).send({ code, name: 'Quarry Road Yard' }))
    return { id, name: code.toUpperCase(), path: `/api/warehouses/${id}`, read: async () => (await admin.get(`/api/warehouses/${id}`)).body.warehouse.version }
  },
  tabA: { address: '2 Quarry Road' },
  tabB: { address: '88 Ferry Street', walkDirection: 'oneWay' },
  stored: 'SELECT address, walk_direction AS walkDirection, version FROM warehouses WHERE id = ?',
  afterA: { address: '2 Quarry Road', walkDirection: 'serpentine' },
  afterB: { address: '88 Ferry Street', walkDirection: 'oneWay' },
})

staleTrial('a price level changed from two screens', {
  role: 'admin',
  method: 'put',
  make: async (admin) => {
    const code = `SE-${fx.tag}`.toUpperCase()
    const { id } = await created(await admin.post('/api/pricing/levels').set(CSRF).send({ code, name: 'Trade', percentOff: '10' }))
    const read = async () => ((await admin.get('/api/pricing/levels')).body as { id: number; version: number }[]).find((l) => l.id === id)!.version
    return { id, name: code, path: `/api/pricing/levels/${id}`, read, whole: { code, active: true } }
  },
  tabA: { name: 'Trade', percentOff: '12' },
  tabB: { name: 'Trade plus', percentOff: '15' },
  stored: 'SELECT name, percent_off AS percentOff, version FROM price_levels WHERE id = ?',
  afterA: { name: 'Trade', percentOff: '12.00' },
  afterB: { name: 'Trade plus', percentOff: '15.00' },
})

// A price rule (one break of an item's price) is never changed in place: a new price is a rule removed and another
// added, and the table's unique key (item, level, basis, least quantity) refuses a second rule for the same break.
// So what one screen can get wrong is removing a rule another screen has already removed, or replaced meanwhile.
// source: RFC 9110 §15.5.5 (404 Not Found: the origin server has no current representation for the target resource).
describe('a price rule removed from two screens', () => {
  it('removes it once; the second removal is refused (404) and removes nothing else, not the rule that replaced it', async () => {
    const admin = await h.as('admin')
    const rule = (price: string) => ({ levelId: null, itemId: sales.block.id, minQty: 12, basis: 'unit', price, percentOff: null })
    const made = await admin.post('/api/pricing/rules').set(CSRF).send(rule('21.50'))
    expect(made.status, JSON.stringify(made.body)).toBe(201)
    const itemRules = () => h.ds.query('SELECT id, price FROM price_rules WHERE item_id = ? ORDER BY id', [sales.block.id]) as Promise<{ id: number; price: string }[]>
    const removals = () => countRows(h.ds, 'audit_entries', "action = 'price_rule.delete' AND entity_id = ?", [String(made.body.id)])

    // Screen A removes the rule and adds the same break at a new price; screen B still lists the old rule.
    expect((await admin.delete(`/api/pricing/rules/${made.body.id}`).set(CSRF)).status).toBe(200)
    const replaced = await admin.post('/api/pricing/rules').set(CSRF).send(rule('19.75'))
    expect(replaced.status, JSON.stringify(replaced.body)).toBe(201)
    const before = await itemRules()
    expect(await removals()).toBe(1)

    const stale = await admin.delete(`/api/pricing/rules/${made.body.id}`).set(CSRF)
    expect(stale.status).toBe(404)
    expect(stale.body.error.code).toBe('price_rule_not_found')
    expect(await itemRules()).toEqual(before)
    expect(before.map((r) => [Number(r.id), r.price])).toEqual([[replaced.body.id, '19.75']])
    expect(await removals()).toBe(1)

    // Adding the old break again from screen B is refused too: the new price stays.
    const again = await admin.post('/api/pricing/rules').set(CSRF).send(rule('21.50'))
    expect(again.status).toBe(409)
    expect(again.body.error.code).toBe('price_rule_taken')
    expect(await itemRules()).toEqual(before)
  })
})
