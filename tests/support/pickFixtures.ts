// Pick list test fixtures: items, a warehouse with aisle-bay-level bins and a second one, lots with
// their own received dates, stock received through the API, and a bill of materials written
// straight into boms/bom_lines (the counter's screens save them in the app). Invented data.
import supertest from 'supertest'
import type { DataSource } from 'typeorm'
import { withCheckDigit } from '../../shared/barcode/checkDigit.js'
import { CSRF } from './apiHarness.js'
import { countRows, insertId, tagOf } from './fixtureRows.js'

export { countRows, tagOf }

export interface FxItem { id: number; sku: string; gtin: string | null }
export interface FxWarehouse { id: number; code: string; bins: Record<string, number> }

export async function fxItem(ds: DataSource, sku: string, o: { family?: string; matchLot?: boolean; caseQty?: number | null; palletQty?: number | null; weightKg?: string; gtin?: boolean; madeToOrder?: boolean; nominalSize?: string } = {}): Promise<FxItem> {
  // A fresh GTIN-14 per run: indicator 0, 12 random digits, then the GS1 check digit.
  const gtin = o.gtin ? withCheckDigit('0' + String(Math.floor(Math.random() * 1e12)).padStart(12, '0')) : null
  const id = await insertId(ds,
    `INSERT INTO items (sku, name, family, stock_unit, case_qty, pallet_qty, gtin, weight_kg, cost, match_lot, made_to_order, nominal_size)
     VALUES (?, ?, ?, 'each', ?, ?, ?, ?, 0, ?, ?, ?)`,
    [sku, `Test ${sku}`, o.family ?? 'glass_block', o.caseQty ?? null, o.palletQty ?? null, gtin, o.weightKg ?? '0', o.matchLot ? 1 : 0, o.madeToOrder ? 1 : 0, o.nominalSize ?? null])
  return { id, sku, gtin }
}

export async function fxWarehouse(ds: DataSource, code: string, binCodes: string[], walk: { aisleOrder?: string; walkDirection?: 'serpentine' | 'oneWay' } = {}): Promise<FxWarehouse> {
  const id = await insertId(ds, 'INSERT INTO warehouses (code, name, aisle_order, walk_direction) VALUES (?, ?, ?, ?)',
    [code, `Test yard ${code}`, walk.aisleOrder ?? '', walk.walkDirection ?? 'serpentine'])
  const bins: Record<string, number> = {}
  for (const b of binCodes) bins[b] = await insertId(ds, `INSERT INTO bins (warehouse_id, code, kind) VALUES (?, ?, 'storage')`, [id, b])
  return { id, code, bins }
}

export async function fxLot(ds: DataSource, itemId: number, code: string, receivedAt: string): Promise<number> {
  return insertId(ds, 'INSERT INTO lots (item_id, code, received_at) VALUES (?, ?, ?)', [itemId, code, receivedAt])
}

/** Stock in through the stock API, as the warehouse receives it. */
export async function receive(agent: supertest.Agent, warehouseId: number, lines: { itemId: number; binId: number; lotId?: number | null; qty: number }[]): Promise<void> {
  const res = await agent.post('/api/stock/receipts').set(CSRF)
    .send({ warehouseId, lines: lines.map((l) => ({ ...l, lotId: l.lotId ?? null, unitCost: '2.50' })) })
  if (res.status !== 201) throw new Error(`receipt failed: ${res.status} ${JSON.stringify(res.body)}`)
}

export interface FxBom { customerId: number; jobId: number; bomId: number; lineIds: number[] }

