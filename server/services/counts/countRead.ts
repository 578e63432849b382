// Reading counts: the list, one count for review, the counter's handheld view (blind), and a bin's or
// an item's count history. Ledger figures (snapshot, expected, variance) reach only reviewers, and only
// for lines already counted. Costs go out under the cost field names (unitCost, varianceValue, valueOff),
// which the one cost rule (services/costVisibility.ts) removes for callers who may not see them.
import type { DataSource } from 'typeorm'
import { varianceValue } from '../../../shared/counts/countVariance.js'
import { mayReview } from '../../../shared/counts/countReviewRules.js'
import { walkOrder } from '../../../shared/inventory/walkOrder.js'
import type {
  CountDetail, CountHistoryQuery, CountHistoryRow, CountLineView, CountScopeDetail, CountSummary, CountsQuery, HandheldCount, HandheldCountBin,
} from '../../../shared/schemas/counts.js'
import type { Role } from '../../../shared/roles.js'
import { Warehouse } from '../../entities/Warehouse.js'
import { AppError } from '../../errors.js'
import { SqlWhere } from '../../db/sqlWhere.js'
import { walkConfigOf } from '../picking/pickWalk.js'
import { countSettings } from './countSettings.js'

export interface CountViewer {
  userId: number
  roles: readonly Role[]
}

interface SummaryRow {
  id: number
  warehouse_id: number
  warehouse_code: string
  warehouse_name: string
  scope: CountSummary['scope']
  scope_detail: string | null
  items_only: number
  status: CountSummary['status']
  note: string | null
  created_by_name: string | null
  created_at: Date
  closed_at: Date | null
  bins_total: string
  bins_done: string
  lines_waiting: string
  lines_counted: string
  lines_settled: string
  value_off: string | null
}

const SUMMARY_SELECT = `
  SELECT c.id, c.warehouse_id, w.code AS warehouse_code, w.name AS warehouse_name, c.scope, c.scope_detail, c.items_only, c.status, c.note,
         u.display_name AS created_by_name, c.created_at, c.closed_at,
         (SELECT COUNT(*) FROM count_bins cb WHERE cb.count_id = c.id) AS bins_total,
         (SELECT COUNT(*) FROM count_bins cb WHERE cb.count_id = c.id AND cb.status = 'done') AS bins_done,
         (SELECT COUNT(*) FROM count_lines l WHERE l.count_id = c.id AND l.status = 'waiting') AS lines_waiting,
         (SELECT COUNT(*) FROM count_lines l WHERE l.count_id = c.id AND l.status = 'counted') AS lines_counted,
         (SELECT COUNT(*) FROM count_lines l WHERE l.count_id = c.id AND l.status IN ('matched', 'approved')) AS lines_settled,
         (SELECT SUM(ABS(ROUND(l.variance * l.unit_cost, 2))) FROM count_lines l
           WHERE l.count_id = c.id AND l.status IN ('counted', 'approved') AND l.variance IS NOT NULL) AS value_off
    FROM cycle_counts c
    JOIN warehouses w ON w.id = c.warehouse_id
    LEFT JOIN users u ON u.id = c.created_by`

function detailOf(text: string | null): CountScopeDetail {
  try {
    return text ? (JSON.parse(text) as CountScopeDetail) : {}
  } catch {
    return {}
  }
}

const iso = (d: Date | string | null) => (d === null ? null : new Date(d).toISOString())

function toSummary(r: SummaryRow): CountSummary {
  return {
    id: r.id,
    warehouse: { id: r.warehouse_id, code: r.warehouse_code, name: r.warehouse_name },
    scope: r.scope, scopeDetail: detailOf(r.scope_detail), status: r.status, note: r.note,
    createdBy: r.created_by_name, createdAt: iso(r.created_at)!, closedAt: iso(r.closed_at),
    binCounts: { total: Number(r.bins_total), done: Number(r.bins_done) },
    lineCounts: { waiting: Number(r.lines_waiting), toReview: Number(r.lines_counted), settled: Number(r.lines_settled) },
    valueOff: Number(r.value_off ?? 0).toFixed(2),
  }
}

