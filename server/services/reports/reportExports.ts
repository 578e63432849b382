// Each report as a spreadsheet in the reader's language, through the one writer (exports/xlsxWriter.ts),
// streamed row by row: the same figures as the screen, costs only for those who may see them (columns marked
// `cost`), and a second sheet naming the period and filters.
import type { Writable } from 'node:stream'
import type { DataSource } from 'typeorm'
import type { DeadStockQuery, DeadStockRow, PeriodQuery, TurnsRow, UsageCell, VendorRow } from '../../../shared/schemas/reports.js'
import { familyName } from '../../../shared/familyNames.js'
import { fieldsSheet, sheet, streamXlsx, type Field, type SheetColumn } from '../exports/xlsxWriter.js'
import { deadAndSlowStock } from './deadStock.js'
import { stockTurns } from './stockTurns.js'
import { usageByMonth } from './usageByMonth.js'
import { vendorPerformance } from './vendorPerformance.js'

type Lang = 'en' | 'es'

const WORDS = {
  en: {
    filters: 'Filters', from: 'From', to: 'To', days: 'Days', warehouse: 'Warehouse', all: 'All', family: 'Family', total: 'All families',
    turns: { name: 'Turns', title: 'Turns and days of supply', used: 'Units used', usageValue: 'Cost of what was used', begin: 'Stock value at the start', end: 'Stock value at the end', average: 'Average stock value', turns: 'Turns', annual: 'Turns a year', days: 'Days of supply' },
    usage: { name: 'Usage', title: 'Usage by family and month', month: 'Month', qty: 'Units used', value: 'Cost of what was used' },
    dead: { name: 'Dead and slow stock', kind: 'Kind', dead: 'Dead', slow: 'Slow', sku: 'SKU', item: 'Item', onHand: 'On hand', lastUsed: 'Last used', used: 'Used in the window', days: 'Days of supply', avgCost: 'Unit cost', value: 'Value', deadDays: 'Dead after (days)', slowDays: 'Slow beyond (days of supply)', windowDays: 'Use measured over (days)' },
    vendors: { name: 'Vendors', code: 'Vendor', vendor: 'Name', orders: 'Orders received', withDate: 'With an expected date', onTime: 'On time', rate: 'On-time rate', mean: 'Lead time, mean (days)', min: 'Least (days)', max: 'Most (days)', stated: 'Stated lead time (days)' },
  },
  es: {
    filters: 'Filtros', from: 'Desde', to: 'Hasta', days: 'Días', warehouse: 'Almacén', all: 'Todos', family: 'Familia', total: 'Todas las familias',
    turns: { name: 'Rotación', title: 'Rotación y días de existencia', used: 'Unidades usadas', usageValue: 'Costo de lo usado', begin: 'Valor al comienzo', end: 'Valor al final', average: 'Valor promedio', turns: 'Rotaciones', annual: 'Rotaciones al año', days: 'Días de existencia' },
    usage: { name: 'Consumo', title: 'Consumo por familia y mes', month: 'Mes', qty: 'Unidades usadas', value: 'Costo de lo usado' },
    dead: { name: 'Existencias sin movimiento', kind: 'Tipo', dead: 'Sin movimiento', slow: 'Lenta', sku: 'SKU', item: 'Artículo', onHand: 'En existencia', lastUsed: 'Último uso', used: 'Usado en el periodo', days: 'Días de existencia', avgCost: 'Costo unitario', value: 'Valor', deadDays: 'Sin movimiento tras (días)', slowDays: 'Lenta desde (días de existencia)', windowDays: 'Uso medido en (días)' },
    vendors: { name: 'Proveedores', code: 'Proveedor', vendor: 'Nombre', orders: 'Órdenes recibidas', withDate: 'Con fecha prevista', onTime: 'A tiempo', rate: 'Tasa a tiempo', mean: 'Plazo de entrega, promedio (días)', min: 'Mínimo (días)', max: 'Máximo (días)', stated: 'Plazo declarado (días)' },
  },
} as const

/** Who reads the sheet: its language, and whether they may see costs (value columns are left out otherwise). */
export interface ExportReader {
  lang: Lang
  costs: boolean
}

export interface ReportExport {
  filename: string
  write(out: Writable): Promise<void>
}

async function warehouseField(ds: DataSource, lang: Lang, warehouseId: number | undefined): Promise<Field> {
  const [w] = warehouseId ? ((await ds.query('SELECT code FROM warehouses WHERE id = ?', [warehouseId])) as { code: string }[]) : []
  return { label: WORDS[lang].warehouse, kind: 'text', value: w?.code ?? WORDS[lang].all }
}

const periodFields = (lang: Lang, q: { from: string; to: string }): Field[] =>
  [{ label: WORDS[lang].from, kind: 'date', value: q.from }, { label: WORDS[lang].to, kind: 'date', value: q.to }]

const stamp = () => new Date().toISOString().slice(0, 10)

