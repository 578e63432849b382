// Walks every route of the API with every role and signed out, and asserts the designed status:
// 401 signed out, 403 for a role outside the row, anything else (200, 400, 404…) for a role in it.
// Deny by default (OWASP ASVS 5.0, 8.2.1): a route missing from the design fails the test.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type supertest from 'supertest'
import { ROLES, type Role } from '../../shared/roles.js'
import { routeTable } from '../../server/http/routeTable.js'
import { CSRF, TEST_PASSWORD, startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import { designedAccess } from './roleMatrix.js'

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
        }),
      ])
    }
    expect(failures).toEqual([])
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
