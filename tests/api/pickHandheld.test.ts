// What the handheld needs from the server, against the real MariaDB: each person's weight unit, read
// back with the session; a short pick "not in the bin" asks for a count of that bin (once); a
// confirmation a handheld will not send is discarded with who, why and what it said on the audit
// trail, changing no stock or pick line; a discard of a confirmation the server already has (its
// answer was lost on the way back) discards nothing and answers with it; two people on one line: the
// second confirmation is refused with its own code (what the handheld shows as a per-line outcome).
// Bad input: 400, nothing written.
import { randomUUID } from 'node:crypto'
import type supertest from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { PickListDetail } from '../../shared/schemas/picking.js'
import { CSRF, startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import { countRows, fxBom, pickScenario, releasedPickList, type PickScenario } from '../support/pickFixtures.js'

let h: ApiHarness
let crew: supertest.Agent
let otherPicker: supertest.Agent
let counter: supertest.Agent
let s: PickScenario
let listId: number
let lineId: number
beforeAll(async () => {
  h = await startApiHarness()
  crew = await h.as('warehouse')
  otherPicker = await h.as('admin')
  counter = await h.as('counter')
  s = await pickScenario(h.ds, crew)
  const bom = await fxBom(h.ds, s.tag, [{ itemId: s.spacer.id, qty: 12 }])
  listId = await releasedPickList(counter, bom.bomId, s.main.id)
  lineId = ((await crew.get(`/api/pick-lists/${listId}`)).body as PickListDetail).lines[0].id
})
afterAll(() => h?.close())

const spacerScan = (qty: number) => ({ lineId, binScan: 'B:A-02-1', itemScan: s.spacer.sku, qty })
const confirm = (agent: supertest.Agent, body: object, key = randomUUID()) =>
  agent.post(`/api/pick-lists/${listId}/confirmations`).set(CSRF).set('Idempotency-Key', key).send(body)
const discard = (body: object, key = randomUUID()) =>
  crew.post(`/api/pick-lists/${listId}/discards`).set(CSRF).set('Idempotency-Key', key).send(body)
const discardAudits = () => countRows(h.ds, 'audit_entries', `action = 'pick_confirmation.discard' AND entity_id = ?`, [String(listId)])
const lineRow = async () => (await h.ds.query('SELECT confirmed_qty, short_qty FROM pick_list_lines WHERE id = ?', [lineId]))[0]

describe('discarding a confirmation held on a device', () => {
  it('records who, why and what, and changes nothing else', async () => {
    const key = randomUUID()
    const before = await lineRow()
    const res = await discard({ clientKey: key, lineId, qty: 5, reason: 'entered_by_mistake', note: 'scanned the wrong count' })
    expect(res.status).toBe(200)
    expect(res.body).toEqual({ discarded: true })
    const [entry] = await h.ds.query(`SELECT user_id, detail FROM audit_entries WHERE action = 'pick_confirmation.discard' AND entity_id = ? ORDER BY id DESC LIMIT 1`, [String(listId)])
    expect(JSON.parse(entry.detail)).toMatchObject({ clientKey: key, lineId, itemId: s.spacer.id, qty: 5, reason: 'entered_by_mistake', note: 'scanned the wrong count' })
    expect(entry.user_id).not.toBeNull()
    expect(await lineRow()).toEqual(before)
    expect(await countRows(h.ds, 'pick_confirmations', 'client_key = ?', [key])).toBe(0)
  })

  it('discards nothing when the server already has that confirmation, and answers with it', async () => {
    const key = randomUUID()
    expect((await confirm(crew, spacerScan(4), key)).status).toBe(201) // its answer "lost" on the way back
    const audits = await discardAudits()
    const res = await discard({ clientKey: key, lineId, qty: 4, reason: 'recorded_elsewhere' })
    expect(res.status).toBe(200)
    expect(res.body).toMatchObject({ discarded: false, recorded: { lineId, confirmedQty: 4, remaining: 8, replayed: true } })
    expect(await discardAudits()).toBe(audits)
    expect(await countRows(h.ds, 'pick_confirmations', 'client_key = ?', [key])).toBe(1)
  })

  it('refuses a second picker over the line with its own code; the refused one is then discarded as seen', async () => {
    expect((await confirm(otherPicker, spacerScan(8))).status).toBe(201) // someone else finishes the line
    const key = randomUUID()
    const late = await confirm(crew, spacerScan(3), key)
    expect(late.status).toBe(409)
    expect(late.body.error.code).toBe('over_pick')
    expect(await countRows(h.ds, 'pick_confirmations', 'client_key = ?', [key])).toBe(0)
    const res = await discard({ clientKey: key, lineId, qty: 3, refusedCode: 'over_pick', reason: 'refusal_seen' })
    expect(res.body).toEqual({ discarded: true })
  })

  it('refuses bad input with 400 and field messages, writing nothing', async () => {
    const audits = await discardAudits()
    const good = { clientKey: randomUUID(), lineId, qty: 1, reason: 'other', note: 'x' }
    const cases: [object, string][] = [
      [{ ...good, reason: 'other', note: '  ' }, 'note'],
      [{ ...good, reason: 'forgot' }, 'reason'],
      [{ ...good, clientKey: 'short' }, 'clientKey'],
      [{ ...good, clientKey: 'has spaces in it' }, 'clientKey'],
      [{ ...good, qty: -1 }, 'qty'],
      [{ ...good, lineId: 999999999 }, 'lineId'],
    ]
    for (const [body, field] of cases) {
      const res = await discard(body)
      expect(res.status, JSON.stringify(body)).toBe(400)
      expect(Object.keys(res.body.error.fields ?? {})).toContain(field)
    }
    expect(await discardAudits()).toBe(audits)
  })
})

describe('a short pick "not in the bin"', () => {
  it('asks for a count of that bin, item and lot once, and a damaged short pick does not', async () => {
    const bom = await fxBom(h.ds, s.tag, [{ itemId: s.altBlock.id, qty: 10 }, { itemId: s.block.id, qty: 5 }])
    const id = await releasedPickList(counter, bom.bomId, s.main.id)
    const lines = ((await crew.get(`/api/pick-lists/${id}`)).body as PickListDetail).lines
    const alt = lines.find((l) => l.sku === s.altBlock.sku)!
    const block = lines.find((l) => l.sku === s.block.sku)!
    const countLines = (line: typeof alt) => countRows(h.ds, 'count_lines', `bin_id = ? AND item_id = ? AND lot_key = ? AND status = 'waiting' AND source = 'short_pick'`,
      [line.binId, line.itemId, line.lotId ?? 0])
    const short = (line: typeof alt, reason: string) => crew.post(`/api/pick-lists/${id}/confirmations`).set(CSRF).set('Idempotency-Key', randomUUID())
      .send({ lineId: line.id, binScan: `B:${line.binCode}`, qty: 0, shortReason: reason })
    expect(await countLines(alt)).toBe(0)
    expect((await short(alt, 'not_found')).status).toBe(201)
    const [row] = await h.ds.query(`SELECT pick_list_id, pick_list_line_id FROM count_lines WHERE bin_id = ? AND item_id = ? AND source = 'short_pick'`, [alt.binId, alt.itemId])
    expect(row).toEqual({ pick_list_id: id, pick_list_line_id: alt.id })
    expect(await countLines(alt)).toBe(1)
    expect((await short(block, 'damaged')).status).toBe(201)
    expect(await countLines(block)).toBe(0)
  })
})

describe('the weight unit the handheld shows', () => {
  it('is each person\'s own, kept in the profile and read back with the session', async () => {
    const person = await h.as('warehouse', 'counter') // a user of its own, so other tests keep theirs
    expect((await person.get('/api/session')).body.user.weightUnit).toBe('lb')
    const changed = await person.patch('/api/profile').set(CSRF).send({ weightUnit: 'kg' })
    expect(changed.status).toBe(200)
    expect(changed.body.user.weightUnit).toBe('kg')
    expect((await person.get('/api/session')).body.user.weightUnit).toBe('kg')
    const bad = await person.patch('/api/profile').set(CSRF).send({ weightUnit: 'stone' })
    expect(bad.status).toBe(400)
    expect(Object.keys(bad.body.error.fields)).toEqual(['weightUnit'])
    expect((await person.get('/api/session')).body.user.weightUnit).toBe('kg')
  })
})
