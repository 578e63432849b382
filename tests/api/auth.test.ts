// Sign-in, sessions and CSRF against the real app and MariaDB.
// Bar: OWASP ASVS 5.0 level 2 (section numbers beside each check).
import supertest from 'supertest'
import type { DataSource } from 'typeorm'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Role } from '../../shared/roles.js'
import { createApp, type BuiltApp } from '../../server/app.js'
import { createDataSource } from '../../server/db/dataSource.js'
import { CSRF, TEST_PASSWORD, startApiHarness, type ApiHarness } from '../support/apiHarness.js'

let h: ApiHarness
beforeAll(async () => {
  h = await startApiHarness({ LUMENYARD_SIGNIN_FAILS_PER_ACCOUNT: '3' })
})
afterAll(() => h?.close())

function sessionCookie(res: { headers: Record<string, unknown> }): string | undefined {
  const raw = res.headers['set-cookie'] as string[] | undefined
  return raw?.find((c) => c.startsWith('lumenyard.sid='))?.split(';')[0]
}

describe('health', () => {
  it('answers ok when the database answers', async () => {
    const res = await h.agent().get('/api/health')
    expect(res.status).toBe(200)
    expect(res.body).toMatchObject({ status: 'ok', database: 'ok' })
  })
})

describe('sign-in', () => {
  it('signs in with the right password and returns the user without secrets', async () => {
    await h.user('auth-good', ['counter'])
    const agent = h.agent()
    const res = await agent.post('/api/session').set(CSRF).send({ username: 'auth-good', password: TEST_PASSWORD })
    expect(res.status).toBe(200)
    expect(res.body.user).toMatchObject({ username: 'auth-good', roles: ['counter'] })
    expect(JSON.stringify(res.body)).not.toContain('password')
    const me = await agent.get('/api/session')
    expect(me.status).toBe(200)
    expect(me.body.user.username).toBe('auth-good')
  })

  it('sets an HttpOnly, SameSite=Lax cookie (ASVS 3.3.1, 3.3.4)', async () => {
    await h.user('auth-cookie', ['viewer'])
    const res = await h.agent().post('/api/session').set(CSRF).send({ username: 'auth-cookie', password: TEST_PASSWORD })
    const raw = (res.headers['set-cookie'] as unknown as string[]).join(';')
    expect(raw).toMatch(/HttpOnly/i)
    expect(raw).toMatch(/SameSite=Lax/i)
  })

  it('refuses a wrong password with 401 and one message for unknown users and bad passwords', async () => {
    await h.user('auth-bad', ['viewer'])
    const wrong = await h.agent().post('/api/session').set(CSRF).send({ username: 'auth-bad', password: 'not-the-password' })
    const unknown = await h.agent().post('/api/session').set(CSRF).send({ username: 'nobody-here', password: 'whatever-it-is' })
    expect(wrong.status).toBe(401)
    expect(unknown.status).toBe(401)
    expect(wrong.body.error.message).toBe(unknown.body.error.message)
  })

  it('answers 400 with field messages for empty input', async () => {
    const res = await h.agent().post('/api/session').set(CSRF).send({ username: '', password: '' })
    expect(res.status).toBe(400)
    expect(res.body.error.fields).toHaveProperty('username')
    expect(res.body.error.fields).toHaveProperty('password')
  })

  it('throttles an account after repeated failures, even with the right password (ASVS 6.3.1)', async () => {
    await h.user('auth-throttle', ['viewer'])
    for (let i = 0; i < 3; i++) {
      const r = await h.agent().post('/api/session').set(CSRF).send({ username: 'auth-throttle', password: 'wrong-password!' })
      expect(r.status).toBe(401)
    }
    const locked = await h.agent().post('/api/session').set(CSRF).send({ username: 'auth-throttle', password: TEST_PASSWORD })
    expect(locked.status).toBe(429)
    expect(locked.body.error.message).toMatch(/Too many failed sign-ins/)
  })

  it('gives a new session id on sign-in (ASVS 7.2.4)', async () => {
    await h.user('auth-fixation', ['viewer'])
    const agent = h.agent()
    // A failed attempt creates no session (saveUninitialized false); make one exist first by signing in twice.
    const first = await agent.post('/api/session').set(CSRF).send({ username: 'auth-fixation', password: TEST_PASSWORD })
    const second = await agent.post('/api/session').set(CSRF).send({ username: 'auth-fixation', password: TEST_PASSWORD })
    const a = sessionCookie(first)
    const b = sessionCookie(second)
    expect(a).toBeDefined()
    expect(b).toBeDefined()
    expect(a).not.toBe(b)
  })

  it('refuses the old cookie after sign-out (ASVS 7.4.1)', async () => {
    await h.user('auth-signout', ['viewer'])
    const agent = h.agent()
    const res = await agent.post('/api/session').set(CSRF).send({ username: 'auth-signout', password: TEST_PASSWORD })
    const cookie = sessionCookie(res)!
    expect((await agent.delete('/api/session').set(CSRF)).status).toBe(204)
    const replay = await h.agent().get('/api/profile').set('Cookie', cookie)
    expect(replay.status).toBe(401)
  })

  it("ends a deactivated user's session at once (ASVS 7.4.2)", async () => {
    const target = await h.user('auth-deactivate', ['counter'])
    const victim = h.agent()
    await victim.post('/api/session').set(CSRF).send({ username: 'auth-deactivate', password: TEST_PASSWORD })
    expect((await victim.get('/api/profile')).status).toBe(200)
    const admin = await h.as('admin')
    const off = await admin.patch(`/api/users/${target.id}`).set(CSRF).send({ active: false })
    expect(off.status).toBe(200)
    expect((await victim.get('/api/profile')).status).toBe(401)
    const again = await h.agent().post('/api/session').set(CSRF).send({ username: 'auth-deactivate', password: TEST_PASSWORD })
    expect(again.status).toBe(401)
  })

  it('ends sessions when an admin sets a new password', async () => {
    const target = await h.user('auth-reset', ['viewer'])
    const victim = h.agent()
    await victim.post('/api/session').set(CSRF).send({ username: 'auth-reset', password: TEST_PASSWORD })
    const admin = await h.as('admin')
    const reset = await admin.post(`/api/users/${target.id}/password`).set(CSRF).send({ password: 'a-brand-new-passphrase' })
    expect(reset.status).toBe(200)
    expect((await victim.get('/api/profile')).status).toBe(401)
    const withNew = await h.agent().post('/api/session').set(CSRF).send({ username: 'auth-reset', password: 'a-brand-new-passphrase' })
    expect(withNew.status).toBe(200)
  })
})

