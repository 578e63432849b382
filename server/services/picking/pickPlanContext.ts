// Everything a pick plan reads about a bill of materials: its job and customer, the warehouses,
// and per line what is still to pick (ordered less picked less what open pick lists already hold).
import { In, type EntityManager } from 'typeorm'
import { OPEN_PICK_STATUSES } from '../../../shared/schemas/picking.js'
import { Bom } from '../../entities/Bom.js'
import { Customer, Job } from '../../entities/Customer.js'
import { Item } from '../../entities/Item.js'
import { Warehouse } from '../../entities/Warehouse.js'
import { AppError, problem } from '../../errors.js'

export interface PlanBomLine {
  id: number
  lineNo: number
  itemId: number | null
  description: string
  qty: number
  pickedQty: number
  /** Held by open pick lists (less what they closed short). */
  openQty: number
  remaining: number
  madeToOrder: boolean
}

export interface PlanContext {
  bom: Bom
  job: Job
  customerName: string
  warehouse: Warehouse
  /** Active warehouses, the chosen one first, then by code. */
  warehouses: Warehouse[]
  lines: PlanBomLine[]
  items: Map<number, Item>
}

interface BomLineData { id: number; line_no: number; item_id: number | null; description: string; qty: number; picked_qty: number; made_to_order: number }

/**
 * locking: read under share locks (creating a list), so what other transactions committed while
 * this one waited for the bill of materials' lock is seen, not an older snapshot (the Idempotency-Key
 * record's insert may already have opened one). Two counters making lists for different bills at
 * once can meet on these share locks' gaps: MariaDB then ends one with a deadlock, and
 * inTransaction runs it again.
 */
async function bomLines(em: EntityManager, bomId: number, locking: boolean): Promise<PlanBomLine[]> {
  const lock = locking ? ' LOCK IN SHARE MODE' : ''
  const rows = (await em.query(
    `SELECT id, line_no, item_id, description, qty, picked_qty, made_to_order FROM bom_lines WHERE bom_id = ? ORDER BY line_no, id${lock}`,
    [bomId],
  )) as BomLineData[]
  if (!rows.length) return []
  const open = (await em.query(
    `SELECT pll.bom_line_id, SUM(pll.qty - pll.short_qty) AS open_qty
       FROM pick_list_lines pll JOIN pick_lists pl ON pl.id = pll.pick_list_id
      WHERE pll.bom_line_id IN (?) AND pl.status IN (?)
      GROUP BY pll.bom_line_id${lock}`,
    [rows.map((r) => r.id), OPEN_PICK_STATUSES],
  )) as { bom_line_id: number; open_qty: string }[]
  const openBy = new Map(open.map((o) => [Number(o.bom_line_id), Number(o.open_qty)]))
  return rows.map((r) => {
    const openQty = openBy.get(Number(r.id)) ?? 0
    return {
      id: Number(r.id), lineNo: Number(r.line_no), itemId: r.item_id === null ? null : Number(r.item_id), description: r.description,
      qty: Number(r.qty), pickedQty: Number(r.picked_qty), openQty, madeToOrder: Number(r.made_to_order) === 1,
      remaining: Math.max(0, Number(r.qty) - Number(r.picked_qty) - openQty),
    }
  })
}

export async function loadWarehouse(em: EntityManager, id: number, field = 'warehouseId'): Promise<Warehouse> {
  const wh = await em.findOneBy(Warehouse, { id })
  if (!wh) throw AppError.badRequest('warehouse_not_found', 'That warehouse does not exist.', { fields: { [field]: problem('warehouse_not_found') } })
  if (!wh.active) throw AppError.badRequest('warehouse_inactive', `${wh.name} is not in use.`, { params: { warehouse: wh.code }, fields: { [field]: problem('warehouse_inactive', { warehouse: wh.code }) } })
  return wh
}

/** A bill replaced by a later revision of its job's bill is never picked from again. */
async function refuseSuperseded(em: EntityManager, bom: Bom, locking: boolean): Promise<void> {
  const [row] = (await em.query(`SELECT MAX(revision) AS latest FROM boms WHERE job_id = ?${locking ? ' LOCK IN SHARE MODE' : ''}`, [bom.jobId])) as { latest: number | null }[]
  const latest = Number(row?.latest ?? bom.revision)
  if (latest > bom.revision) {
    throw AppError.conflict('bill_superseded', `Revision ${bom.revision} of this job's bill was replaced by revision ${latest}; start the pick list from revision ${latest}.`, { params: { revision: bom.revision, latest } })
  }
}

/** `FROM … WHERE` of the standing (not cancelled) sales orders made from a bill's quote; `bom` is `?` or a column. */
export const ordersOfBillSql = (bom: string) => `FROM sales_orders o JOIN quotes q ON q.id = o.quote_id WHERE q.bom_id = ${bom} AND o.status <> 'cancelled'`

/** The first standing sales order made from the bill's quote, or null. */
export async function salesOrderOfBill(em: EntityManager, bomId: number, locking = false): Promise<{ id: number; number: string } | null> {
  const [sold] = (await em.query(
    `SELECT o.id, o.number ${ordersOfBillSql('?')} ORDER BY o.id LIMIT 1${locking ? ' LOCK IN SHARE MODE' : ''}`,
    [bomId],
  )) as { id: number; number: string }[]
  return sold ? { id: Number(sold.id), number: String(sold.number) } : null
}

/**
 * A bill whose quote became a sales order is picked through the order (its own pick list carries the order's
 * holds); a second list from the bill would reserve the same goods twice. A cancelled order no longer holds anything.
 */
async function refuseSold(em: EntityManager, bomId: number, locking: boolean): Promise<void> {
  const sold = await salesOrderOfBill(em, bomId, locking)
  if (sold) {
    throw AppError.conflict('bill_on_sales_order', `This bill became sales order ${sold.number}; pick it from the order.`, {
      params: { order: sold.number, orderId: sold.id },
    })
  }
}

export async function loadPlanContext(em: EntityManager, bomId: number, warehouseId: number, opts: { locking: boolean }): Promise<PlanContext> {
  const bom = await em.findOne(Bom, { where: { id: bomId }, ...(opts.locking && { lock: { mode: 'pessimistic_write' as const } }) })
  if (!bom) throw AppError.badRequest('bom_not_found', 'That bill of materials does not exist.', { fields: { bomId: problem('bom_not_found') } })
  await refuseSuperseded(em, bom, opts.locking)
  await refuseSold(em, bom.id, opts.locking)
  const warehouse = await loadWarehouse(em, warehouseId)
  const job = await em.findOneByOrFail(Job, { id: bom.jobId })
  const customer = await em.findOneBy(Customer, { id: job.customerId })
  const lines = await bomLines(em, bom.id, opts.locking)
  const itemIds = [...new Set(lines.flatMap((l) => (l.itemId === null ? [] : [l.itemId])))]
  const items = new Map((itemIds.length ? await em.findBy(Item, { id: In(itemIds) }) : []).map((i) => [i.id, i]))
  const others = (await em.find(Warehouse, { where: { active: true }, order: { code: 'ASC' } })).filter((w) => w.id !== warehouse.id)
  return { bom, job, customerName: customer?.name ?? '', warehouse, warehouses: [warehouse, ...others], lines, items }
}
