// Purchasing fixtures written straight into the tables (the catalog and counter APIs are other
// features'), each named with a fresh tag so test files and reruns never collide.
import { randomInt } from 'node:crypto'
import type supertest from 'supertest'
import type { DataSource } from 'typeorm'
import { withCheckDigit } from '../../shared/barcode/checkDigit.js'
import { CSRF } from './apiHarness.js'
import { countRows, insertId, tagOf } from './fixtureRows.js'

export { insertId, tagOf }

/** A valid GTIN-13 in the 2xx "restricted circulation" range, so it never names a real product. */
export function testGtin(): string {
  return withCheckDigit(`2${String(randomInt(0, 1e11)).padStart(11, '0')}`)
}

export interface FixtureItem {
  id: number
  sku: string
  gtin: string | null
}

export interface PurchasingFixture {
  tag: string
  warehouse: { id: number; code: string; bins: { dock: number; a1: number; a2: number } }
  otherWarehouse: { id: number; code: string; bin: number }
  /** Lot-tracked block with a GTIN, a sealant without GTIN, a made-to-order shower base. */
  block: FixtureItem
  sealant: FixtureItem
  base: FixtureItem
  vendorA: number
  vendorB: number
}

async function item(ds: DataSource, sku: string, extra: { family: string; unit: string; gtin?: string | null; matchLot?: boolean; mto?: boolean; cost: string }) {
  const gtin = extra.gtin ?? null
  const id = await insertId(
    ds,
    `INSERT INTO items (sku, name, family, stock_unit, gtin, cost, match_lot, made_to_order, case_qty) VALUES (?, ?, ?, ?, ?, ?, ?, ?, NULL)`,
    [sku, `Item ${sku}`, extra.family, extra.unit, gtin, extra.cost, extra.matchLot ? 1 : 0, extra.mto ? 1 : 0],
  )
  return { id, sku, gtin }
}

async function warehouse(ds: DataSource, code: string, bins: string[]) {
  const id = await insertId(ds, 'INSERT INTO warehouses (code, name, address) VALUES (?, ?, ?)', [code, `Yard ${code}`, '12 Kiln Road, Brightwater'])
  const ids: number[] = []
  for (const [i, b] of bins.entries()) {
    ids.push(await insertId(ds, 'INSERT INTO bins (warehouse_id, code, kind) VALUES (?, ?, ?)', [id, b, i === 0 ? 'receiving' : 'storage']))
  }
  return { id, ids }
}

export async function vendor(ds: DataSource, code: string, extra: { name?: string; email?: string | null; lead?: number } = {}): Promise<number> {
  return insertId(ds, 'INSERT INTO vendors (code, name, contact_name, email, terms, lead_time_days, address) VALUES (?, ?, ?, ?, ?, ?, ?)', [
    code, extra.name ?? `Vendor ${code}`, 'Mara Quill', extra.email === undefined ? `orders-${code.toLowerCase()}@vendor.example` : extra.email,
    'Net 30', extra.lead ?? 12, '3 Annealing Way, Corvale',
  ])
}

export async function vendorItem(ds: DataSource, vendorId: number, itemId: number, v: { sku: string; pack: number; min: number; cost: string; lead?: number | null; preferred?: boolean }) {
  return insertId(ds, 'INSERT INTO vendor_items (vendor_id, item_id, vendor_sku, pack_qty, min_order_qty, unit_cost, lead_time_days, preferred) VALUES (?, ?, ?, ?, ?, ?, ?, ?)', [
    vendorId, itemId, v.sku, v.pack, v.min, v.cost, v.lead ?? null, v.preferred ? 1 : 0,
  ])
}

/** The company profile every PO document prints; a test may overwrite it, a fixture only fills it when empty. */
export const TEST_COMPANY = {
  legalName: 'Brightcourse Glass Supply', billTo: 'Accounts payable\n2140 Harbor Road\nPort Alder', phone: '555-0142',
  email: 'office@brightcourse.example', replyTo: 'buying@brightcourse.example',
}

export async function companyProfileFixture(ds: DataSource): Promise<void> {
  await ds.query(
    `INSERT IGNORE INTO company_profile (id, legal_name, bill_to_address, phone, email, reply_to, document_unit) VALUES (1, ?, ?, ?, ?, ?, 'in')`,
    [TEST_COMPANY.legalName, TEST_COMPANY.billTo, TEST_COMPANY.phone, TEST_COMPANY.email, TEST_COMPANY.replyTo],
  )
}