export async function listCounts(ds: DataSource, q: CountsQuery): Promise<CountSummary[]> {
  const where = new SqlWhere()
    .add('c.status = ?', [q.status], q.status !== 'all')
    .add('c.warehouse_id = ?', [q.warehouseId], !!q.warehouseId)
  const rows: SummaryRow[] = await ds.query(
    `${SUMMARY_SELECT} ${where.sql()} ORDER BY c.status = 'open' DESC, c.id DESC LIMIT 200`,
    where.params,
  )
  return rows.map(toSummary)
}

interface LineRow {
  id: number
  bin_id: number
  bin_code: string
  item_id: number
  sku: string
  item_name: string
  stock_unit: string
  lot_id: number | null
  lot_code: string | null
  attempt: number
  source: CountLineView['source']
  status: CountLineView['status']
  snapshot_qty: number | null
  snapshot_move_id: string | null
  moves_since: number | null
  expected_qty: number | null
  counted_qty: number | null
  counted_move_id: string | null
  variance: number | null
  unit_cost: string | null
  counted_by: number | null
  counted_by_name: string | null
  counted_at: Date | null
  reviewed_by_name: string | null
  reviewed_at: Date | null
  review_note: string | null
  move_id: string | null
  pick_list_id: number | null
  warehouse_id: number
}

const LINE_SELECT = `
  SELECT l.id, l.bin_id, b.code AS bin_code, l.item_id, i.sku, i.name AS item_name, i.stock_unit, l.lot_id, lo.code AS lot_code,
         l.attempt, l.source, l.status, l.snapshot_qty, l.snapshot_move_id, l.moves_since, l.expected_qty, l.counted_qty, l.counted_move_id,
         l.variance, l.unit_cost, l.counted_by, cu.display_name AS counted_by_name, l.counted_at, ru.display_name AS reviewed_by_name,
         l.reviewed_at, l.review_note, l.move_id, l.pick_list_id, l.warehouse_id
    FROM count_lines l
    JOIN bins b ON b.id = l.bin_id
    JOIN items i ON i.id = l.item_id
    LEFT JOIN lots lo ON lo.id = l.lot_id
    LEFT JOIN users cu ON cu.id = l.counted_by
    LEFT JOIN users ru ON ru.id = l.reviewed_by`

function toLineView(r: LineRow, figures: boolean): CountLineView {
  // A line still waiting shows nothing of the ledger to anyone; a counted one shows it to reviewers.
  const show = figures && r.status !== 'waiting' && r.status !== 'cancelled'
  const counted = r.status !== 'waiting' && r.status !== 'cancelled'
  return {
    id: r.id, binId: r.bin_id, binCode: r.bin_code, itemId: r.item_id, sku: r.sku, itemName: r.item_name, stockUnit: r.stock_unit,
    lotId: r.lot_id, lotCode: r.lot_code, attempt: r.attempt, source: r.source, status: r.status,
    snapshotQty: show ? r.snapshot_qty : null, movesSince: show ? r.moves_since : null, expectedQty: show ? r.expected_qty : null,
    countedQty: counted ? r.counted_qty : null, variance: show ? r.variance : null,
    unitCost: show ? r.unit_cost : null,
    varianceValue: show && r.variance !== null && r.unit_cost !== null ? varianceValue(r.variance, r.unit_cost) : null,
    countedBy: counted ? r.counted_by_name : null, countedById: counted ? r.counted_by : null, countedAt: counted ? iso(r.counted_at) : null,
    reviewedBy: r.reviewed_by_name, reviewedAt: iso(r.reviewed_at), reviewNote: r.review_note, moveId: r.move_id, pickListId: r.pick_list_id,
  }
}

