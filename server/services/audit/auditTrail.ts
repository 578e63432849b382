// The audit trail read back for the admin: the entries the services recorded (audit_entries) and every stock
// move (the ledger, itself append-only), merged newest first, filtered by person, kind and calendar days in
// the reader's time zone. Pages are cut by a cursor (time, source, id), so a page never repeats or skips an
// entry while new ones arrive. Nothing here writes: the trail has no route that changes or deletes an entry.
import type { DataSource } from 'typeorm'
import { actionsOfKind, AUDIT_ACTIONS, AUDIT_KINDS, auditKindOf, type AuditKind } from '../../../shared/audit/auditKinds.js'
import type { MoveType, StockUnit } from '../../../shared/catalog.js'
import { dayEnd, dayStart } from '../../../shared/reports/zonedDays.js'
import { AUDIT_CURSOR, type AuditExportQuery, type AuditSubject, type AuditTrailEntry, type AuditTrailPage, type AuditTrailQuery } from '../../../shared/schemas/audit.js'
import { SqlWhere } from '../../db/sqlWhere.js'
import { pickNumber } from '../picking/pickListLocks.js'

type Filters = Omit<AuditExportQuery, 'lang'>

interface Cursor { at: Date; source: 'a' | 'm'; id: string }

function cursorOf(c: string | undefined): Cursor | null {
  const m = c ? AUDIT_CURSOR.exec(c) : null
  return m ? { at: new Date(Number(m[1])), source: m[2] as 'a' | 'm', id: m[3] } : null
}

/** Newest first; at the same instant stock moves ('m') before entries ('a'), then by id. */
const RANK = { a: 0, m: 1 } as const

/** Rows of one source that come after the cursor in that order. */
function afterCursor(where: SqlWhere, alias: string, source: 'a' | 'm', c: Cursor | null): SqlWhere {
  if (!c) return where
  if (RANK[source] === RANK[c.source]) return where.add(`(${alias}.at < ? OR (${alias}.at = ? AND ${alias}.id < ?))`, [c.at, c.at, c.id])
  return RANK[source] < RANK[c.source] ? where.add(`${alias}.at <= ?`, [c.at]) : where.add(`${alias}.at < ?`, [c.at])
}

function wantedKinds(f: Filters): AuditKind[] {
  return f.kind?.length ? f.kind : [...AUDIT_KINDS]
}

function entryWhere(f: Filters): SqlWhere | null {
  const kinds = wantedKinds(f).filter((k) => k !== 'stock_move')
  if (!kinds.length) return null
  const actions = kinds.flatMap(actionsOfKind)
  return new SqlWhere()
    // 'records' also takes any action written before it had a kind of its own.
    .add(kinds.includes('records') ? '(e.action IN (?) OR e.action NOT IN (?))' : 'e.action IN (?)', kinds.includes('records') ? [actions, Object.keys(AUDIT_ACTIONS)] : [actions], kinds.length < AUDIT_KINDS.length - 1)
    .add('e.user_id = ?', [f.userId], !!f.userId)
    .add('e.at >= ?', [f.from && dayStart(f.from, f.tz)], !!f.from)
    .add('e.at < ?', [f.to && dayEnd(f.to, f.tz)], !!f.to)
}

function moveWhere(f: Filters): SqlWhere | null {
  if (!wantedKinds(f).includes('stock_move')) return null
  return new SqlWhere()
    .add('m.user_id = ?', [f.userId], !!f.userId)
    .add('m.at >= ?', [f.from && dayStart(f.from, f.tz)], !!f.from)
    .add('m.at < ?', [f.to && dayEnd(f.to, f.tz)], !!f.to)
}

interface EntryRow { id: string; at: Date; user_id: number | null; user_name: string | null; ip: string | null; action: string; entity: string; entity_id: string | null; detail: string | null }
interface MoveRow {
  id: string; at: Date; user_id: number | null; user_name: string | null; move_type: MoveType; sku: string; item_name: string; stock_unit: StockUnit
  qty: number; warehouse_code: string; bin_code: string; lot_code: string | null; reason: string | null; doc_type: string | null; doc_id: number | null
}

const ENTRY_SELECT = `SELECT e.id, e.at, e.user_id, u.display_name AS user_name, e.ip, e.action, e.entity, e.entity_id, e.detail
  FROM audit_entries e LEFT JOIN users u ON u.id = e.user_id`
const MOVE_SELECT = `SELECT m.id, m.at, m.user_id, u.display_name AS user_name, m.move_type, i.sku, i.name AS item_name, i.stock_unit, m.qty,
       w.code AS warehouse_code, bn.code AS bin_code, l.code AS lot_code, m.reason, m.doc_type, m.doc_id
  FROM stock_moves m JOIN items i ON i.id = m.item_id JOIN warehouses w ON w.id = m.warehouse_id JOIN bins bn ON bn.id = m.bin_id
  LEFT JOIN lots l ON l.id = m.lot_id LEFT JOIN users u ON u.id = m.user_id`

