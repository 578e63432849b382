// Feature: the admin's takeoff settings (server/routes/takeoffSettings.ts): waste allowances, material
// rules switched off, changed and put back, and the role → item mapping with its checks. Every change
// shows in the next computed bill; bad input is a 400 naming the field, with nothing written.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type supertest from 'supertest'
import { defaultMaterialRules } from '../../shared/takeoff/materials.js'
import { CSRF, startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import { createCounterFixture, IN, openingTakeoff, type CounterFixture } from '../support/counterFixtures.js'

let h: ApiHarness
let admin: supertest.Agent
let counter: supertest.Agent
let fx: CounterFixture

beforeAll(async () => {
  h = await startApiHarness()
  admin = await h.as('admin')
  counter = await h.as('counter')
  fx = await createCounterFixture(h.ds)
})
afterAll(async () => {
  // Settings are shared by every test file: put them back as shipped.
  await admin?.patch('/api/takeoff-settings/waste').set(CSRF).send({ block: null })
  await admin?.delete('/api/takeoff-settings/rules/screws').set(CSRF)
  await admin?.delete('/api/takeoff-settings/rules/blocks').set(CSRF)
  await h?.close()
})

const count = async (table: string) => Number((await h.ds.query(`SELECT COUNT(*) AS n FROM ${table}`))[0].n)
const compute = async () => (await counter.post('/api/takeoffs/compute').set(CSRF).send({ takeoff: openingTakeoff(fx), unit: 'in' })).body
const line = (body: { lines: { role: string; quantity: number }[] }, role: string) => body.lines.find((l) => l.role === role)

describe('waste allowances', () => {
  it('a changed block waste shows in the next bill: 90 × 1.10 = 99 → 13 cases of 8 = 104', async () => {
    // 90 blocks: the 6 ft × 7 ft opening worked in counterBill.test.ts (common practice opening rule).
    const res = await admin.patch('/api/takeoff-settings/waste').set(CSRF).send({ block: 10 })
    expect(res.status).toBe(200)
    expect(res.body.block).toBe(10)
    expect(line(await compute(), 'block')).toMatchObject({ quantity: 104 })
    await admin.patch('/api/takeoff-settings/waste').set(CSRF).send({ block: null }).expect(200)
    // Back to the shipped 5 %: 94.5 → 95 → 12 cases = 96.
    expect(line(await compute(), 'block')).toMatchObject({ quantity: 96 })
  })

  it('bad input: 400 per field, nothing written; the counter may read but not change', async () => {
    const before = await count('waste_allowances')
    const res = await admin.patch('/api/takeoff-settings/waste').set(CSRF).send({ block: 140, glitter: 5 })
    expect(res.status).toBe(400)
    expect(res.body.error.fields.block).toBeTruthy()
    expect((await counter.patch('/api/takeoff-settings/waste').set(CSRF).send({ block: 1 })).status).toBe(403)
    expect((await counter.get('/api/takeoff-settings/waste')).status).toBe(200)
    expect(await count('waste_allowances')).toBe(before)
  })
})

describe('material rules', () => {
  it('a rule switched off drops its line; put back as shipped, it returns', async () => {
    const screws = defaultMaterialRules.find((r) => r.id === 'screws')!
    const off = await admin.put('/api/takeoff-settings/rules/screws').set(CSRF).send({ rule: screws, enabled: false })
    expect(off.status).toBe(200)
    expect(off.body.find((r: { rule: { id: string } }) => r.rule.id === 'screws')).toMatchObject({ enabled: false, origin: 'changed' })
    expect(line(await compute(), 'screw')).toBeUndefined()
    const back = await admin.delete('/api/takeoff-settings/rules/screws').set(CSRF)
    expect(back.body.find((r: { rule: { id: string } }) => r.rule.id === 'screws')).toMatchObject({ enabled: true, origin: 'default' })
    expect(line(await compute(), 'screw')).toBeDefined()
  })

  it('a changed rate shows in the explanation and the quantity', async () => {
    const blocks = defaultMaterialRules.find((r) => r.id === 'blocks')!
    const doubled = { ...blocks, terms: [{ measure: 'standardBlocks', rate: 2 }], note: 'Two of each, for a test.' }
    expect((await admin.put('/api/takeoff-settings/rules/blocks').set(CSRF).send({ rule: doubled })).status).toBe(200)
    const body = await compute()
    // 180 × 1.05 = 189 → 24 cases of 8 = 192.
    expect(line(body, 'block')).toMatchObject({ quantity: 192, needed: 180 })
    expect(body.lines.find((l: { role: string }) => l.role === 'block').explanation.rule).toContain('Two of each')
    await admin.delete('/api/takeoff-settings/rules/blocks').set(CSRF).expect(200)
  })

  it('bad input: 400 with the field path; an id that does not match the address; nothing written', async () => {
    const before = await count('material_rules')
    const bad = await admin.put('/api/takeoff-settings/rules/blocks').set(CSRF).send({ rule: { id: 'blocks', role: 'glitter', method: 'count' } })
    expect(bad.status).toBe(400)
    expect(Object.keys(bad.body.error.fields).some((k) => k.startsWith('rule.'))).toBe(true)
    const screws = defaultMaterialRules.find((r) => r.id === 'screws')!
    const mismatch = await admin.put('/api/takeoff-settings/rules/blocks').set(CSRF).send({ rule: screws })
    expect(mismatch.status).toBe(400)
    expect(mismatch.body.error.fields['rule.id']).toBeTruthy()
    expect((await counter.put('/api/takeoff-settings/rules/screws').set(CSRF).send({ rule: screws })).status).toBe(403)
    expect(await count('material_rules')).toBe(before)
  })
})

describe('role → item mapping', () => {
  it('checks the item fits the role, the length of a piece, and refuses a second row for the same slot', async () => {
    const before = await count('material_role_items')
    const wrongFamily = await admin.post('/api/takeoff-settings/role-items').set(CSRF).send({ role: 'sealant', itemId: fx.items.screw.id })
    expect(wrongFamily.status).toBe(400)
    expect(wrongFamily.body.error.fields.itemId).toMatchObject({ code: 'role_family_mismatch', params: { families: ['sealant'] } })
    const noLength = await admin.post('/api/takeoff-settings/role-items').set(CSRF).send({ role: 'jointReinforcement', itemId: fx.items.jointReinforcement.id, jointKind: 'mortar' })
    expect(noLength.status).toBe(400)
    expect(noLength.body.error.fields.pieceLengthMm).toBeTruthy()
    const blockRole = await admin.post('/api/takeoff-settings/role-items').set(CSRF).send({ role: 'block', itemId: fx.blockId })
    expect(blockRole.status).toBe(400)
    const duplicate = await admin.post('/api/takeoff-settings/role-items').set(CSRF).send({ role: 'sealant', itemId: fx.items.sealant.id, blockItemId: fx.blockId })
    expect(duplicate.status).toBe(409)
    expect(await count('material_role_items')).toBe(before)
  })

  it('a mapping changed to another item fills the role in the next bill', async () => {
    const rows = (await admin.get('/api/takeoff-settings/role-items')).body as { id: number; role: string; blockItemId: number | null }[]
    const strip = rows.find((r) => r.role === 'expansionStrip' && r.blockItemId === fx.blockId)!
    // The reinforcement item as an 8 ft strip piece: 228 in ÷ 96 in = 2.375 × 1.10 → 3 pieces.
    const res = await admin.put(`/api/takeoff-settings/role-items/${strip.id}`).set(CSRF).send({
      role: 'expansionStrip', itemId: fx.items.jointReinforcement.id, blockItemId: fx.blockId, pieceLengthMm: 96 * IN,
    })
    expect(res.status).toBe(200)
    expect(line(await compute(), 'expansionStrip')).toMatchObject({ quantity: 3, sku: fx.items.jointReinforcement.sku })
    await admin.put(`/api/takeoff-settings/role-items/${strip.id}`).set(CSRF).send({ role: 'expansionStrip', itemId: fx.items.expansionStrip.id, blockItemId: fx.blockId }).expect(200)
    expect((await counter.delete(`/api/takeoff-settings/role-items/${strip.id}`).set(CSRF)).status).toBe(403)
  })
})
