// Walks every route of the API with every role and signed out, and asserts the designed status:
// 401 signed out, 403 for a role outside the row, anything else (200, 400, 404…) for a role in it.
// Deny by default (OWASP ASVS 5.0, 8.2.1): a route missing from the design fails the test.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type supertest from 'supertest'
import { ROLES, type Role } from '../../shared/roles.js'
import { routeTable } from '../../server/http/routeTable.js'
import { CSRF, TEST_PASSWORD, startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import { createPurchasingFixture, suggestion } from '../support/purchasingFixtures.js'
import { download, loadWorkbook, workbookTexts } from '../support/downloads.js'
import { pdfText } from '../support/pdfText.js'
import { COST_ROLES, costKeysIn, designedAccess } from './roleMatrix.js'

let h: ApiHarness
beforeAll(async () => {
  h = await startApiHarness()
})
afterAll(() => h?.close())

const key = (r: { method: string; path: string }) => `${r.method.toUpperCase()} ${r.path}`
const concrete = (path: string) => path.replace(/:[A-Za-z]+/g, '999999999')

function call(agent: supertest.Agent, method: string, path: string, query?: string) {
  const m = method.toLowerCase() as 'get' | 'post' | 'put' | 'patch' | 'delete'
  const req = agent[m](concrete(path) + (query ? `?${query}` : '')).set(CSRF)
  return m === 'get' || m === 'delete' ? req : req.send({})
}

describe('role matrix', () => {
  it('the server declares exactly the designed routes', () => {
    const actual = new Set(routeTable.map(key))
    const designed = new Set(Object.keys(designedAccess))
    const notDesigned = [...actual].filter((k) => !designed.has(k)).sort()
    const notServed = [...designed].filter((k) => !actual.has(k)).sort()
    expect({ notDesigned, notServed }).toEqual({ notDesigned: [], notServed: [] })
  })

  it('each route declares the designed access', () => {
    for (const route of routeTable) {
      const row = designedAccess[key(route)]
      expect(row, key(route)).toBeDefined()
      const declared = route.access === 'public' ? 'public' : [...route.access.roles].sort()
      const designed = row.access === 'public' ? 'public' : [...row.access].sort()
      expect(declared, key(route)).toEqual(designed)
    }
  })

  it('answers every route with the designed status for every role and signed out', { timeout: 240_000 }, async () => {
    const failures: string[] = []
    const agents = new Map<Role, supertest.Agent>()
    for (const role of ROLES as readonly Role[]) agents.set(role, await h.as(role))
    for (const route of routeTable) {
      const row = designedAccess[key(route)]
      if (!row) continue
      // The six callers of one route go at once; routes go one after another.
      await Promise.all([
        call(h.agent(), route.method, route.path, row.query).then((anon) => {
          if (row.access !== 'public' && anon.status !== 401) failures.push(`${key(route)} signed out: ${anon.status}, want 401`)
          if (row.access === 'public' && anon.status === 401) failures.push(`${key(route)} signed out: 401 on a public route`)
        }),
        ...(ROLES as readonly Role[]).map(async (role) => {
          const agent = row.freshSession ? await freshAgent(role) : agents.get(role)!
          const res = await call(agent, route.method, route.path, row.query)
          const allowed = row.access === 'public' || row.access.includes(role)
          if (allowed && (res.status === 401 || res.status === 403)) {
            failures.push(`${key(route)} as ${role}: ${res.status}, want allowed (${JSON.stringify(res.body)})`)
          }
          if (!allowed && res.status !== 403) failures.push(`${key(route)} as ${role}: ${res.status}, want 403`)
          if (res.status >= 500) failures.push(`${key(route)} as ${role}: server error ${res.status}`)
          if (!COST_ROLES.includes(role) && costKeysIn(res.body).length) failures.push(`${key(route)} as ${role}: answered a cost`)
        }),
      ])
    }
    expect(failures).toEqual([])
  })
})

// The export headers that show a cost (the JSON fields are COST_KEYS in roleMatrix.ts).
const COST_HEADERS = ['Cost', 'Unit cost', 'Value', 'Line total', 'Total', 'Cost of what was used', 'Average stock value']

/** The costs an answer carries: cost fields of JSON, cost headers of a workbook or of a PDF's table. */
async function costsAnswered(agent: supertest.Agent, path: string): Promise<{ status: number; costs: string[] }> {
  if (/\/pdf$/.test(path)) {
    const res = await download(agent, path)
    if (res.status !== 200) return { status: res.status, costs: [] }
    const lines = (await pdfText(res.body as Buffer)).split('\n').map((l) => l.trim())
    return { status: 200, costs: COST_HEADERS.filter((header) => lines.includes(header)) }
  }
  if (/export|\.xlsx/.test(path)) {
    const res = await download(agent, path)
    if (res.status !== 200) return { status: res.status, costs: [] }
    return { status: 200, costs: workbookTexts(await loadWorkbook(res.body as Buffer)).filter((t) => COST_HEADERS.includes(t)) }
  }
  const res = await agent.get(path)
  return { status: res.status, costs: costKeysIn(res.body) }
}

describe('cost visibility', () => {
  it('answers costs on every route that has them to exactly the roles the cost rule allows', { timeout: 120_000 }, async () => {
    // One received order: an item with a standard cost, a vendor price, a PO with totals, a ledger
    // receipt at cost and a moving average; and an accepted suggestion with the vendor's price.
    const f = await createPurchasingFixture(h.ds)
    const admin = await h.as('admin')
    const created = await admin.post('/api/purchase-orders').set(CSRF)
      .send({ vendorId: f.vendorA, warehouseId: f.warehouse.id, lines: [{ itemId: f.sealant.id, packsOrdered: 2 }] })
    expect(created.status).toBe(201)
    const po = created.body as { id: number; number: string; version: number; lines: { id: number }[] }
    expect((await admin.post(`/api/purchase-orders/${po.id}/approve`).set(CSRF).send({ version: po.version })).status).toBe(200)
    expect((await admin.post(`/api/purchase-orders/${po.id}/mark-sent`).set(CSRF)).status).toBe(200)
    const received = await admin.post(`/api/purchase-orders/${po.id}/receipts`).set(CSRF)
      .send({ lines: [{ poLineId: po.lines[0].id, binId: f.warehouse.bins.a1, qty: 12 }] })
    expect(received.status).toBe(201)
    await suggestion(h.ds, { itemId: f.block.id, warehouseId: f.warehouse.id, vendorId: f.vendorA, qty: 48 })
    const fill = (t: string) => t.replace('{item}', String(f.sealant.id)).replace('{sku}', encodeURIComponent(f.sealant.sku))
      .replace('{warehouse}', String(f.warehouse.id)).replace('{vendor}', String(f.vendorA)).replace('{poNumber}', po.number).replace('{po}', String(po.id))

    const rows = Object.entries(designedAccess).filter(([, row]) => row.costs)
    expect(rows.length).toBeGreaterThanOrEqual(12)
    const check = async (roles: readonly Role[], seen: (role: Role) => boolean) => {
      const failures: string[] = []
      for (const [name, row] of rows) {
        for (const role of roles) {
          if (row.access === 'public' || !row.access.includes(role)) continue
          const { status, costs } = await costsAnswered(await h.as(role), fill(row.costs!))
          if (status !== 200) failures.push(`${name} as ${role}: ${status}`)
          else if (seen(role) && !costs.length) failures.push(`${name} as ${role}: no cost answered, want costs`)
          else if (!seen(role) && costs.length) failures.push(`${name} as ${role}: answered ${costs.join(', ')}`)
        }
      }
      expect(failures).toEqual([])
    }
    await check(ROLES as readonly Role[], (role) => COST_ROLES.includes(role))
    // The admin lets the warehouse crew see costs: now they do, and nobody else changes.
    expect((await admin.patch('/api/purchasing/settings').set(CSRF).send({ warehouseSeesCosts: true })).status).toBe(200)
    try {
      await check(['warehouse', 'viewer'], (role) => role === 'warehouse')
    } finally {
      await admin.patch('/api/purchasing/settings').set(CSRF).send({ warehouseSeesCosts: false })
    }
  })
})

describe('cost visibility under overlapping requests', () => {
  it('keeps each answer to its own caller\'s access when a buyer\'s and a viewer\'s requests interleave', { timeout: 60_000 }, async () => {
    // source: OWASP ASVS 5.0 8.2.3, field-level access (from memory) — the access travels with each answer, so
    // requests in flight together must never lend each other theirs.
    const f = await createPurchasingFixture(h.ds)
    const [buyer, viewer] = [await h.as('buyer'), await h.as('viewer')]
    const path = `/api/items/${f.sealant.id}`
    const answers = await Promise.all(Array.from({ length: 24 }, (_, i) => (i % 2 ? viewer : buyer).get(path).then((res) => ({ i, res }))))
    for (const { i, res } of answers) {
      expect(res.status).toBe(200)
      if (i % 2) expect(costKeysIn(res.body), `viewer answer ${i}`).toEqual([])
      else expect(costKeysIn(res.body), `buyer answer ${i}`).toContain('cost')
    }
  })
})

let freshCount = 0
async function freshAgent(role: Role): Promise<supertest.Agent> {
  const username = `matrix-fresh-${role}-${++freshCount}`
  await h.user(username, [role])
  const agent = h.agent()
  const res = await agent.post('/api/session').set(CSRF).send({ username, password: TEST_PASSWORD })
  if (res.status !== 200) throw new Error(`fresh sign-in failed for ${username}`)
  return agent
}
