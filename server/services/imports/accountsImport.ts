// Contractor accounts with their contact, price level and tax-exempt certificate (customer_terms, the
// selling-price terms of an account), from the business's own list. New accounts only (a code already in
// Lumenyard is refused: edit that account on its page), so the import can be reversed whole while none of
// its accounts has a job.
import type { EntityManager } from 'typeorm'
import { problem } from '../../../shared/errors/errorCodes.js'
import { zodIssueProblem } from '../../../shared/errors/zodProblems.js'
import { customerCreateSchema, type CustomerCreateInput } from '../../../shared/schemas/counter.js'
import { AppError } from '../../errors.js'
import type { CheckedRow, DataImportDefinition } from './dataImports.js'
import { cellText, distinctOf, filledCells, headerOf, heldValues, inChunks, marks, parserProblems, repeatedRows, validDay } from './importFacts.js'
import type { ImportSpec, ParsedSheet } from './importTypes.js'
import { insertRows } from './recordsImport.js'

export const ACCOUNTS_SPEC: ImportSpec = {
  columns: [
    { key: 'code', header: 'Account code', aliases: ['Code', 'Account'], required: true, kind: 'text' },
    { key: 'name', header: 'Name', aliases: ['Account name', 'Company'], required: true, kind: 'text' },
    { key: 'contactName', header: 'Contact', aliases: ['Contact name'], kind: 'text' },
    { key: 'email', header: 'E-mail', aliases: ['Email'], kind: 'text' },
    { key: 'phone', header: 'Phone', kind: 'text' },
    { key: 'address', header: 'Address', kind: 'text' },
    { key: 'notes', header: 'Notes', kind: 'text' },
    { key: 'priceLevel', header: 'Price level', kind: 'text' },
    { key: 'exemptCertificate', header: 'Tax-exempt certificate', aliases: ['Tax exempt certificate', 'Exemption certificate'], kind: 'text' },
    { key: 'exemptUntil', header: 'Exempt until', kind: 'text' },
  ],
  ignore: ['Active'],
  maxRows: 20_000,
  maxColumns: 30,
}

export const ACCOUNTS_GUIDE: Record<string, string> = {
  code: 'Your code for the account: 2 to 20 letters, digits or dashes. A code already in Lumenyard is refused.',
  name: 'The contractor\'s name as it goes on quotes and pick lists.',
  contactName: 'Who to ask for.',
  email: 'Where quotes go.',
  priceLevel: 'A price level code, as set up under Selling prices (blank: list prices).',
  exemptCertificate: 'The tax-exempt certificate number, when the contractor buys tax-free (up to 40 characters).',
  exemptUntil: 'The last day the certificate holds, YYYY-MM-DD (optional).',
}

type Account = CustomerCreateInput & { priceLevelId: number | null; exemptCertificate: string | null; exemptUntil: string | null }

const col = headerOf(ACCOUNTS_SPEC)

async function checkChunk(em: EntityManager, importId: number | null, sheet: ParsedSheet, repeated: ReturnType<typeof repeatedRows>): Promise<CheckedRow<Account>[]> {
  const codes = distinctOf(sheet, 'code').map((c) => c.toUpperCase())
  const taken = await heldValues(em, 'customers', 'code', codes, importId)
  const levelRows: { id: number; code: string }[] = await em.query('SELECT id, code FROM price_levels WHERE active = 1')
  const levels = new Map(levelRows.map((l) => [l.code.toUpperCase(), l.id]))
  const problemsOf = parserProblems(sheet, col)
  return sheet.rows.map((r): CheckedRow<Account> => {
    const errors = problemsOf(r.row)
    const parsed = customerCreateSchema.safeParse(filledCells(r.values))
    if (!parsed.success) for (const issue of parsed.error.issues) errors.push({ column: col(String(issue.path[0] ?? '')), problem: zodIssueProblem(issue) })
    const code = cellText(r.values.code).toUpperCase()
    if (code && taken.has(code)) errors.push({ column: col('code'), problem: problem('import_code_exists', { code }) })
    const again = code ? repeated(code, r.row) : null
    if (again) errors.push(again)
    const level = cellText(r.values.priceLevel)
    const priceLevelId = level ? (levels.get(level.toUpperCase()) ?? null) : null
    if (level && priceLevelId === null) errors.push({ column: col('priceLevel'), problem: problem('import_price_level_unknown', { level }) })
    const exemptCertificate = cellText(r.values.exemptCertificate) || null
    if (exemptCertificate && exemptCertificate.length > 40) errors.push({ column: col('exemptCertificate'), problem: problem('too_long', { max: 40 }) })
    const exemptUntil = cellText(r.values.exemptUntil).slice(0, 10) || null
    if (exemptUntil && !validDay(exemptUntil)) errors.push({ column: col('exemptUntil'), problem: problem('invalid_date') })
    const preview = { row: r.row, label: code || null, place: cellText(r.values.name) || null, qty: null, errors }
    return { preview, write: errors.length || !parsed.success ? null : { ...parsed.data, priceLevelId, exemptCertificate, exemptUntil } }
  })
}

export const accountsImport: DataImportDefinition<Account> = {
  kind: 'accounts',
  spec: ACCOUNTS_SPEC,
  // Each chunk looks up the codes it names (an account a commit's earlier chunks wrote is the file's own, not one
  // held before); only the codes seen so far carry over, for repeats. Each account is written on its own.
  checker(em, importId) {
    const repeated = repeatedRows()
    return { check: (sheet) => checkChunk(em, importId, sheet, repeated) }
  },
  async write(em, actor, importId, rows) {
    await insertRows(em, 'customers', ['code', 'name', 'contact_name', 'email', 'phone', 'address', 'notes'], importId, rows,
      (a) => [a.code, a.name, a.contactName ?? null, a.email ?? null, a.phone ?? null, a.address ?? null, a.notes ?? null])
    const withTerms = rows.filter((a) => a.priceLevelId !== null || a.exemptCertificate !== null)
    if (withTerms.length) {
      const codes = withTerms.map((a) => a.code)
      const ids = new Map((await inChunks(codes, (c) => em.query(`SELECT id, code FROM customers WHERE import_id = ? AND code IN (${marks(c.length)})`, [importId, ...c]) as Promise<{ id: number; code: string }[]>))
        .map((c) => [c.code, c.id]))
      for (let i = 0; i < withTerms.length; i += 500) {
        const chunk = withTerms.slice(i, i + 500)
        await em.query(
          `INSERT INTO customer_terms (customer_id, price_level_id, exempt_certificate, exempt_until, updated_by) VALUES ${chunk.map(() => '(?, ?, ?, ?, ?)').join(', ')}`,
          chunk.flatMap((a) => [ids.get(a.code), a.priceLevelId, a.exemptCertificate, a.exemptUntil, actor.userId]),
        )
      }
    }
    return { accounts: rows.length, withTerms: withTerms.length }
  },
  async reverse(em, _actor, importId) {
    const [used]: { code: string }[] = await em.query('SELECT c.code FROM customers c JOIN jobs j ON j.customer_id = c.id WHERE c.import_id = ? LIMIT 1 LOCK IN SHARE MODE', [importId])
    if (used) throw AppError.conflict('import_records_in_use', `Account ${used.code} has jobs now; the import can no longer be reversed as a whole.`, { params: { code: used.code } })
    await em.query('DELETE FROM customers WHERE import_id = ?', [importId])
  },
}
