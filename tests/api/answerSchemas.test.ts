// The answer schemas the client checks answers against (src/api/client.ts, in development and the browser tests'
// build) must describe what the real server sends from the real database, or a screen would refuse a good answer.
// Each answer below is read from the demo scenario and parsed with its schema; a field renamed or retyped on
// either side fails here. A deliberately wrong answer is refused, so a schema that accepts anything fails too.
// source: common practice (contract check between a client's expected shape and the server's answers)
import { z } from 'zod'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { sessionAnswerSchema, userSummarySchema } from '../../shared/schemas/auth.js'
import { itemPageSchema, lotRowsSchema } from '../../shared/schemas/catalog.js'
import { counterCatalogSchema, customerSummarySchema, jobSummarySchema } from '../../shared/schemas/counter.js'
import { setupStateSchema } from '../../shared/schemas/setup.js'
import { placesSchema } from '../../shared/schemas/stockViews.js'
import { warehouseDetailSchema, warehouseRowSchema } from '../../shared/schemas/warehouses.js'
import { CSRF, startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import { designedAccess } from './roleMatrix.js'
import { CHECKED_ELSEWHERE, everyRead, FILE_ROUTES, FIRST_CHECKED } from './answerSchemaReads.js'

let h: ApiHarness
beforeAll(async () => {
  h = await startApiHarness()
})
afterAll(() => h?.close())

function problemsOf(schema: z.ZodType, body: unknown): string[] {
  const got = schema.safeParse(body)
  return got.success ? [] : got.error.issues.map((i) => `${i.path.join('.')}: ${i.code}`)
}

describe('answers match the schemas the client checks them with', () => {
  it('session, warehouses, places, takeoff catalog, checklist and users', async () => {
    const admin = await h.as('admin')
    const session = await admin.get('/api/session')
    expect(session.status).toBe(200)
    expect(session.body.user).not.toBeNull()
    expect(problemsOf(sessionAnswerSchema, session.body)).toEqual([])
    expect(problemsOf(sessionAnswerSchema, (await h.agent().get('/api/session')).body)).toEqual([])

    const list = await admin.get('/api/warehouses')
    expect(list.status).toBe(200)
    expect(list.body.length).toBeGreaterThan(0)
    expect(problemsOf(z.array(warehouseRowSchema), list.body)).toEqual([])
    // One of the demo's own warehouses (other test files add bare warehouses that may sort first).
    const demo = (list.body as { id: number; code: string }[]).find((w) => w.code === 'HRY')
    expect(demo).toBeDefined()
    const detail = await admin.get(`/api/warehouses/${demo!.id}`)
    expect(detail.body.bins.length).toBeGreaterThan(0)
    expect(problemsOf(warehouseDetailSchema, detail.body)).toEqual([])

    const places = await admin.get('/api/stock/places')
    expect(places.body.length).toBeGreaterThan(0)
    expect(problemsOf(placesSchema, places.body)).toEqual([])

    const catalog = await admin.get('/api/takeoffs/catalog')
    expect(catalog.status).toBe(200)
    expect(catalog.body.blocks.length).toBeGreaterThan(0)
    expect(catalog.body.rules.length).toBeGreaterThan(0)
    expect(problemsOf(counterCatalogSchema, catalog.body)).toEqual([])

    expect(problemsOf(setupStateSchema, (await admin.get('/api/setup')).body)).toEqual([])
    const users = await admin.get('/api/users')
    expect(users.body.length).toBeGreaterThan(0)
    expect(problemsOf(z.array(userSummarySchema), users.body)).toEqual([])
  })

  it('catalog pages and lots, with costs and without', async () => {
    for (const who of [await h.as('admin'), await h.as('warehouse')]) {
      const page = await who.get('/api/items?pageSize=50')
      expect(page.status).toBe(200)
      expect(page.body.rows.length).toBeGreaterThan(0)
      expect(problemsOf(itemPageSchema, page.body)).toEqual([])
      const lotted = page.body.rows.find((r: { matchLot: boolean; onHand: number }) => r.matchLot && r.onHand > 0) ?? page.body.rows[0]
      const lots = await who.get(`/api/items/${lotted.id}/lots`)
      expect(lots.status).toBe(200)
      expect(problemsOf(lotRowsSchema, lots.body)).toEqual([])
    }
  })

  it('contractor accounts and jobs: lists, one job, and what a save answers', async () => {
    const counter = await h.as('counter')
    const customers = await counter.get('/api/customers?active=all')
    expect(customers.body.length).toBeGreaterThan(0)
    expect(problemsOf(z.array(customerSummarySchema), customers.body)).toEqual([])
    const jobs = await counter.get('/api/jobs?limit=200')
    expect(jobs.body.length).toBeGreaterThan(0)
    expect(problemsOf(z.array(jobSummarySchema), jobs.body)).toEqual([])
    expect(problemsOf(jobSummarySchema, (await counter.get(`/api/jobs/${jobs.body[0].id}`)).body)).toEqual([])
    const saved = await counter.post('/api/jobs').set(CSRF).send({ customerId: customers.body[0].id, name: 'Brightcourse lobby screen wall' })
    expect(saved.status).toBe(201)
    expect(problemsOf(jobSummarySchema, saved.body)).toEqual([])
  })

  it('every other read: its answer from the demo scenario passes the schema its API call checks it with', async () => {
    const problems: Record<string, string[]> = {}
    for (const read of await everyRead(h)) {
      const who = await h.as(read.role)
      const got = await who.get(read.path)
      const rows: unknown = read.nonEmpty === true ? got.body : read.nonEmpty ? got.body?.[read.nonEmpty] : null
      const found = got.status !== 200 ? [`status ${got.status}`]
        : read.nonEmpty && !(Array.isArray(rows) && rows.length) ? ['no rows: nothing was checked']
        : problemsOf(read.schema, got.body)
      if (found.length) problems[`${read.route} as ${read.role}`] = found.slice(0, 6)
    }
    expect(problems).toEqual({})
  })

  it("every JSON read the server routes is checked above, or is a file download", async () => {
    const checked = new Set([...FIRST_CHECKED, ...Object.keys(CHECKED_ELSEWHERE), ...(await everyRead(h)).map((r) => r.route)])
    const gets = Object.keys(designedAccess).filter((k) => k.startsWith('GET '))
    expect(gets.length).toBeGreaterThan(80)
    const unchecked = gets.filter((k) => !checked.has(k) && !FILE_ROUTES.has(k))
    expect(unchecked).toEqual([])
  })

  it('refuses an answer that lost or retyped a field', async () => {
    const admin = await h.as('admin')
    const detail = (await admin.get('/api/warehouses')).body[0]
    expect(problemsOf(warehouseRowSchema, { ...detail, active: 'yes' })).toEqual(['active: invalid_type'])
    const { bins: _bins, ...noBinCount } = detail
    expect(problemsOf(warehouseRowSchema, noBinCount)).toEqual(['bins: invalid_type'])
  })
})
