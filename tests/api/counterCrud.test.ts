// Feature: the Counter's contractor accounts, jobs and saved takeoffs (server/routes/customers.ts,
// jobs.ts, takeoffs.ts): create, search, change, remove, and bad input answered 400 with nothing written.
import { randomBytes } from 'node:crypto'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type supertest from 'supertest'
import { CSRF, startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import { createCounterFixture, openingTakeoff, type CounterFixture } from '../support/counterFixtures.js'

let h: ApiHarness
let counter: supertest.Agent
let fx: CounterFixture
const tag = randomBytes(3).toString('hex').toUpperCase()

beforeAll(async () => {
  h = await startApiHarness()
  counter = await h.as('counter')
  fx = await createCounterFixture(h.ds)
})
afterAll(() => h?.close())

const count = async (table: string) => Number((await h.ds.query(`SELECT COUNT(*) AS n FROM ${table}`))[0].n)

describe('customers', () => {
  let id: number

  it('creates an account (code upper-cased) and audits it', async () => {
    const res = await counter.post('/api/customers').set(CSRF).send({ code: `gl-${tag}`, name: 'Glasswing Interiors', email: 'ops@glasswing.example', phone: '555-0101' })
    expect(res.status).toBe(201)
    expect(res.body).toMatchObject({ code: `GL-${tag}`, name: 'Glasswing Interiors', active: true, openJobs: 0 })
    id = res.body.id
    const audit = await h.ds.query("SELECT action FROM audit_entries WHERE entity = 'customer' AND entity_id = ?", [String(id)])
    expect(audit.map((a: { action: string }) => a.action)).toEqual(['customer.create'])
  })

  it('refuses a second account with the same code: 409 naming the field', async () => {
    const before = await count('customers')
    const res = await counter.post('/api/customers').set(CSRF).send({ code: `GL-${tag}`, name: 'Another' })
    expect(res.status).toBe(409)
    expect(res.body.error.fields.code).toBeTruthy()
    expect(await count('customers')).toBe(before)
  })

  it('bad input: 400 with a message per field, nothing written', async () => {
    const before = await count('customers')
    const res = await counter.post('/api/customers').set(CSRF).send({ code: 'x', name: '', email: 'not-an-email' })
    expect(res.status).toBe(400)
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['code', 'email', 'name'])
    expect(await count('customers')).toBe(before)
  })

  it('searches by name, contact and phone; LIKE wildcards match themselves', async () => {
    const hit = await counter.get('/api/customers').query({ q: 'glasswing' })
    expect(hit.body.map((c: { id: number }) => c.id)).toContain(id)
    const phone = await counter.get('/api/customers').query({ q: '555-0101' })
    expect(phone.body.map((c: { id: number }) => c.id)).toContain(id)
    const wildcard = await counter.get('/api/customers').query({ q: '%' })
    expect(wildcard.body).toEqual([])
  })

  it('changes and deactivates an account; inactive accounts leave the default list', async () => {
    const { version } = (await counter.get(`/api/customers/${id}`)).body
    const res = await counter.patch(`/api/customers/${id}`).set(CSRF).send({ version, contactName: 'Rae Halvorsen', active: false })
    expect(res.status).toBe(200)
    expect(res.body).toMatchObject({ contactName: 'Rae Halvorsen', active: false })
    const list = await counter.get('/api/customers').query({ q: 'glasswing' })
    expect(list.body).toEqual([])
    const all = await counter.get('/api/customers').query({ q: 'glasswing', active: 'all' })
    expect(all.body).toHaveLength(1)
    await counter.patch(`/api/customers/${id}`).set(CSRF).send({ version: res.body.version, active: true }).expect(200)
  })

  it('removes an account without jobs; one with jobs is kept (409)', async () => {
    const spare = await counter.post('/api/customers').set(CSRF).send({ code: `SP-${tag}`, name: 'Spare account' })
    expect((await counter.delete(`/api/customers/${spare.body.id}`).set(CSRF)).status).toBe(200)
    expect((await counter.get(`/api/customers/${spare.body.id}`)).status).toBe(404)
    await counter.post('/api/jobs').set(CSRF).send({ customerId: id, name: 'Keeps the account' }).expect(201)
    const refused = await counter.delete(`/api/customers/${id}`).set(CSRF)
    expect(refused.status).toBe(409)
    expect((await counter.get(`/api/customers/${id}`)).status).toBe(200)
  })

  describe('jobs and takeoffs', () => {
    let jobId: number
    let takeoffId: number

    it('creates a job with a due date and lists it first among recent jobs', async () => {
      const res = await counter.post('/api/jobs').set(CSRF).send({ customerId: id, name: 'Halvorsen sunroom', dueDate: '2031-04-30', siteAddress: '4 Tern Way' })
      expect(res.status).toBe(201)
      expect(res.body).toMatchObject({ status: 'open', dueDate: '2031-04-30', customerCode: `GL-${tag}`, latestRevision: null, takeoffs: 0 })
      jobId = res.body.id
      const recent = await counter.get('/api/jobs').query({ limit: 5 })
      expect(recent.body[0].id).toBe(jobId)
      const filtered = await counter.get('/api/jobs').query({ customerId: id, status: 'open' })
      expect(filtered.body.map((j: { id: number }) => j.id)).toContain(jobId)
    })

    it('bad job input: 400 per field, nothing written', async () => {
      const before = await count('jobs')
      const res = await counter.post('/api/jobs').set(CSRF).send({ customerId: 'abc', name: '', dueDate: '2031-02-30', status: 'lost' })
      expect(res.status).toBe(400)
      expect(Object.keys(res.body.error.fields).sort()).toEqual(['customerId', 'dueDate', 'name', 'status'])
      const unknown = await counter.post('/api/jobs').set(CSRF).send({ customerId: 999999999, name: 'Ghost' })
      expect(unknown.status).toBe(400)
      expect(unknown.body.error.fields.customerId).toBeTruthy()
      expect(await count('jobs')).toBe(before)
    })

    it('changes status and due date', async () => {
      const { version } = (await counter.get(`/api/jobs/${jobId}`)).body
      const res = await counter.patch(`/api/jobs/${jobId}`).set(CSRF).send({ version, status: 'ordered', dueDate: null })
      expect(res.status).toBe(200)
      expect(res.body).toMatchObject({ status: 'ordered', dueDate: null })
      await counter.patch(`/api/jobs/${jobId}`).set(CSRF).send({ version: res.body.version, status: 'open' }).expect(200)
    })

    it('saves, loads and replaces a takeoff validated with the shared schema', async () => {
      const input = openingTakeoff(fx)
      const created = await counter.post(`/api/jobs/${jobId}/takeoffs`).set(CSRF).send({ name: 'Sunroom wall', input })
      expect(created.status).toBe(201)
      takeoffId = created.body.id
      const loaded = await counter.get(`/api/takeoffs/${takeoffId}`)
      expect(loaded.body.input).toEqual(input)
      const changed = { ...input, walls: [{ ...input.walls[0], name: 'Sunroom wall, east' }] }
      const put = await counter.put(`/api/takeoffs/${takeoffId}`).set(CSRF).send({ version: loaded.body.version, name: 'Sunroom', input: changed })
      expect(put.status).toBe(200)
      expect(put.body.input.walls[0].name).toBe('Sunroom wall, east')
      const job = await counter.get(`/api/jobs/${jobId}`)
      expect(job.body.takeoffList).toHaveLength(1)
      expect(job.body.customer.id).toBe(id)
    })

    it('a takeoff that breaks the schema: 400 with the field path, nothing written', async () => {
      const before = await count('takeoffs')
      const input = openingTakeoff(fx)
      const bad = { ...input, walls: [{ ...input.walls[0], heightMm: undefined, segments: [{ kind: 'curved', insideRadiusMm: 900, direction: 'left' }] }] }
      const res = await counter.post(`/api/jobs/${jobId}/takeoffs`).set(CSRF).send({ name: 'Broken', input: bad })
      expect(res.status).toBe(400)
      expect(res.body.error.fields['input.walls.0.heightMm']).toEqual({ code: 'opening_height_needed' })
      expect(res.body.error.fields['input.walls.0.segments.0.arcAngleDeg']).toEqual({ code: 'arc_one_measure' })
      expect(await count('takeoffs')).toBe(before)
      const { version } = (await counter.get(`/api/takeoffs/${takeoffId}`)).body
      const unchanged = await counter.put(`/api/takeoffs/${takeoffId}`).set(CSRF).send({ version, name: 'Broken', input: bad })
      expect(unchanged.status).toBe(400)
      expect((await counter.get(`/api/takeoffs/${takeoffId}`)).body.name).toBe('Sunroom')
    })

    it('deletes a takeoff no bill came from', async () => {
      const spare = await counter.post(`/api/jobs/${jobId}/takeoffs`).set(CSRF).send({ name: 'Spare', input: openingTakeoff(fx) })
      expect((await counter.delete(`/api/takeoffs/${spare.body.id}`).set(CSRF)).status).toBe(200)
      expect((await counter.get(`/api/takeoffs/${spare.body.id}`)).status).toBe(404)
    })

    it('a closed job takes no new takeoffs (409)', async () => {
      const closed = await counter.patch(`/api/jobs/${jobId}`).set(CSRF).send({ version: (await counter.get(`/api/jobs/${jobId}`)).body.version, status: 'complete' }).expect(200)
      const res = await counter.post(`/api/jobs/${jobId}/takeoffs`).set(CSRF).send({ name: 'Late', input: openingTakeoff(fx) })
      expect(res.status).toBe(409)
      await counter.patch(`/api/jobs/${jobId}`).set(CSRF).send({ version: closed.body.version, status: 'open' }).expect(200)
    })
  })
})
