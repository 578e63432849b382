// passport's request methods live on the app's request prototype (http/session.ts, passportOnRequestPrototype), not
// on each request: a signed-in request leaves passport's session middleware without the seven properties it used to
// add, and signing in, reading the session and signing out still work through them. Real app and MariaDB.
// source: passport 0.7's own middleware (node_modules/passport/lib/middleware/authenticate.js) names the seven
// properties; ECMAScript 2024, §10.1.9.2 OrdinarySetWithOwnDescriptor: assigning a name whose inherited property is
// an accessor calls its setter and makes no own property.
import http from 'node:http'
import type { AddressInfo } from 'node:net'
import type { Request } from 'express'
import supertest from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { CSRF, TEST_PASSWORD, startApiHarness, type ApiHarness } from '../support/apiHarness.js'

const PASSPORT_NAMES = ['logIn', 'login', 'logOut', 'logout', 'isAuthenticated', 'isUnauthenticated', '_sessionManager']

let h: ApiHarness
let server: http.Server
/** Each answered request's own property names, and whether passport called it signed in, in order. */
const seen: { url: string; own: string[]; signedIn: boolean }[] = []

beforeAll(async () => {
  h = await startApiHarness()
  server = http.createServer((req, res) => {
    res.once('finish', () => {
      const r = req as unknown as Request
      seen.push({ url: req.url ?? '', own: Object.keys(req), signedIn: typeof r.isAuthenticated === 'function' && r.isAuthenticated() })
    })
    h.built.app(req, res)
  })
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve))
})
afterAll(async () => {
  await new Promise<void>((resolve) => server?.close(() => resolve()))
  await h?.close()
})

describe('passport on the request prototype', () => {
  it('adds none of its seven properties to a request, and sign-in, session and sign-out still work', async () => {
    await h.user('proto-scanner', ['warehouse'])
    const agent = supertest.agent(`http://127.0.0.1:${(server.address() as AddressInfo).port}`)
    const signIn = await agent.post('/api/session').set(CSRF).send({ username: 'proto-scanner', password: TEST_PASSWORD })
    expect(signIn.status).toBe(200)
    const me = await agent.get('/api/session')
    expect(me.status).toBe(200)
    expect(me.body.user.username).toBe('proto-scanner')
    const out = await agent.delete('/api/session').set(CSRF)
    expect(out.status).toBeLessThan(300)
    const after = await agent.get('/api/session')
    expect(after.body.user ?? null).toBeNull()

    expect(seen.map((s) => s.signedIn)).toEqual([true, true, false, false])
    for (const s of seen) expect(s.own.filter((name) => PASSPORT_NAMES.includes(name))).toEqual([])
  })
})
