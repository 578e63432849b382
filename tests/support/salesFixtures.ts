// Counter-sales fixtures written straight into the tables: priced items (a block, spacers sold by the
// case of 100), a warehouse with bins, and a contractor account with a job; all tagged afresh per file.
import type { DataSource } from 'typeorm'
import { createCustomerAndJob } from './counterFixtures.js'
import { insertId, tagOf } from './fixtureRows.js'
import { createWarehouse } from './stockFixtures.js'

export interface SalesFixture {
  tag: string
  block: { id: number; sku: string }
  spacers: { id: number; sku: string }
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
  const w = await createWarehouse(ds, `P${tag}`, ['C-01-1', 'C-01-2'])
  const { customerId, jobId } = await createCustomerAndJob(ds, tag)
  return { tag, block: { id: blockId, sku: blockSku }, spacers: { id: spacerId, sku: spacerSku }, warehouseId: w.id, bins: w.bins, customerId, jobId }
}
