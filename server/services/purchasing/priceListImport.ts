// A vendor's price list from .xlsx or .csv, through the shared upload guard and parser
// (server/services/imports): preview checks every row and writes nothing; commit checks again and
// writes every row in one transaction, or nothing when any row fails. A row whose SKU the vendor
// already sells updates that vendor item (absent columns keep their values); others are added.
import { In, type DataSource, type EntityManager } from 'typeorm'
import { vendorItemSchema } from '../../../shared/schemas/purchasing.js'
import type { PriceListPreview, PriceListPreviewRow as PriceListRow } from '../../../shared/schemas/purchasingViews.js'
import { inTransaction } from '../../db/transaction.js'
import { Item } from '../../entities/Item.js'
import { VendorItem } from '../../entities/Vendor.js'
import { AppError, problem } from '../../errors.js'
import type { RowProblem } from '../../../shared/errors/errorCodes.js'
import { zodIssueProblem } from '../../../shared/errors/zodProblems.js'
import { audit, type AuditActor } from '../auditService.js'
import { buildXlsx, sheet } from '../exports/xlsxWriter.js'
import type { ImportRow, ImportSpec, ParsedSheet } from '../imports/importTypes.js'
import { parseSpreadsheet } from '../imports/spreadsheetParser.js'
import type { GuardedUpload } from '../imports/uploadGuard.js'
import { findVendor } from './vendorService.js'
import { versionBumpIfChanged } from '../../db/versionBump.js'

export const PRICE_LIST_SPEC: ImportSpec = {
  columns: [
    { key: 'sku', header: 'Our SKU', aliases: ['SKU', 'Item SKU'], required: true, kind: 'text' },
    { key: 'vendorSku', header: 'Vendor SKU', aliases: ['Vendor item', 'Their SKU'], required: true, kind: 'text' },
    { key: 'unitCost', header: 'Cost per stock unit', aliases: ['Unit cost', 'Cost', 'Price'], required: true, kind: 'decimal' },
    { key: 'packQty', header: 'Pack size', aliases: ['Pack', 'Pack qty'], kind: 'integer' },
    { key: 'minOrderQty', header: 'Minimum order', aliases: ['Min order', 'Minimum'], kind: 'integer' },
    { key: 'leadTimeDays', header: 'Lead time days', aliases: ['Lead time'], kind: 'integer' },
    { key: 'preferred', header: 'Preferred', kind: 'boolean' },
  ],
  ignore: ['Description', 'Item name', 'Name', 'Notes'],
  maxRows: 5000,
  maxColumns: 30,
}

interface Checked {
  preview: PriceListRow
  write: { itemId: number; vendorSku: string; packQty: number; minOrderQty: number; unitCost: string; leadTimeDays: number | null; preferred: boolean } | null
}

const rowSchema = vendorItemSchema.omit({ itemId: true })
const HEADER = new Map(PRICE_LIST_SPEC.columns.map((c) => [c.key, c.header]))
const headerOf = (key: string | null) => (key ? (HEADER.get(key) ?? key) : null)

function checkRow(r: ImportRow, sheet: ParsedSheet, item: Item | undefined, existing: VendorItem | undefined): Checked {
  const issues = sheet.issues.filter((i) => i.row === r.row)
  const errors: RowProblem[] = issues.map((i) => ({ column: headerOf(i.column), problem: i.problem }))
  const sku = typeof r.values.sku === 'string' ? r.values.sku : null
  const present = Object.fromEntries(Object.entries(r.values).filter(([k, v]) => k !== 'sku' && v !== null && !issues.some((i) => i.column === k)))
  if (sku && !item) errors.push({ column: 'Our SKU', problem: problem('sku_not_in_catalog', { sku }) })
  const base = existing
    ? { vendorSku: existing.vendorSku, packQty: existing.packQty, minOrderQty: existing.minOrderQty, unitCost: existing.unitCost, leadTimeDays: existing.leadTimeDays, preferred: existing.preferred }
    : { packQty: 1, minOrderQty: 1 }
  const parsed = rowSchema.safeParse({ ...base, ...present })
  if (!parsed.success) {
    for (const issue of parsed.error.issues) {
      const key = String(issue.path[0] ?? '')
      if (!issues.some((i) => i.column === key)) errors.push({ column: headerOf(key || null), problem: zodIssueProblem(issue) })
    }
  }
  const preview: PriceListRow = {
    row: r.row, sku, vendorSku: typeof r.values.vendorSku === 'string' ? r.values.vendorSku : null, action: existing ? 'update' : 'add',
    unitCost: parsed.success ? parsed.data.unitCost : null, previousCost: existing?.unitCost ?? null, errors,
  }
  return { preview, write: parsed.success && item && !errors.length ? { ...parsed.data, itemId: item.id } : null }
}

