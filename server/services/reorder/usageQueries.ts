// Usage from the ledger as SQL aggregates: ledger rows never come into Node. Issues and picks are usage
// (their quantities are negative), and so is imported usage history (usage_history, from before Lumenyard:
// positive quantities, never stock moves), added day by day beside them. The inner query sums each item × warehouse × day (the day as its offset
// from the first day read, DATEDIFF(at, start), which groups exactly as DATE(at) does); the outer one gives per
// line Σx and Σx² over the days that had use, which statsFromSums turns into a mean and spread over every day of
// the window, the empty days included. The range is covered by ix_moves_type_at (move_type, at, item, wh, qty).
//
// Both levels group by ONE integer key rather than by (item_id, warehouse_id[, day]): MariaDB 10.11 sorts
// several GROUP BY columns through filesort, but hashes one key in a temporary table — measured 1.5–3× faster
// on a million moves (npm run bench). The key packs item × 2^16 + warehouse (warehouse ids below 65,536), and the
// day offset × 2^11 (look-backs below 2,048 days).
import type { EntityManager } from 'typeorm'
import { addDays, dayAfter, type WindowBounds } from './usageWindow.js'

export const USAGE_MOVE_TYPES = ['issue', 'pick'] as const
const WAREHOUSE_SPAN = 65536
const DAY_SPAN = 2048

export interface UsageSums {
  itemId: number
  warehouseId: number
  sum: number
  sumSquares: number
  daysWithUse: number
  firstHalfSum: number
  secondHalfSum: number
  /** Days from the last day of net use to the window's end; null without use (in the window, or as far back as looked). */
  idleDays: number | null
}

export const lineKey = (itemId: number, warehouseId: number) => `${itemId}:${warehouseId}`
const keyOfLine = (line: string | number) => {
  const n = Number(line)
  return lineKey(Math.floor(n / WAREHOUSE_SPAN), n % WAREHOUSE_SPAN)
}
const LINE_EXPR = `(m.item_id * ${WAREHOUSE_SPAN} + m.warehouse_id)`
/** The same key over usage_history (aliased m too, so the item filter reads the same). */
const HISTORY_LINE_EXPR = LINE_EXPR

interface UsageRow {
  line: string
  sum_qty: string | null
  sum_sq: string | null
  days_with_use: string | null
  first_half: string | null
  second_half: string | null
  last_offset: number | null
}

// The day groups of a year of a busy ledger outgrow MariaDB's default 16 MB in-memory temporary table and
// spill to disk; this one statement may use up to 64 MB instead (measured: about a third faster).
export const AGGREGATE_MEMORY = 'SET STATEMENT max_heap_table_size = 67108864, tmp_table_size = 67108864 FOR'

/** The packed key needs warehouse ids below 2^16; a yard with more would need a wider key. */
export function assertPackable(warehouseIds: Iterable<number>): void {
  for (const id of warehouseIds) if (id >= WAREHOUSE_SPAN) throw new RangeError(`warehouse id ${id} does not fit the usage key`)
}

/** Whether any imported usage history falls in [from, to) (for these items): one indexed probe. */
async function hasHistory(em: EntityManager, from: string, to: string, itemIds?: readonly number[]): Promise<boolean> {
  const rows: unknown[] = await em.query(`SELECT 1 FROM usage_history m WHERE m.day >= ? AND m.day < ? ${itemFilter(itemIds)} LIMIT 1`, [from, to, ...(itemIds ?? [])])
  return rows.length > 0
}

function itemFilter(itemIds: readonly number[] | undefined): string {
  return itemIds?.length ? `AND m.item_id IN (${itemIds.map(() => '?').join(',')})` : ''
}

/**
 * Per item and warehouse over the window: the sums behind the statistics, the halves for the trend and the last
 * day of net use within the window (idleBeforeWindow looks further back for lines quiet in it). `itemIds`
 * narrows to some items.
 */
