// Counter-sales fixtures written straight into the tables: priced items (a block, spacers sold by the
// case of 100), a warehouse with bins, and a contractor account with a job; all tagged afresh per file.
import type supertest from 'supertest'
import type { DataSource } from 'typeorm'
import { CSRF } from './apiHarness.js'
import { createCustomerAndJob } from './counterFixtures.js'
import { insertId, tagOf } from './fixtureRows.js'
import { createWarehouse } from './stockFixtures.js'

export interface SalesFixture {
  tag: string
  block: { id: number; sku: string }
  spacers: { id: number; sku: string }
  /** A shower base for tiling, made to order. */
  base: { id: number; sku: string }
  warehouseId: number
  bins: Record<string, number>
  customerId: number
  jobId: number
}

export async function createSalesFixture(ds: DataSource): Promise<SalesFixture> {
  const tag = tagOf()
  const blockSku = `SB-${tag}`
  const spacerSku = `SS-${tag}`
  const blockId = await insertId(ds, `INSERT INTO items (sku, name, family, stock_unit, cost, list_price, weight_kg) VALUES (?, ?, 'glass_block', 'each', '9.1000', '24.99', '2.700')`, [blockSku, `Test block ${tag}`])
  const spacerId = await insertId(
    ds,
    `INSERT INTO items (sku, name, family, stock_unit, cost, list_price, case_qty, sell_by_pack) VALUES (?, ?, 'spacer', 'each', '0.1200', '0.45', 100, 1)`,
    [spacerSku, `Test spacers ${tag}`],
  )
  const baseSku = `SBT-${tag}`
  const baseId = await insertId(
    ds,
    `INSERT INTO items (sku, name, family, stock_unit, cost, list_price, made_to_order, weight_kg) VALUES (?, ?, 'shower_base', 'each', '410.0000', '895.00', 1, '38.000')`,
    [baseSku, `Test shower base for tiling ${tag}`],
  )
  const w = await createWarehouse(ds, `P${tag}`, ['C-01-1', 'C-01-2'])
  const { customerId, jobId } = await createCustomerAndJob(ds, tag)
  return { tag, block: { id: blockId, sku: blockSku }, spacers: { id: spacerId, sku: spacerSku }, base: { id: baseId, sku: baseSku }, warehouseId: w.id, bins: w.bins, customerId, jobId }
}

/** A saved bill for the fixture's job: 120 blocks, 250 spacers and one made-to-order base (revision `revision`). */
export async function billFor(ds: DataSource, fx: SalesFixture, revision: number, blocks = 120): Promise<number> {
  const bomId = await insertId(ds, "INSERT INTO boms (job_id, revision, status) VALUES (?, ?, 'saved')", [fx.jobId, revision])
  const lines: [number, string, string, number, number][] = [
    [fx.block.id, fx.block.sku, 'Glass block', blocks, 0],
    [fx.spacers.id, fx.spacers.sku, 'Joint spacers', 250, 0],
    [fx.base.id, fx.base.sku, 'Shower base for tiling, made to order', 1, 1],
  ]
  for (const [i, [itemId, sku, description, qty, mto]] of lines.entries()) {
    await ds.query(
      "INSERT INTO bom_lines (bom_id, line_no, item_id, sku, description, qty, unit, made_to_order) VALUES (?, ?, ?, ?, ?, ?, 'each', ?)",
      [bomId, i + 1, itemId, sku, description, qty, mto],
    )
  }
  return bomId
}

/**
 * A booked order for the fixture's contractor on a 15 %-off level (the base sells at 895.00 × 0.85 = 760.75,
 * hand-worked), made through the API: a bill, a quote offered by hand, the quote taken. Answers the order id.
 */
export async function bookedOrder(ds: DataSource, counter: supertest.Agent, fx: SalesFixture, levelCode: string, blocks = 120): Promise<number> {
  const level = await insertId(ds, "INSERT INTO price_levels (code, name, percent_off) VALUES (?, 'Contractor', 15)", [levelCode])
  await ds.query('INSERT INTO customer_terms (customer_id, price_level_id) VALUES (?, ?) ON DUPLICATE KEY UPDATE price_level_id = VALUES(price_level_id)', [fx.customerId, level])
  const bill = await billFor(ds, fx, 1, blocks)
  const quote = await counter.post('/api/quotes').set(CSRF).send({ bomId: bill, warehouseId: fx.warehouseId })
  if (quote.status !== 201) throw new Error(`quote: ${quote.status} ${JSON.stringify(quote.body)}`)
  await ds.query("UPDATE quotes SET status = 'offered', offered_at = NOW() WHERE id = ?", [quote.body.id])
  const order = await counter.post('/api/sales-orders').set(CSRF).send({ quoteId: quote.body.id })
  if (order.status !== 201) throw new Error(`order: ${order.status} ${JSON.stringify(order.body)}`)
  return order.body.id as number
}
