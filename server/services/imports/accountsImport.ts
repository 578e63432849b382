// Contractor accounts with their contact, from the business's own list. New accounts only (a code already
// in Lumenyard is refused: edit that account on its page), so the import can be reversed whole while none of
// its accounts has a job.
//
// Price level and tax-exempt certificate: counter sales will add these to accounts. Their columns are named
// here already and skipped (ACCOUNT_HOOK_HEADERS); once the accounts table has them, move each to `columns`
// with its check and write it in `write` below.
import { problem, type RowProblem } from '../../../shared/errors/errorCodes.js'
import { zodIssueProblem } from '../../../shared/errors/zodProblems.js'
import { customerCreateSchema, type CustomerCreateInput } from '../../../shared/schemas/counter.js'
import { AppError } from '../../errors.js'
import type { CheckedRow, DataImportDefinition } from './dataImports.js'
import { cellText, distinctOf, inChunks, issuesByRow, marks } from './importFacts.js'
import type { ImportSpec } from './importTypes.js'

export const ACCOUNT_HOOK_HEADERS = ['Price level', 'Tax-exempt certificate', 'Tax exempt certificate', 'Tax exempt']

export const ACCOUNTS_SPEC: ImportSpec = {
  columns: [
    { key: 'code', header: 'Account code', aliases: ['Code', 'Account'], required: true, kind: 'text' },
    { key: 'name', header: 'Name', aliases: ['Account name', 'Company'], required: true, kind: 'text' },
    { key: 'contactName', header: 'Contact', aliases: ['Contact name'], kind: 'text' },
    { key: 'email', header: 'E-mail', aliases: ['Email'], kind: 'text' },
    { key: 'phone', header: 'Phone', kind: 'text' },
    { key: 'address', header: 'Address', kind: 'text' },
    { key: 'notes', header: 'Notes', kind: 'text' },
  ],
  ignore: ACCOUNT_HOOK_HEADERS,
  maxRows: 20_000,
  maxColumns: 30,
}

export const ACCOUNTS_GUIDE: Record<string, string> = {
  code: 'Your code for the account: 2 to 20 letters, digits or dashes. A code already in Lumenyard is refused.',
  name: 'The contractor\'s name as it goes on quotes and pick lists.',
  contactName: 'Who to ask for.',
  email: 'Where quotes go.',
}

const HEADER = new Map(ACCOUNTS_SPEC.columns.map((c) => [c.key, c.header]))
const col = (key: string) => HEADER.get(key) ?? key

export const accountsImport: DataImportDefinition<CustomerCreateInput> = {
  kind: 'accounts',
  spec: ACCOUNTS_SPEC,
  async check(em, sheet) {
    const codes = distinctOf(sheet, 'code').map((c) => c.toUpperCase())
    const taken = new Set((await inChunks(codes, (c) => em.query(`SELECT code FROM customers WHERE code IN (${marks(c.length)})`, c) as Promise<{ code: string }[]>)).map((r) => r.code.toUpperCase()))
    const seen = new Map<string, number>()
    const issuesOf = issuesByRow(sheet)
    return sheet.rows.map((r): CheckedRow<CustomerCreateInput> => {
      const errors: RowProblem[] = issuesOf(r.row).map((i) => ({ column: i.column ? col(i.column) : null, problem: i.problem }))
      const parsed = customerCreateSchema.safeParse(Object.fromEntries(Object.entries(r.values).filter(([, v]) => v !== null)))
      if (!parsed.success) for (const issue of parsed.error.issues) errors.push({ column: col(String(issue.path[0] ?? '')), problem: zodIssueProblem(issue) })
      const code = cellText(r.values.code).toUpperCase()
      if (code && taken.has(code)) errors.push({ column: col('code'), problem: problem('import_code_exists', { code }) })
      const first = seen.get(code)
      if (code && first !== undefined) errors.push({ column: null, problem: problem('import_row_repeated', { row: first }) })
      else if (code) seen.set(code, r.row)
      const preview = { row: r.row, label: code || null, place: cellText(r.values.name) || null, qty: null, errors }
      return { preview, write: errors.length || !parsed.success ? null : parsed.data }
    })
  },
  async write(em, _actor, importId, rows) {
    for (let i = 0; i < rows.length; i += 500) {
      const chunk = rows.slice(i, i + 500)
      await em.query(
        `INSERT INTO customers (code, name, contact_name, email, phone, address, notes, import_id) VALUES ${chunk.map(() => '(?, ?, ?, ?, ?, ?, ?, ?)').join(', ')}`,
        chunk.flatMap((a) => [a.code, a.name, a.contactName ?? null, a.email ?? null, a.phone ?? null, a.address ?? null, a.notes ?? null, importId]),
      )
    }
    return { accounts: rows.length }
  },
  async reverse(em, _actor, importId) {
    const [used]: { code: string }[] = await em.query('SELECT c.code FROM customers c JOIN jobs j ON j.customer_id = c.id WHERE c.import_id = ? LIMIT 1 LOCK IN SHARE MODE', [importId])
    if (used) throw AppError.conflict('import_records_in_use', `Account ${used.code} has jobs now; the import can no longer be reversed as a whole.`, { params: { code: used.code } })
    await em.query('DELETE FROM customers WHERE import_id = ?', [importId])
  },
}
