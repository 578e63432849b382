// Crash tests (`npm run test:faults`): a private MariaDB and the app as a child process, streams of
// receipts, issues and pick confirmations from several clients, then
//   1. kill -9 of the app mid-stream, restart, replay every request whose answer was lost by its
//      Idempotency-Key: 0 acknowledged moves lost, 0 doubled;
//   2. kill -9 of mariadbd mid-stream: the app answers 503 db_unavailable meanwhile, reconnects by itself
//      when the database is back (no app restart), and nothing acknowledged is lost.
// source: IETF draft "The Idempotency-Key HTTP Header Field" (a retry with the key gets the first result);
// MariaDB documentation, innodb_flush_log_at_trx_commit=1 (a committed transaction survives a crash);
// Jepsen's bank workload as the model of the totals check. Every loop is bounded; the figures are printed.
import { randomUUID } from 'node:crypto'
import { readFileSync } from 'node:fs'
import path from 'node:path'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { DataSource } from 'typeorm'
import { loadConfig } from '../../server/config.js'
import { createDataSource } from '../../server/db/dataSource.js'
import { hashPassword } from '../../server/services/userService.js'
import { adminSql, dataRoot, dbEnv, ensureAppDatabase, ensureEmbeddedServer, shutdownEmbeddedServer, type EmbeddedServer } from '../../scripts/embeddedMariadb.js'
import { insertId } from '../support/fixtureRows.js'
import { freePort, health, startAppProcess, waitFor, type AppProcess } from '../support/processes.js'

const PROFILE = 'faults'
const DATABASE = 'lumenyard_faults'
const PASSWORD = 'faults-password-123'

let server: EmbeddedServer
let profile: { name: string; port: number }
let env: Record<string, string>
let ds: DataSource
let app: AppProcess | null = null
let appPort: number

interface Fixture { itemId: number; whId: number; bins: number[]; listId: number; line: { id: number; sku: string; binCode: string }; seed: number }
let fx: Fixture
let cookies: string[] = []

beforeAll(async () => {
  profile = { name: PROFILE, port: await freePort('LUMENYARD_FAULTS_DB_PORT') }
  server = await ensureEmbeddedServer(profile)
  const creds = await ensureAppDatabase(server, profile, DATABASE, { reset: true })
  env = { ...dbEnv(creds), NODE_ENV: 'test', LUMENYARD_SESSION_SECRET: 'faults-session-secret-of-at-least-32-chars', LUMENYARD_LOG_LEVEL: 'info', LUMENYARD_SIGNIN_FAILS_PER_IP: '100000' }
  const config = loadConfig({ ...process.env, ...env })
  ds = createDataSource({ db: { ...config.db, pool: 4 } })
  await ds.initialize()
  await ds.runMigrations({ transaction: 'each' })
  fx = await fixture(ds)
  appPort = await freePort()
  app = await startAppProcess(env, appPort)
  cookies = await signIn(app.url, 6)
}, 240_000)

afterAll(async () => {
  await app?.stop()
  await ds?.destroy().catch(() => undefined)
  await shutdownEmbeddedServer(path.join(dataRoot, PROFILE, 'mysqld.sock')).catch(() => undefined)
}, 60_000)

async function fixture(ds: DataSource): Promise<Fixture> {
  const hash = await hashPassword(PASSWORD)
  for (const [name, role] of [['crash-warehouse', 'warehouse'], ['crash-counter', 'counter']] as const) {
    await ds.query('INSERT INTO users (username, display_name, roles, password_hash, active) VALUES (?, ?, ?, ?, 1)', [name, name, role, hash])
  }
  const itemId = await insertId(ds, `INSERT INTO items (sku, name, family, stock_unit, cost) VALUES ('CRASH-1', 'Crash test block', 'glass_block', 'each', 0)`, [])
  const whId = await insertId(ds, `INSERT INTO warehouses (code, name) VALUES ('CR', 'Crash yard')`, [])
  const bins: number[] = []
  for (const code of ['A-01-1', 'A-02-1', 'B-01-1']) bins.push(await insertId(ds, `INSERT INTO bins (warehouse_id, code, kind) VALUES (?, ?, 'storage')`, [whId, code]))
  return { itemId, whId, bins, listId: 0, line: { id: 0, sku: 'CRASH-1', binCode: '' }, seed: 0 }
}

