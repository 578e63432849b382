// The demo scenario on the test database: the ledger explains every balance (the sum of a balance's
// moves is its on hand), nothing is negative, and the history is a year of trade ending today.
// Invariant as in the bank workload of Jepsen: totals are conserved, whatever else ran before.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { ValuationReport } from '../../shared/schemas/reports.js'
import type { TodayAnswer } from '../../shared/schemas/today.js'
import { startApiHarness, type ApiHarness } from '../support/apiHarness.js'

let h: ApiHarness
beforeAll(async () => {
  h = await startApiHarness()
})
afterAll(() => h?.close())

const num = (v: unknown) => Number(v)
/** The demo's own warehouses: other tests add fixtures of their own beside them. */
const DEMO_SITES = "(SELECT id FROM warehouses WHERE code IN ('HRY', 'MBS', 'EKD'))"

describe('demo scenario stock invariants', () => {
  it('every balance equals the sum of its moves over item, bin and lot, and none is negative', async () => {
    const mismatched = await h.ds.query(`
      SELECT b.id, b.item_id, b.bin_id, b.lot_id, b.on_hand, COALESCE(m.total, 0) AS total
      FROM stock_balances b
      LEFT JOIN (SELECT item_id, bin_id, IFNULL(lot_id, 0) AS lot_key, SUM(qty) AS total FROM stock_moves GROUP BY item_id, bin_id, IFNULL(lot_id, 0)) m
        ON m.item_id = b.item_id AND m.bin_id = b.bin_id AND m.lot_key = b.lot_key
      WHERE b.on_hand <> COALESCE(m.total, 0)`)
    expect(mismatched).toEqual([])
    const [negative] = await h.ds.query('SELECT COUNT(*) AS n FROM stock_balances WHERE on_hand < 0 OR reserved < 0')
    expect(num(negative.n)).toBe(0)
  })

  it('every group of moves in the demo warehouses has its balance row, in the warehouse of its bin', async () => {
    const orphans = await h.ds.query(`
      SELECT m.item_id, m.bin_id, m.lot_key FROM
        (SELECT DISTINCT item_id, bin_id, IFNULL(lot_id, 0) AS lot_key FROM stock_moves WHERE warehouse_id IN ${DEMO_SITES}) m
      LEFT JOIN stock_balances b ON b.item_id = m.item_id AND b.bin_id = m.bin_id AND b.lot_key = m.lot_key
      WHERE b.id IS NULL`)
    expect(orphans).toEqual([])
    const [wrongWarehouse] = await h.ds.query(
      'SELECT COUNT(*) AS n FROM stock_moves m JOIN bins b ON b.id = m.bin_id WHERE b.warehouse_id <> m.warehouse_id')
    expect(num(wrongWarehouse.n)).toBe(0)
  })

  it('reserved equals the reservations held against each balance of the demo warehouses', async () => {
    const rows = await h.ds.query(`
      SELECT b.id FROM stock_balances b
      LEFT JOIN (SELECT balance_id, SUM(qty) AS held FROM stock_reservations GROUP BY balance_id) r ON r.balance_id = b.id
      WHERE b.warehouse_id IN ${DEMO_SITES} AND b.reserved <> COALESCE(r.held, 0)`)
    expect(rows).toEqual([])
  })

  it('is a year of history ending today, across three warehouses and the whole catalog', async () => {
    const [span] = await h.ds.query('SELECT MIN(at) AS first, MAX(at) AS last, COUNT(*) AS n FROM stock_moves')
    const days = (new Date(span.last).getTime() - new Date(span.first).getTime()) / 86_400_000
    expect(days).toBeGreaterThan(360)
    expect(Date.now() - new Date(span.last).getTime()).toBeLessThan(3 * 86_400_000)
    expect(num(span.n)).toBeGreaterThanOrEqual(20_000)
    const families = await h.ds.query('SELECT DISTINCT family FROM items')
    expect(families.map((f: { family: string }) => f.family).sort()).toEqual(
      ['accessory', 'anchor', 'arc_spacer', 'fastener', 'glass_block', 'grout', 'sealant', 'shower_base', 'spacer', 'wall_section'])
    const sites = await h.ds.query(
      "SELECT w.code, COUNT(*) AS n FROM stock_moves m JOIN warehouses w ON w.id = m.warehouse_id WHERE w.code IN ('HRY', 'MBS', 'EKD') GROUP BY w.code ORDER BY w.code")
    expect(sites.map((s: { code: string }) => s.code)).toEqual(['EKD', 'HRY', 'MBS'])
    expect(sites.every((s: { n: string }) => num(s.n) > 2000)).toBe(true)
  })

  it('never keeps made-to-order items on hand unheld, and gives the demo blocks (SKUs GB-…) several lots', async () => {
    // In the demo's warehouses made-to-order units never sit free: one on hand is held for the order it was made
    // for, until it is handed over. (Other tests' own yards may keep one freed by a cancelled order.)
    const [mto] = await h.ds.query(
      `SELECT COALESCE(SUM(b.on_hand - b.reserved), 0) AS n FROM stock_balances b JOIN items i ON i.id = b.item_id
        WHERE i.made_to_order = 1 AND b.warehouse_id IN ${DEMO_SITES}`)
    expect(num(mto.n)).toBe(0)
    const [demoMto] = await h.ds.query(
      `SELECT COUNT(*) AS n FROM stock_moves m JOIN items i ON i.id = m.item_id WHERE i.made_to_order = 1 AND m.warehouse_id IN ${DEMO_SITES} AND m.doc_type IS NULL`)
    expect(num(demoMto.n)).toBe(0)
    const [lots] = await h.ds.query(`
      SELECT MIN(n) AS fewest, AVG(n) AS mean FROM
        (SELECT i.id, COUNT(l.id) AS n FROM items i LEFT JOIN lots l ON l.item_id = i.id WHERE i.family = 'glass_block' AND i.sku LIKE 'GB-%' GROUP BY i.id) t`)
    expect(num(lots.fewest)).toBeGreaterThanOrEqual(2)
    expect(num(lots.mean)).toBeGreaterThanOrEqual(3)
  })

  it('keeps a moving average for every demo warehouse that received an item', async () => {
    const missing = await h.ds.query(`
      SELECT DISTINCT m.item_id, m.warehouse_id FROM stock_moves m
      LEFT JOIN item_warehouses iw ON iw.item_id = m.item_id AND iw.warehouse_id = m.warehouse_id
      WHERE m.move_type IN ('receipt', 'transfer_in') AND m.warehouse_id IN ${DEMO_SITES} AND m.unit_cost > 0
        AND (iw.item_id IS NULL OR iw.avg_cost <= 0)`)
    expect(missing).toEqual([])
  })

  it("gives the owner's start page the same stock value per warehouse as the valuation report for today", async () => {
    // Two roads to one figure: the start page values today's balances at each pair's moving average as
    // kept by the stock service; the report replays the ledger's receipts and transfers to the end of today.
    // Moving-average (perpetual) costing — source: Weygandt, Kimmel & Kieso, Accounting Principles, inventories
    // chapter appendix — gives one average whichever way it is reached, so the two must agree to the cent.
    // Other test files may post stock meanwhile: a read is kept only when the start page is the same before
    // and after the report.
    const admin = await h.as('admin')
    const demoCodes = ['EKD', 'HRY', 'MBS']
    const startPage = async () => {
      const res = await admin.get('/api/today?tz=UTC')
      expect(res.status).toBe(200)
      const owner = (res.body as TodayAnswer).panels.find((p) => p.panel === 'owner')
      return new Map((owner?.figures ?? []).filter((f) => f.name === 'stockValue' && demoCodes.includes(f.warehouseCode ?? ''))
        .map((f) => [f.warehouseCode, f.stockValue]))
    }
    for (let attempt = 1; ; attempt++) {
      const before = await startPage()
      const res = await admin.get('/api/reports/stock-valuation?tz=UTC')
      expect(res.status).toBe(200)
      const after = await startPage()
      if (JSON.stringify([...before]) !== JSON.stringify([...after]) && attempt < 5) continue
      expect(before.size).toBe(3)
      const report = new Map((res.body as ValuationReport).warehouses.filter((w) => demoCodes.includes(w.warehouseCode))
        .map((w) => [w.warehouseCode, w.stockValue]))
      expect(report).toEqual(before)
      break
    }
  })
})
