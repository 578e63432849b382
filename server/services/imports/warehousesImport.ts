// Warehouses and their bins from the business's own lists, in the columns of the everything-out files
// warehouses.xlsx and bins.xlsx. New records only: a warehouse or bin already here is changed on its page.
// Transit bins are skipped (transfers make their own); a storage bin must fit its warehouse's bin pattern.
import { problem } from '../../../shared/errors/errorCodes.js'
import { binCodeFitsPattern, binSchema, warehouseSchema } from '../../../shared/schemas/warehouses.js'
import type { ImportSpec } from './importTypes.js'
import { cellText, distinctOf, filledCells, heldValues, inChunks, marks, namedWarehouse, notOwn } from './importFacts.js'
import { firstTimeIds, insertRows, recordsImport } from './recordsImport.js'

export const WAREHOUSES_SPEC: ImportSpec = {
  columns: [
    { key: 'code', header: 'Code', aliases: ['Warehouse', 'Warehouse code'], required: true, kind: 'text' },
    { key: 'name', header: 'Name', aliases: ['Warehouse name'], required: true, kind: 'text' },
    { key: 'address', header: 'Address', kind: 'text' },
    { key: 'binPattern', header: 'Bin pattern', kind: 'text' },
    { key: 'active', header: 'Active', kind: 'boolean' },
  ],
  maxRows: 500,
  maxColumns: 20,
}

export const WAREHOUSES_GUIDE: Record<string, string> = {
  code: 'Your code for the warehouse: 2 to 12 capital letters or digits. A code already in Lumenyard is refused.',
  name: 'Its name, as documents show it.',
  address: 'Where it is (optional).',
  binPattern: 'How its storage bin codes are made, as a pattern naming aisle, bay and level (blank: A-01-1 style).',
  active: 'no for a warehouse no longer in use (blank: yes).',
}

export const BINS_SPEC: ImportSpec = {
  columns: [
    { key: 'warehouse', header: 'Warehouse', aliases: ['Warehouse code'], required: true, kind: 'text' },
    { key: 'code', header: 'Bin', aliases: ['Bin code', 'Code'], required: true, kind: 'text' },
    { key: 'kind', header: 'Kind', kind: 'text' },
    { key: 'active', header: 'Active', kind: 'boolean' },
  ],
  maxRows: 20_000,
  maxColumns: 20,
}

export const BINS_GUIDE: Record<string, string> = {
  warehouse: 'The code of a warehouse already in Lumenyard (import warehouses first).',
  code: 'The bin code, unique in its warehouse. A storage bin must fit the warehouse\'s bin pattern.',
  kind: 'storage, receiving or staging (blank: storage). Transit rows are skipped: transfers make their own.',
  active: 'no for a bin no longer in use (blank: yes).',
}

interface WarehouseWrite { code: string; name: string; address: string | null; binPattern: string; active: boolean }

export const warehousesImport = recordsImport<WarehouseWrite, object>({
  kind: 'warehouses',
  spec: WAREHOUSES_SPEC,
  async facts(em, part, importId) {
    return { held: await heldValues(em, 'warehouses', 'code', distinctOf(part, 'code'), importId) }
  },
  read(values, _facts, reader) {
    const parsed = warehouseSchema.safeParse({ ...filledCells(values), code: cellText(values.code).toUpperCase() })
    if (!parsed.success) {
      reader.issues(parsed.error.issues)
      return null
    }
    const w = parsed.data
    return { code: w.code, name: w.name, address: w.address ?? null, binPattern: w.binPattern, active: w.active ?? true }
  },
  identity: (w) => w.code,
  identityColumn: 'code',
  preview: (w, values) => ({ label: w?.code ?? (cellText(values.code) || null), place: w?.name ?? null }),
  async insert(em, importId, rows) {
    await insertRows(em, 'warehouses', ['code', 'name', 'address', 'bin_pattern', 'active'], importId, rows, (w) => [w.code, w.name, w.address, w.binPattern, w.active ? 1 : 0])
    return { warehouses: rows.length }
  },
  async inUse(em, importId) {
    // Anything that names a warehouse by id: its bins, stock, orders, history, settings.
    const refs = ['bins', 'stock_moves', 'item_warehouses', 'purchase_orders', 'usage_history', 'reorder_policies', 'sales_tax_rates']
    const [used]: { code: string }[] = await em.query(
      `SELECT w.code FROM warehouses w WHERE w.import_id = ? AND (${refs.map((t) => `EXISTS (SELECT 1 FROM ${t} x WHERE x.warehouse_id = w.id)`).join(' OR ')}) LIMIT 1`, [importId])
    return used?.code ?? null
  },
  remove: (em, importId) => em.query('DELETE FROM warehouses WHERE import_id = ?', [importId]),
})