describe('session timeouts without a write on every read', () => {
  // The session row's expiry is the idle timeout; it is pushed forward at most once a minute (server/db/sessionStore.ts).
  const sidOf = (cookie: string) => decodeURIComponent(cookie.split('=')[1]).slice(2).split('.')[0]
  const expiresOf = async (sid: string) => Number((await h.ds.query('SELECT expires FROM sessions WHERE session_id = ?', [sid]))[0].expires)

  async function signedIn(name: string) {
    await h.user(name, ['viewer'])
    const agent = h.agent()
    const res = await agent.post('/api/session').set(CSRF).send({ username: name, password: TEST_PASSWORD })
    return { agent, sid: sidOf(sessionCookie(res)!) }
  }

  it('does not write the session row on reads within a minute of the last write', async () => {
    const { agent, sid } = await signedIn('auth-touch')
    const written = (await expiresOf(sid)) - 30 // as if written half a minute ago
    await h.ds.query('UPDATE sessions SET expires = ? WHERE session_id = ?', [written, sid])
    for (let i = 0; i < 3; i++) expect((await agent.get('/api/profile')).status).toBe(200)
    expect(await expiresOf(sid)).toBe(written)
  })

  it('pushes the idle timeout forward on a read once the last write is over a minute old', async () => {
    const { agent, sid } = await signedIn('auth-touch-old')
    const twoMinutesAgo = (await expiresOf(sid)) - 120
    await h.ds.query('UPDATE sessions SET expires = ? WHERE session_id = ?', [twoMinutesAgo, sid])
    expect((await agent.get('/api/profile')).status).toBe(200)
    expect(await expiresOf(sid)).toBeGreaterThanOrEqual(twoMinutesAgo + 115)
  })

  it('sends no cookie on reads within a minute of the last write, and a renewed one when the timeout moves', async () => {
    // source: OWASP ASVS 5.0 7.3.1 (idle timeout) — the browser's cookie must live as long as the row it names,
    // and re-signing an unchanged cookie on every answer buys nothing (common practice).
    const { agent, sid } = await signedIn('auth-cookie-once')
    const written = (await expiresOf(sid)) - 30
    await h.ds.query('UPDATE sessions SET expires = ? WHERE session_id = ?', [written, sid])
    const quiet = await agent.get('/api/profile')
    expect(quiet.status).toBe(200)
    expect(sessionCookie(quiet)).toBeUndefined()
    await h.ds.query('UPDATE sessions SET expires = ? WHERE session_id = ?', [written - 90, sid])
    const renewed = await agent.get('/api/profile')
    expect(renewed.status).toBe(200)
    expect(sessionCookie(renewed)).toBeDefined()
    const expiresAt = Date.parse(/Expires=([^;]+)/i.exec((renewed.headers['set-cookie'] as unknown as string[]).join(';'))![1])
    const rowAt = (await expiresOf(sid)) * 1000
    expect(Math.abs(expiresAt - rowAt)).toBeLessThan(5_000) // the cookie ends when the row does
    expect(rowAt - Date.now()).toBeGreaterThan(29 * 60_000) // 30 minutes from now (the default idle timeout)
    expect((await agent.get('/api/profile')).status).toBe(200) // the renewed cookie still names the session
  })

  it('ends a session idle past its timeout (ASVS 7.3.1)', async () => {
    const { agent, sid } = await signedIn('auth-idle')
    await h.ds.query('UPDATE sessions SET expires = UNIX_TIMESTAMP() - 1 WHERE session_id = ?', [sid])
    expect((await agent.get('/api/profile')).status).toBe(401)
  })

  it('ends a session past its absolute lifetime even while in use (ASVS 7.3.2)', async () => {
    const { agent, sid } = await signedIn('auth-absolute')
    const longAgo = Date.now() - 13 * 3_600_000 // the default absolute timeout is 12 hours
    await h.ds.query("UPDATE sessions SET data = JSON_SET(data, '$.signedInAt', ?) WHERE session_id = ?", [longAgo, sid])
    expect((await agent.get('/api/profile')).status).toBe(401)
  })
})