async function signIn(url: string, n: number): Promise<string[]> {
  const out: string[] = []
  for (const username of ['crash-warehouse', 'crash-counter']) {
    const res = await fetch(`${url}/api/session`, { method: 'POST', headers: { 'Content-Type': 'application/json', 'X-Lumenyard-Request': '1' }, body: JSON.stringify({ username, password: PASSWORD }) })
    if (res.status !== 200) throw new Error(`sign-in ${username}: ${res.status}`)
    out.push(res.headers.getSetCookie().map((c) => c.split(';')[0]).join('; '))
  }
  return Array.from({ length: n }, () => out[0]).concat(out[1])
}

interface Answer { status: number; body: Record<string, unknown> | null }
async function post(url: string, cookie: string, p: string, body: object, key: string): Promise<Answer> {
  try {
    const res = await fetch(`${url}${p}`, {
      method: 'POST', body: JSON.stringify(body), signal: AbortSignal.timeout(15_000),
      headers: { 'Content-Type': 'application/json', 'X-Lumenyard-Request': '1', 'Idempotency-Key': key, Cookie: cookie },
    })
    return { status: res.status, body: (await res.json().catch(() => null)) as Record<string, unknown> | null }
  } catch {
    return { status: 0, body: null } // the connection broke: the outcome is unknown
  }
}

interface Sent { path: string; body: object; key: string; kind: 'receipt' | 'issue' | 'confirm'; qty: number; answer: Answer }
/** Unknown outcome: no answer, a 5xx, or the key's first request still running. */
const unknown = (a: Answer) => a.status === 0 || a.status >= 500 || (a.status === 409 && (a.body?.error as { code?: string })?.code === 'idempotency_in_progress')

/** One client's stream until stop() is true: receipts, issues and pick confirmations in turn. */
async function stream(url: () => string, cookie: string, c: number, sent: Sent[], stop: () => boolean, pauseOnFailure: boolean): Promise<void> {
  for (let i = 0; i < 400 && !stop(); i++) {
    const kind = (['receipt', 'issue', 'confirm'] as const)[(i + c) % 3]
    const bin = fx.bins[(i + c) % 2]
    const qty = 1 + ((i * 7 + c) % 4)
    const req = kind === 'receipt'
      ? { path: '/api/stock/receipts', body: { warehouseId: fx.whId, lines: [{ itemId: fx.itemId, binId: bin, qty, unitCost: '2.40' }] } }
      : kind === 'issue'
        ? { path: '/api/stock/issues', body: { lines: [{ itemId: fx.itemId, binId: bin, lotId: null, qty }] } }
        : { path: `/api/pick-lists/${fx.listId}/confirmations`, body: { lineId: fx.line.id, binScan: `B:${fx.line.binCode}`, itemScan: fx.line.sku, qty: 1 } }
    const key = randomUUID()
    const answer = await post(url(), cookie, req.path, req.body, key)
    sent.push({ ...req, key, kind, qty: kind === 'confirm' ? 1 : qty, answer })
    if (unknown(answer)) {
      if (!pauseOnFailure) return
      await new Promise((r) => setTimeout(r, 150))
    }
  }
}

/** Sends every request with an unknown outcome again, by its key, until it has a definite answer. */
async function replayUnknown(url: string, sent: Sent[], cookie: (s: Sent) => string): Promise<number> {
  let replayed = 0
  for (const s of sent.filter((x) => unknown(x.answer))) {
    for (let attempt = 0; attempt < 20 && unknown(s.answer); attempt++) {
      if (attempt) await new Promise((r) => setTimeout(r, 250))
      s.answer = await post(url, cookie(s), s.path, s.body, s.key)
    }
    replayed++
  }
  return replayed
}

