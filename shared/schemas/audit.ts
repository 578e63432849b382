// The audit trail: what the admin's page sends (the server parses it with these) and the answers' shapes.
import { z } from 'zod'
import type { MoveType, StockUnit } from '../catalog.js'
import { AUDIT_KINDS, type AuditKind } from '../audit/auditKinds.js'
import { issueCode, issueOf } from '../errors/zodProblems.js'
import { timeZoneParam } from './exportQuery.js'

const blankToUndefined = (v: unknown) => (v === '' || v === null ? undefined : v)

const kinds = z.preprocess(
  (v) => (v === undefined || v === '' ? undefined : Array.isArray(v) ? v : String(v).split(',')),
  z
    .array(z.string())
    .max(AUDIT_KINDS.length)
    .refine((xs) => xs.every((x) => (AUDIT_KINDS as readonly string[]).includes(x)), issueCode('invalid_choice'))
    .transform((xs) => xs as AuditKind[])
    .optional(),
)

/** Where the last page ended: `<epoch ms>.<a|m>.<id>` (a: an audit entry, m: a stock move). */
export const AUDIT_CURSOR = /^(\d{1,15})\.([am])\.(\d{1,19})$/

const trailFilterShape = {
  kind: kinds,
  userId: z.preprocess(blankToUndefined, z.coerce.number().int().positive().optional()),
  /** Calendar days in the reader's time zone, both included. */
  from: z.preprocess(blankToUndefined, z.iso.date().optional()),
  to: z.preprocess(blankToUndefined, z.iso.date().optional()),
  tz: timeZoneParam,
}

const fromBeforeTo = (v: { from?: string; to?: string }) => !v.from || !v.to || v.from <= v.to

export const auditTrailQuerySchema = z
  .object({
    ...trailFilterShape,
    before: z.preprocess(blankToUndefined, z.string().regex(AUDIT_CURSOR, issueCode('invalid_format')).optional()),
    limit: z.preprocess(blankToUndefined, z.coerce.number().int().min(1).max(500).default(100)),
  })
  .refine(fromBeforeTo, { path: ['to'], ...issueOf('ends_before_start') })
export type AuditTrailQuery = z.infer<typeof auditTrailQuerySchema>

export const auditExportQuerySchema = z
  .object({ ...trailFilterShape, lang: z.preprocess(blankToUndefined, z.enum(['en', 'es']).default('en')) })
  .refine(fromBeforeTo, { path: ['to'], ...issueOf('ends_before_start') })
export type AuditExportQuery = z.infer<typeof auditExportQuerySchema>

// ---- answers ----
/** What an entry is about, named as people name it (a PO's number, a person's name); `ref` null when it has none. */
export interface AuditSubject {
  type: string
  ref: string | null
}

export interface AuditMove {
  moveType: MoveType
  sku: string
  itemName: string
  qty: number
  stockUnit: StockUnit
  warehouseCode: string
  binCode: string
  lotCode: string | null
  reason: string | null
  document: AuditSubject | null
}

export interface AuditTrailEntry {
  /** `a<id>` or `m<id>`: unique across both sources. */
  key: string
  at: string
  kind: AuditKind
  /** The recorded action ('po.sent', 'session.sign_in_failed', …); 'stock.move' for a stock move. */
  action: string
  userId: number | null
  userName: string | null
  ip: string | null
  subject: AuditSubject | null
  /** A few recorded values the page words: roles before and after, the user name typed at a failed sign-in. */
  facts: { rolesFrom?: string[]; rolesTo?: string[]; username?: string; reason?: string }
  move: AuditMove | null
}

export interface AuditTrailPage {
  entries: AuditTrailEntry[]
  /** Pass as `before` for the next (older) page; null at the end. */
  next: string | null
}