export async function usageSums(
  em: EntityManager,
  window: WindowBounds,
  itemIds?: readonly number[],
): Promise<Map<string, UsageSums>> {
  if (itemIds && itemIds.length === 0) return new Map()
  if (window.days >= DAY_SPAN) throw new RangeError(`window of ${window.days} days is beyond ${DAY_SPAN - 1}`)
  // Day offsets t from the window's first day; the halves end and start at the offsets below.
  const secondStart = window.days - window.half
  const t = `(d.k MOD ${DAY_SPAN})`
  const movesByDay = `SELECT ${LINE_EXPR} * ${DAY_SPAN} + DATEDIFF(m.at, ?) AS k, -SUM(m.qty) AS qty
                 FROM stock_moves m
                WHERE m.move_type IN (?, ?) AND m.at >= ? AND m.at < ? ${itemFilter(itemIds)}
                GROUP BY k`
  const end = dayAfter(window.end)
  const movesParams = [window.start, ...USAGE_MOVE_TYPES, window.start, end, ...(itemIds ?? [])]
  // Imported history is added day by day beside the moves (a second grouping of the union). Most yards have
  // none in the window, and then the moves' own day groups are the days: one grouping pass fewer.
  const history = await hasHistory(em, window.start, end, itemIds)
  const days = history
    ? `(SELECT u.k, SUM(u.qty) AS qty FROM (
               ${movesByDay}
               UNION ALL
               SELECT ${HISTORY_LINE_EXPR} * ${DAY_SPAN} + DATEDIFF(m.day, ?) AS k, SUM(m.qty) AS qty
                 FROM usage_history m
                WHERE m.day >= ? AND m.day < ? ${itemFilter(itemIds)}
                GROUP BY k) u
              GROUP BY u.k)`
    : `(${movesByDay})`
  const rows: UsageRow[] = await em.query(
    `${AGGREGATE_MEMORY}
     SELECT d.k DIV ${DAY_SPAN} AS line,
            SUM(d.qty) AS sum_qty,
            SUM(d.qty * d.qty) AS sum_sq,
            SUM(d.qty > 0) AS days_with_use,
            SUM(IF(${t} < ${window.half}, d.qty, 0)) AS first_half,
            SUM(IF(${t} >= ${secondStart}, d.qty, 0)) AS second_half,
            MAX(IF(d.qty > 0, ${t}, NULL)) AS last_offset
       FROM ${days} d
      GROUP BY line`,
    history ? [...movesParams, window.start, window.start, end, ...(itemIds ?? [])] : movesParams,
  )
  return new Map(rows.map((r) => {
    const key = keyOfLine(r.line)
    const [itemId, warehouseId] = key.split(':').map(Number)
    return [key, toSums(r, itemId, warehouseId, window.days)]
  }))
}

function toSums(r: UsageRow, itemId: number, warehouseId: number, lookback: number): UsageSums {
  return {
    itemId,
    warehouseId,
    sum: Number(r.sum_qty ?? 0),
    sumSquares: Number(r.sum_sq ?? 0),
    daysWithUse: Number(r.days_with_use ?? 0),
    firstHalfSum: Number(r.first_half ?? 0),
    secondHalfSum: Number(r.second_half ?? 0),
    idleDays: r.last_offset === null ? null : lookback - 1 - Number(r.last_offset),
  }
}

const LAST_USE_CHUNK = 400

/**
 * The last day of net use before the window, looking back `lookbackDays` from the window's end, for the lines
 * given (those without use in the window) and for any line with imported history there: days from that day to
 * the window's end, per line key. The usage aggregate reads the window alone (what the statistics need); dead
 * stock older than the window is found here, through the line's own index (ix_moves_item_wh_at), so the cost
 * grows with the quiet lines asked about, not with a year of everybody's moves.
 */
