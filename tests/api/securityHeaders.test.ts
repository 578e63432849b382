// The security headers the API answers with are the ones helmet itself sets for the same options. The app works
// them out once at start (server/http/securityHeaders.ts); the reference here is helmet mounted the documented way
// (`app.use(helmet(options))`) on a live Express answer over a real socket, so a helmet release that sets other
// headers, other values or sets them another way makes the two differ and fails this test.
// source: helmet (npm registry, the version in package-lock.json), README "Get started" — used as the reference library.
import express from 'express'
import helmet from 'helmet'
import supertest from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { helmetHeaders, helmetOptions } from '../../server/http/securityHeaders.js'
import { startApiHarness, type ApiHarness } from '../support/apiHarness.js'

let h: ApiHarness
beforeAll(async () => {
  h = await startApiHarness()
})
afterAll(() => h?.close())

/** What a bare Express answer carries by itself (date, length, type, x-powered-by…), to tell helmet's part from it. */
function bareApp(withHelmet: boolean): express.Express {
  const app = express()
  if (withHelmet) app.use(helmet({ ...helmetOptions }))
  app.get('/probe', (_req, res) => {
    res.json({ ok: true })
  })
  return app
}

/** helmet's own effect on a live answer: the headers it added (name → value) and the ones it took away. */
async function helmetOnLiveAnswer(): Promise<{ added: Record<string, string>; removed: string[] }> {
  const plain = (await supertest(bareApp(false)).get('/probe')).headers as Record<string, string>
  const guarded = (await supertest(bareApp(true)).get('/probe')).headers as Record<string, string>
  const skip = new Set(['date', 'etag', 'content-length', 'connection', 'keep-alive'])
  const added = Object.fromEntries(Object.entries(guarded).filter(([name]) => !skip.has(name) && plain[name] !== guarded[name]))
  const removed = Object.keys(plain).filter((name) => !(name in guarded))
  return { added, removed }
}

describe('security headers against helmet itself', () => {
  it('helmet, run once on a real response at start, yields exactly what it sets on a live Express answer', async () => {
    const live = await helmetOnLiveAnswer()
    // Not vacuous: helmet sets its policy and a dozen more, and takes Express's x-powered-by away.
    expect(Object.keys(live.added).length).toBeGreaterThanOrEqual(10)
    expect(live.added['content-security-policy']).toContain("frame-ancestors 'none'")
    expect(live.removed).toContain('x-powered-by')
    const atStart = Object.fromEntries(helmetHeaders().map(([name, value]) => [name.toLowerCase(), String(value)]))
    expect(atStart).toEqual(live.added)
  })

  it('the API answers carry helmet’s headers and values, and none it takes away', async () => {
    const live = await helmetOnLiveAnswer()
    const scanner = await h.as('warehouse')
    const answers = {
      'health, signed out': await h.agent().get('/api/health'),
      'scan lookup, signed in (no compression, short answer)': await scanner.get('/api/stock/lookup').query({ kind: 'gtin', code: '00000000000000' }),
      'unknown API address': await h.agent().get('/api/no-such-address'),
      'refused: signed out': await h.agent().get('/api/stock/overview'),
    }
    for (const [what, res] of Object.entries(answers)) {
      const carried = Object.fromEntries(Object.keys(live.added).map((name) => [name, res.headers[name]]))
      expect(carried, what).toEqual(live.added)
      for (const name of live.removed) expect(res.headers[name], `${what}: ${name}`).toBeUndefined()
    }
  })
})
