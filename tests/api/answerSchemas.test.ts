// The answer schemas the client checks answers against (src/api/client.ts, in development and the browser tests'
// build) must describe what the real server sends from the real database, or a screen would refuse a good answer.
// Each answer below is read from the demo scenario, as every role the role matrix lets read it, and parsed with its
// schema; a field renamed or retyped on either side fails here, and so does a cost that reaches a role the cost rule
// keeps it from, or a schema that would refuse the answer a role without costs gets. A deliberately wrong answer is
// refused, so a schema that accepts anything fails too.
// source: common practice (contract check between a client's expected shape and the server's answers);
// OWASP ASVS 5.0, 8.2.2 (data-specific access: a field a role may not read never reaches it)
import { z } from 'zod'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { ROLES, type Role } from '../../shared/roles.js'
import { sessionAnswerSchema } from '../../shared/schemas/auth.js'
import { customerSummarySchema, jobSummarySchema } from '../../shared/schemas/counter.js'
import { warehouseRowSchema } from '../../shared/schemas/warehouses.js'
import { CSRF, startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import { COST_KEYS, COST_ROLES, costKeysIn, designedAccess } from './roleMatrix.js'
import { CHECKED_ELSEWHERE, everyRead, FILE_ROUTES, type Read } from './answerSchemaReads.js'

let h: ApiHarness
beforeAll(async () => {
  h = await startApiHarness()
})
afterAll(() => h?.close())

function problemsOf(schema: z.ZodType, body: unknown): string[] {
  const got = schema.safeParse(body)
  return got.success ? [] : got.error.issues.map((i) => `${i.path.join('.')}: ${i.code}`)
}

/** The roles the role matrix lets read a route (a public read: every role). */
function readersOf(read: Read): Role[] {
  const row = designedAccess[read.route]
  if (!row) throw new Error(`${read.route} has no row in the role matrix`)
  return row.access === 'public' ? [...ROLES] : row.access
}

/**
 * The cost fields a schema names and whether each accepts being absent, however deep they sit (objects, lists,
 * records, unions, optional and nullable wrappers), by the path to them.
 */
function costFieldsOf(schema: z.ZodType, at = '', found = new Map<string, boolean>()): Map<string, boolean> {
  const def = (schema as unknown as { _zod: { def: Record<string, unknown> & { type: string } } })._zod.def
  const inner = (s: unknown, path = at) => costFieldsOf(s as z.ZodType, path, found)
  switch (def.type) {
    case 'object':
      for (const [key, field] of Object.entries((schema as z.ZodObject).shape)) {
        if (COST_KEYS.includes(key)) found.set(`${at}.${key}`, (field as z.ZodType).safeParse(undefined).success)
        inner(field, `${at}.${key}`)
      }
      break
    case 'array': inner(def.element, `${at}[]`); break
    case 'record': inner(def.valueType, `${at}{}`); break
    case 'union': for (const option of def.options as z.ZodType[]) inner(option); break
    case 'intersection': inner(def.left); inner(def.right); break
    case 'optional': case 'nullable': case 'default': case 'readonly': case 'catch': case 'nonoptional': inner(def.innerType); break
    case 'pipe': inner(def.in); break
    case 'lazy': inner((def.getter as () => z.ZodType)()); break
  }
  return found
}

describe('answers match the schemas the client checks them with', () => {
  it('a signed-out session answer passes its schema too', async () => {
    const anon = await h.agent().get('/api/session')
    expect(anon.body.user).toBeNull()
    expect(problemsOf(sessionAnswerSchema, anon.body)).toEqual([])
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

  it('every read, as every role that may read it: its answer passes the schema its API call checks it with, costs only to whom the cost rule allows', { timeout: 180_000 }, async () => {
    // The warehouse crew sees costs only while the admin allows it; these reads are made with it off.
    const settings = await (await h.as('admin')).get('/api/purchasing/settings')
    expect(settings.body.warehouseSeesCosts).toBe(false)
    const problems: Record<string, string[]> = {}
    let readsMade = 0
    for (const read of await everyRead(h)) {
      for (const role of readersOf(read)) {
        const got = await (await h.as(role)).get(read.path)
        readsMade++
        const rows: unknown = read.nonEmpty === true ? got.body : read.nonEmpty ? got.body?.[read.nonEmpty] : null
        const found = got.status !== 200 ? [`status ${got.status}`]
          : read.nonEmpty && !(Array.isArray(rows) && rows.length) ? ['no rows: nothing was checked']
          : problemsOf(read.schema, got.body)
        if (!COST_ROLES.includes(role)) found.push(...[...new Set(costKeysIn(got.body))].map((k) => `${k}: a cost reached a role without cost access`))
        if (found.length) problems[`${read.route} as ${role}`] = found.slice(0, 6)
      }
    }
    expect(problems).toEqual({})
    expect(readsMade).toBeGreaterThan(200)
  })

  it('a schema of an answer a role without costs reads lets every cost in it be absent; one only cost roles read requires them', async () => {
    const wrong: string[] = []
    for (const read of await everyRead(h)) {
      const costless = readersOf(read).some((role) => !COST_ROLES.includes(role))
      for (const [path, mayBeAbsent] of costFieldsOf(read.schema)) {
        if (costless && !mayBeAbsent) wrong.push(`${read.route} ${path}: required, but a role without costs reads it (withheldCost)`)
        if (!costless && mayBeAbsent) wrong.push(`${read.route} ${path}: optional, but only cost roles read it`)
      }
    }
    expect(wrong).toEqual([])
    // The walk finds the costs it should: the item detail's standard cost, vendor prices and average costs.
    const itemRead = (await everyRead(h)).find((r) => r.route === 'GET /api/items/:id')!
    expect([...costFieldsOf(itemRead.schema).keys()].sort()).toEqual(['.item.cost', '.vendors[].unitCost', '.warehouses[].avgCost'])
  })

  it("every JSON read the server routes is checked above, or is a file download", async () => {
    const checked = new Set([...Object.keys(CHECKED_ELSEWHERE), ...(await everyRead(h)).map((r) => r.route)])
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