export async function fxBom(ds: DataSource, tag: string, lines: { itemId: number | null; qty: number; madeToOrder?: boolean; description?: string }[]): Promise<FxBom> {
  const customerId = await insertId(ds, 'INSERT INTO customers (code, name) VALUES (?, ?)', [`C${tag}${tagOf()}`.slice(0, 20), `Harbourline Masonry ${tag}`])
  const jobId = await insertId(ds, 'INSERT INTO jobs (customer_id, name) VALUES (?, ?)', [customerId, `Lakeview bath wall ${tag}`])
  const bomId = await insertId(ds, 'INSERT INTO boms (job_id, revision) VALUES (?, 1)', [jobId])
  const lineIds: number[] = []
  for (const [i, l] of lines.entries()) {
    lineIds.push(await insertId(ds,
      `INSERT INTO bom_lines (bom_id, line_no, item_id, description, qty, unit, made_to_order) VALUES (?, ?, ?, ?, ?, 'each', ?)`,
      [bomId, i + 1, l.itemId, l.description ?? `Line ${i + 1}`, l.qty, l.madeToOrder ? 1 : 0]))
  }
  return { customerId, jobId, bomId, lineIds }
}

/** The standard yard: main warehouse M (aisles A, B, C), other warehouse O; a lot-matched block, a spacer, a second block, a shower base. */
export interface PickScenario {
  tag: string
  main: FxWarehouse
  other: FxWarehouse
  block: FxItem
  spacer: FxItem
  altBlock: FxItem
  shower: FxItem
  lots: { old: number; mid: number; young: number; alt: number }
}

export async function pickScenario(ds: DataSource, receiver: supertest.Agent): Promise<PickScenario> {
  const tag = tagOf()
  const main = await fxWarehouse(ds, `M${tag}`, ['A-01-1', 'A-02-1', 'A-03-1', 'B-01-1', 'B-02-1', 'C-01-1'], { aisleOrder: 'A,B,C' })
  const other = await fxWarehouse(ds, `O${tag}`, ['A-01-1', 'A-02-1'])
  const block = await fxItem(ds, `GB8-${tag}`, { matchLot: true, caseQty: 8, palletQty: 320, weightKg: '2.950', gtin: true, nominalSize: '8x8' })
  const spacer = await fxItem(ds, `SP-${tag}`, { family: 'spacer', caseQty: 100, weightKg: '0.010' })
  const altBlock = await fxItem(ds, `GB8W-${tag}`, { matchLot: true, caseQty: 8, weightKg: '2.950', nominalSize: '8x8' })
  const shower = await fxItem(ds, `SB-${tag}`, { family: 'shower_base', madeToOrder: true })
  const lots = {
    old: await fxLot(ds, block.id, `R1${tag}`, '2025-01-10'),
    mid: await fxLot(ds, block.id, `R2${tag}`, '2025-03-01'),
    young: await fxLot(ds, block.id, `R3${tag}`, '2025-05-01'),
    alt: await fxLot(ds, altBlock.id, `W1${tag}`, '2025-02-01'),
  }
  await receive(receiver, main.id, [
    { itemId: block.id, binId: main.bins['A-03-1'], lotId: lots.old, qty: 30 },
    { itemId: block.id, binId: main.bins['B-01-1'], lotId: lots.old, qty: 10 },
    { itemId: block.id, binId: main.bins['A-01-1'], lotId: lots.mid, qty: 100 },
    { itemId: block.id, binId: main.bins['C-01-1'], lotId: lots.young, qty: 60 },
    { itemId: spacer.id, binId: main.bins['A-02-1'], qty: 500 },
    { itemId: altBlock.id, binId: main.bins['B-02-1'], lotId: lots.alt, qty: 40 },
  ])
  await receive(receiver, other.id, [
    { itemId: block.id, binId: other.bins['A-01-1'], lotId: lots.young, qty: 50 },
    { itemId: spacer.id, binId: other.bins['A-02-1'], qty: 300 },
  ])
  return { tag, main, other, block, spacer, altBlock, shower, lots }
}