interface BinWrite { warehouseId: number; warehouse: string; code: string; kind: string; active: boolean }

export const binsImport = recordsImport<BinWrite, { warehouses: Map<string, { id: number; code: string; pattern: string }> }>({
  kind: 'bins',
  spec: BINS_SPEC,
  async facts(em, part, importId) {
    const rows: { id: number; code: string; bin_pattern: string }[] = await em.query('SELECT id, code, bin_pattern FROM warehouses')
    const [own, ownId] = notOwn('b.import_id', importId)
    const bins = await inChunks(distinctOf(part, 'code'), (c) => em.query(
      `SELECT w.code AS warehouse, b.code FROM bins b JOIN warehouses w ON w.id = b.warehouse_id WHERE b.code IN (${marks(c.length)})${own}`, [...c, ownId]) as Promise<{ warehouse: string; code: string }[]>)
    return {
      warehouses: new Map(rows.map((w) => [w.code.toUpperCase(), { id: w.id, code: w.code, pattern: w.bin_pattern }])),
      held: new Set(bins.map((b) => `${b.warehouse} ${b.code}`.toUpperCase())),
    }
  },
  read(values, facts, reader) {
    const { warehouse } = namedWarehouse(values.warehouse, facts.warehouses, reader)
    const kind = cellText(values.kind).toLowerCase() || 'storage'
    if (kind === 'transit') return null
    const parsed = binSchema.safeParse({ code: values.code ?? '', kind, active: values.active ?? undefined })
    if (!parsed.success) {
      reader.issues(parsed.error.issues)
      return null
    }
    if (!warehouse) return null
    const { code } = parsed.data
    if (parsed.data.kind === 'storage' && !binCodeFitsPattern(code, warehouse.pattern)) {
      reader.add('code', problem('bin_code_misfit', { code, warehouse: warehouse.code }))
    }
    return { warehouseId: warehouse.id, warehouse: warehouse.code, code, kind: parsed.data.kind, active: parsed.data.active ?? true }
  },
  identity: (b) => `${b.warehouse} ${b.code}`,
  identityColumn: 'code',
  preview: (b, values) => ({ label: b?.code ?? (cellText(values.code) || null), place: b?.warehouse ?? (cellText(values.warehouse) || null) }),
  async insert(em, importId, rows) {
    const warehouses = await firstTimeIds(em, 'bins', 'warehouse_id', importId, rows.map((b) => b.warehouseId))
    await insertRows(em, 'bins', ['warehouse_id', 'code', 'kind', 'active'], importId, rows, (b) => [b.warehouseId, b.code, b.kind, b.active ? 1 : 0])
    return { bins: rows.length, warehouses }
  },
  async inUse(em, importId) {
    const [used]: { code: string }[] = await em.query(
      `SELECT b.code FROM bins b WHERE b.import_id = ? AND (EXISTS (SELECT 1 FROM stock_moves m WHERE m.bin_id = b.id)
         OR EXISTS (SELECT 1 FROM stock_balances s WHERE s.bin_id = b.id)) LIMIT 1`, [importId])
    return used?.code ?? null
  },
  remove: (em, importId) => em.query('DELETE FROM bins WHERE import_id = ?', [importId]),
})

