// Stock test fixtures written straight into the catalog tables (the catalog APIs are another
// feature's), plus a real listening server and signed-in clients for concurrency tests.
import type { Server } from 'node:http'
import supertest from 'supertest'
import type { DataSource } from 'typeorm'
import { CSRF, TEST_PASSWORD, type ApiHarness } from './apiHarness.js'
import { insertId, tagOf } from './fixtureRows.js'

export interface StockFixture {
  tag: string
  itemId: number
  sku: string
  lotId: number
  lotCode: string
  warehouses: { id: number; code: string }[]
  /** Storage bins by code: warehouse 0 gets A1…A5, warehouse 1 gets B1, B2. */
  bins: Record<string, number>
}

export async function createItem(ds: DataSource, sku: string, extra: { name?: string; gtin?: string | null } = {}): Promise<number> {
  return insertId(ds, `INSERT INTO items (sku, name, family, stock_unit, gtin, cost) VALUES (?, ?, 'glass_block', 'each', ?, 0)`, [
    sku,
    extra.name ?? `Test block ${sku}`,
    extra.gtin ?? null,
  ])
}

export async function createWarehouse(ds: DataSource, code: string, binCodes: string[]): Promise<{ id: number; bins: Record<string, number> }> {
  const id = await insertId(ds, 'INSERT INTO warehouses (code, name) VALUES (?, ?)', [code, `Test yard ${code}`])
  const bins: Record<string, number> = {}
  for (const b of binCodes) bins[b] = await insertId(ds, `INSERT INTO bins (warehouse_id, code, kind) VALUES (?, ?, 'storage')`, [id, b])
  return { id, bins }
}

/**
 * What an opening-stock file needs to be good: a lot-matched glass block `sku` (cases of 8) and a warehouse `code`
 * with its one bin A-01-1. Answers the item's id.
 */
export async function createOpeningStockTarget(ds: DataSource, sku: string, code: string): Promise<number> {
  const itemId = await insertId(ds, "INSERT INTO items (sku, name, family, stock_unit, cost, case_qty, match_lot) VALUES (?, 'Test clear 8x8 block', 'glass_block', 'each', 0, 8, 1)", [sku])
  await createWarehouse(ds, code, ['A-01-1'])
  return itemId
}

export async function createLot(ds: DataSource, itemId: number, code: string): Promise<number> {
  return insertId(ds, 'INSERT INTO lots (item_id, code, received_at) VALUES (?, ?, CURRENT_DATE)', [itemId, code])
}

/** One item with a lot, two warehouses and a few bins, all named with a fresh tag so runs never collide. */
export async function createStockFixture(ds: DataSource): Promise<StockFixture> {
  const tag = tagOf()
  const sku = `TST-${tag}`
  const itemId = await createItem(ds, sku)
  const lotCode = `R${tag}`
  const lotId = await createLot(ds, itemId, lotCode)
  const w1 = await createWarehouse(ds, `N${tag}`, ['A-01-1', 'A-01-2', 'A-02-1', 'A-02-2', 'A-03-1'])
  const w2 = await createWarehouse(ds, `S${tag}`, ['B-01-1', 'B-01-2'])
  const names = ['A1', 'A2', 'A3', 'A4', 'A5']
  const bins: Record<string, number> = {}
  Object.values(w1.bins).forEach((id, i) => (bins[names[i]] = id))
  Object.values(w2.bins).forEach((id, i) => (bins[`B${i + 1}`] = id))
  return {
    tag, itemId, sku, lotId, lotCode,
    warehouses: [{ id: w1.id, code: `N${tag}` }, { id: w2.id, code: `S${tag}` }],
    bins,
  }
}

export interface Listening {
  url: string
  close(): Promise<void>
}

/** The app on a real port, so parallel requests really run in parallel over separate connections. */
export async function listen(h: ApiHarness): Promise<Listening> {
  const server: Server = await new Promise((resolve) => {
    const s = h.built.app.listen(0, '127.0.0.1', () => resolve(s))
  })
  const address = server.address()
  const url = `http://127.0.0.1:${typeof address === 'object' && address ? address.port : 0}`
  return {
    url,
    close: () =>
      new Promise<void>((resolve) => {
        server.close(() => resolve())
        server.closeAllConnections()
      }),
  }
}

/**
 * n clients signed in as warehouse users. Sign-in costs a bcrypt comparison, so `users` distinct
 * people sign in once each and the clients share their sessions round-robin.
 */
export async function warehouseClients(h: ApiHarness, url: string, n: number, users = 6): Promise<supertest.Agent[]> {
  const cookies: string[] = []
  for (let i = 1; i <= users; i++) {
    const username = `stock-crew-${i}`
    await h.user(username, ['warehouse'])
    const res = await supertest(url).post('/api/session').set(CSRF).send({ username, password: TEST_PASSWORD })
    if (res.status !== 200) throw new Error(`sign-in of ${username} failed: ${res.status}`)
    const raw = res.headers['set-cookie'] as unknown as string[]
    cookies.push(raw.map((c) => c.split(';')[0]).join('; '))
  }
  return Array.from({ length: n }, (_, i) => supertest.agent(url).set('Cookie', cookies[i % users]).set(CSRF))
}

export async function ledgerCount(ds: DataSource): Promise<number> {
  const [row] = await ds.query('SELECT COUNT(*) AS n FROM stock_moves')
  return Number(row.n)
}
