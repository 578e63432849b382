// Security checks mapped to OWASP ASVS 5.0 level 2 (the requirement number is beside each check; numbers
// recalled from the 5.0.0 release are marked "from memory" in SECURITY.md). Real app, real MariaDB.
// Session timeouts run on a fake clock: only Date is faked, the session store compares expiry times in
// JavaScript, so no test waits half an hour.
import { Writable } from 'node:stream'
import { pino } from 'pino'
import supertest from 'supertest'
import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from 'vitest'
import { createApp } from '../../server/app.js'
import { loadConfig } from '../../server/config.js'
import { CSRF, TEST_PASSWORD, startApiHarness, type ApiHarness } from '../support/apiHarness.js'

let h: ApiHarness
beforeAll(async () => {
  h = await startApiHarness({ LUMENYARD_SESSION_IDLE_MINUTES: '30', LUMENYARD_SESSION_MAX_HOURS: '12' })
})
afterAll(() => h?.close())
afterEach(() => vi.useRealTimers())

const MINUTE = 60_000

async function signedIn(username: string) {
  await h.user(username, ['viewer'])
  const agent = h.agent()
  const res = await agent.post('/api/session').set(CSRF).send({ username, password: TEST_PASSWORD })
  expect(res.status).toBe(200)
  return agent
}

describe('session timeouts on a fake clock', () => {
  it('ends a session idle for longer than 30 minutes, and keeps one in use (ASVS V7.3.1)', async () => {
    vi.useFakeTimers({ toFake: ['Date'], now: Date.now() })
    const busy = await signedIn('sec-idle-busy')
    const idle = await signedIn('sec-idle-away')
    for (let step = 0; step < 3; step++) {
      vi.setSystemTime(Date.now() + 25 * MINUTE)
      expect((await busy.get('/api/profile')).status, `busy after ${(step + 1) * 25} min`).toBe(200)
    }
    // idle has not been used for 75 minutes now.
    expect((await idle.get('/api/profile')).status).toBe(401)
  })

  it('ends a session 12 hours after sign-in however busy it is (ASVS V7.3.2)', async () => {
    vi.useFakeTimers({ toFake: ['Date'], now: Date.now() })
    const agent = await signedIn('sec-absolute')
    const statuses: number[] = []
    for (let minutes = 25; minutes <= 13 * 60; minutes += 25) {
      vi.setSystemTime(Date.now() + 25 * MINUTE)
      statuses.push((await agent.get('/api/profile')).status)
    }
    // Steps of 25 minutes: 28 × 25 = 700 min is inside 12 h (720 min), 29 × 25 = 725 min is past it.
    expect(statuses.slice(0, 28)).toEqual(Array(28).fill(200))
    expect(statuses[28]).toBe(401)
    expect(new Set(statuses.slice(29))).toEqual(new Set([401]))
  })
})

describe('headers and cookies', () => {
  it('sends the security headers (ASVS V3.4.3 CSP, V3.4.4 nosniff, V3.4.5 Referrer-Policy, V3.4.6 frame-ancestors)', async () => {
    const res = await h.agent().get('/api/health')
    const picked = Object.fromEntries(
      ['content-security-policy', 'x-content-type-options', 'x-frame-options', 'referrer-policy', 'cross-origin-opener-policy', 'cross-origin-resource-policy', 'cache-control', 'x-powered-by']
        .map((name) => [name, res.headers[name] ?? null]),
    )
    expect(picked).toEqual({
      'content-security-policy': "default-src 'self';script-src 'self';style-src 'self' 'unsafe-inline';img-src 'self' data: blob:;font-src 'self' data:;connect-src 'self';media-src 'self' data: blob:;worker-src 'self' blob:;object-src 'none';base-uri 'self';form-action 'self';frame-ancestors 'none'",
      'x-content-type-options': 'nosniff',
      'x-frame-options': 'SAMEORIGIN',
      'referrer-policy': 'no-referrer',
      'cross-origin-opener-policy': 'same-origin',
      'cross-origin-resource-policy': 'same-origin',
      'cache-control': 'no-store',
      'x-powered-by': null,
    })
  })

  it('marks the session cookie Secure by default in production (ASVS V3.3.1)', () => {
    const required = { LUMENYARD_DB_PASSWORD: 'x', LUMENYARD_SESSION_SECRET: 'y'.repeat(32), LUMENYARD_PAY_SECRET_KEY: 'sk-production-key', LUMENYARD_PAY_WEBHOOK_SECRET: 'signing-secret-production' }
    expect(loadConfig({ ...required, NODE_ENV: 'production' }).session.secureCookies).toBe(true)
    expect(loadConfig({ ...required, NODE_ENV: 'production', LUMENYARD_SECURE_COOKIES: 'false' }).session.secureCookies).toBe(false)
    expect(loadConfig({ ...required, NODE_ENV: 'development' }).session.secureCookies).toBe(false)
  })

  it('refuses a cross-site form post: no app header, form encoding (ASVS V3.5.1)', async () => {
    await h.user('sec-csrf', ['warehouse'])
    const agent = h.agent()
    await agent.post('/api/session').set(CSRF).send({ username: 'sec-csrf', password: TEST_PASSWORD })
    const res = await agent.post('/api/stock/issues').set('Origin', 'https://elsewhere.example').type('form').send('lines=1')
    expect(res.status).toBe(403)
    expect(res.body.error.code).toBe('csrf')
  })
})

describe('logs', () => {
  it('write no password, cookie, session id or database password (ASVS V16.2.5)', async () => {
    const lines: string[] = []
    const sink = new Writable({ write(chunk, _enc, done) { lines.push(String(chunk)); done() } })
    const built = createApp({ config: h.config, ds: h.ds, logger: pino({ level: 'trace' }, sink) })
    try {
      await h.user('sec-logs', ['warehouse'])
      const agent = supertest.agent(built.app)
      await agent.post('/api/session').set(CSRF).send({ username: 'sec-logs', password: 'a-wrong-secret-passphrase' })
      const ok = await agent.post('/api/session').set(CSRF).send({ username: 'sec-logs', password: TEST_PASSWORD })
      const cookie = (ok.headers['set-cookie'] as unknown as string[])[0].split(';')[0]
      await agent.get('/api/profile')
      await agent.post('/api/stock/issues').set(CSRF).send({ lines: [{ itemId: 999999999, binId: 1, lotId: null, qty: 1 }] })
      await agent.post('/api/session').set(CSRF).set('Content-Type', 'application/json').send('{"broken":')
      const log = lines.join('')
      expect(lines.length).toBeGreaterThan(3)
      for (const secret of [TEST_PASSWORD, 'a-wrong-secret-passphrase', cookie, cookie.split('=')[1], decodeURIComponent(cookie.split('=')[1]), h.config.db.password, h.config.session.secret]) {
        expect(log.includes(secret), `log holds ${secret.slice(0, 6)}…`).toBe(false)
      }
    } finally {
      await built.close()
    }
  })
})
