// The filtered audit trail as a spreadsheet in the reader's language, through the one writer
// (exports/xlsxWriter.ts): times in the reader's time zone, every entry worded as on the page, and the
// recorded values as written (for an investigation). At most EXPORT_LIMIT entries: narrow the days beyond.
import type { Writable } from 'node:stream'
import type { DataSource } from 'typeorm'
import { actionKey } from '../../../shared/audit/auditKinds.js'
import { auditWordsEn } from '../../../shared/audit/auditWordsEn.js'
import { auditWordsEs } from '../../../shared/audit/auditWordsEs.js'
import type { AuditExportQuery, AuditSubject } from '../../../shared/schemas/audit.js'
import { AppError } from '../../errors.js'
import { fieldsSheet, sheet, streamXlsx, wallClockIn, type SheetColumn } from '../exports/xlsxWriter.js'
import { auditTrailRows, countTrail, type TrailRow } from './auditTrail.js'

export const AUDIT_EXPORT_LIMIT = 20_000

type Words = typeof auditWordsEn
const WORDS: Record<'en' | 'es', Words> = { en: auditWordsEn, es: auditWordsEs }

const fill = (template: string, ref: string) => template.replace('{ref}', ref)

/** What an entry is about, in words: "Purchase order PO-2026-00012", "Settings: counts". */
export function subjectWords(w: Words, s: AuditSubject | null): string | null {
  if (!s) return null
  const subjects = w.subjects as Record<string, string>
  const bare = w.subjectsBare as Record<string, string>
  if (s.type === 'app_settings') return fill(subjects.app_settings, (w.settingsAreas as Record<string, string>)[s.ref ?? ''] ?? w.sheet.all)
  if (s.ref !== null && subjects[s.type]) return fill(subjects[s.type], s.ref)
  return bare[s.type] ?? subjects[s.type]?.replace(' {ref}', '') ?? subjects.other
}

export function actionWords(w: Words, action: string): string {
  return (w.actions as Record<string, string>)[actionKey(action)] ?? w.actions.other
}

type Row = TrailRow & { wallClock: Date }

function columns(w: Words): SheetColumn<Row>[] {
  const s = w.sheet
  return [
    { header: s.when, kind: 'datetime', value: (r) => r.wallClock, numFmt: 'yyyy-mm-dd hh:mm:ss' },
    { header: s.kind, kind: 'text', value: (r) => w.kinds[r.kind] },
    { header: s.what, kind: 'text', width: 34, value: (r) => actionWords(w, r.action) },
    { header: s.about, kind: 'text', width: 34, value: (r) => subjectWords(w, r.move ? r.move.document : r.subject) },
    { header: s.who, kind: 'text', width: 20, value: (r) => r.userName ?? r.facts.username },
    { header: s.item, kind: 'text', width: 30, value: (r) => (r.move ? `${r.move.sku} · ${r.move.itemName}` : null) },
    { header: s.qty, kind: 'integer', value: (r) => r.move?.qty, numFmt: '#,##0;[Red]-#,##0' },
    { header: s.unit, kind: 'text', value: (r) => r.move?.stockUnit },
    { header: s.place, kind: 'text', value: (r) => (r.move ? `${r.move.warehouseCode} · ${r.move.binCode}` : null) },
    { header: s.lot, kind: 'text', value: (r) => r.move?.lotCode },
    { header: s.address, kind: 'text', value: (r) => r.ip },
    { header: s.recorded, kind: 'text', width: 60, value: (r) => r.detailText },
    { header: s.entry, kind: 'text', value: (r) => r.key },
  ]
}

export interface AuditExport {
  filename: string
  write(out: Writable): Promise<void>
}

export async function prepareAuditExport(ds: DataSource, q: AuditExportQuery, limit = AUDIT_EXPORT_LIMIT): Promise<AuditExport> {
  const total = await countTrail(ds, q)
  if (total > limit) {
    throw AppError.badRequest('audit_export_too_large', `These filters match ${total} entries; an export holds at most ${limit}. Narrow the days or filters.`, {
      params: { count: total, max: limit },
    })
  }
  const w = WORDS[q.lang]
  const [person] = q.userId ? ((await ds.query('SELECT display_name FROM users WHERE id = ?', [q.userId])) as { display_name: string }[]) : []
  return {
    filename: `audit-trail-${new Date().toISOString().slice(0, 10)}.xlsx`,
    write: async (out) => {
      const clock = wallClockIn(q.tz)
      const rows: Row[] = (await auditTrailRows(ds, q)).map((r) => ({ ...r, wallClock: clock(new Date(r.at)) }))
      const s = w.sheet
      const title = `${s.name}${q.from || q.to ? `, ${q.from ?? '…'} – ${q.to ?? '…'}` : ''}`
      await streamXlsx(
        out,
        sheet({ name: s.name, title, columns: columns(w), rows, orientation: 'landscape' }),
        fieldsSheet({
          name: s.filters, title,
          fields: [
            { label: s.exported, kind: 'datetime', value: clock(new Date()) }, { label: s.timeZone, kind: 'text', value: q.tz },
            { label: s.entries, kind: 'integer', value: rows.length },
            { label: s.kinds, kind: 'text', value: q.kind?.length ? q.kind.map((k) => w.kinds[k]).join(', ') : s.all },
            { label: s.person, kind: 'text', value: person?.display_name ?? s.all },
            { label: s.from, kind: 'date', value: q.from }, { label: s.to, kind: 'date', value: q.to },
          ],
        }),
      )
    },
  }
}