describe('CSRF', () => {
  it('refuses a state-changing request without the app header', async () => {
    const res = await h.agent().post('/api/session').send({ username: 'x', password: 'y' })
    expect(res.status).toBe(403)
    expect(res.body.error.code).toBe('csrf')
  })

  it('refuses a request from another origin even with the header', async () => {
    const admin = await h.as('admin')
    const res = await admin.post('/api/users').set(CSRF).set('Origin', 'https://evil.example').send({})
    expect(res.status).toBe(403)
    expect(res.body.error.code).toBe('csrf')
  })
})

describe('errors', () => {
  it('answers unknown API paths with the JSON error shape', async () => {
    const res = await h.agent().get('/api/no-such-thing')
    expect(res.status).toBe(404)
    expect(res.body).toEqual({ error: { code: 'route_not_found', message: expect.any(String) } })
  })

  it('answers malformed JSON with 400 and no stack trace', async () => {
    const admin = await h.as('admin')
    const res = await admin.post('/api/users').set(CSRF).set('Content-Type', 'application/json').send('{"broken":')
    expect(res.status).toBe(400)
    expect(JSON.stringify(res.body)).not.toMatch(/at .*\.ts/)
  })
})

describe('revocation reaches every app process at once', () => {
  // source: OWASP ASVS 5.0 7.4.2 (a disabled account's or changed role's active sessions end) and 8.3.1 (every
  // request is authorised on the server with the user's current rights). A second app with its own connection
  // pools stands for another process: whatever one process keeps between requests, the other's change must reach
  // the very next request, not some time later.
  let other: BuiltApp
  let otherDs: DataSource
  beforeAll(async () => {
    otherDs = createDataSource(h.config)
    await otherDs.initialize()
    other = createApp({ config: h.config, ds: otherDs })
  })
  afterAll(async () => {
    await other?.close()
    await otherDs?.destroy()
  })

  /** Signed in on the other process, with a read there first (anything it keeps is warm). */
  async function signedInElsewhere(name: string, roles: Role[]) {
    const user = await h.user(name, roles)
    const agent = supertest.agent(other.app)
    expect((await agent.post('/api/session').set(CSRF).send({ username: name, password: TEST_PASSWORD })).status).toBe(200)
    expect((await agent.get('/api/reorder/choices')).status).toBe(200)
    return { user, agent }
  }

  it('a role taken away in one process is refused on the next request in another', async () => {
    const { user, agent } = await signedInElsewhere('auth-role-elsewhere', ['buyer'])
    const admin = await h.as('admin')
    expect((await admin.patch(`/api/users/${user.id}`).set(CSRF).send({ roles: ['viewer'] })).status).toBe(200)
    expect((await agent.get('/api/reorder/choices')).status).toBe(401)
  })

  it("a user's roles changed in the database count on the next request, without signing in again", async () => {
    const { user, agent } = await signedInElsewhere('auth-role-row', ['buyer'])
    await h.ds.query("UPDATE users SET roles = 'viewer' WHERE id = ?", [user.id])
    expect((await agent.get('/api/reorder/choices')).status).toBe(403)
    expect((await agent.get('/api/profile')).body.user.roles).toEqual(['viewer'])
  })

  it('a sign-out of all sessions (a new session epoch) ends the session on the next request in another process', async () => {
    const { user, agent } = await signedInElsewhere('auth-epoch-elsewhere', ['buyer'])
    await h.ds.query('UPDATE users SET session_epoch = session_epoch + 1 WHERE id = ?', [user.id])
    expect((await agent.get('/api/profile')).status).toBe(401)
  })

  it('a deactivation ends the session on the next request in another process', async () => {
    const { user, agent } = await signedInElsewhere('auth-off-elsewhere', ['buyer'])
    await h.ds.query('UPDATE users SET active = 0 WHERE id = ?', [user.id])
    expect((await agent.get('/api/profile')).status).toBe(401)
  })

  it('a sign-out in one process ends the same session in another', async () => {
    const name = 'auth-signout-elsewhere'
    await h.user(name, ['buyer'])
    const here = h.agent()
    const res = await here.post('/api/session').set(CSRF).send({ username: name, password: TEST_PASSWORD })
    const cookie = sessionCookie(res)!
    expect((await supertest(other.app).get('/api/profile').set('Cookie', cookie)).status).toBe(200)
    expect((await here.delete('/api/session').set(CSRF)).status).toBe(204)
    expect((await supertest(other.app).get('/api/profile').set('Cookie', cookie)).status).toBe(401)
  })
})
