// Catalog spreadsheets: the filtered item list as .xlsx (re-importable: the same columns as the
// import) and the blank import template with a sheet that explains each column.
import type { DataSource } from 'typeorm'
import type { ItemFields, ItemListQuery } from '../../shared/schemas/catalog.js'
import { listFilter, STOCK_JOIN } from './catalogQueries.js'
import { columnOf, ITEM_COLUMNS, itemColumnAllowed, itemSheetColumns, MAX_IMPORT_ROWS, STOCK_SHEET_COLUMNS } from './catalogSheet.js'
import { buildXlsx, sheet } from './exports/xlsxWriter.js'
import { readmeWord, type ReadmeLang } from './exports/readmeWords.js'
import { importGuideSheet } from './imports/importGuide.js'

type ExportRow = Partial<Record<keyof ItemFields, string | number | boolean | null>> & { onHand: number; available: number }

const MAX_EXPORT_ROWS = 50_000

function exportRow(raw: Record<string, unknown>): ExportRow {
  const row: ExportRow = { onHand: Number(raw.on_hand ?? 0), available: Number(raw.on_hand ?? 0) - Number(raw.reserved ?? 0) }
  for (const c of ITEM_COLUMNS) {
    const value = raw[columnOf(c.key)]
    row[c.key] = c.kind === 'boolean' ? Boolean(value) : value === null || value === undefined ? null : (value as string | number)
  }
  return row
}

/** The list as a workbook; `costs`: whether the caller may see costs (the cost column is left out otherwise). */
export async function exportItems(ds: DataSource, q: ItemListQuery, costs: boolean): Promise<Buffer> {
  const { where, params } = listFilter(q)
  const raw = await ds.query(
    `SELECT i.*, COALESCE(s.on_hand, 0) AS on_hand, COALESCE(s.reserved, 0) AS reserved FROM items i ${STOCK_JOIN} ${where} ORDER BY i.sku LIMIT ${MAX_EXPORT_ROWS}`,
    params,
  )
  const rows = (raw as Record<string, unknown>[]).map(exportRow)
  return buildXlsx(sheet<ExportRow>({ name: 'Items', columns: [...itemSheetColumns<ExportRow>(), ...STOCK_SHEET_COLUMNS], rows, costs }))
}

/** The blank template; `costs` as for the export (the template is the admin's, who always may). */
export async function itemImportTemplate(lang: ReadmeLang, costs: boolean): Promise<Buffer> {
  return buildXlsx(
    sheet<ExportRow>({ name: 'Items', columns: itemSheetColumns<ExportRow>(), rows: [], costs }),
    importGuideSheet(ITEM_COLUMNS, itemColumnAllowed, readmeWord(lang, 'itemTemplateRows', { max: MAX_IMPORT_ROWS.toLocaleString(lang === 'es' ? 'es-ES' : 'en-US') }), lang),
  )
}