/** The ledger against what the clients were told. */
async function audit(sent: Sent[], label: string) {
  const acked = sent.filter((s) => s.answer.status >= 200 && s.answer.status < 300)
  const stillUnknown = sent.filter((s) => unknown(s.answer)).length
  const moving = acked.filter((s) => s.kind !== 'confirm')
  const batchIds = moving.map((s) => String(s.answer.body?.batchId))
  const found = batchIds.length ? ((await ds.query('SELECT DISTINCT batch_id FROM stock_moves WHERE batch_id IN (?)', [batchIds])) as { batch_id: string }[]) : []
  const lost = batchIds.filter((b) => !found.some((f) => f.batch_id === b))
  const [batches] = (await ds.query('SELECT COUNT(DISTINCT batch_id) AS n FROM stock_moves WHERE item_id = ?', [fx.itemId])) as { n: string }[]
  const [confirmed] = (await ds.query('SELECT COUNT(*) AS n, COALESCE(SUM(qty), 0) AS qty FROM pick_confirmations WHERE pick_list_id = ?', [fx.listId])) as { n: string; qty: string }[]
  const [totals] = (await ds.query(
    `SELECT (SELECT COALESCE(SUM(on_hand), 0) FROM stock_balances WHERE item_id = ?) AS on_hand, (SELECT COALESCE(SUM(qty), 0) FROM stock_moves WHERE item_id = ?) AS ledger`,
    [fx.itemId, fx.itemId])) as { on_hand: string; ledger: string }[]
  const units = (k: Sent['kind']) => acked.filter((s) => s.kind === k).reduce((n, s) => n + s.qty, 0)
  const expected = fx.seed + units('receipt') - units('issue')
  const figures = {
    sent: sent.length, acknowledged: acked.length, refused: sent.filter((s) => s.answer.status >= 400 && s.answer.status < 500 && !unknown(s.answer)).length,
    'still unknown': stillUnknown, lost: lost.length, 'ledger batches': Number(batches.n), 'expected batches': 1 + moving.length,
    confirmations: Number(confirmed.n), 'acknowledged confirmations': acked.filter((s) => s.kind === 'confirm').length,
    'on hand': Number(totals.on_hand), ledger: Number(totals.ledger), expected,
  }
  console.log(`${label}: ${JSON.stringify(figures)}`)
  expect(stillUnknown).toBe(0)
  expect(lost).toEqual([]) // 0 lost
  expect(Number(batches.n)).toBe(1 + moving.length) // 0 doubled: one batch per acknowledged key, plus the seed
  expect(Number(confirmed.n)).toBe(figures['acknowledged confirmations'])
  expect(Number(totals.on_hand)).toBe(expected)
  expect(Number(totals.ledger)).toBe(Number(totals.on_hand))
}

const sentAll: Sent[] = []