export async function turnsExport(ds: DataSource, q: PeriodQuery & ExportReader): Promise<ReportExport> {
  const w = WORDS[q.lang]
  const wt = w.turns
  type Row = Omit<TurnsRow, 'family'> & { label: string }
  const columns: SheetColumn<Row>[] = [
    { header: w.family, kind: 'text', value: (r) => r.label },
    { header: wt.used, kind: 'integer', value: (r) => r.usedQty },
    { header: wt.usageValue, kind: 'money', value: (r) => r.usageValue, cost: true },
    { header: wt.begin, kind: 'money', value: (r) => r.beginValue, cost: true },
    { header: wt.end, kind: 'money', value: (r) => r.endValue, cost: true },
    { header: wt.average, kind: 'money', value: (r) => r.averageValue, cost: true },
    { header: wt.turns, kind: 'decimal', places: 2, value: (r) => r.turns },
    { header: wt.annual, kind: 'decimal', places: 2, value: (r) => r.annualTurns },
    { header: wt.days, kind: 'decimal', places: 1, value: (r) => r.daysOfSupply },
  ]
  return {
    filename: `turns-${stamp()}.xlsx`,
    write: async (out) => {
      const report = await stockTurns(ds, q)
      const rows: Row[] = [
        ...report.families.map((r) => ({ ...r, label: familyName(q.lang, r.family) })),
        ...(report.total ? [{ ...report.total, label: w.total }] : []),
      ]
      const fields = [...periodFields(q.lang, q), { label: w.days, kind: 'integer' as const, value: report.days }, await warehouseField(ds, q.lang, q.warehouseId)]
      await streamXlsx(out, sheet({ name: wt.name, title: wt.title, columns, rows, orientation: 'landscape', costs: q.costs }), fieldsSheet({ name: w.filters, title: wt.title, fields }))
    },
  }
}

export async function usageExport(ds: DataSource, q: PeriodQuery & ExportReader): Promise<ReportExport> {
  const w = WORDS[q.lang]
  const columns: SheetColumn<UsageCell>[] = [
    { header: w.family, kind: 'text', value: (r) => familyName(q.lang, r.family) },
    { header: w.usage.month, kind: 'text', value: (r) => r.month },
    { header: w.usage.qty, kind: 'integer', value: (r) => r.qty },
    { header: w.usage.value, kind: 'money', value: (r) => r.usageValue, cost: true },
  ]
  return {
    filename: `usage-${stamp()}.xlsx`,
    write: async (out) => {
      const report = await usageByMonth(ds, q)
      const rows = [...report.cells].sort((a, b) => a.family.localeCompare(b.family) || a.month.localeCompare(b.month))
      const fields = [...periodFields(q.lang, q), await warehouseField(ds, q.lang, q.warehouseId)]
      await streamXlsx(out, sheet({ name: w.usage.name, title: w.usage.title, columns, rows, costs: q.costs }), fieldsSheet({ name: w.filters, title: w.usage.title, fields }))
    },
  }
}

export async function deadStockExport(ds: DataSource, q: DeadStockQuery & ExportReader): Promise<ReportExport> {
  const w = WORDS[q.lang]
  const wd = w.dead
  const columns: SheetColumn<DeadStockRow>[] = [
    { header: wd.kind, kind: 'text', value: (r) => (r.kind === 'dead' ? wd.dead : wd.slow) },
    { header: wd.sku, kind: 'text', value: (r) => r.sku },
    { header: wd.item, kind: 'text', width: 34, value: (r) => r.name },
    { header: w.family, kind: 'text', value: (r) => familyName(q.lang, r.family) },
    { header: w.warehouse, kind: 'text', value: (r) => r.warehouseCode },
    { header: wd.onHand, kind: 'integer', value: (r) => r.onHand },
    { header: wd.lastUsed, kind: 'date', value: (r) => r.lastUsedAt },
    { header: wd.used, kind: 'integer', value: (r) => r.usedInWindow },
    { header: wd.days, kind: 'decimal', places: 0, value: (r) => r.daysOfSupply },
    { header: wd.avgCost, kind: 'cost', value: (r) => r.avgCost, cost: true },
    { header: wd.value, kind: 'money', value: (r) => r.stockValue, cost: true },
  ]
  return {
    filename: `dead-and-slow-stock-${stamp()}.xlsx`,
    write: async (out) => {
      const report = await deadAndSlowStock(ds, q)
      const fields: Field[] = [
        { label: wd.deadDays, kind: 'integer', value: q.deadDays }, { label: wd.slowDays, kind: 'integer', value: q.slowDays },
        { label: wd.windowDays, kind: 'integer', value: q.windowDays }, await warehouseField(ds, q.lang, q.warehouseId),
      ]
      await streamXlsx(out, sheet({ name: wd.name, columns, rows: report.rows, orientation: 'landscape', costs: q.costs }), fieldsSheet({ name: w.filters, title: wd.name, fields }))
    },
  }
}

export async function vendorsExport(ds: DataSource, q: PeriodQuery & ExportReader): Promise<ReportExport> {
  const w = WORDS[q.lang]
  const wv = w.vendors
  const columns: SheetColumn<VendorRow>[] = [
    { header: wv.code, kind: 'text', value: (r) => r.code },
    { header: wv.vendor, kind: 'text', width: 30, value: (r) => r.name },
    { header: wv.orders, kind: 'integer', value: (r) => r.orders },
    { header: wv.withDate, kind: 'integer', value: (r) => r.withDate },
    { header: wv.onTime, kind: 'integer', value: (r) => r.onTime },
    { header: wv.rate, kind: 'decimal', places: 2, numFmt: '0%', value: (r) => r.onTimeRate },
    { header: wv.mean, kind: 'decimal', places: 1, value: (r) => r.leadDaysMean },
    { header: wv.min, kind: 'decimal', places: 1, value: (r) => r.leadDaysMin },
    { header: wv.max, kind: 'decimal', places: 1, value: (r) => r.leadDaysMax },
    { header: wv.stated, kind: 'integer', value: (r) => r.statedLeadDays },
  ]
  return {
    filename: `vendors-on-time-${stamp()}.xlsx`,
    write: async (out) => {
      const report = await vendorPerformance(ds, q)
      const fields = [...periodFields(q.lang, q), await warehouseField(ds, q.lang, q.warehouseId)]
      await streamXlsx(out, sheet({ name: wv.name, columns, rows: report.vendors, orientation: 'landscape', costs: q.costs }), fieldsSheet({ name: w.filters, title: wv.name, fields }))
    },
  }
}
