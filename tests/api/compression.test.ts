// How the client and the API answers travel: pre-compressed files chosen by Accept-Encoding (RFC 9110 §12.5.3),
// hashed files cached for good, the page itself revalidated, JSON compressed on the fly.
import { gunzipSync, brotliCompressSync, gzipSync } from 'node:zlib'
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs'
import http, { type IncomingHttpHeaders, type Server } from 'node:http'
import type { AddressInfo } from 'node:net'
import os from 'node:os'
import path from 'node:path'
import supertest from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createApp, type BuiltApp } from '../../server/app.js'
import { CSRF, TEST_PASSWORD, startApiHarness, type ApiHarness } from '../support/apiHarness.js'

let h: ApiHarness
let app: BuiltApp
let dist: string
const script = `console.log(${JSON.stringify('glass block '.repeat(400))})\n`

let server: Server
interface RawAnswer { status: number; headers: IncomingHttpHeaders; body: Buffer }

/** An answer's bytes as sent, not decoded (HTTP clients such as supertest decode them on the way in). */
function getRaw(pathname: string, headers: Record<string, string>): Promise<RawAnswer> {
  const { port } = server.address() as AddressInfo
  return new Promise((resolve, reject) => {
    http.get({ host: '127.0.0.1', port, path: pathname, headers }, (res) => {
      const chunks: Buffer[] = []
      res.on('data', (c: Buffer) => chunks.push(c))
      res.on('end', () => resolve({ status: res.statusCode ?? 0, headers: res.headers, body: Buffer.concat(chunks) }))
    }).on('error', reject)
  })
}

beforeAll(async () => {
  h = await startApiHarness()
  dist = mkdtempSync(path.join(os.tmpdir(), 'lumenyard-dist-'))
  mkdirSync(path.join(dist, 'assets'))
  writeFileSync(path.join(dist, 'index.html'), '<!doctype html><title>Lumenyard</title>')
  const js = path.join(dist, 'assets', 'main-AbC123.js')
  writeFileSync(js, script)
  writeFileSync(js + '.br', brotliCompressSync(script))
  writeFileSync(js + '.gz', gzipSync(script))
  app = createApp({ config: h.config, ds: h.ds, clientDist: dist })
  server = await new Promise<Server>((resolve) => {
    const s = app.app.listen(0, '127.0.0.1', () => resolve(s))
  })
})
afterAll(async () => {
  await new Promise((resolve) => server?.close(resolve))
  await app?.close()
  await h?.close()
  rmSync(dist, { recursive: true, force: true })
})

describe('client files', () => {
  it('sends the brotli file to a browser that takes it, and caches a hashed file for good', async () => {
    const res = await getRaw('/assets/main-AbC123.js', { 'Accept-Encoding': 'gzip, deflate, br' })
    expect(res.status).toBe(200)
    expect(res.headers['content-encoding']).toBe('br')
    expect(res.headers['content-type']).toMatch(/javascript/)
    expect(res.headers['cache-control']).toBe('public, max-age=31536000, immutable')
    expect(res.headers.vary).toMatch(/Accept-Encoding/i)
    expect(res.body.length).toBeLessThan(script.length / 10)
  })

  it('sends the gzip file when brotli is not accepted, and the plain file when nothing is', async () => {
    const gz = await getRaw('/assets/main-AbC123.js', { 'Accept-Encoding': 'gzip' })
    expect(gz.headers['content-encoding']).toBe('gzip')
    expect(gunzipSync(gz.body).toString()).toBe(script)
    const plain = await getRaw('/assets/main-AbC123.js', { 'Accept-Encoding': 'identity' })
    expect(plain.headers['content-encoding']).toBeUndefined()
    expect(plain.body.toString()).toBe(script)
  })

  it('answers any page address with index.html, revalidated on every visit', async () => {
    const res = await supertest(app.app).get('/stock/overview')
    expect(res.status).toBe(200)
    expect(res.text).toContain('<title>Lumenyard</title>')
    expect(res.headers['cache-control']).toBe('no-cache')
    // source: RFC 9110 §13.1.2 and §15.4.5 — a revisit naming the page's current validator gets 304 Not Modified
    const tag = res.headers.etag as string
    expect(tag).toMatch(/^W\/".+"$/)
    const again = await supertest(app.app).get('/stock/overview').set('If-None-Match', tag)
    expect(again.status).toBe(304)
    const changed = await supertest(app.app).get('/stock/overview').set('If-None-Match', 'W/"another-page"')
    expect(changed.status).toBe(200)
  })
})

describe('API answers', () => {
  it('compresses a large JSON answer for a client that accepts gzip', async () => {
    await h.user('compression-viewer', ['viewer'])
    const signIn = await supertest(app.app).post('/api/session').set(CSRF).send({ username: 'compression-viewer', password: TEST_PASSWORD })
    const cookie = (signIn.headers['set-cookie'] as unknown as string[])[0].split(';')[0]
    const res = await getRaw('/api/stock/levels', { 'Accept-Encoding': 'gzip', Cookie: cookie })
    expect(res.status).toBe(200)
    expect(res.headers['content-encoding']).toBe('gzip')
    const body = JSON.parse(gunzipSync(res.body).toString())
    expect(body.rows.length).toBeGreaterThan(10) // the demo scenario's stock
    expect(res.body.length).toBeLessThan(JSON.stringify(body).length / 3)
  })

  it("sends a scanner's short answer as it is, and no answer of the API with a validator it would never use", async () => {
    // source: RFC 9111 §5.2.2.5 — an answer marked no-store is never kept, so nothing revalidates it (common practice
    // to leave its ETag out); a few hundred bytes gain nothing from gzip (RFC 1952 adds 18 bytes of frame).
    await h.user('compression-scanner', ['warehouse'])
    const signIn = await supertest(app.app).post('/api/session').set(CSRF).send({ username: 'compression-scanner', password: TEST_PASSWORD })
    const cookie = (signIn.headers['set-cookie'] as unknown as string[])[0].split(';')[0]
    const [{ sku }] = await h.ds.query('SELECT sku FROM items WHERE active = 1 ORDER BY id LIMIT 1')
    const res = await getRaw(`/api/stock/lookup?kind=sku&code=${encodeURIComponent(sku)}`, { 'Accept-Encoding': 'gzip, br', Cookie: cookie })
    expect(res.status).toBe(200)
    expect(res.headers['content-encoding']).toBeUndefined()
    expect(JSON.parse(res.body.toString()).item.sku).toBe(sku)
    expect(res.headers['cache-control']).toBe('no-store')
    expect(res.headers.etag).toBeUndefined()
    const levels = await getRaw('/api/stock/levels', { 'Accept-Encoding': 'gzip', Cookie: cookie })
    expect(levels.headers.etag).toBeUndefined()
  })
})