export async function idleBeforeWindow(
  em: EntityManager,
  window: WindowBounds,
  lookbackDays: number,
  quietLines: Iterable<string>,
): Promise<Map<string, number>> {
  const idle = new Map<string, number>()
  if (lookbackDays <= window.days) return idle
  const first = addDays(window.end, 1 - lookbackDays)
  const range = [first, window.start]
  const withHistory: { item_id: number; warehouse_id: number }[] = await em.query(
    'SELECT DISTINCT item_id, warehouse_id FROM usage_history WHERE day >= ? AND day < ?', range)
  const keys = [...new Set([...quietLines, ...withHistory.map((r) => lineKey(r.item_id, r.warehouse_id))])]
  for (let i = 0; i < keys.length; i += LAST_USE_CHUNK) {
    const pairs = keys.slice(i, i + LAST_USE_CHUNK).flatMap((k) => k.split(':').map(Number))
    const rowIn = Array.from({ length: pairs.length / 2 }, () => '(?, ?)').join(', ')
    const rows: { item_id: number; warehouse_id: number; idle: number }[] = await em.query(
      `SELECT d.item_id, d.warehouse_id, DATEDIFF(?, MAX(d.day)) AS idle FROM (
         SELECT u.item_id, u.warehouse_id, u.day FROM (
           SELECT m.item_id, m.warehouse_id, DATE(m.at) AS day, -SUM(m.qty) AS qty
             FROM stock_moves m
            WHERE (m.item_id, m.warehouse_id) IN (${rowIn}) AND m.at >= ? AND m.at < ? AND m.move_type IN (?, ?)
            GROUP BY m.item_id, m.warehouse_id, DATE(m.at)
           UNION ALL
           SELECT h.item_id, h.warehouse_id, h.day, SUM(h.qty)
             FROM usage_history h
            WHERE (h.item_id, h.warehouse_id) IN (${rowIn}) AND h.day >= ? AND h.day < ?
            GROUP BY h.item_id, h.warehouse_id, h.day) u
          GROUP BY u.item_id, u.warehouse_id, u.day
         HAVING SUM(u.qty) > 0) d
        GROUP BY d.item_id, d.warehouse_id`,
      [window.end, ...pairs, ...range, ...USAGE_MOVE_TYPES, ...pairs, ...range],
    )
    for (const r of rows) idle.set(lineKey(r.item_id, r.warehouse_id), Number(r.idle))
  }
  return idle
}

/** Net use per day for one line, for its chart: at most one row per day of the window. */
export async function dailyUsage(
  em: EntityManager,
  itemId: number,
  warehouseId: number,
  window: WindowBounds,
): Promise<{ date: string; qty: number }[]> {
  const rows: { day: string; qty: string }[] = await em.query(
    `SELECT DATE_FORMAT(u.day, '%Y-%m-%d') AS day, SUM(u.qty) AS qty FROM (
       SELECT DATE(at) AS day, -SUM(qty) AS qty
         FROM stock_moves
        WHERE item_id = ? AND warehouse_id = ? AND move_type IN (?, ?) AND at >= ? AND at < ?
        GROUP BY DATE(at)
       UNION ALL
       SELECT day, SUM(qty) FROM usage_history WHERE item_id = ? AND warehouse_id = ? AND day >= ? AND day < ? GROUP BY day) u
      GROUP BY u.day
      ORDER BY day`,
    [itemId, warehouseId, ...USAGE_MOVE_TYPES, window.start, dayAfter(window.end), itemId, warehouseId, window.start, dayAfter(window.end)],
  )
  return rows.map((r) => ({ date: r.day, qty: Number(r.qty) }))
}

/** Window use per line without the daily split: what the ABC classes need. One integer key, as above. */
export async function usageTotals(em: EntityManager, window: WindowBounds, itemIds?: readonly number[]): Promise<Map<string, number>> {
  const rows: { line: string; qty: string }[] = await em.query(
    `${AGGREGATE_MEMORY} SELECT u.line, SUM(u.qty) AS qty FROM (
       SELECT ${LINE_EXPR} AS line, -SUM(m.qty) AS qty
         FROM stock_moves m
        WHERE m.move_type IN (?, ?) AND m.at >= ? AND m.at < ? ${itemFilter(itemIds)}
        GROUP BY line
       UNION ALL
       SELECT ${HISTORY_LINE_EXPR} AS line, SUM(m.qty) AS qty
         FROM usage_history m
        WHERE m.day >= ? AND m.day < ? ${itemFilter(itemIds)}
        GROUP BY line) u
      GROUP BY u.line`,
    [...USAGE_MOVE_TYPES, window.start, dayAfter(window.end), ...(itemIds ?? []), window.start, dayAfter(window.end), ...(itemIds ?? [])],
  )
  return new Map(rows.map((r) => [keyOfLine(r.line), Number(r.qty)]))
}

/** How many days of the window imported usage history covers (from its first to its last day within the window). */
export async function historyDaysInWindow(em: EntityManager, window: WindowBounds): Promise<number> {
  const [row]: { days: string | null }[] = await em.query(
    'SELECT DATEDIFF(MAX(day), MIN(day)) + 1 AS days FROM usage_history WHERE day >= ? AND day < ?',
    [window.start, dayAfter(window.end)],
  )
  return Number(row?.days ?? 0)
}
