// Opening-stock import against the real MariaDB: a file per refusal changes nothing; a commit writes
// balances and ledger together and starts the moving average from the sheet's costs; the same file
// committed twice (even at the same moment) writes once; a reversal restores the earlier state, and is
// refused once other stock has moved.
import { createHash } from 'node:crypto'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { CSRF, startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import { countRows, insertId, tagOf } from '../support/fixtureRows.js'
import { createWarehouse } from '../support/stockFixtures.js'

let h: ApiHarness
const tag = tagOf()
const BLK = `OS-BLK-${tag}` // a glass block matched by lot, 8 to a case
const SEAL = `OS-SEAL-${tag}` // a sealant tube, 12 to a case
const BASE = `OS-BASE-${tag}` // a shower base, made to order
const W1 = `O1${tag}`
const W2 = `O2${tag}`
const ids: { blk: number; seal: number; w1: number; w2: number; bins: Record<string, number> } = { blk: 0, seal: 0, w1: 0, w2: 0, bins: {} }

beforeAll(async () => {
  h = await startApiHarness()
  ids.blk = await insertId(h.ds, "INSERT INTO items (sku, name, family, stock_unit, cost, case_qty, match_lot) VALUES (?, 'Test clear 8x8 block', 'glass_block', 'each', 0, 8, 1)", [BLK])
  ids.seal = await insertId(h.ds, "INSERT INTO items (sku, name, family, stock_unit, cost, case_qty) VALUES (?, 'Test clear sealant', 'sealant', 'tube', 0, 12)", [SEAL])
  await h.ds.query("INSERT INTO items (sku, name, family, stock_unit, cost, made_to_order) VALUES (?, 'Test shower base', 'shower_base', 'each', 0, 1)", [BASE])
  const w1 = await createWarehouse(h.ds, W1, ['A-01-1', 'A-01-2'])
  const w2 = await createWarehouse(h.ds, W2, ['B-01-1'])
  ids.w1 = w1.id
  ids.w2 = w2.id
  ids.bins = { ...w1.bins, ...w2.bins }
  ids.bins.transit = await insertId(h.ds, "INSERT INTO bins (warehouse_id, code, kind) VALUES (?, 'OTW-TEST', 'transit')", [w1.id])
})
afterAll(() => h?.close())

const HEAD = 'SKU,Warehouse,Bin,Lot,Quantity,Unit cost'
const csv = (...rows: string[]) => Buffer.from([HEAD, ...rows].join('\r\n') + '\r\n', 'utf8')
const send = async (step: 'preview' | 'commit', file: Buffer, name = 'opening.csv') =>
  (await h.as('admin')).post(`/api/imports/opening_stock/${step}`).set(CSRF).attach('file', file, name)

/** Everything an import could touch for this file's items: balances, averages, moves, lots, import records. */
async function state() {
  const items = [ids.blk, ids.seal]
  return {
    balances: await h.ds.query('SELECT item_id, bin_id, lot_id, on_hand, reserved FROM stock_balances WHERE item_id IN (?) AND on_hand <> 0 ORDER BY item_id, bin_id, lot_id', [items]),
    averages: await h.ds.query('SELECT item_id, warehouse_id, avg_cost FROM item_warehouses WHERE item_id IN (?) ORDER BY item_id, warehouse_id', [items]),
    moves: await countRows(h.ds, 'stock_moves', 'item_id IN (?)', [items]),
    lots: await countRows(h.ds, 'lots', 'item_id IN (?)', [items]),
    imports: await countRows(h.ds, 'data_imports'),
  }
}

/** Ledger equals balances: the sum of every move per item, bin and lot is its on hand. */
async function ledgerMatchesBalances() {
  const gaps = await h.ds.query(
    `SELECT m.item_id, m.bin_id, m.lot_id, SUM(m.qty) AS moved, COALESCE(MAX(b.on_hand), 0) AS on_hand FROM stock_moves m
     LEFT JOIN stock_balances b ON b.item_id = m.item_id AND b.bin_id = m.bin_id AND b.lot_key = COALESCE(m.lot_id, 0)
     WHERE m.item_id IN (?) GROUP BY m.item_id, m.bin_id, m.lot_id HAVING moved <> on_hand`, [[ids.blk, ids.seal]])
  expect(gaps).toEqual([])
}

const GOOD = csv(
  `${BLK},${W1},A-01-1,R-2041,3 cases,4.00`,
  `${BLK},${W1},A-01-2,R-2041,16,5.50`,
  `${SEAL},${W1},A-01-1,,10,6.10`,
  `${SEAL},${W2},b-01-1,,1 case,6.40`,
  `${SEAL},${W2},B-01-1,R-OLD,0,6.40`,
)

describe('opening stock import', () => {
  it('refuses each bad file with the problem named on its row, and writes nothing', async () => {
    const before = await state()
    // One file per refusal the import promises, each with one bad row after a good one.
    const cases: [string, string, string][] = [
      ['unknown SKU', `NOPE-${tag},${W1},A-01-1,,5,1.00`, 'sku_not_in_catalog'],
      ['unknown bin', `${SEAL},${W1},Z-99-9,,5,1.00`, 'import_bin_unknown'],
      ['bin of another warehouse', `${SEAL},${W2},A-01-1,,5,1.00`, 'import_bin_other_warehouse'],
      ['no lot for an item matched by lot', `${BLK},${W1},A-01-1,,5,1.00`, 'import_lot_required'],
      ['negative quantity', `${SEAL},${W1},A-01-1,,-5,1.00`, 'import_qty_negative'],
      ['fractional eaches', `${SEAL},${W1},A-01-1,,2.5,1.00`, 'import_qty_whole'],
      ['missing cost', `${SEAL},${W1},A-01-1,,5,`, 'required'],
      ['pallets of an item without a pallet size', `${SEAL},${W1},A-01-1,,2 pallets,1.00`, 'import_qty_no_pallet'],
      ['a made-to-order item', `${BASE},${W1},A-01-1,,1,1.00`, 'import_made_to_order'],
      ['an on-the-way bin', `${SEAL},${W1},OTW-TEST,,5,1.00`, 'import_bin_not_storage'],
      ['unknown warehouse', `${SEAL},NOWHERE,A-01-1,,5,1.00`, 'import_warehouse_unknown'],
    ]
    for (const [name, row, code] of cases) {
      const res = await send('commit', csv(`${SEAL},${W1},A-01-2,,4,2.00`, row))
      expect(res.status, name).toBe(422)
      expect(res.body.error.code, name).toBe('import_invalid')
      expect(res.body.error.fields['3'].code, `${name}: ${JSON.stringify(res.body.error.fields)}`).toBe(code)
      expect(res.body.error.fields['2'], `${name}: the good row is not blamed`).toBeUndefined()
    }
    expect(await state()).toEqual(before)
  })

  it('checks every row in one pass, names each problem with its column, and writes nothing', async () => {
    const before = await state()
    const res = await send('preview', csv(
      `${SEAL},${W1},A-01-1,,2.5,-1`, // two problems on one row
      `${BLK},${W1},A-01-1,,5,1.00`,
      `${SEAL},${W1},A-01-2,,7,1.00`,
      `${SEAL},${W1},A-01-2,,3,1.00`, // the same item, bin and lot again
    ))
    expect(res.status, JSON.stringify(res.body)).toBe(200)
    expect(res.body).toMatchObject({ total: 4, errorRows: 3, repeatOf: null })
    const byRow = new Map<number, { column: string; problem: { code: string } }[]>(res.body.rows.map((r: { row: number; errors: [] }) => [r.row, r.errors]))
    expect(byRow.get(2)!.map((e) => [e.column, e.problem.code])).toEqual([['Quantity', 'import_qty_whole'], ['Unit cost', 'not_negative']])
    expect(byRow.get(3)!.map((e) => [e.column, e.problem.code])).toEqual([['Lot', 'import_lot_required']])
    expect(byRow.get(5)!.map((e) => e.problem)).toEqual([{ code: 'import_row_repeated', params: { row: 4 } }])
    expect(await state()).toEqual(before)
  })

  it('commits balances and ledger together, starts the moving average from the sheet, and writes a second commit of the file not at all', async () => {
    const before = await state()
    const preview = await send('preview', GOOD)
    expect(preview.body).toMatchObject({ total: 5, ready: 4, skipped: 1, errorRows: 0, repeatOf: null })
    expect(await state()).toEqual(before)

    // A double submit: both requests at once, one effect.
    const [a, b] = await Promise.all([send('commit', GOOD), send('commit', GOOD)])
    expect([a.status, b.status], JSON.stringify([a.body, b.body])).toEqual([200, 200])
    expect([a.body.repeated, b.body.repeated].sort()).toEqual([false, true])
    expect(a.body.record.id).toBe(b.body.record.id)
    const record = a.body.record
    // source: FIPS 180-4 SHA-256, computed by Node's crypto over the uploaded bytes
    expect(record).toMatchObject({ kind: 'opening_stock', fileName: 'opening.csv', rows: 5, checksum: createHash('sha256').update(GOOD).digest('hex'), byName: 'Test t-admin', reversedAt: null })
    expect(record.summary).toEqual({ lines: 4, units: 24 + 16 + 10 + 12, lotsCreated: 1 })

    const lot = (await h.ds.query('SELECT id FROM lots WHERE item_id = ? AND code = ?', [ids.blk, 'R-2041']))[0].id
    const on = async (item: number, bin: string, lotId: number | null) =>
      Number((await h.ds.query('SELECT on_hand FROM stock_balances WHERE item_id = ? AND bin_id = ? AND lot_key = ?', [item, ids.bins[bin], lotId ?? 0]))[0]?.on_hand ?? 0)
    expect(await on(ids.blk, 'A-01-1', lot)).toBe(24) // 3 cases of 8
    expect(await on(ids.blk, 'A-01-2', lot)).toBe(16)
    expect(await on(ids.seal, 'A-01-1', null)).toBe(10)
    expect(await on(ids.seal, 'B-01-1', null)).toBe(12) // 1 case of 12; the bin code matched without regard to case
    const avg = async (item: number, wh: number) => (await h.ds.query('SELECT avg_cost FROM item_warehouses WHERE item_id = ? AND warehouse_id = ?', [item, wh]))[0].avg_cost
    // source: weighted-average unit cost = cost of goods available ÷ units available (Weygandt, Kimmel &
    // Kieso, Accounting Principles, inventory chapter): (24 × 4.00 + 16 × 5.50) ÷ 40 = 184 ÷ 40 = 4.60
    expect(await avg(ids.blk, ids.w1)).toBe('4.6000')
    expect(await avg(ids.seal, ids.w1)).toBe('6.1000')
    expect(await avg(ids.seal, ids.w2)).toBe('6.4000')
    const moves = await h.ds.query("SELECT move_type, doc_type, doc_id, unit_cost FROM stock_moves WHERE item_id IN (?) AND doc_type = 'data_import' AND doc_id = ?", [[ids.blk, ids.seal], record.id])
    expect(moves).toHaveLength(4)
    expect(new Set(moves.map((m: { move_type: string }) => m.move_type))).toEqual(new Set(['opening']))
    await ledgerMatchesBalances()

    // Later, the same file again: nothing changes, and the check says so beforehand.
    const after = await state()
    expect((await send('preview', GOOD)).body.repeatOf.id).toBe(record.id)
    const again = await send('commit', GOOD, 'opening-again.csv')
    expect(again.status).toBe(200)
    expect(again.body).toMatchObject({ repeated: true, record: { id: record.id } })
    expect(await state()).toEqual(after)
  })

  it('reverses an import whole to the state before it, averages included; once reversed the file may come in again', async () => {
    // Stock already there (the file above and a receipt), then an opening row blends into it.
    const admin = await h.as('admin')
    const received = await admin.post('/api/stock/receipts').set(CSRF).set('Idempotency-Key', `os-rcv-${tag}`)
      .send({ warehouseId: ids.w2, lines: [{ itemId: ids.seal, binId: ids.bins['B-01-1'], qty: 10, unitCost: '5.00' }] })
    expect(received.status, JSON.stringify(received.body)).toBe(201)
    const before = await state()
    const file = csv(`${SEAL},${W2},B-01-1,,10,7.00`)
    const commit = await send('commit', file)
    expect(commit.status, JSON.stringify(commit.body)).toBe(200)
    // source: perpetual moving average (Weygandt, Kimmel & Kieso, Accounting Principles, inventory chapter),
    // worked by hand: 12 tubes at 6.40 from the file above, + 10 received at 5.00 → 126.80 ÷ 22 = 5.7636;
    // + 10 opening at 7.00 → (126.80 + 70.00) ÷ 32 = 6.1500
    expect((await h.ds.query('SELECT avg_cost FROM item_warehouses WHERE item_id = ? AND warehouse_id = ?', [ids.seal, ids.w2]))[0].avg_cost).toBe('6.1500')

    const reversed = await admin.post(`/api/imports/${commit.body.record.id}/reverse`).set(CSRF)
    expect(reversed.status, JSON.stringify(reversed.body)).toBe(200)
    expect(reversed.body.reversedAt).not.toBeNull()
    const now = await state()
    expect({ ...now, moves: 0, imports: 0 }).toEqual({ ...before, moves: 0, imports: 0 })
    expect(now.moves).toBe(before.moves + 2) // the opening move and its reversal: the ledger keeps both
    expect(now.imports).toBe(before.imports + 1) // and the record stays, marked reversed
    await ledgerMatchesBalances()
    // The stock value replays the ledger's costed moves: a reversal must not read as a receipt of minus units.
    const value = await admin.get(`/api/reports/stock-valuation?warehouseId=${ids.w2}`)
    expect(value.status, JSON.stringify(value.body)).toBe(200)
    const twice = await admin.post(`/api/imports/${commit.body.record.id}/reverse`).set(CSRF)
    expect([twice.status, twice.body.error.code]).toEqual([409, 'import_already_reversed'])
    const again = await send('commit', file)
    expect([again.status, again.body.repeated]).toEqual([200, false])

    // Now something else moves that stock: the import can no longer be reversed, and nothing changes.
    const issued = await admin.post('/api/stock/issues').set(CSRF).set('Idempotency-Key', `os-iss-${tag}`)
      .send({ lines: [{ itemId: ids.seal, binId: ids.bins['B-01-1'], lotId: null, qty: 1 }] })
    expect(issued.status, JSON.stringify(issued.body)).toBe(201)
    const touched = await state()
    const refused = await admin.post(`/api/imports/${again.body.record.id}/reverse`).set(CSRF)
    expect(refused.status).toBe(409)
    expect(refused.body.error).toMatchObject({ code: 'import_touched', params: { sku: SEAL, warehouse: W2 } })
    expect(await state()).toEqual(touched)
    const list = await admin.get('/api/imports')
    expect(list.body.find((r: { id: number }) => r.id === commit.body.record.id).reversedByName).toBe('Test t-admin')
  })
})