describe('crashes mid-stream', () => {
  it('prepares stock and a released pick list through the API', async () => {
    const seedKey = randomUUID()
    const seed = await post(app!.url, cookies[0], '/api/stock/receipts', { warehouseId: fx.whId, lines: fx.bins.map((binId) => ({ itemId: fx.itemId, binId, qty: 400, unitCost: '2.40' })) }, seedKey)
    expect(seed.status).toBe(201)
    fx.seed = 1200
    const customerId = await insertId(ds, `INSERT INTO customers (code, name) VALUES ('CRASH', 'Crash test mason')`, [])
    const jobId = await insertId(ds, `INSERT INTO jobs (customer_id, name) VALUES (?, 'Crash test wall')`, [customerId])
    const bomId = await insertId(ds, 'INSERT INTO boms (job_id, revision) VALUES (?, 1)', [jobId])
    await ds.query(`INSERT INTO bom_lines (bom_id, line_no, item_id, description, qty, unit, made_to_order) VALUES (?, 1, ?, 'blocks', 300, 'each', 0)`, [bomId, fx.itemId])
    const made = await post(app!.url, cookies[cookies.length - 1], '/api/pick-lists', { bomId, warehouseId: fx.whId, release: true }, randomUUID())
    expect(made.status).toBe(201)
    fx.listId = (made.body!.ids as number[])[0]
    const [line] = (await ds.query('SELECT l.id, b.code FROM pick_list_lines l JOIN bins b ON b.id = l.bin_id WHERE l.pick_list_id = ? ORDER BY l.id LIMIT 1', [fx.listId])) as { id: number; code: string }[]
    fx.line = { id: line.id, sku: 'CRASH-1', binCode: line.code }
    // The app said at start whether every commit is flushed to disk.
    expect(app!.output.join('')).toMatch(/redo log is flushed at every commit/)
  })

  it('kill -9 of the app: replays by key lose nothing and double nothing', async () => {
    const sent: Sent[] = []
    let stop = false
    const streams = cookies.slice(0, 6).map((cookie, c) => stream(() => app!.url, cookie, c, sent, () => stop, false))
    await waitFor(async () => sent.filter((s) => s.answer.status === 201).length >= 40, 60_000, () => 'the stream did not get going')
    await app!.crash()
    stop = true
    await Promise.all(streams)
    const cut = sent.filter((s) => unknown(s.answer)).length
    // Restart with the redo-log flush turned down for a moment: the app must say so at start.
    await adminSql(server, 'SET GLOBAL innodb_flush_log_at_trx_commit = 2')
    app = await startAppProcess(env, appPort)
    await adminSql(server, 'SET GLOBAL innodb_flush_log_at_trx_commit = 1')
    expect(app.output.join('')).toMatch(/innodb_flush_log_at_trx_commit is 2, not 1/)
    const replayed = await replayUnknown(app.url, sent, () => cookies[0])
    console.log(`app kill -9: ${sent.length} sent before the crash, ${cut} without an answer, ${replayed} replayed by key`)
    expect(cut).toBeGreaterThan(0)
    sentAll.push(...sent)
    await audit(sentAll, 'after the app crash')
  }, 180_000)

  it('kill -9 of mariadbd: 503 meanwhile, reconnection by itself, nothing acknowledged lost', async () => {
    const sent: Sent[] = []
    let stop = false
    const url = app!.url
    const streams = cookies.slice(0, 6).map((cookie, c) => stream(() => url, cookie, c, sent, () => stop, true))
    await waitFor(async () => sent.filter((s) => s.answer.status === 201).length >= 40, 60_000, () => 'the stream did not get going')
    const pid = Number(readFileSync(path.join(dataRoot, PROFILE, 'mysqld.pid'), 'utf8'))
    process.kill(pid, 'SIGKILL')
    const killedAt = Date.now()
    await waitFor(async () => sent.filter((s) => s.answer.status === 503).length >= 6, 30_000, () => 'no 503 during the outage')
    expect(await health(url)).toBe(503)
    server = await ensureEmbeddedServer(profile) // InnoDB crash recovery
    const reconnectMs = await waitFor(async () => (await health(url)) === 200, 60_000, () => 'the app did not reconnect by itself')
    const outageMs = Date.now() - killedAt
    await new Promise((r) => setTimeout(r, 1000))
    stop = true
    await Promise.all(streams)
    const byStatus: Record<number, number> = {}
    for (const s of sent) byStatus[s.answer.status] = (byStatus[s.answer.status] ?? 0) + 1
    const codes503 = new Set(sent.filter((s) => s.answer.status === 503).map((s) => (s.answer.body?.error as { code?: string } | undefined)?.code ?? ''))
    const replayed = await replayUnknown(url, sent, () => cookies[0])
    console.log(`mariadbd kill -9: answers ${JSON.stringify(byStatus)}, 503 codes ${[...codes503].join(',')}, outage ${outageMs} ms, app reconnected ${reconnectMs} ms after the database restarted, ${replayed} replayed by key`)
    expect(byStatus[500] ?? 0).toBe(0)
    expect([...codes503]).toEqual(['db_unavailable'])
    sentAll.push(...sent)
    await audit(sentAll, 'after the database crash')
  }, 180_000)

  it('completes the pick list: the confirmed units leave the stock once', async () => {
    const done = await post(app!.url, cookies[0], `/api/pick-lists/${fx.listId}/complete`, { acceptShort: true }, randomUUID())
    expect(done.status).toBe(200)
    const confirmedUnits = sentAll.filter((s) => s.kind === 'confirm' && s.answer.status === 201).length
    expect(done.body!.issued).toBe(confirmedUnits)
    const [totals] = (await ds.query('SELECT (SELECT SUM(on_hand) FROM stock_balances WHERE item_id = ?) AS on_hand, (SELECT SUM(qty) FROM stock_moves WHERE item_id = ?) AS ledger', [fx.itemId, fx.itemId])) as { on_hand: string; ledger: string }[]
    const units = (k: Sent['kind']) => sentAll.filter((s) => s.kind === k && s.answer.status === 201).reduce((n, s) => n + s.qty, 0)
    const expected = fx.seed + units('receipt') - units('issue') - confirmedUnits
    console.log(`pick list completed: ${confirmedUnits} units issued; on hand ${totals.on_hand}, expected ${expected}`)
    expect(Number(totals.on_hand)).toBe(expected)
    expect(Number(totals.ledger)).toBe(expected)
  })
})
