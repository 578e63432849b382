// Upload of a contractor's takeoff in Lumenyard's own template: the catalog import's guard and child-
// process parser read the file; every row problem is reported before anything is saved.
import type { DataSource } from 'typeorm'
import { MAX_SHEET_ROWS, TAKEOFF_COLUMNS, TAKEOFF_SHEET } from '../../../shared/counter/takeoffSheetColumns.js'
import type { TakeoffRecord } from '../../../shared/schemas/counter.js'
import type { LengthUnit } from '../../../shared/units.js'
import { inTransaction } from '../../db/transaction.js'
import { AppError, problem, type FieldProblems } from '../../errors.js'
import type { AuditActor } from '../auditService.js'
import { buildXlsx, sheet } from '../exports/xlsxWriter.js'
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
/** Field problems keyed `row:column` (the first per cell), for the upload screen's table. */
function rowFields(issues: RowIssue[]): FieldProblems {
  const fields: FieldProblems = {}
  for (const i of [...issues].sort((a, b) => a.row - b.row).slice(0, 200)) fields[`${i.row}:${i.column ?? ''}`] ??= i.problem
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
    throw AppError.badRequest('sheet_rows', `${rows} row${rows === 1 ? '' : 's'} of the file need attention; nothing was saved.`, { params: { rows }, fields: rowFields(all) })
  }
  if (takeoff.walls.length === 0 && takeoff.looseLines.length === 0) throw AppError.badRequest('takeoff_file_empty', 'The file holds no walls and no items; nothing was saved.', { fields: { file: problem('takeoff_file_empty') } })
  const saved = await inTransaction(ds, (em) => insertTakeoff(em, actor, jobId, options.name, takeoff, 'takeoff.import'))
  return getTakeoff(ds, saved.id)
}

type HelpRow = { name: string; level: string; help: string }

/** The blank template: the header row on the first sheet, what each column holds on the second. */
export async function takeoffTemplate(): Promise<Buffer> {
  const help: HelpRow[] = TAKEOFF_COLUMNS.map((c) => ({ name: c.name, level: c.level === 'item' ? 'item row' : c.level === 'wall' ? 'wall, first row' : 'every wall row', help: c.help }))
  help.push(
    { name: '', level: '', help: '' },
    { name: '', level: '', help: 'Lengths: 84 in, 7\' 0", 7 3/4", 2134 mm. A bare number is read in the unit chosen on the upload screen.' },
    { name: '', level: '', help: 'Only the first sheet is read; a .csv file holds the same columns. At most 2,000 rows.' },
  )
  return buildXlsx(
    sheet<never>({ name: TAKEOFF_SHEET, title: 'Takeoff', rows: [], columns: TAKEOFF_COLUMNS.map((c) => ({ header: c.name, kind: 'text', value: () => null })) }),
    sheet<HelpRow>({
      name: 'Help', title: 'Takeoff template: the columns', rows: help,
      columns: [
        { header: 'column', kind: 'text', value: (r) => r.name },
        { header: 'row kind', kind: 'text', value: (r) => r.level },
        { header: 'what it holds', kind: 'text', width: 90, value: (r) => r.help },
      ],
    }),
  )
}

export const takeoffTemplateCsv = () => Buffer.from(TAKEOFF_COLUMNS.map((c) => c.name).join(',') + '\r\n', 'utf8')
