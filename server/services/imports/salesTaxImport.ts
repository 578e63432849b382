// The sales tax rate the counter charges at each warehouse, in the columns of the everything-out file
// sales-tax.xlsx. The same rule as the prices screen's tax tab (0 to 30 %, up to 4 decimals); new rates only: a
// warehouse that already charges a rate is changed on that tab.
import { problem } from '../../../shared/errors/errorCodes.js'
import { taxRateInputSchema } from '../../../shared/schemas/pricing.js'
import type { ImportSpec } from './importTypes.js'
import { cellText, namedWarehouse, notOwn, type WarehouseFacts, warehousesByCode } from './importFacts.js'
import { insertRows, recordsImport } from './recordsImport.js'

export const SALES_TAX_SPEC: ImportSpec = {
  columns: [
    { key: 'warehouse', header: 'Warehouse', aliases: ['Warehouse code', 'Location'], required: true, kind: 'text' },
    { key: 'ratePercent', header: 'Rate percent', aliases: ['Rate', 'Tax rate'], required: true, kind: 'decimal' },
    { key: 'label', header: 'Label', aliases: ['Printed as'], kind: 'text' },
  ],
  maxRows: 500,
  maxColumns: 20,
}

export const SALES_TAX_GUIDE: Record<string, string> = {
  warehouse: 'The code of a warehouse already in Lumenyard: sales from it are taxed at this rate. One row per warehouse.',
  ratePercent: 'The rate in percent, 0 to 30 with up to 4 decimals (8.25 for 8.25 %). A warehouse that already charges a rate is refused: change it under Selling prices → Sales tax by location.',
  label: 'How documents name the tax, up to 80 characters (optional).',
}

interface TaxWrite { warehouseId: number; warehouse: string; ratePercent: string; label: string | null }
interface TaxFacts { warehouses: Map<string, WarehouseFacts>; rates: Map<number, string> }

export const salesTaxImport = recordsImport<TaxWrite, TaxFacts>({
  kind: 'sales_tax',
  spec: SALES_TAX_SPEC,
  async facts(em, _part, importId) {
    const [own, ownId] = notOwn('import_id', importId)
    const rates: { warehouse_id: number; rate_percent: string }[] = await em.query(`SELECT warehouse_id, rate_percent FROM sales_tax_rates WHERE 1 = 1${own}`, [ownId])
    return { warehouses: await warehousesByCode(em), rates: new Map(rates.map((r) => [r.warehouse_id, r.rate_percent])), held: new Set<string>() }
  },
  read(values, facts, reader) {
    const { warehouse } = namedWarehouse(values.warehouse, facts.warehouses, reader)
    const parsed = taxRateInputSchema.safeParse({ ratePercent: values.ratePercent ?? '', label: values.label ?? null })
    if (!parsed.success) reader.issues(parsed.error.issues)
    const held = warehouse ? facts.rates.get(warehouse.id) : undefined
    if (warehouse && held !== undefined) reader.add('warehouse', problem('import_tax_rate_set', { warehouse: warehouse.code, rate: held }))
    if (!warehouse || !parsed.success || held !== undefined) return null
    return { warehouseId: warehouse.id, warehouse: warehouse.code, ratePercent: parsed.data.ratePercent, label: parsed.data.label }
  },
  identity: (t) => t.warehouse,
  identityColumn: 'warehouse',
  preview: (t, values) => ({ label: t?.warehouse ?? (cellText(values.warehouse) || null), place: t ? `${t.ratePercent} %` : null }),
  async insert(em, importId, rows) {
    await insertRows(em, 'sales_tax_rates', ['warehouse_id', 'rate_percent', 'label'], importId, rows, (t) => [t.warehouseId, t.ratePercent, t.label])
    return { taxRates: rows.length }
  },
  async inUse(em, importId) {
    // A rate set on the prices screen since (the screen names who set it) belongs to that change now.
    const [changed]: { code: string }[] = await em.query(
      `SELECT w.code FROM sales_tax_rates t JOIN warehouses w ON w.id = t.warehouse_id
        WHERE t.import_id = ? AND t.updated_by IS NOT NULL LIMIT 1 FOR UPDATE`, [importId])
    return changed?.code ?? null
  },
  remove: (em, importId) => em.query('DELETE FROM sales_tax_rates WHERE import_id = ?', [importId]),
})
