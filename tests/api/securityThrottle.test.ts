// Sign-in throttling under concurrency, against the real app and MariaDB.
// source: OWASP ASVS 5.0, V6.3.1 (controls against credential stuffing and brute force: a limit per account
// that a burst of parallel attempts cannot get around). Two app instances on one database stand for two
// processes behind a proxy: the counters are shared through MariaDB.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createApp, type BuiltApp } from '../../server/app.js'
import { CSRF, TEST_PASSWORD, startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import supertest from 'supertest'

const LIMIT = 5
let h: ApiHarness
let second: BuiltApp
beforeAll(async () => {
  h = await startApiHarness({ LUMENYARD_SIGNIN_FAILS_PER_ACCOUNT: String(LIMIT) })
  second = createApp({ config: h.config, ds: h.ds })
})
afterAll(async () => {
  await second?.close()
  await h?.close()
})

const attempt = (app: BuiltApp, username: string, password: string) =>
  supertest(app.app).post('/api/session').set(CSRF).send({ username, password })

describe('sign-in throttle under concurrency (ASVS V6.3.1)', () => {
  it(`lets exactly ${LIMIT} of 30 simultaneous wrong passwords reach the check; the rest are 429`, async () => {
    await h.user('throttle-burst', ['viewer'])
    const answers = await Promise.all(Array.from({ length: 30 }, () => attempt(h.built, 'throttle-burst', 'wrong-password-1')))
    const count = (s: number) => answers.filter((a) => a.status === s).length
    console.log(`throttle burst: 30 wrong passwords at once → ${count(401)} checked (401), ${count(429)} refused (429)`)
    expect(count(401)).toBe(LIMIT)
    expect(count(429)).toBe(30 - LIMIT)
    // Locked now, even with the right password.
    expect((await attempt(h.built, 'throttle-burst', TEST_PASSWORD)).status).toBe(429)
  })

  it('shares the counters between two app processes on one database', async () => {
    await h.user('throttle-two', ['viewer'])
    const answers = await Promise.all(Array.from({ length: 20 }, (_, i) => attempt(i % 2 ? second : h.built, 'throttle-two', 'wrong-password-2')))
    const checked = answers.filter((a) => a.status === 401).length
    console.log(`throttle across two processes: 20 wrong passwords → ${checked} checked`)
    expect(checked).toBe(LIMIT)
    expect((await attempt(second, 'throttle-two', TEST_PASSWORD)).status).toBe(429)
  })

  it('forgets the failures after a right password', async () => {
    await h.user('throttle-reset', ['viewer'])
    for (let i = 0; i < LIMIT - 1; i++) expect((await attempt(h.built, 'throttle-reset', 'wrong-password-3')).status).toBe(401)
    expect((await attempt(second, 'throttle-reset', TEST_PASSWORD)).status).toBe(200)
    for (let i = 0; i < LIMIT - 1; i++) expect((await attempt(h.built, 'throttle-reset', 'wrong-password-3')).status).toBe(401)
    expect((await attempt(h.built, 'throttle-reset', TEST_PASSWORD)).status).toBe(200)
  })
})
