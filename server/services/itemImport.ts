// Item import from .xlsx or .csv: preview (every row checked, nothing written) and commit (the same
// checks again, then every row in ONE transaction: nothing is written if any row fails). A row whose
// SKU exists updates that item (columns absent from the file keep their values); others are created.
import type { DataSource, EntityManager } from 'typeorm'
import { In } from 'typeorm'
import { itemCrossFieldIssues, itemFields, itemSchema, type ImportPreview, type ImportPreviewRow, type ItemInput } from '../../shared/schemas/catalog.js'
import { inTransaction } from '../db/transaction.js'
import { Item } from '../entities/Item.js'
import { AppError, problem } from '../errors.js'
import { zodIssueProblem } from '../../shared/errors/zodProblems.js'
import { audit, type AuditActor } from './auditService.js'
import { itemColumns, toItemRecord } from './catalogService.js'
import { columnOf, ITEM_COLUMNS, ITEM_IMPORT_SPEC } from './catalogSheet.js'
import type { ImportRow, ParsedSheet, RowIssue } from './imports/importTypes.js'
import { parseSpreadsheet } from './imports/spreadsheetParser.js'
import type { GuardedUpload } from './imports/uploadGuard.js'
import { versionBumpIfChanged } from '../db/versionBump.js'

interface CheckedRow {
  preview: ImportPreviewRow
  input: ItemInput | null
}

const HEADER_OF = new Map(ITEM_COLUMNS.map((c) => [c.key as string, c.header]))
const headerOf = (key: string | null) => (key ? (HEADER_OF.get(key) ?? key) : null)

function checkRow(r: ImportRow, existing: Item | undefined, parserIssues: RowIssue[]): CheckedRow {
  const errors = parserIssues.map((i) => ({ column: headerOf(i.column), problem: i.problem }))
  const present = Object.fromEntries(Object.entries(r.values).filter(([key]) => !parserIssues.some((i) => i.column === key)))
  const candidate = existing ? { ...toItemRecord(existing), ...present } : present
  const parsed = itemSchema.safeParse(candidate)
  if (!parsed.success) {
    const bad = new Set(parserIssues.map((i) => i.column as string))
    for (const issue of parsed.error.issues) {
      const key = String(issue.path[0] ?? '')
      if (!bad.has(key)) errors.push({ column: headerOf(key || null), problem: zodIssueProblem(issue) })
      bad.add(key)
    }
    // The checks between fields run only once every field reads; run them now on the fields that do,
    // so a row shows all its problems at once instead of one wave after another.
    const readable = Object.fromEntries(Object.entries(candidate).filter(([key]) => !bad.has(key)))
    const partial = itemFields.partial().safeParse(readable)
    if (partial.success) {
      for (const issue of itemCrossFieldIssues(partial.data)) {
        if (!bad.has(issue.path)) errors.push({ column: headerOf(issue.path), problem: issue.params ? { code: issue.code, params: issue.params } : { code: issue.code } })
      }
    }
  }
  const sku = typeof r.values.sku === 'string' ? r.values.sku : null
  const name = typeof r.values.name === 'string' ? r.values.name : null
  return { preview: { row: r.row, sku, name, action: existing ? 'update' : 'create', errors }, input: parsed.success ? parsed.data : null }
}

async function loadBy(em: EntityManager, column: 'sku' | 'gtin', values: string[]): Promise<Item[]> {
  const found: Item[] = []
  for (let i = 0; i < values.length; i += 1000) found.push(...(await em.findBy(Item, { [column]: In(values.slice(i, i + 1000)) })))
  return found
}

