// The day at a glance: for each of the signed-in person's roles, the figures of the day's work, each
// counted in SQL with the same filter as the list it links to (the PO list's `poFilterSql`, the jobs
// list's `SPECIAL_ORDER_DUE_SQL`, the stock levels' `levelsSql`, the reports' own rules), so a figure and
// its list agree. Money figures go only to people the cost rule lets see costs.
import type { DataSource } from 'typeorm'
import { DEFAULT_REORDER_POLICY } from '../../../shared/inventory/reorder.js'
import { MoneyDecimal } from '../../../shared/money.js'
import { addDays, localDayIn } from '../../../shared/reports/zonedDays.js'
import type { Role } from '../../../shared/roles.js'
import { OPEN_PICK_STATUSES } from '../../../shared/schemas/picking.js'
import type { PoStatus } from '../../../shared/schemas/purchasing.js'
import { levelsQuerySchema } from '../../../shared/schemas/stockViews.js'
import type { TodayAnswer, TodayFigure, TodayPanel, TodayPanelName, TodayQuery } from '../../../shared/schemas/today.js'
import { SPECIAL_ORDER_DUE_SQL } from '../counter/jobService.js'
import { countAccuracy } from '../counts/countAccuracy.js'
import { costsVisibleTo } from '../costVisibility.js'
import { poFilterSql, type PoFilter } from '../purchasing/poRead.js'
import { computeReorderLines } from '../reorder/reorderLines.js'
import { deadAndSlowStock } from '../reports/deadStock.js'
import { levelsSql } from '../stockQueries.js'

/** Which panel each role opens to; a person with several roles gets each of theirs. */
const PANEL_OF: Partial<Record<Role, TodayPanelName>> = { counter: 'counter', warehouse: 'warehouse', buyer: 'buyer', admin: 'owner' }
/** Orders still to arrive, whether sent or only approved. */
const AWAITED: PoStatus[] = ['approved', 'sent', 'partly_received']
/** Orders placed with the vendor: what the month's spend adds up. */
const PLACED: PoStatus[] = ['sent', 'partly_received', 'received', 'closed']
/** Special orders count as due this many days ahead of the job's due date. */
export const SPECIAL_ORDER_LEAD_DAYS = 7

interface Day { day: string; tz: string; roles: readonly Role[] }

const one = async (ds: DataSource, sql: string, params: unknown[] = []): Promise<number> =>
  Number(((await ds.query(sql, params)) as { n: string | number | null }[])[0]?.n ?? 0)

const listQuery = (f: PoFilter): Record<string, string> => Object.fromEntries(
  Object.entries({ ...f, status: f.status.join(',') }).filter(([, v]) => v !== undefined && v !== '').map(([k, v]) => [k, String(v)]),
)

async function poFigure(ds: DataSource, name: TodayFigure['name'], f: PoFilter, withSpend = false): Promise<TodayFigure> {
  const where = poFilterSql(f)
  const [r] = (await ds.query(`SELECT COUNT(*) AS n, COALESCE(SUM(o.total), 0) AS spend FROM purchase_orders o ${where.sql}`, where.params)) as { n: string; spend: string }[]
  return { name, count: Number(r.n), ...(withSpend ? { spendValue: new MoneyDecimal(r.spend).toFixed(2) } : {}), query: listQuery(f) }
}

async function counterPanel(ds: DataSource, d: Day): Promise<TodayFigure[]> {
  const dueBy = addDays(d.day, SPECIAL_ORDER_LEAD_DAYS)
  const [jobsToPick, underWay, specialDue] = await Promise.all([
    // A bill waits while its stocked lines hold more than is picked and on open lists (as the Counter's picking page works it out).
    one(ds, `SELECT COUNT(*) AS n FROM (
        SELECT b.id, SUM(bl.qty - bl.picked_qty) - (SELECT COALESCE(SUM(pll.qty - pll.short_qty), 0) FROM pick_list_lines pll
                 JOIN pick_lists pl ON pl.id = pll.pick_list_id WHERE pl.bom_id = b.id AND pl.status IN (?)) AS to_pick
          FROM boms b JOIN bom_lines bl ON bl.bom_id = b.id AND bl.item_id IS NOT NULL AND bl.made_to_order = 0
         WHERE b.revision = (SELECT MAX(b2.revision) FROM boms b2 WHERE b2.job_id = b.job_id)
         GROUP BY b.id HAVING to_pick > 0) w`, [OPEN_PICK_STATUSES]),
    one(ds, "SELECT COUNT(*) AS n FROM pick_lists WHERE status = 'picking'"),
    one(ds, `SELECT COUNT(*) AS n FROM jobs j WHERE ${SPECIAL_ORDER_DUE_SQL}`, [dueBy]),
  ])
  return [
    { name: 'jobsToPick', count: jobsToPick, query: { toPick: '1' } },
    { name: 'picksUnderWay', count: underWay, query: { status: 'picking' } },
    { name: 'specialOrdersDue', count: specialDue, query: { specialDueBy: dueBy } },
  ]
}

