// Feature: selling prices (server/routes/pricing.ts) against the real MariaDB: the admin sets a price level,
// item price rules (a quantity break, a case price), a warehouse's tax rate and an account's level and
// exemption; the counter's "how much?" answers with hand-worked figures; bad input is a 400 naming the
// field with nothing written; the counter may read but not change terms.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type supertest from 'supertest'
import { CSRF, startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import { countRows } from '../support/fixtureRows.js'
import { createSalesFixture, type SalesFixture } from '../support/salesFixtures.js'

let h: ApiHarness
let admin: supertest.Agent
let counter: supertest.Agent
let fx: SalesFixture
let levelId: number

beforeAll(async () => {
  h = await startApiHarness()
  admin = await h.as('admin')
  counter = await h.as('counter')
  fx = await createSalesFixture(h.ds)
})
afterAll(async () => {
  await h?.close()
})

const estimate = (body: Record<string, unknown>) => counter.post('/api/pricing/estimate').set(CSRF).send({ warehouseId: fx.warehouseId, ...body })

describe('setting up selling terms (admin)', () => {
  it('a level 15 % off list, a break at 100 and a case price; the tax rate of the location; the account on the level', async () => {
    const level = await admin.post('/api/pricing/levels').set(CSRF).send({ code: `c-${fx.tag}`, name: 'Contractor', percentOff: '15' })
    expect(level.status).toBe(201)
    expect(level.body).toMatchObject({ code: `C-${fx.tag}`, percentOff: '15.00', accounts: 0 })
    levelId = level.body.id
    expect((await admin.post('/api/pricing/rules').set(CSRF).send({ levelId, itemId: fx.block.id, minQty: 100, price: '19.50' })).status).toBe(201)
    const pack = await admin.post('/api/pricing/rules').set(CSRF).send({ levelId, itemId: fx.spacers.id, basis: 'pack', price: '36.00' })
    expect(pack.status).toBe(201)
    expect(pack.body).toMatchObject({ basis: 'pack', price: '36.00', packSize: 100, levelCode: `C-${fx.tag}` })
    const tax = await admin.put(`/api/pricing/tax-rates/${fx.warehouseId}`).set(CSRF).send({ ratePercent: '8.25', label: 'City and county' })
    expect(tax.status).toBe(200)
    expect(tax.body.find((r: { warehouseId: number }) => r.warehouseId === fx.warehouseId)).toMatchObject({ ratePercent: '8.2500' })
    const terms = await admin.put(`/api/pricing/accounts/${fx.customerId}`).set(CSRF).send({ priceLevelId: levelId })
    expect(terms.status).toBe(200)
    expect(terms.body).toMatchObject({ priceLevelCode: `C-${fx.tag}`, exemptCertificate: null })
  })

  it('bad input is a 400 per field and writes nothing; a duplicate rule is a 409; the counter may not change terms', async () => {
    const before = await countRows(h.ds, 'price_rules')
    const both = await admin.post('/api/pricing/rules').set(CSRF).send({ levelId, itemId: fx.block.id, price: '1.00', percentOff: '5' })
    expect(both.status).toBe(400)
    expect(both.body.error.fields.price.code).toBe('price_rule_one_of')
    const float = await admin.post('/api/pricing/rules').set(CSRF).send({ levelId, itemId: fx.block.id, price: '1.005' })
    expect(float.body.error.fields.price.code).toBe('price_format')
    const over = await admin.post('/api/pricing/levels').set(CSRF).send({ code: 'OVER', name: 'Over', percentOff: '120' })
    expect(over.body.error.fields.percentOff.code).toBe('percent_format')
    // A case price on an item that is not sold by the case.
    const pack = await admin.post('/api/pricing/rules').set(CSRF).send({ levelId, itemId: fx.block.id, basis: 'pack', price: '1.00' })
    expect(pack.status).toBe(400)
    expect(pack.body.error.code).toBe('pack_rule_needs_case')
    const dup = await admin.post('/api/pricing/rules').set(CSRF).send({ levelId, itemId: fx.block.id, minQty: 100, percentOff: '30' })
    expect(dup.status).toBe(409)
    expect(dup.body.error.code).toBe('price_rule_taken')
    const cert = await admin.put(`/api/pricing/accounts/${fx.customerId}`).set(CSRF).send({ priceLevelId: levelId, exemptCertificate: 'RS-1' })
    expect(cert.body.error.fields.exemptUntil.code).toBe('exemption_needs_both')
    const rate = await admin.put(`/api/pricing/tax-rates/${fx.warehouseId}`).set(CSRF).send({ ratePercent: '8,25' })
    expect(rate.body.error.fields.ratePercent.code).toBe('tax_rate_format')
    expect((await counter.post('/api/pricing/rules').set(CSRF).send({ levelId, itemId: fx.block.id, price: '1.00' })).status).toBe(403)
    expect((await counter.put(`/api/pricing/accounts/${fx.customerId}`).set(CSRF).send({ priceLevelId: null })).status).toBe(403)
    expect(await countRows(h.ds, 'price_rules')).toBe(before)
    expect((await counter.get(`/api/pricing/accounts/${fx.customerId}`)).body.priceLevelId).toBe(levelId)
  })

  it('a level in use cannot be removed (409 with the count); the change is audited', async () => {
    const res = await admin.delete(`/api/pricing/levels/${levelId}`).set(CSRF)
    expect(res.status).toBe(409)
    expect(res.body.error).toMatchObject({ code: 'price_level_in_use', params: { accounts: 1 } })
    expect(await countRows(h.ds, 'audit_entries', "action = 'customer.terms' AND entity_id = ?", [String(fx.customerId)])).toBe(1)
  })
})

describe('how much? (the counter)', () => {
  it('prices a list for the account, with the source of every price and the tax rounded once', async () => {
    const res = await estimate({ customerId: fx.customerId, onDay: '2026-12-04', lines: [{ itemId: fx.block.id, qty: 120 }, { itemId: fx.spacers.id, qty: 250 }] })
    expect(res.status).toBe(200)
    const [block, spacers] = res.body.lines
    // 120 blocks reach the break at 100: 120 × 19.50 = 2,340.00.
    expect(block).toMatchObject({ qty: 120, unitPrice: '19.50', extension: '2340.00', explanation: { source: 'break', minQty: 100 } })
    // 250 spacers sold by the case of 100 → 3 cases; the case price 36.00 beats 0.45 × 0.85 = 0.3825 → 0.38 × 100 = 38.00; 3 × 36.00 = 108.00.
    expect(spacers).toMatchObject({ askedQty: 250, qty: 300, packs: 3, packPrice: '36.00', extension: '108.00', explanation: { basis: 'pack' } })
    // Subtotal 2,448.00 × 8.25 % = 201.96 exactly (source: Streamlined Sales and Use Tax Agreement §324 rounding, from memory).
    expect(res.body).toMatchObject({ subtotal: '2448.00', tax: { ratePercent: '8.2500', tax: '201.96' }, amountDue: '2649.96', priceLevelCode: `C-${fx.tag}` })
  })

  it('a walk-in (no account) pays list: 7 × 24.99 = 174.93; tax 174.93 × 8.25 % = 14.431725 → 14.43', async () => {
    const res = await estimate({ lines: [{ itemId: fx.block.id, qty: 7 }] })
    expect(res.body).toMatchObject({ lines: [{ unitPrice: '24.99', explanation: { source: 'list' } }], subtotal: '174.93', tax: { tax: '14.43' }, amountDue: '189.36' })
  })

  it('a tax-exempt account pays no tax while its certificate holds, and tax the day after', async () => {
    await admin.put(`/api/pricing/accounts/${fx.customerId}`).set(CSRF).send({ priceLevelId: levelId, exemptCertificate: 'RS-40112', exemptUntil: '2026-12-31' }).expect(200)
    const lines = [{ itemId: fx.block.id, qty: 10 }]
    // 10 × (24.99 × 0.85 = 21.2415 → 21.24) = 212.40
    const inside = await estimate({ customerId: fx.customerId, onDay: '2026-12-31', lines })
    expect(inside.body).toMatchObject({ subtotal: '212.40', tax: { tax: '0.00', exemptCertificate: 'RS-40112' }, amountDue: '212.40' })
    // 212.40 × 8.25 % = 17.523 → 17.52
    const after = await estimate({ customerId: fx.customerId, onDay: '2027-01-01', lines })
    expect(after.body).toMatchObject({ tax: { tax: '17.52' }, amountDue: '229.92' })
  })

  it('bad numbers are refused per line: 0, a fraction, an unknown item', async () => {
    const res = await estimate({ lines: [{ itemId: fx.block.id, qty: 0 }, { itemId: fx.block.id, qty: 1.5 }] })
    expect(res.status).toBe(400)
    expect(Object.keys(res.body.error.fields)).toEqual(expect.arrayContaining(['lines.0.qty', 'lines.1.qty']))
    const unknown = await estimate({ lines: [{ itemId: 999999999, qty: 1 }] })
    expect(unknown.status).toBe(400)
    expect(unknown.body.error.fields['lines.0.itemId'].code).toBe('item_not_found')
  })

  it('no cost reaches the counter in a price answer', async () => {
    const res = await estimate({ lines: [{ itemId: fx.block.id, qty: 1 }] })
    expect(JSON.stringify(res.body)).not.toMatch(/"(cost|unitCost|avgCost)"/)
    expect(JSON.stringify(res.body)).not.toContain('9.1000')
  })
})
