// Vendors and vendor items through the API: validation (e-mail, currency, packs, cost), one
// preferred vendor per item, and who may keep them.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { CSRF, startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import { count, createPurchasingFixture, type PurchasingFixture } from '../support/purchasingFixtures.js'

let h: ApiHarness
let f: PurchasingFixture
beforeAll(async () => {
  h = await startApiHarness()
  f = await createPurchasingFixture(h.ds)
})
afterAll(() => h?.close())

describe('vendors', () => {
  it('creates and edits a vendor with contact, terms, currency and lead time', async () => {
    const buyer = await h.as('buyer')
    const created = await buyer.post('/api/vendors').set(CSRF).send({
      code: `KV${f.tag}`, name: 'Kestrel Valley Glass', contactName: 'Oona Fairweather', email: 'orders@kestrel-valley.example',
      terms: 'Net 45', currency: 'CAD', leadTimeDays: 21,
    })
    expect(created.status, JSON.stringify(created.body)).toBe(201)
    expect(created.body).toMatchObject({ code: `KV${f.tag}`, currency: 'CAD', leadTimeDays: 21, active: true, itemCount: 0, phone: null })
    const edited = await buyer.patch(`/api/vendors/${created.body.id}`).set(CSRF).send({ version: created.body.version, email: '', leadTimeDays: 10 })
    expect(edited.body).toMatchObject({ email: null, leadTimeDays: 10 })
    const dup = await buyer.post('/api/vendors').set(CSRF).send({ code: `KV${f.tag}`, name: 'Copy' })
    expect(dup.status).toBe(409)
    expect(dup.body.error.fields).toHaveProperty('code')
  })

  it('answers 400 with a message per field and writes nothing', async () => {
    const buyer = await h.as('buyer')
    const before = await count(h.ds, 'vendors')
    const res = await buyer.post('/api/vendors').set(CSRF).send({ code: 'bad code!', name: '', email: 'not-mail', currency: 'dollars', leadTimeDays: -3 })
    expect(res.status).toBe(400)
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['code', 'currency', 'email', 'leadTimeDays', 'name'])
    expect(await count(h.ds, 'vendors')).toBe(before)
  })

  it('is kept by buyers and admins only', async () => {
    for (const role of ['warehouse', 'counter', 'viewer'] as const) {
      const agent = await h.as(role)
      expect((await agent.get('/api/vendors')).status).toBe(403)
      expect((await agent.post('/api/vendors').set(CSRF).send({ code: 'X', name: 'X' })).status).toBe(403)
    }
    expect((await (await h.as('admin')).get('/api/vendors')).status).toBe(200)
  })
})

describe('vendor items', () => {
  it('adds, edits and removes what a vendor sells, keeping one preferred vendor per item', async () => {
    const buyer = await h.as('buyer')
    const added = await buyer.post(`/api/vendors/${f.vendorB}/items`).set(CSRF).send({ itemId: f.block.id, vendorSku: 'NB-8812', packQty: 40, minOrderQty: 80, unitCost: '2.3900', leadTimeDays: 9, preferred: true })
    expect(added.status, JSON.stringify(added.body)).toBe(201)
    expect(added.body).toMatchObject({ sku: f.block.sku, vendorSku: 'NB-8812', packQty: 40, minOrderQty: 80, unitCost: '2.3900', preferred: true })
    const prefs = await h.ds.query('SELECT vendor_id, preferred FROM vendor_items WHERE item_id = ? ORDER BY vendor_id', [f.block.id])
    expect(prefs).toEqual([{ vendor_id: f.vendorA, preferred: 0 }, { vendor_id: f.vendorB, preferred: 1 }])
    const again = await buyer.post(`/api/vendors/${f.vendorB}/items`).set(CSRF).send({ itemId: f.block.id, vendorSku: 'X', packQty: 1, minOrderQty: 1, unitCost: '1' })
    expect(again.status).toBe(409)
    const edited = await buyer.patch(`/api/vendors/${f.vendorB}/items/${added.body.id}`).set(CSRF).send({ version: added.body.version, unitCost: '2.41', preferred: false })
    expect(edited.body).toMatchObject({ unitCost: '2.4100', preferred: false })
    const list = await buyer.get(`/api/vendors/${f.vendorB}/items`)
    expect(list.body.map((v: { sku: string }) => v.sku)).toContain(f.block.sku)
    expect((await buyer.delete(`/api/vendors/${f.vendorB}/items/${added.body.id}`).set(CSRF)).status).toBe(200)
    expect((await buyer.delete(`/api/vendors/${f.vendorB}/items/${added.body.id}`).set(CSRF)).status).toBe(404)
    // an item of another vendor can't be reached through this vendor
    const [other] = await h.ds.query('SELECT id, version FROM vendor_items WHERE vendor_id = ? LIMIT 1', [f.vendorA])
    expect((await buyer.patch(`/api/vendors/${f.vendorB}/items/${other.id}`).set(CSRF).send({ version: Number(other.version), unitCost: '1' })).status).toBe(404)
  })

  it('refuses bad packs, costs and unknown items with field messages, writing nothing', async () => {
    const buyer = await h.as('buyer')
    const before = await count(h.ds, 'vendor_items')
    const res = await buyer.post(`/api/vendors/${f.vendorB}/items`).set(CSRF).send({ itemId: f.base.id, vendorSku: '', packQty: 0, minOrderQty: 1.5, unitCost: '12,50' })
    expect(res.status).toBe(400)
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['minOrderQty', 'packQty', 'unitCost', 'vendorSku'])
    const unknown = await buyer.post(`/api/vendors/${f.vendorB}/items`).set(CSRF).send({ itemId: 999999999, vendorSku: 'Z', packQty: 1, minOrderQty: 1, unitCost: '1' })
    expect(unknown.status).toBe(400)
    expect(unknown.body.error.fields).toHaveProperty('itemId')
    expect(await count(h.ds, 'vendor_items')).toBe(before)
  })

  it('offers catalog items and warehouses to choose from', async () => {
    const buyer = await h.as('buyer')
    const items = await buyer.get(`/api/purchasing/items?q=${f.tag}`)
    expect(items.body.map((i: { sku: string }) => i.sku).sort()).toEqual([f.block.sku, f.base.sku, f.sealant.sku].sort())
    expect(items.body.find((i: { sku: string }) => i.sku === f.base.sku).madeToOrder).toBe(true)
    const warehouses = await buyer.get('/api/purchasing/warehouses')
    expect(warehouses.body.map((w: { code: string }) => w.code)).toContain(f.warehouse.code)
  })
})