/** Every row against the schema, each other (repeated SKU or GTIN) and the catalog (a GTIN of another item). */
async function checkSheet(em: EntityManager, sheet: ParsedSheet): Promise<CheckedRow[]> {
  const skus = [...new Set(sheet.rows.map((r) => r.values.sku).filter((s): s is string => typeof s === 'string'))]
  const bySku = new Map((await loadBy(em, 'sku', skus)).map((i) => [i.sku, i]))
  const checked = sheet.rows.map((r) => checkRow(r, bySku.get(String(r.values.sku)), sheet.issues.filter((i) => i.row === r.row)))
  const gtins = [...new Set(checked.map((c) => c.input?.gtin).filter((g): g is string => !!g))]
  const gtinOwner = new Map((await loadBy(em, 'gtin', gtins)).map((i) => [i.gtin!, i.sku]))
  const seenSku = new Map<string, number>()
  const seenGtin = new Map<string, number>()
  for (const c of checked) {
    // A repeated SKU is reported even on a row with other problems (all of a row's problems in one pass).
    const sku = c.input?.sku ?? c.preview.sku?.trim()
    if (sku) {
      const firstSku = seenSku.get(sku)
      if (firstSku !== undefined) c.preview.errors.push({ column: 'SKU', problem: problem('sku_repeated', { sku, row: firstSku }) })
      else seenSku.set(sku, c.preview.row)
    }
    const gtin = c.input?.gtin
    if (!gtin) continue
    const owner = gtinOwner.get(gtin)
    if (owner && owner !== sku) c.preview.errors.push({ column: 'GTIN', problem: problem('gtin_belongs_to', { gtin, sku: owner }) })
    const firstGtin = seenGtin.get(gtin)
    if (firstGtin !== undefined) c.preview.errors.push({ column: 'GTIN', problem: problem('gtin_repeated', { gtin, row: firstGtin }) })
    else seenGtin.set(gtin, c.preview.row)
  }
  return checked
}

function summarise(filename: string, checked: CheckedRow[]): ImportPreview {
  const bad = checked.filter((c) => c.preview.errors.length > 0)
  const good = checked.filter((c) => c.preview.errors.length === 0)
  return {
    filename,
    total: checked.length,
    creates: checked.filter((c) => c.preview.action === 'create').length,
    updates: checked.filter((c) => c.preview.action === 'update').length,
    errorRows: bad.length,
    rows: [...bad.slice(0, 1000), ...good.slice(0, 100)].map((c) => c.preview),
  }
}

export async function previewItemImport(ds: DataSource, upload: GuardedUpload): Promise<ImportPreview> {
  const sheet = await parseSpreadsheet(upload, ITEM_IMPORT_SPEC)
  return summarise(upload.filename, await checkSheet(ds.manager, sheet))
}

const WRITE_COLUMNS = ITEM_COLUMNS.map((c) => c.key)

/** Creates and updates in multi-row upserts on the SKU key (GTIN clashes were refused above). */
async function writeItems(em: EntityManager, inputs: ItemInput[]): Promise<void> {
  const columns = WRITE_COLUMNS.map(columnOf)
  const tuple = `(${columns.map(() => '?').join(', ')})`
  const changing = columns.filter((c) => c !== 'sku')
  // A changed item moves to its next version first, so an edit screen opened before the import cannot write over it.
  const updates = [versionBumpIfChanged(changing), ...changing.map((c) => `${c} = VALUES(${c})`)].join(', ')
  for (let i = 0; i < inputs.length; i += 500) {
    const chunk = inputs.slice(i, i + 500).map((input) => {
      const values = itemColumns(input) as Record<string, unknown>
      return WRITE_COLUMNS.map((key) => values[key] ?? null)
    })
    await em.query(
      `INSERT INTO items (${columns.join(', ')}) VALUES ${chunk.map(() => tuple).join(', ')} ON DUPLICATE KEY UPDATE ${updates}`,
      chunk.flat(),
    )
  }
}

export async function commitItemImport(ds: DataSource, actor: AuditActor, upload: GuardedUpload): Promise<ImportPreview> {
  const sheet = await parseSpreadsheet(upload, ITEM_IMPORT_SPEC)
  return inTransaction(ds, async (em) => {
    const checked = await checkSheet(em, sheet)
    const summary = summarise(upload.filename, checked)
    if (summary.errorRows > 0) {
      const first = summary.rows.filter((r) => r.errors.length).slice(0, 5).map((r) => [String(r.row), r.errors[0].problem]) // keyed by row number
      throw new AppError(422, 'import_invalid', `${summary.errorRows} of ${summary.total} rows need attention; nothing was imported.`, { params: { rows: summary.errorRows, total: summary.total }, fields: Object.fromEntries(first) })
    }
    if (summary.total === 0) throw AppError.unprocessable('items_file_empty', 'The file holds no item rows; nothing was imported.')
    await writeItems(em, checked.map((c) => c.input!))
    await audit(em, actor, 'item.import', 'item', null, { file: upload.filename, created: summary.creates, updated: summary.updates })
    return summary
  })
}