/** Balance rows whose on hand differs from the sum of their ledger moves, or whose reserved differs from their reservations. */
export async function ledgerMismatches(ds: DataSource, itemIds: number[]): Promise<string[]> {
  const rows = (await ds.query(
    `SELECT sb.id, sb.on_hand, sb.reserved,
            (SELECT COALESCE(SUM(m.qty), 0) FROM stock_moves m WHERE m.item_id = sb.item_id AND m.bin_id = sb.bin_id AND IFNULL(m.lot_id, 0) = sb.lot_key) AS ledger,
            (SELECT COALESCE(SUM(r.qty), 0) FROM stock_reservations r WHERE r.balance_id = sb.id) AS held
       FROM stock_balances sb WHERE sb.item_id IN (?)`,
    [itemIds],
  )) as { id: number; on_hand: number; reserved: number; ledger: string; held: string }[]
  return rows.filter((r) => Number(r.on_hand) !== Number(r.ledger) || Number(r.reserved) !== Number(r.held))
    .map((r) => `balance ${r.id}: on hand ${r.on_hand} vs ledger ${r.ledger}, reserved ${r.reserved} vs held ${r.held}`)
}

export async function balanceOf(ds: DataSource, itemId: number, binId: number): Promise<{ onHand: number; reserved: number }> {
  const [row] = (await ds.query('SELECT COALESCE(SUM(on_hand), 0) AS on_hand, COALESCE(SUM(reserved), 0) AS reserved FROM stock_balances WHERE item_id = ? AND bin_id = ?', [itemId, binId])) as { on_hand: string; reserved: string }[]
  return { onHand: Number(row.on_hand), reserved: Number(row.reserved) }
}

/** A supertest agent signed in as one of the demo users (browser tests set up their data through the API). */
export async function signedInAgent(app: Parameters<typeof supertest.agent>[0], username: string, password: string): Promise<supertest.Agent> {
  const agent = supertest.agent(app)
  const res = await agent.post('/api/session').set(CSRF).send({ username, password })
  if (res.status !== 200) throw new Error(`sign-in as ${username} failed: ${res.status}`)
  return agent
}

/** A released pick list for a bill of materials, made through the API as the counter would. */
export async function releasedPickList(counter: supertest.Agent, bomId: number, warehouseId: number, note: string | null = null): Promise<number> {
  const res = await counter.post('/api/pick-lists').set(CSRF).send({ bomId, warehouseId, release: true, note })
  if (res.status !== 201) throw new Error(`making the pick list failed: ${res.status} ${JSON.stringify(res.body)}`)
  return res.body.ids[0] as number
}

/**
 * A completed list's ledger against its confirmations: the units taken by each confirmation (in the
 * order recorded), and anything wrong: a confirmation with no move, a move with no confirmation or
 * of another size, a move issued twice.
 */
export async function pickLedgerCheck(ds: DataSource, listId: number): Promise<{ taken: number[]; problems: string[] }> {
  const confirmations = (await ds.query(
    'SELECT id, qty, move_id FROM pick_confirmations WHERE pick_list_id = ? AND qty > 0 ORDER BY id', [listId])) as { id: number; qty: number; move_id: string | null }[]
  const moves = (await ds.query(
    `SELECT id, qty, move_type FROM stock_moves WHERE doc_type = 'pick_list' AND doc_id = ? ORDER BY id`, [listId])) as { id: string; qty: number; move_type: string }[]
  const problems: string[] = []
  const used = new Set<string>()
  for (const c of confirmations) {
    const move = moves.find((m) => String(m.id) === String(c.move_id))
    if (!move) problems.push(`confirmation ${c.id} has no move`)
    else if (move.move_type !== 'pick' || Number(move.qty) !== -Number(c.qty)) problems.push(`confirmation ${c.id} (${c.qty}) issued as ${move.move_type} ${move.qty}`)
    else if (used.has(String(move.id))) problems.push(`move ${move.id} issued twice`)
    else used.add(String(move.id))
  }
  for (const m of moves) if (!used.has(String(m.id))) problems.push(`move ${m.id} (${m.qty}) belongs to no confirmation`)
  return { taken: confirmations.map((c) => Number(c.qty)), problems }
}