async function checkSheet(em: EntityManager, vendorId: number, sheet: ParsedSheet): Promise<Checked[]> {
  const skus = [...new Set(sheet.rows.map((r) => r.values.sku).filter((s): s is string => typeof s === 'string'))]
  const items = skus.length ? await em.findBy(Item, { sku: In(skus) }) : []
  const bySku = new Map(items.map((i) => [i.sku, i]))
  const current = items.length ? await em.findBy(VendorItem, { vendorId, itemId: In(items.map((i) => i.id)) }) : []
  const byItem = new Map(current.map((v) => [v.itemId, v]))
  const seen = new Map<string, number>()
  return sheet.rows.map((r) => {
    const sku = String(r.values.sku ?? '')
    const item = bySku.get(sku)
    const checked = checkRow(r, sheet, item, item ? byItem.get(item.id) : undefined)
    const first = seen.get(sku)
    if (sku && first !== undefined) {
      checked.preview.errors.push({ column: 'Our SKU', problem: problem('sku_repeated', { sku, row: first }) })
      checked.write = null
    } else if (sku) seen.set(sku, r.row)
    return checked
  })
}

function summarise(filename: string, checked: Checked[]): PriceListPreview {
  const bad = checked.filter((c) => c.preview.errors.length)
  const good = checked.filter((c) => !c.preview.errors.length)
  return {
    filename,
    total: checked.length,
    adds: checked.filter((c) => c.preview.action === 'add').length,
    updates: checked.filter((c) => c.preview.action === 'update').length,
    errorRows: bad.length,
    rows: [...bad.slice(0, 1000), ...good.slice(0, 200)].map((c) => c.preview),
  }
}

export async function previewPriceList(ds: DataSource, vendorId: number, upload: GuardedUpload): Promise<PriceListPreview> {
  await findVendor(ds, vendorId)
  const sheet = await parseSpreadsheet(upload, PRICE_LIST_SPEC)
  return summarise(upload.filename, await checkSheet(ds.manager, vendorId, sheet))
}

const LINE_COLUMNS = ['vendor_sku', 'pack_qty', 'min_order_qty', 'unit_cost', 'lead_time_days', 'preferred']
/** A changed line moves to its next version first, so an edit screen opened before the list came in cannot write over it. */
const LINE_UPDATES = [versionBumpIfChanged(LINE_COLUMNS), ...LINE_COLUMNS.map((c) => `${c} = VALUES(${c})`)].join(', ')

async function writeRows(em: EntityManager, vendorId: number, rows: NonNullable<Checked['write']>[]): Promise<void> {
  for (const r of rows) {
    await em.query(
      `INSERT INTO vendor_items (vendor_id, item_id, vendor_sku, pack_qty, min_order_qty, unit_cost, lead_time_days, preferred)
       VALUES (?, ?, ?, ?, ?, ?, ?, ?) ON DUPLICATE KEY UPDATE ${LINE_UPDATES}`,
      [vendorId, r.itemId, r.vendorSku, r.packQty, r.minOrderQty, r.unitCost, r.leadTimeDays, r.preferred ? 1 : 0],
    )
    // One preferred vendor per item (a line no longer preferred moves to its next version too).
    if (r.preferred) await em.query('UPDATE vendor_items SET preferred = 0, version = version + 1 WHERE item_id = ? AND vendor_id <> ? AND preferred = 1', [r.itemId, vendorId])
  }
}

export async function commitPriceList(ds: DataSource, actor: AuditActor, vendorId: number, upload: GuardedUpload): Promise<PriceListPreview> {
  await findVendor(ds, vendorId)
  const sheet = await parseSpreadsheet(upload, PRICE_LIST_SPEC)
  return inTransaction(ds, async (em) => {
    const checked = await checkSheet(em, vendorId, sheet)
    const summary = summarise(upload.filename, checked)
    if (summary.errorRows) {
      const first = summary.rows.filter((r) => r.errors.length).slice(0, 5).map((r) => [String(r.row), r.errors[0].problem]) // keyed by row number
      throw new AppError(422, 'import_invalid', `${summary.errorRows} of ${summary.total} rows need attention; nothing was imported.`, { params: { rows: summary.errorRows, total: summary.total }, fields: Object.fromEntries(first) })
    }
    if (!summary.total) throw AppError.unprocessable('price_list_empty', 'The file holds no price rows; nothing was imported.')
    await writeRows(em, vendorId, checked.map((c) => c.write!))
    await audit(em, actor, 'vendor_item.import', 'vendor', vendorId, { file: upload.filename, added: summary.adds, updated: summary.updates })
    return summary
  })
}

/** An empty price list with the expected headers, for vendors or buyers to fill in. */
export async function priceListTemplate(): Promise<Buffer> {
  const headers = [...PRICE_LIST_SPEC.columns.map((c) => c.header), 'Description']
  return buildXlsx(sheet<never>({
    name: 'Price list', title: 'Price list', rows: [],
    columns: headers.map((header) => ({ header, kind: 'text', width: header === 'Description' ? 40 : undefined, value: () => null })),
  }))
}