async function summaryById(ds: DataSource, id: number): Promise<CountSummary & { itemsOnly: boolean }> {
  const [row]: SummaryRow[] = await ds.query(`${SUMMARY_SELECT} WHERE c.id = ?`, [id])
  if (!row) throw new AppError(404, 'count_not_found', 'That count was not found.')
  return { ...toSummary(row), itemsOnly: Boolean(row.items_only) }
}

/** The moves in each counted line's bin × item × lot between its snapshot and its count. */
async function movesDuring(ds: DataSource, lines: LineRow[]): Promise<CountDetail['movesDuring']> {
  const out: CountDetail['movesDuring'] = {}
  const wanted = lines.filter((l) => l.moves_since !== null && l.moves_since !== 0 && l.snapshot_move_id && l.counted_move_id)
  for (const l of wanted) {
    const rows: { id: string; at: Date; move_type: string; qty: number; by: string | null }[] = await ds.query(
      `SELECT m.id, m.at, m.move_type, m.qty, u.display_name AS \`by\` FROM stock_moves m LEFT JOIN users u ON u.id = m.user_id
        WHERE m.item_id = ? AND m.warehouse_id = ? AND m.bin_id = ? AND m.lot_id <=> ? AND m.id > ? AND m.id <= ? ORDER BY m.id LIMIT 50`,
      [l.item_id, l.warehouse_id, l.bin_id, l.lot_id, l.snapshot_move_id, l.counted_move_id],
    )
    out[l.id] = rows.map((m) => ({ id: String(m.id), at: iso(m.at)!, moveType: m.move_type, qty: Number(m.qty), by: m.by }))
  }
  return out
}

export async function countDetail(ds: DataSource, viewer: CountViewer, id: number): Promise<CountDetail> {
  const settings = await countSettings(ds)
  const summary = await summaryById(ds, id)
  const canReview = mayReview(viewer.roles, settings.reviewerRoles)
  const [lineRows, binRows] = await Promise.all([
    ds.query(`${LINE_SELECT} WHERE l.count_id = ? ORDER BY b.code, i.sku, l.lot_id, l.attempt`, [id]) as Promise<LineRow[]>,
    ds.query(
      `SELECT cb.bin_id, b.code AS bin_code, cb.status, cb.visits, u.display_name AS started_by, cb.finished_at
         FROM count_bins cb JOIN bins b ON b.id = cb.bin_id LEFT JOIN users u ON u.id = cb.started_by WHERE cb.count_id = ? ORDER BY b.code`,
      [id],
    ) as Promise<{ bin_id: number; bin_code: string; status: CountDetail['bins'][number]['status']; visits: number; started_by: string | null; finished_at: Date | null }[]>,
  ])
  const { itemsOnly: _itemsOnly, ...rest } = summary
  return {
    ...rest,
    bins: binRows.map((b) => ({ binId: b.bin_id, binCode: b.bin_code, status: b.status, visits: Number(b.visits), startedBy: b.started_by, finishedAt: iso(b.finished_at) })),
    lines: lineRows.map((r) => toLineView(r, canReview)),
    movesDuring: canReview ? await movesDuring(ds, lineRows.filter((r) => r.status === 'counted')) : {},
    canReview,
  }
}

