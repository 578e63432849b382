// The floor: a bare Express 5 + mysql2 server doing the same work as Lumenyard's routes with nothing
// around it (no session, no validation library, no ORM, no logging), so each benchmark can say how far
// Lumenyard is from the least a Node server must do. Reads run Lumenyard's own SQL (imported); writes
// are the raw transaction a hand-written server would run. Also serves the minimal pages of floorPages/.
import express from 'express'
import expressStaticGzip from 'express-static-gzip'
import mysql, { type PoolConnection, type ResultSetHeader, type RowDataPacket } from 'mysql2/promise'
import { randomUUID } from 'node:crypto'
import { existsSync } from 'node:fs'
import { computeCounterBill } from '../../shared/counter/counterBill.js'
import type { CounterCatalog } from '../../shared/schemas/counter.js'
import { loadConfig } from '../../server/config.js'
import { createDataSource } from '../../server/db/dataSource.js'
import { loadCounterCatalog } from '../../server/services/counter/counterCatalog.js'
import { itemLookupSql } from '../../server/services/stockPickers.js'
import { levelsSql } from '../../server/services/stockQueries.js'

const config = loadConfig(process.env)
const pool = mysql.createPool({
  host: config.db.host, port: config.db.port, user: config.db.user, password: config.db.password, database: config.db.database,
  connectionLimit: config.db.pool,
})

async function loadCatalogOnce(): Promise<CounterCatalog> {
  const ds = createDataSource(config)
  await ds.initialize()
  try {
    return await loadCounterCatalog(ds.manager)
  } finally {
    await ds.destroy()
  }
}

async function inTransaction<T>(work: (c: PoolConnection) => Promise<T>): Promise<T> {
  const c = await pool.getConnection()
  try {
    await c.query('START TRANSACTION')
    const out = await work(c)
    await c.query('COMMIT')
    return out
  } catch (err) {
    await c.query('ROLLBACK').catch(() => undefined)
    throw err
  } finally {
    c.release()
  }
}

/** The signed-in user a hand-written server would take from its session: one bench user. */
const USER = Number(process.env.BENCH_USER_ID ?? 1)

const app = express()
app.use(express.json({ limit: '1mb' }))

app.get('/api/lookup', async (req, res) => {
  const { sql, params } = itemLookupSql('gtin', String(req.query.code))
  const [rows] = await pool.query<RowDataPacket[]>(sql, params)
  if (!rows.length) return res.status(404).json({ error: 'not found' })
  const r = rows[0]
  res.json({ item: { id: r.id, sku: r.sku, name: r.name, stockUnit: r.stock_unit, gtin: r.gtin, matchLot: !!r.match_lot }, lot: null, bin: null })
})

app.get('/api/levels', async (_req, res) => {
  const { sql, params } = levelsSql({ lowOnly: false, includeEmpty: false })
  const [rows] = await pool.query<RowDataPacket[]>(sql, params)
  res.json({
    rows: rows.slice(0, 5000).map((r) => {
      const onHand = Number(r.on_hand), reserved = Number(r.reserved)
      return {
        itemId: r.item_id, sku: r.sku, name: r.name, family: r.family, stockUnit: r.stock_unit, warehouseId: r.warehouse_id, warehouseCode: r.warehouse_code,
        onHand, reserved, available: onHand - reserved, inTransit: Number(r.in_transit), minQty: r.min_qty, low: r.min_qty !== null && onHand - reserved < r.min_qty,
      }
    }),
    truncated: rows.length > 5000,
  })
})

/** One stock issue: the key, the row locked, the balance and the ledger written, the answer kept with the key. */
app.post('/api/issue', async (req, res) => {
  const { itemId, binId, qty } = req.body as { itemId: number; binId: number; qty: number }
  const key = req.get('idempotency-key') ?? randomUUID()
  const answer = await inTransaction(async (c) => {
    await c.query('INSERT INTO idempotency_records (user_id, idem_key, scope, request_hash, response_status, response_body) VALUES (?, ?, ?, ?, 0, ?)',
      [USER, key, 'POST /floor/issue', 'x', 'null'])
    const [[bal]] = await c.query<RowDataPacket[]>(
      'SELECT id, on_hand, reserved, warehouse_id FROM stock_balances WHERE item_id = ? AND bin_id = ? AND lot_key = 0 FOR UPDATE', [itemId, binId])
    if (!bal || bal.on_hand - bal.reserved < qty) throw new Error('not enough')
    const [[cost]] = await c.query<RowDataPacket[]>('SELECT avg_cost FROM item_warehouses WHERE item_id = ? AND warehouse_id = ?', [itemId, bal.warehouse_id])
    await c.query('UPDATE stock_balances SET on_hand = on_hand - ? WHERE id = ?', [qty, bal.id])
    const batchId = randomUUID()
    const [move] = await c.query<ResultSetHeader>(
      "INSERT INTO stock_moves (at, move_type, item_id, warehouse_id, bin_id, qty, unit_cost, batch_id, user_id) VALUES (NOW(3), 'issue', ?, ?, ?, ?, ?, ?, ?)",
      [itemId, bal.warehouse_id, binId, -qty, cost?.avg_cost ?? null, batchId, USER])
    const body = { batchId, moves: [{ id: String(move.insertId), moveType: 'issue', itemId, binId, lotId: null, qty: -qty }] }
    await c.query('UPDATE idempotency_records SET response_status = 201, response_body = ? WHERE user_id = ? AND idem_key = ?', [JSON.stringify(body), USER, key])
    return body
  })
  res.status(201).json(answer)
})