async function readRows(ds: DataSource, f: Filters, cursor: Cursor | null, limit: number | null): Promise<{ entries: EntryRow[]; moves: MoveRow[] }> {
  const ew = entryWhere(f)
  const mw = moveWhere(f)
  const cap = limit === null ? '' : 'LIMIT ?'
  const [entries, moves] = await Promise.all([
    ew ? (afterCursor(ew, 'e', 'a', cursor), ds.query(`${ENTRY_SELECT} ${ew.sql()} ORDER BY e.at DESC, e.id DESC ${cap}`, limit === null ? ew.params : [...ew.params, limit])) : [],
    mw ? (afterCursor(mw, 'm', 'm', cursor), ds.query(`${MOVE_SELECT} ${mw.sql()} ORDER BY m.at DESC, m.id DESC ${cap}`, limit === null ? mw.params : [...mw.params, limit])) : [],
  ])
  return { entries: entries as EntryRow[], moves: moves as MoveRow[] }
}

/** How many entries the filters match (both sources). */
export async function countTrail(ds: DataSource, f: Filters): Promise<number> {
  const ew = entryWhere(f)
  const mw = moveWhere(f)
  const [a, m] = await Promise.all([
    ew ? ds.query(`SELECT COUNT(*) AS n FROM audit_entries e ${ew.sql()}`, ew.params) : [{ n: 0 }],
    mw ? ds.query(`SELECT COUNT(*) AS n FROM stock_moves m ${mw.sql()}`, mw.params) : [{ n: 0 }],
  ])
  return Number(a[0].n) + Number(m[0].n)
}

// ---- naming what an entry is about ----

/** The SQL that names each kind of record by what people call it. */
const NAMERS: Record<string, string> = {
  user: 'SELECT id, display_name AS ref FROM users WHERE id IN (?)',
  purchase_order: 'SELECT id, number AS ref FROM purchase_orders WHERE id IN (?)',
  job: 'SELECT id, name AS ref FROM jobs WHERE id IN (?)',
  customer: 'SELECT id, name AS ref FROM customers WHERE id IN (?)',
  vendor: 'SELECT id, name AS ref FROM vendors WHERE id IN (?)',
  item: 'SELECT id, sku AS ref FROM items WHERE id IN (?)',
  lot: "SELECT l.id, CONCAT(i.sku, ' · ', l.code) AS ref FROM lots l JOIN items i ON i.id = l.item_id WHERE l.id IN (?)",
  warehouse: 'SELECT id, code AS ref FROM warehouses WHERE id IN (?)',
  bin: "SELECT b.id, CONCAT(w.code, ' · ', b.code) AS ref FROM bins b JOIN warehouses w ON w.id = b.warehouse_id WHERE b.id IN (?)",
  takeoff: 'SELECT id, name AS ref FROM takeoffs WHERE id IN (?)',
  bom: "SELECT b.id, CONCAT(j.name, ' · ', b.revision) AS ref FROM boms b JOIN jobs j ON j.id = b.job_id WHERE b.id IN (?)",
  cycle_count: "SELECT c.id, CONCAT(w.code, ' · ', c.id) AS ref FROM cycle_counts c JOIN warehouses w ON w.id = c.warehouse_id WHERE c.id IN (?)",
  transfer: "SELECT t.id, CONCAT(f.code, ' → ', d.code, ' · ', t.id) AS ref FROM transfers t JOIN warehouses f ON f.id = t.from_warehouse_id JOIN warehouses d ON d.id = t.to_warehouse_id WHERE t.id IN (?)",
  quote: 'SELECT id, number AS ref FROM quotes WHERE id IN (?)',
  sales_order: 'SELECT id, number AS ref FROM sales_orders WHERE id IN (?)',
  handover_ticket: 'SELECT id, number AS ref FROM handover_tickets WHERE id IN (?)',
  price_level: 'SELECT id, code AS ref FROM price_levels WHERE id IN (?)',
  data_import: 'SELECT id, file_name AS ref FROM data_imports WHERE id IN (?)',
  item_warehouse: "SELECT CONCAT(iw.item_id, ':', iw.warehouse_id) AS id, CONCAT(i.sku, ' · ', w.code) AS ref FROM item_warehouses iw JOIN items i ON i.id = iw.item_id JOIN warehouses w ON w.id = iw.warehouse_id WHERE CONCAT(iw.item_id, ':', iw.warehouse_id) IN (?)",
}

/** Records named by their settings area ('purchasing', 'counts', 'takeoff'): the page words the area. */
const NAMED_BY_KEY = new Set(['app_settings'])