/** The counter's view: the bins in walking order and, for the bin they are counting, what to count and what they entered. */
export async function handheldCount(ds: DataSource, viewer: CountViewer, id: number): Promise<HandheldCount> {
  const summary = await summaryById(ds, id)
  const wh = await ds.manager.findOneByOrFail(Warehouse, { id: summary.warehouse.id })
  const binRows: { bin_id: number; bin_code: string; status: HandheldCount['bins'][number]['status']; started_by: number | null; started_by_name: string | null }[] = await ds.query(
    `SELECT cb.bin_id, b.code AS bin_code, cb.status, cb.started_by, u.display_name AS started_by_name
       FROM count_bins cb JOIN bins b ON b.id = cb.bin_id LEFT JOIN users u ON u.id = cb.started_by WHERE cb.count_id = ?`,
    [id],
  )
  const bins = walkOrder(binRows.map((b) => ({ binId: b.bin_id, binCode: b.bin_code, status: b.status, startedBy: b.status === 'counting' ? b.started_by_name : null })), walkConfigOf(wh))
  const mine = binRows.find((b) => b.status === 'counting' && b.started_by === viewer.userId)
  let current: HandheldCountBin | null = null
  if (mine) {
    const lines: { id: number; item_id: number; sku: string; name: string; lot_code: string | null; counted_qty: number | null; source: string; attempt: number }[] = await ds.query(
      `SELECT l.id, l.item_id, i.sku, i.name, lo.code AS lot_code, l.counted_qty, l.source, l.attempt
         FROM count_lines l JOIN items i ON i.id = l.item_id LEFT JOIN lots lo ON lo.id = l.lot_id
        WHERE l.count_id = ? AND l.bin_id = ? AND l.status = 'waiting' ORDER BY i.sku, lo.code`,
      [id, mine.bin_id],
    )
    // Whole-bin counts are blind to the bin's contents too; only recounts and short-pick checks name their item.
    const named = lines.filter((l) => summary.itemsOnly || l.attempt > 1 || l.source === 'short_pick')
    current = {
      binId: mine.bin_id, binCode: mine.bin_code, status: 'counting', startedBy: mine.started_by_name,
      asked: named.map((l) => ({ itemId: l.item_id, sku: l.sku, itemName: l.name, lotCode: l.lot_code })),
      entered: lines.filter((l) => l.counted_qty !== null).map((l) => ({ lineId: l.id, itemId: l.item_id, sku: l.sku, itemName: l.name, lotCode: l.lot_code, qty: Number(l.counted_qty) })),
    }
  }
  const { binCounts: _b, lineCounts: _l, createdBy: _c, createdAt: _a, closedAt: _z, note: _n, valueOff: _v, itemsOnly, ...head } = summary
  return { id: head.id, warehouse: head.warehouse, scope: head.scope, scopeDetail: head.scopeDetail, status: head.status, itemsOnly, bins, current }
}

export async function countHistory(ds: DataSource, viewer: CountViewer, q: CountHistoryQuery): Promise<CountHistoryRow[]> {
  const figures = mayReview(viewer.roles, (await countSettings(ds)).reviewerRoles)
  const where = new SqlWhere()
    .add("l.status IN ('matched', 'approved', 'recounted', 'counted')")
    .add('l.bin_id = ?', [q.binId], !!q.binId)
    .add('l.item_id = ?', [q.itemId], !!q.itemId)
    .add('l.warehouse_id = ?', [q.warehouseId], !!q.warehouseId)
  const rows: (LineRow & { count_id: number; scope: CountHistoryRow['scope']; warehouse_code: string })[] = await ds.query(
    `SELECT l2.*, c.scope, w.code AS warehouse_code FROM (${LINE_SELECT} ${where.sql()} ORDER BY l.counted_at DESC, l.id DESC LIMIT 500) l2
       JOIN count_lines cl ON cl.id = l2.id JOIN cycle_counts c ON c.id = cl.count_id JOIN warehouses w ON w.id = cl.warehouse_id
      ORDER BY l2.counted_at DESC, l2.id DESC`,
    where.params,
  )
  return rows.map((r) => {
    const v = toLineView(r, figures)
    return {
      lineId: r.id, countId: Number(r.count_id ?? 0), scope: r.scope, warehouseCode: r.warehouse_code, binCode: r.bin_code, sku: r.sku, itemName: r.item_name,
      lotCode: r.lot_code, attempt: r.attempt, status: r.status, expectedQty: v.expectedQty, countedQty: v.countedQty, variance: v.variance,
      varianceValue: v.varianceValue ?? null,
      countedBy: v.countedBy, countedAt: v.countedAt, reviewedBy: v.reviewedBy,
    }
  })
}