/** One scanner confirmation: the list and line locked, the confirmation stored, the line and list updated. */
app.post('/api/pick-lists/:id/confirmations', async (req, res) => {
  const listId = Number(req.params.id)
  const { lineId, qty, binScan, itemScan } = req.body as { lineId: number; qty: number; binScan: string; itemScan: string }
  const key = req.get('idempotency-key') ?? randomUUID()
  const answer = await inTransaction(async (c) => {
    const [[list]] = await c.query<RowDataPacket[]>('SELECT id, status FROM pick_lists WHERE id = ? FOR UPDATE', [listId])
    const [[line]] = await c.query<RowDataPacket[]>(
      `SELECT l.id, l.qty, l.confirmed_qty, l.short_qty, b.code AS bin_code, i.sku
         FROM pick_list_lines l JOIN bins b ON b.id = l.bin_id JOIN items i ON i.id = l.item_id
        WHERE l.id = ? AND l.pick_list_id = ?`, [lineId, listId])
    if (!list || !line || line.bin_code !== binScan || line.sku !== itemScan) throw new Error('wrong scan')
    const [conf] = await c.query<ResultSetHeader>(
      'INSERT INTO pick_confirmations (pick_list_id, line_id, qty, client_key, bin_scan, item_scan, confirmed_by) VALUES (?, ?, ?, ?, ?, ?, ?)',
      [listId, lineId, qty, key, binScan, itemScan, USER])
    await c.query('UPDATE pick_list_lines SET confirmed_qty = confirmed_qty + ? WHERE id = ?', [qty, lineId])
    await c.query("UPDATE pick_lists SET status = 'picking' WHERE id = ?", [listId])
    return { confirmationId: conf.insertId, lineId, confirmedQty: line.confirmed_qty + qty, shortQty: line.short_qty, remaining: line.qty - line.confirmed_qty - qty, listStatus: 'picking', replayed: false }
  })
  res.status(201).json(answer)
})

// The takeoff: the same shared computation and the same stock query; the catalog is read once at start.
const catalog = await loadCatalogOnce()
app.post('/api/takeoff', async (req, res) => {
  const { takeoff, unit } = req.body
  const { bound: _bound, ...bill } = computeCounterBill(takeoff, catalog, unit ?? 'in')
  const ids = [...new Set(bill.lines.filter((l) => l.itemId !== null && !l.madeToOrder).map((l) => l.itemId as number))]
  const [stock] = ids.length
    ? await pool.query<RowDataPacket[]>(
      `SELECT sb.item_id, sb.warehouse_id, SUM(sb.on_hand - sb.reserved) AS available FROM stock_balances sb JOIN bins b ON b.id = sb.bin_id
        WHERE b.kind <> 'transit' AND sb.item_id IN (?) GROUP BY sb.item_id, sb.warehouse_id`, [ids])
    : [[]]
  res.json({ ...bill, availability: stock })
})

const pages = process.env.BENCH_FLOOR_PAGES
if (pages && existsSync(pages)) app.use(expressStaticGzip(pages, { enableBrotli: true, orderPreference: ['br', 'gz'], index: false }))

app.use((err: Error, _req: express.Request, res: express.Response, _next: express.NextFunction) => {
  res.status(500).json({ error: err.message })
})

// Express 5 calls this with the error when the port is taken: stop then, rather than report port 0 and fail every request.
const server = app.listen(Number(process.env.BENCH_PORT ?? 0), '127.0.0.1', (err?: Error) => {
  if (err) {
    console.error(`floor: cannot listen on port ${process.env.BENCH_PORT}: ${err.message}`)
    process.exit(1)
  }
  const a = server.address()
  process.send?.({ url: `http://127.0.0.1:${typeof a === 'object' && a ? a.port : 0}` })
})
process.once('SIGTERM', () => {
  server.close()
  server.closeAllConnections()
  pool.end().finally(() => process.exit(0))
})
// The bench runner gone (stopped, or failed midway): stop too, rather than keep the port.
process.once('disconnect', () => process.exit(0))