export async function createPurchasingFixture(ds: DataSource): Promise<PurchasingFixture> {
  const tag = tagOf()
  await companyProfileFixture(ds)
  const w = await warehouse(ds, `P${tag}`, ['DOCK', 'A-01-1', 'A-01-2'])
  const o = await warehouse(ds, `Q${tag}`, ['B-01-1'])
  const block = await item(ds, `PB-${tag}`, { family: 'glass_block', unit: 'each', gtin: testGtin(), matchLot: true, cost: '2.0000' })
  const sealant = await item(ds, `PS-${tag}`, { family: 'sealant', unit: 'tube', cost: '6.5000' })
  const base = await item(ds, `PSB-${tag}`, { family: 'shower_base', unit: 'each', mto: true, cost: '410.0000' })
  const vendorA = await vendor(ds, `VA${tag}`)
  const vendorB = await vendor(ds, `VB${tag}`, { lead: 5 })
  await vendorItem(ds, vendorA, block.id, { sku: `LK-${tag}-8`, pack: 24, min: 48, cost: '2.5000', lead: 20, preferred: true })
  await vendorItem(ds, vendorA, sealant.id, { sku: `LK-${tag}-S`, pack: 12, min: 12, cost: '6.2500' })
  await vendorItem(ds, vendorB, sealant.id, { sku: `NB-${tag}-S`, pack: 10, min: 10, cost: '6.1000', preferred: true })
  await vendorItem(ds, vendorA, base.id, { sku: `LK-${tag}-SB`, pack: 1, min: 1, cost: '395.0000', lead: 21 })
  return {
    tag,
    warehouse: { id: w.id, code: `P${tag}`, bins: { dock: w.ids[0], a1: w.ids[1], a2: w.ids[2] } },
    otherWarehouse: { id: o.id, code: `Q${tag}`, bin: o.ids[0] },
    block, sealant, base, vendorA, vendorB,
  }
}

/** An accepted suggestion; one 'reorder' suggestion may be open per item and warehouse, so others use 'backorder'. */
export async function suggestion(ds: DataSource, s: { itemId: number; warehouseId: number; vendorId: number | null; qty: number; source?: 'reorder' | 'backorder' }): Promise<number> {
  return insertId(ds, `INSERT INTO purchase_suggestions (item_id, warehouse_id, vendor_id, qty, status, source) VALUES (?, ?, ?, ?, 'accepted', ?)`, [
    s.itemId, s.warehouseId, s.vendorId, s.qty, s.source ?? 'reorder',
  ])
}

/** The takeoff's nested shower base spec, as the counter stores it in bom_lines.spec_json. */
export const BASE_SPEC = { widthMm: 1219, depthMm: 914, drain: { fromLeftMm: 610, fromBackMm: 457 }, entry: 'left', curbless: false }

/** A job with one saved bill of materials holding a made-to-order shower base line. */
export async function jobWithShowerBase(ds: DataSource, f: PurchasingFixture, dueDate: string): Promise<{ jobId: number; bomLineId: number }> {
  const customer = await insertId(ds, 'INSERT INTO customers (code, name) VALUES (?, ?)', [`C${f.tag}${randomInt(0, 999)}`, `Tessellate Builders ${f.tag}`])
  const jobId = await insertId(ds, 'INSERT INTO jobs (customer_id, name, due_date) VALUES (?, ?, ?)', [customer, `Harbour loft bath ${f.tag}`, dueDate])
  const bomId = await insertId(ds, 'INSERT INTO boms (job_id, revision) VALUES (?, 1)', [jobId])
  await insertId(ds, `INSERT INTO bom_lines (bom_id, line_no, item_id, sku, description, qty, unit) VALUES (?, 1, ?, ?, 'Glass block 8x8', 120, 'each')`, [bomId, f.block.id, f.block.sku])
  const bomLineId = await insertId(
    ds,
    `INSERT INTO bom_lines (bom_id, line_no, item_id, role, sku, description, qty, unit, made_to_order, spec_json) VALUES (?, 2, ?, 'showerBase', ?, 'Shower base', 1, 'each', 1, ?)`,
    [bomId, f.base.id, f.base.sku, JSON.stringify(BASE_SPEC)],
  )
  return { jobId, bomLineId }
}

export async function count(ds: DataSource, table: string): Promise<number> {
  return countRows(ds, table)
}

/** Approves an order as its screen does: with the version the screen read (an approval without one is refused). */
export async function approveAsShown(agent: supertest.Agent, poId: number): Promise<supertest.Response> {
  const shown = await agent.get(`/api/purchase-orders/${poId}`)
  return agent.post(`/api/purchase-orders/${poId}/approve`).set(CSRF).send({ version: shown.body.version })
}
