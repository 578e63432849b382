// Upload of a contractor's takeoff in Lumenyard's own template: the catalog import's guard and child-
// process parser read the file; every row problem is reported before anything is saved.
import ExcelJS from 'exceljs'
import type { DataSource } from 'typeorm'
import { MAX_SHEET_ROWS, TAKEOFF_COLUMNS, TAKEOFF_SHEET } from '../../../shared/counter/takeoffSheetColumns.js'
import type { TakeoffRecord } from '../../../shared/schemas/counter.js'
import type { LengthUnit } from '../../../shared/units.js'
import { inTransaction } from '../../db/transaction.js'
import { AppError } from '../../errors.js'
import type { AuditActor } from '../auditService.js'
import type { ImportSpec, RowIssue } from '../imports/importTypes.js'
import { parseSpreadsheet } from '../imports/spreadsheetParser.js'
import type { GuardedUpload } from '../imports/uploadGuard.js'
import { loadCounterCatalog } from './counterCatalog.js'
import { takeoffFromRows } from './takeoffSheetRows.js'
import { getTakeoff, insertTakeoff } from './takeoffService.js'

export const TAKEOFF_IMPORT_SPEC: ImportSpec = {
  columns: TAKEOFF_COLUMNS.map((c) => ({ key: c.name, header: c.name, kind: c.kind })),
  maxRows: MAX_SHEET_ROWS,
  maxColumns: 40,
}

/** Row problems as field messages keyed "row:column", the first 200 of them. */
function rowFields(issues: RowIssue[]): Record<string, string> {
  const fields: Record<string, string> = {}
  for (const i of [...issues].sort((a, b) => a.row - b.row).slice(0, 200)) {
    const key = `${i.row}:${i.column ?? ''}`
    fields[key] = fields[key] ? `${fields[key]}; ${i.message}` : i.message
  }
  return fields
}

export async function importTakeoff(
  ds: DataSource,
  actor: AuditActor,
  jobId: number,
  upload: GuardedUpload,
  options: { name: string; unit: LengthUnit },
): Promise<TakeoffRecord> {
  const sheet = await parseSpreadsheet(upload, TAKEOFF_IMPORT_SPEC)
  const catalog = await loadCounterCatalog(ds.manager)
  const { takeoff, issues } = takeoffFromRows(sheet.rows, catalog, options.unit, options.name)
  const all = [...sheet.issues, ...issues]
  if (all.length > 0 || !takeoff) {
    const rows = new Set(all.map((i) => i.row)).size
    throw new AppError(400, 'sheet_rows', `${rows} row${rows === 1 ? '' : 's'} of the file need attention; nothing was saved.`, rowFields(all))
  }
  if (takeoff.walls.length === 0 && takeoff.looseLines.length === 0) throw AppError.badRequest('The file holds no walls and no items; nothing was saved.', { file: 'No rows' })
  const saved = await inTransaction(ds, (em) => insertTakeoff(em, actor, jobId, options.name, takeoff, 'takeoff.import'))
  return getTakeoff(ds, saved.id)
}

/** The blank template: the header row on the first sheet, what each column holds on the second. */
export async function takeoffTemplate(): Promise<Buffer> {
  const book = new ExcelJS.Workbook()
  book.creator = 'Lumenyard'
  const sheet = book.addWorksheet(TAKEOFF_SHEET)
  sheet.columns = TAKEOFF_COLUMNS.map((c) => ({ header: c.name, key: c.name, width: Math.max(12, c.name.length + 4) }))
  sheet.getRow(1).font = { bold: true }
  sheet.views = [{ state: 'frozen', ySplit: 1 }]
  const help = book.addWorksheet('Help')
  help.columns = [{ header: 'column', key: 'name', width: 16 }, { header: 'row kind', key: 'level', width: 12 }, { header: 'what it holds', key: 'help', width: 100 }]
  help.getRow(1).font = { bold: true }
  for (const c of TAKEOFF_COLUMNS) help.addRow({ name: c.name, level: c.level === 'item' ? 'item row' : c.level === 'wall' ? 'wall, first row' : 'every wall row', help: c.help })
  help.addRow({})
  help.addRow({ help: 'Lengths: 84 in, 7\' 0", 7 3/4", 2134 mm. A bare number is read in the unit chosen on the upload screen.' })
  help.addRow({ help: 'Only the first sheet is read; a .csv file holds the same columns. At most 2,000 rows.' })
  return Buffer.from(await book.xlsx.writeBuffer())
}

export const takeoffTemplateCsv = () => Buffer.from(TAKEOFF_COLUMNS.map((c) => c.name).join(',') + '\r\n', 'utf8')