async function subjectNames(ds: DataSource, wanted: { type: string; id: string }[]): Promise<Map<string, string>> {
  const byType = new Map<string, Set<string>>()
  for (const w of wanted) if (NAMERS[w.type] || w.type === 'pick_list' || w.type === 'pick_transfer') byType.set(w.type, (byType.get(w.type) ?? new Set()).add(w.id))
  const out = new Map<string, string>()
  await Promise.all([...byType].map(async ([type, ids]) => {
    if (type === 'pick_list' || type === 'pick_transfer') {
      for (const id of ids) out.set(`${type}|${id}`, pickNumber(Number(id)))
      return
    }
    const rows: { id: string | number; ref: string | number }[] = await ds.query(NAMERS[type], [[...ids]])
    for (const r of rows) out.set(`${type}|${r.id}`, String(r.ref))
  }))
  return out
}

function factsOf(action: string, detail: unknown): AuditTrailEntry['facts'] {
  if (!detail || typeof detail !== 'object') return {}
  const d = detail as Record<string, unknown>
  const strings = (v: unknown) => (Array.isArray(v) ? v.map(String) : undefined)
  if (action === 'user.roles') return { rolesFrom: strings(d.from), rolesTo: strings(d.to) }
  if (action === 'user.create') return { rolesTo: strings(d.roles) }
  if (action.startsWith('session.')) return { username: typeof d.username === 'string' ? d.username : undefined, reason: typeof d.reason === 'string' ? d.reason : undefined }
  return {}
}

function parseDetail(text: string | null): unknown {
  if (!text) return null
  try {
    return JSON.parse(text)
  } catch {
    return null
  }
}

export interface TrailRow extends AuditTrailEntry {
  /** The recorded values as written (for the spreadsheet, where investigations need them). */
  detailText: string | null
}

async function toEntries(ds: DataSource, entries: EntryRow[], moves: MoveRow[]): Promise<TrailRow[]> {
  const wanted = [
    ...entries.filter((e) => e.entity_id !== null && !NAMED_BY_KEY.has(e.entity)).map((e) => ({ type: e.entity, id: String(e.entity_id) })),
    ...moves.filter((m) => m.doc_type && m.doc_id !== null).map((m) => ({ type: m.doc_type!, id: String(m.doc_id) })),
  ]
  const names = await subjectNames(ds, wanted)
  const subject = (type: string, id: string | null): AuditSubject =>
    ({ type, ref: id === null ? null : NAMED_BY_KEY.has(type) ? id : names.get(`${type}|${id}`) ?? null })
  const rows: TrailRow[] = [
    ...entries.map((e): TrailRow => ({
      key: `a${e.id}`, at: new Date(e.at).toISOString(), kind: auditKindOf(e.action), action: e.action,
      userId: e.user_id === null ? null : Number(e.user_id), userName: e.user_name, ip: e.ip,
      subject: subject(e.entity, e.entity_id), facts: factsOf(e.action, parseDetail(e.detail)), move: null, detailText: e.detail,
    })),
    ...moves.map((m): TrailRow => ({
      key: `m${m.id}`, at: new Date(m.at).toISOString(), kind: 'stock_move', action: 'stock.move',
      userId: m.user_id === null ? null : Number(m.user_id), userName: m.user_name, ip: null, subject: null, facts: {}, detailText: null,
      move: {
        moveType: m.move_type, sku: m.sku, itemName: m.item_name, qty: Number(m.qty), stockUnit: m.stock_unit, warehouseCode: m.warehouse_code,
        binCode: m.bin_code, lotCode: m.lot_code, reason: m.reason, document: m.doc_type ? subject(m.doc_type, m.doc_id === null ? null : String(m.doc_id)) : null,
      },
    })),
  ]
  return rows.sort(newestFirst)
}

function newestFirst(x: AuditTrailEntry, y: AuditTrailEntry): number {
  const byAt = Date.parse(y.at) - Date.parse(x.at)
  if (byAt) return byAt
  const rx = RANK[x.key[0] as 'a' | 'm']
  const ry = RANK[y.key[0] as 'a' | 'm']
  if (rx !== ry) return ry - rx
  const ix = BigInt(x.key.slice(1))
  const iy = BigInt(y.key.slice(1))
  return iy > ix ? 1 : iy < ix ? -1 : 0
}

export async function auditTrailPage(ds: DataSource, q: AuditTrailQuery): Promise<AuditTrailPage> {
  const { entries, moves } = await readRows(ds, q, cursorOf(q.before), q.limit + 1)
  const merged = await toEntries(ds, entries, moves)
  const page = merged.slice(0, q.limit)
  const last = page.at(-1)
  const next = merged.length > q.limit && last ? `${Date.parse(last.at)}.${last.key[0]}.${last.key.slice(1)}` : null
  return { entries: page.map(({ detailText: _, ...e }) => e), next }
}

/** Every entry the filters match, newest first, with the recorded values (for the spreadsheet). */
export async function auditTrailRows(ds: DataSource, f: Filters): Promise<TrailRow[]> {
  const { entries, moves } = await readRows(ds, f, null, null)
  return toEntries(ds, entries, moves)
}
