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
  /** Days from the last day of net use to the window's end, looking back `lookbackDays`; null without use. */
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
 * Per item and warehouse over the window, reading back `lookbackDays` (≥ the window) for the last use only,
 * so dead stock is found even when it is older than the statistics' window. `itemIds` narrows to some items.
 */
export async function usageSums(
  em: EntityManager,
  window: WindowBounds,
  lookbackDays: number,
  itemIds?: readonly number[],
): Promise<Map<string, UsageSums>> {
  if (itemIds && itemIds.length === 0) return new Map()
  const lookback = Math.max(lookbackDays, window.days)
  if (lookback >= DAY_SPAN) throw new RangeError(`look-back of ${lookback} days is beyond ${DAY_SPAN - 1}`)
  // Day offsets t from the first day read: the window is t ≥ from; its halves end and start at the offsets below.
  const from = lookback - window.days
  const firstEnd = from + window.half
  const secondStart = lookback - window.half
  // Only a longer look-back needs the window test inside the sums; without it the outer query stays lean.
  const t = `(d.k MOD ${DAY_SPAN})`
  const inWindow = from > 0 ? `${t} >= ${from} AND` : ''
  const sum = (expr: string) => (from > 0 ? `SUM(IF(${t} >= ${from}, ${expr}, 0))` : `SUM(${expr})`)
  const first = addDays(window.end, 1 - lookback)
  const movesByDay = `SELECT ${LINE_EXPR} * ${DAY_SPAN} + DATEDIFF(m.at, ?) AS k, -SUM(m.qty) AS qty
                 FROM stock_moves m
                WHERE m.move_type IN (?, ?) AND m.at >= ? AND m.at < ? ${itemFilter(itemIds)}
                GROUP BY k`
  const movesParams = [first, ...USAGE_MOVE_TYPES, first, dayAfter(window.end), ...(itemIds ?? [])]
  // Imported history is added day by day beside the moves (a second grouping of the union). Most yards have
  // none in the look-back, and then the moves' own day groups are the days: one grouping pass fewer.
  const history = await hasHistory(em, first, dayAfter(window.end), itemIds)
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
            ${sum('d.qty')} AS sum_qty,
            ${sum('d.qty * d.qty')} AS sum_sq,
            SUM(${inWindow} d.qty > 0) AS days_with_use,
            SUM(IF(${inWindow} ${t} < ${firstEnd}, d.qty, 0)) AS first_half,
            SUM(IF(${t} >= ${secondStart}, d.qty, 0)) AS second_half,
            MAX(IF(d.qty > 0, ${t}, NULL)) AS last_offset
       FROM ${days} d
      GROUP BY line`,
    history ? [...movesParams, first, first, dayAfter(window.end), ...(itemIds ?? [])] : movesParams,
  )
  return new Map(rows.map((r) => {
    const key = keyOfLine(r.line)
    const [itemId, warehouseId] = key.split(':').map(Number)
    return [key, toSums(r, itemId, warehouseId, lookback)]
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
