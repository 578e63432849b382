// A database outage answers 503 with the code db_unavailable (not 500 "internal"), and the app
// reconnects by itself when the database is back. The app reaches MariaDB through a small TCP relay in
// this test, which the test cuts and restores; killing the real mariadbd is `npm run test:faults`.
// source: RFC 9110 §15.6.4 (503 Service Unavailable: a temporary overload or maintenance; Retry-After
// may say how long).
import net from 'node:net'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { CSRF, TEST_PASSWORD, startApiHarness, type ApiHarness } from '../support/apiHarness.js'

let relay: net.Server
let relayPort = 0
const sockets = new Set<net.Socket>()
let target = 0
let h: ApiHarness

function listenRelay(): Promise<void> {
  relay = net.createServer((client) => {
    const upstream = net.connect(target, '127.0.0.1')
    for (const s of [client, upstream]) { sockets.add(s); s.on('close', () => sockets.delete(s)); s.on('error', () => s.destroy()) }
    client.pipe(upstream).pipe(client)
  })
  return new Promise((resolve) => relay.listen(relayPort, '127.0.0.1', () => { relayPort = (relay.address() as net.AddressInfo).port; resolve() }))
}

async function cut(): Promise<void> {
  const closed = new Promise<void>((resolve) => relay.close(() => resolve()))
  for (const s of sockets) s.destroy()
  await closed
}

beforeAll(async () => {
  target = Number(process.env.LUMENYARD_DB_PORT)
  await listenRelay()
  h = await startApiHarness({ LUMENYARD_DB_PORT: String(relayPort) })
})
afterAll(async () => {
  await h?.close()
  relay?.close()
})

describe('database outage', () => {
  it('answers 503 db_unavailable while the database is away, and serves again by itself after', async () => {
    await h.user('outage-crew', ['warehouse'])
    const agent = h.agent()
    expect((await agent.post('/api/session').set(CSRF).send({ username: 'outage-crew', password: TEST_PASSWORD })).status).toBe(200)
    expect((await agent.get('/api/stock/places')).status).toBe(200)

    await cut()
    const read = await agent.get('/api/stock/places')
    const write = await agent.post('/api/stock/issues').set(CSRF).set('Idempotency-Key', 'outage-write-1').send({ lines: [{ itemId: 1, binId: 1, lotId: null, qty: 1 }] })
    const health = await agent.get('/api/health')
    for (const res of [read, write, health]) {
      expect(res.status).toBe(503)
      expect(res.body.error.code).toBe('db_unavailable')
    }
    expect(read.headers['retry-after']).toBe('5')
    expect(JSON.stringify(read.body)).not.toMatch(/ECONNRE|at .*\.ts/) // no driver detail or stack reaches the client

    await listenRelay()
    // The pools discard the broken connections and open new ones: no restart.
    let status = 0
    for (let i = 0; i < 20 && status !== 200; i++) {
      status = (await agent.get('/api/stock/places')).status
      if (status !== 200) await new Promise((r) => setTimeout(r, 250))
    }
    expect(status).toBe(200)
    expect((await agent.get('/api/health')).body).toMatchObject({ status: 'ok' })
  })
})
