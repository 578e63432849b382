// Feature: a takeoff compute that cannot be abused, and bills a clerk can order from: takeoffs past the
// limits refused (400) before any layout while the server keeps answering others, the compute run off the
// main thread, site figures an admin sets, the bill saved in the takeoff's own unit with the base's true
// size, and a superseded bill revision refused for picking.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type supertest from 'supertest'
import type { ComputeAnswer } from '../../shared/counter/counterBill.js'
import type { BomRecord } from '../../shared/schemas/counter.js'
import type { Takeoff } from '../../shared/schemas/takeoff.js'
import { computeRunner, ComputeRunner } from '../../server/services/counter/computeRunner.js'
import { loadCounterCatalog } from '../../server/services/counter/counterCatalog.js'
import { CSRF, startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import { createCounterFixture, createCustomerAndJob, IN, openingTakeoff, type CounterFixture } from '../support/counterFixtures.js'
import { createWarehouse } from '../support/stockFixtures.js'

let h: ApiHarness
let counter: supertest.Agent
let admin: supertest.Agent
let fx: CounterFixture

beforeAll(async () => {
  h = await startApiHarness()
  counter = await h.as('counter')
  admin = await h.as('admin')
  fx = await createCounterFixture(h.ds)
})
afterAll(async () => {
  await admin?.patch('/api/takeoff-settings/figures').set(CSRF).send({ groutDepthMm: null })
  await h?.close()
})

const compute = (takeoff: Takeoff, unit?: 'in' | 'mm') => counter.post('/api/takeoffs/compute').set(CSRF).send({ takeoff, ...(unit ? { unit } : {}) })

/** A shower wall the base can follow: 3 straight blocks and a quarter circle, free end and free top, wet. */
function showerTakeoff(over: Partial<Takeoff> = {}): Takeoff {
  const t = openingTakeoff(fx, {
    name: 'Shower wall', sizing: 'count', heightMm: undefined, courses: 10,
    segments: [{ kind: 'straight', blocks: 3 }, { kind: 'curved', insideRadiusMm: 72 * IN, arcAngleDeg: 90, direction: 'left', closing: 'radius' }],
    freeEnds: { start: false, end: true, top: true }, wetArea: true,
  })
  return { ...t, showerBase: { widthMm: 36 * IN, depthMm: 36 * IN, drain: { fromLeftMm: 18 * IN, fromBackMm: 18 * IN }, entry: 'right', curbless: false, wall: 'Shower wall', fit: 'follow' }, ...over }
}

describe('limits, before anything is laid out', () => {
  it('an opening of 20,000 in is refused with a 400 naming the 100 ft limit while another request is served', async () => {
    const before = computeRunner.computations
    const huge = openingTakeoff(fx, { segments: [{ kind: 'straight', lengthMm: 20_000 * IN }], heightMm: 2_000 * IN })
    const [refused, other] = await Promise.all([compute(huge, 'in'), counter.get('/api/takeoffs/catalog')])
    expect(refused.status).toBe(400)
    expect(refused.body.error.code).toBe('takeoff_too_large')
    // 100 ft = 30,480 mm (NIST SP 811); 20,000 in is 1,667 ft
    // (the client words the limit in the clerk's unit: tests/unit/client/errorText.test.ts)
    const atMost100Ft = { code: 'at_most', params: { max: 30_480, unit: 'mm' } }
    expect(refused.body.error.fields['takeoff.walls.0.segments.0.lengthMm']).toEqual(atMost100Ft)
    expect(refused.body.error.fields['takeoff.walls.0.heightMm']).toEqual(atMost100Ft)
    expect(other.status).toBe(200)
    expect(other.body.blocks.length).toBeGreaterThan(0)
    // the refusal came from the limits: no computation was started for it
    expect(computeRunner.computations).toBe(before)
  })

  it('a wall of 22,500 blocks is refused by its count, with its figures; the same in millimetres', async () => {
    // 95 ft × 95 ft of the typed 190 mm face + 1/8 in joint: 28,956 mm ÷ 193.175 mm = 149.9 → at most 150 across
    // and 150 courses = 22,500 blocks > 10,000 (counted from the figures as typed, before the catalog binds them)
    const big = openingTakeoff(fx, { segments: [{ kind: 'straight', lengthMm: 1140 * IN }], heightMm: 1140 * IN })
    const res = await compute({ ...big, unit: 'mm' })
    expect(res.status).toBe(400)
    expect(res.body.error.code).toBe('takeoff_too_large')
    expect(res.body.error.fields['takeoff.walls.0.segments']).toMatchObject({ code: 'wall_too_large', params: { blocks: 22_500, across: 150, courses: 150 } })
    const typo = await compute(openingTakeoff(fx, { segments: [{ kind: 'straight', lengthMm: 1e9 }] }), 'mm')
    expect(typo.body.error.fields['takeoff.walls.0.segments.0.lengthMm']).toEqual({ code: 'at_most', params: { max: 30_480, unit: 'mm' } })
  })

  it('the largest takeoff allowed is computed off the main thread while other requests are answered', async () => {
    // 6 walls of 90 × 100 = 9,000 blocks: 54,000 blocks, under the 60,000 limit
    const wall = openingTakeoff(fx, { sizing: 'count', heightMm: undefined, courses: 100, segments: [{ kind: 'straight', blocks: 90 }] }).walls[0]
    const large: Takeoff = { walls: Array.from({ length: 6 }, (_, i) => ({ ...wall, name: `Panel ${i + 1}` })), looseLines: [] }
    const before = computeRunner.computations
    const pending = compute(large, 'in')
    const quick = await h.agent().get('/api/health')
    expect(quick.status).toBe(200)
    const res = await pending
    expect(res.status).toBe(200)
    expect(computeRunner.computations).toBe(before + 1)
    const answer = res.body as ComputeAnswer
    expect(answer.totals.blocksNeeded).toBe(54_000)
    // lean: six walls of 9,000 blocks answer in well under a megabyte (the full layouts ran to many)
    expect(JSON.stringify(answer).length).toBeLessThan(200_000)
  })
})

describe('the time cap', () => {
  it('a computation past its time is stopped and answered 503; the next one runs on a fresh worker', async () => {
    const catalog = await loadCounterCatalog(h.ds.manager)
    const wall = openingTakeoff(fx, { sizing: 'count', heightMm: undefined, courses: 100, segments: [{ kind: 'straight', blocks: 90 }] }).walls[0]
    const large: Takeoff = { walls: Array.from({ length: 6 }, (_, i) => ({ ...wall, name: `Panel ${i + 1}` })), looseLines: [] }
    // a 1 ms cap: 54,000 blocks cannot be laid out in it
    const hasty = new ComputeRunner({ timeMs: 1, queue: 2, heapMb: 256 })
    try {
      await expect(hasty.run(large, catalog, 'in', 'lean')).rejects.toMatchObject({ status: 503, code: 'compute_timeout' })
      const patient = new ComputeRunner({ timeMs: 60_000, queue: 2, heapMb: 256 })
      try {
        const bill = await patient.run(openingTakeoff(fx), catalog, 'in', 'lean')
        expect(bill.totals.blocksNeeded).toBe(90)
      } finally {
        await patient.stop()
      }
    } finally {
      await hasty.stop()
    }
  })
})

describe('site figures', () => {
  it('an admin sets the grout fill; the next compute uses it; a bad value changes nothing', async () => {
    const defaults = await counter.get('/api/takeoff-settings/figures')
    // 3/8 in = 9.525 mm (common practice default)
    expect(defaults.body.groutDepthMm).toBeCloseTo(9.525, 9)
    const grout = async () => ((await compute(openingTakeoff(fx), 'in')).body as ComputeAnswer).lines.find((l) => l.role === 'grout')!.needed
    const atDefault = await grout()
    expect((await counter.patch('/api/takeoff-settings/figures').set(CSRF).send({ groutDepthMm: 5 })).status).toBe(403)
    const bad = await admin.patch('/api/takeoff-settings/figures').set(CSRF).send({ groutDepthMm: -1 })
    expect(bad.status).toBe(400)
    const set = await admin.patch('/api/takeoff-settings/figures').set(CSRF).send({ groutDepthMm: 19.05 })
    expect(set.status).toBe(200)
    expect(set.body.groutDepthMm).toBe(19.05)
    // grout scales with the fill: 19.05 / 9.525 = 2×
    expect((await grout()) / atDefault).toBeCloseTo(2, 9)
    const reset = await admin.patch('/api/takeoff-settings/figures').set(CSRF).send({ groutDepthMm: null })
    expect(reset.body.groutDepthMm).toBeCloseTo(9.525, 9)
  })
})

describe('the saved bill', () => {
  let jobId: number
  let takeoffId: number
  let first: BomRecord

  beforeAll(async () => {
    ;({ jobId } = await createCustomerAndJob(h.ds, `${fx.tag}L`))
    const t = await counter.post(`/api/jobs/${jobId}/takeoffs`).set(CSRF).send({ name: 'Shower', input: { ...showerTakeoff(), unit: 'mm' } })
    takeoffId = t.body.id
  })

  it('is saved in the takeoff’s own unit; the user’s profile keeps its unit', async () => {
    const res = await counter.post(`/api/jobs/${jobId}/boms`).set(CSRF).send({ takeoffId })
    expect(res.status).toBe(201)
    first = res.body
    expect(first.unit).toBe('mm')
    expect((await counter.get('/api/session')).body.user.unitPreference).toBe('in')
  })

  it('names the base by its true size and stores it in the spec the special order copies', async () => {
    const base = first.lines.find((l) => l.role === 'showerBase')!
    expect(base.description).toMatch(/^Shower base for tiling, made to order, [\d.]+ × [\d.]+ mm, curved curb R [\d.]+ mm, 90°$/)
    const spec = base.spec as { widthMm: number; curb: { radiusMm: number; arcDeg: number }; trueSize: { text: string; unit: string; curbArcDeg: number; sizedFrom: string } }
    expect(spec.trueSize).toMatchObject({ unit: 'mm', sizedFrom: 'wall' })
    expect(spec.trueSize.curbArcDeg).toBeCloseTo(90, 9)
    expect(spec.curb.arcDeg).toBeCloseTo(90, 9)
    expect(base.description).toContain(spec.trueSize.text)
    expect(spec.widthMm).not.toBeCloseTo(36 * IN, 0)
  })

  it('a base entered by hand that does not fit its wall stops the bill (422) and writes nothing', async () => {
    const [boms] = await h.ds.query('SELECT COUNT(*) AS n FROM boms WHERE job_id = ?', [jobId])
    const input = showerTakeoff({ showerBase: { ...showerTakeoff().showerBase!, fit: 'check' } })
    const { version } = (await counter.get(`/api/takeoffs/${takeoffId}`)).body
    const res = await counter.post(`/api/jobs/${jobId}/boms`).set(CSRF).send({ takeoffId, input, version })
    expect(res.status).toBe(422)
    expect(res.body.error.code).toBe('bill_not_ready')
    expect(res.body.error.message).toContain('does not fit Shower wall')
    const [after] = await h.ds.query('SELECT COUNT(*) AS n FROM boms WHERE job_id = ?', [jobId])
    expect(Number(after.n)).toBe(Number(boms.n))
  })

  it('a superseded revision cannot start a pick list; the latest can', async () => {
    const { version } = (await counter.get(`/api/takeoffs/${takeoffId}`)).body
    const second = await counter.post(`/api/jobs/${jobId}/boms`).set(CSRF).send({ takeoffId, input: showerTakeoff(), version })
    expect(second.status).toBe(201)
    expect(second.body.revision).toBe(first.revision + 1)
    const wh = await createWarehouse(h.ds, `P${fx.tag}`, ['A-01-1'])
    const old = await counter.post('/api/pick-lists/plan').set(CSRF).send({ bomId: first.id, warehouseId: wh.id })
    expect(old.status).toBe(409)
    expect(old.body.error.code).toBe('bill_superseded')
    const created = await counter.post('/api/pick-lists').set(CSRF).send({ bomId: first.id, warehouseId: wh.id })
    expect(created.status).toBe(409)
    const latest = await counter.post('/api/pick-lists/plan').set(CSRF).send({ bomId: second.body.id, warehouseId: wh.id })
    expect(latest.status).toBe(200)
    const listed = (await counter.get('/api/pick-lists/boms')).body as { bomId: number }[]
    expect(listed.some((b) => b.bomId === first.id)).toBe(false)
    expect(listed.some((b) => b.bomId === second.body.id)).toBe(true)
  })
})