async function warehousePanel(ds: DataSource, d: Day): Promise<TodayFigure[]> {
  const [openLists, deliveries, counts, outbox] = await Promise.all([
    one(ds, 'SELECT COUNT(*) AS n FROM pick_lists WHERE status IN (?)', [OPEN_PICK_STATUSES]),
    poFigure(ds, 'deliveriesToday', { status: ['sent', 'partly_received'], expectedFrom: d.day, expectedTo: d.day }),
    one(ds, "SELECT COUNT(*) AS n FROM cycle_counts WHERE status = 'open'"),
    one(ds, 'SELECT COALESCE(SUM(waiting), 0) AS n FROM device_outbox_reports'),
  ])
  return [
    { name: 'openPickLists', count: openLists, query: {} },
    deliveries,
    { name: 'countsOpen', count: counts, query: { status: 'open' } },
    { name: 'deviceOutbox', count: outbox, query: {} },
  ]
}

async function buyerPanel(ds: DataSource, d: Day, costs: boolean): Promise<TodayFigure[]> {
  const weekEnd = addDays(d.day, (7 - new Date(`${d.day}T12:00:00Z`).getUTCDay()) % 7) // through Sunday
  const [lines, late, dueSoon, spend] = await Promise.all([
    computeReorderLines(ds),
    poFigure(ds, 'ordersLate', { status: AWAITED, expectedTo: addDays(d.day, -1) }),
    poFigure(ds, 'ordersDueThisWeek', { status: AWAITED, expectedFrom: d.day, expectedTo: weekEnd }),
    poFigure(ds, 'spendThisMonth', { status: PLACED, sentFrom: `${d.day.slice(0, 8)}01`, sentTo: d.day, tz: d.tz }, true),
  ])
  const orderNow = lines.lines.filter((l) => l.line.status === 'orderNow').length
  return [{ name: 'orderNow', count: orderNow, query: { group: 'orderNow' } }, late, dueSoon, ...(costs ? [spend] : [])]
}

async function ownerPanel(ds: DataSource, d: Day, costs: boolean): Promise<TodayFigure[]> {
  const low = levelsSql(levelsQuerySchema.parse({ lowOnly: 'true' }))
  const deadDays = DEFAULT_REORDER_POLICY.deadStockDays
  const [values, accuracy, lowStock, dead] = await Promise.all([
    costs ? stockValueByWarehouse(ds) : Promise.resolve([]),
    countAccuracy(ds, { from: `${d.day.slice(0, 8)}01`, to: d.day, tz: d.tz }),
    one(ds, `SELECT COUNT(*) AS n FROM (${low.sql}) x`, low.params),
    deadAndSlowStock(ds, { deadDays, slowDays: deadDays, windowDays: deadDays }),
  ])
  const lines = accuracy.reduce((a, r) => ({ counted: a.counted + r.linesCounted, right: a.right + r.linesRight }), { counted: 0, right: 0 })
  return [
    ...values,
    { name: 'accuracy', count: lines.counted, accuracy: lines.counted ? lines.right / lines.counted : null, query: { month: d.day.slice(0, 7) } },
    { name: 'lowStock', count: lowStock, query: { lowOnly: 'true' } },
    { name: 'deadStock', count: dead.rows.filter((r) => r.kind === 'dead').length, query: { tab: 'dead-stock', deadDays: String(deadDays) } },
  ]
}

/** Stock on hand (transit bins included: they belong to the warehouse shipping) at each pair's moving average, per active warehouse. */
async function stockValueByWarehouse(ds: DataSource): Promise<TodayFigure[]> {
  const rows = (await ds.query(
    `SELECT w.id, w.code, COALESCE(SUM(ROUND(s.on_hand * COALESCE(iw.avg_cost, 0), 2)), 0) AS value
       FROM warehouses w
       LEFT JOIN (SELECT item_id, warehouse_id, SUM(on_hand) AS on_hand FROM stock_balances GROUP BY item_id, warehouse_id) s ON s.warehouse_id = w.id
       LEFT JOIN item_warehouses iw ON iw.item_id = s.item_id AND iw.warehouse_id = s.warehouse_id
      WHERE w.active = 1 GROUP BY w.id, w.code ORDER BY w.code`,
  )) as { id: number; code: string; value: string }[]
  return rows.map((r) => ({ name: 'stockValue', stockValue: new MoneyDecimal(r.value).toFixed(2), warehouseCode: r.code, query: { warehouseId: String(r.id) } }))
}

export async function todayFigures(ds: DataSource, roles: readonly Role[], q: TodayQuery, now = new Date()): Promise<TodayAnswer> {
  const d: Day = { day: localDayIn(q.tz, now), tz: q.tz, roles }
  const costs = await costsVisibleTo(ds, roles)
  const wanted = [...new Set(roles.map((r) => PANEL_OF[r]).filter((p): p is TodayPanelName => !!p))]
  const build: Record<TodayPanelName, () => Promise<TodayFigure[]>> = {
    counter: () => counterPanel(ds, d),
    warehouse: () => warehousePanel(ds, d),
    buyer: () => buyerPanel(ds, d, costs),
    owner: () => ownerPanel(ds, d, costs),
  }
  const order: TodayPanelName[] = ['owner', 'buyer', 'warehouse', 'counter']
  const panels: TodayPanel[] = await Promise.all(order.filter((p) => wanted.includes(p)).map(async (panel) => ({ panel, figures: await build[panel]() })))
  return { day: d.day, panels }
}
