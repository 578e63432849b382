// Special orders: a job's made-to-order bill-of-materials lines (shower bases with their spec) become
// purchase lines tied to the job; the counter sees each job's purchase lines and whether they come
// in before the job is due.
import { In, type DataSource, type EntityManager } from 'typeorm'
import type { PoFromJobInput } from '../../../shared/schemas/purchasing.js'
import type { JobPurchaseLines, SpecialOrderJob } from '../../../shared/schemas/purchasingViews.js'
import { packsFor } from '../../../shared/purchasing/poMoney.js'
import { parseSpec, specText } from '../../../shared/purchasing/specText.js'
import { BomLine } from '../../entities/Bom.js'
import { Job } from '../../entities/Customer.js'
import { Vendor } from '../../entities/Vendor.js'
import { AppError, problem } from '../../errors.js'
import type { AuditActor } from '../auditService.js'
import { isoDay } from './sqlValues.js'
import { addDays, addToOpenDraft, insertPo, leadDays, loadItems, preferredVendors, vendorItemsFor, type NewPoLine } from './poWrite.js'

type Db = EntityManager | DataSource

/** Made-to-order lines of the job's latest bill of materials that still need ordering. */
async function openSpecialLines(db: Db, jobId: number): Promise<BomLine[]> {
  return db.query(
    `SELECT l.id, l.item_id AS itemId, l.sku, l.description, l.qty, l.ordered_qty AS orderedQty, l.spec_json AS specJson
       FROM bom_lines l
      WHERE l.bom_id = (SELECT b.id FROM boms b WHERE b.job_id = ? ORDER BY b.revision DESC LIMIT 1)
        AND l.made_to_order = 1 AND l.qty > l.ordered_qty
      ORDER BY l.line_no`,
    [jobId],
  )
}

/**
 * A made-to-order line's description names what is built, never a catalog size: the catalog item a takeoff
 * maps to ("… 36 × 36 in …") is a placeholder, and the size the vendor builds is the line's specification.
 */
const MADE_TO_ORDER_NAMES: Record<string, string> = { shower_base: 'Shower base for tiling, made to order' }
function describeSpecial(item: { name: string; family: string }, specJson: string | null): string {
  const name = MADE_TO_ORDER_NAMES[item.family] ?? item.name
  return specJson ? `${name}, to the specification on this line` : name
}

/** The warehouse a job is served from: the one its latest pick list is picked in, if any. */
async function jobWarehouse(db: Db, jobId: number): Promise<number | null> {
  const [row]: { warehouse_id: number }[] = await db.query(
    'SELECT warehouse_id FROM pick_lists WHERE job_id = ? ORDER BY id DESC LIMIT 1', [jobId])
  return row?.warehouse_id ?? null
}

async function chosenLines(em: EntityManager, jobId: number, bomLineIds: number[] | undefined): Promise<BomLine[]> {
  const open = await openSpecialLines(em, jobId)
  const wanted = bomLineIds ? open.filter((l) => bomLineIds.includes(l.id)) : open
  if (bomLineIds && wanted.length !== new Set(bomLineIds).size) {
    throw AppError.badRequest('special_lines_not_open', 'Some lines are not open made-to-order lines of this job.', { fields: { bomLineIds: problem('special_lines_not_open') } })
  }
  if (!wanted.length) throw AppError.conflict('job_nothing_to_order', 'This job has no made-to-order lines left to order.')
  const unmapped = wanted.filter((l) => l.itemId === null)
  if (unmapped.length) {
    const lines = unmapped.map((l) => l.description)
    throw AppError.conflict('job_lines_unmapped', `Map ${lines.join(', ')} to a catalog item before ordering.`, { params: { lines } })
  }
  // Lock the chosen lines so two buyers can't order the same base twice.
  const locked = await em.find(BomLine, { where: { id: In(wanted.map((l) => l.id)) }, lock: { mode: 'pessimistic_write' } })
  return locked.filter((l) => l.qty > l.orderedQty)
}

/** A made-to-order line to buy: what, how many, its specification and the bill line it came from. */
export interface SpecialLine {
  itemId: number
  qty: number
  specJson: string | null
  bomLineId: number | null
}

/**
 * One draft PO per vendor for special-order lines: each line its own PO line with its spec. `joinDraft`
 * adds them to the vendor's open draft for the same ship-to and job; otherwise each vendor gets a new PO.
 * Returns the PO ids and, per input line, its PO line id. A bill line's ordered quantity goes up.
 */
export async function orderSpecialLines(
  em: EntityManager,
  actor: AuditActor,
  head: { warehouseId: number; jobId: number | null; notes: string; joinDraft: boolean; source: string },
  lines: readonly SpecialLine[],
  vendorId?: number | null,
): Promise<{ poIds: number[]; poLineIds: number[] }> {
  const itemIds = lines.map((l) => l.itemId)
  const preferred = vendorId ? new Map() : await preferredVendors(em, itemIds)
  const vendorOf = (l: SpecialLine): number | undefined => vendorId ?? preferred.get(l.itemId)?.vendorId
  if (lines.some((l) => !vendorOf(l))) throw AppError.badRequest('vendor_needed', 'Choose a vendor: no vendor lists these items.', { fields: { vendorId: problem('vendor_needed') } })
  const items = await loadItems(em, itemIds)
  const poIds: number[] = []
  const poLineIds: number[] = new Array<number>(lines.length)
  for (const vid of [...new Set(lines.map((l) => vendorOf(l)!))]) {
    const vendor = await em.findOneBy(Vendor, { id: vid })
    if (!vendor) throw AppError.badRequest('vendor_not_found', 'Choose a vendor.', { fields: { vendorId: problem('vendor_not_found') } })
    const mine = lines.map((l, i) => ({ l, i })).filter(({ l }) => vendorOf(l) === vid)
    const priced = await vendorItemsFor(em, vid, mine.map(({ l }) => l.itemId))
    const poLines: NewPoLine[] = mine.map(({ l }) => {
      const vi = priced.get(l.itemId)
      const packQty = vi?.packQty ?? 1
      const item = items.get(l.itemId)!
      return {
        itemId: item.id, vendorSku: vi?.vendorSku ?? null, description: describeSpecial(item, l.specJson), packQty,
        packsOrdered: packsFor(l.qty, packQty), unitCost: vi?.unitCost ?? item.cost, bomLineId: l.bomLineId, specJson: l.specJson,
      }
    })
    const po = { vendorId: vid, warehouseId: head.warehouseId, jobId: head.jobId, expectedDate: addDays(leadDays(vendor, [...priced.values()])), notes: head.notes }
    const made = (head.joinDraft ? await addToOpenDraft(em, actor, po, poLines, head.source) : null) ?? (await insertPo(em, actor, po, poLines, head.source))
    mine.forEach(({ i }, k) => { poLineIds[i] = made.lineIds[k] })
    for (const l of poLines) if (l.bomLineId) await em.increment(BomLine, { id: l.bomLineId }, 'orderedQty', l.packsOrdered * l.packQty)
    poIds.push(made.po.id)
  }
  return { poIds, poLineIds }
}

/** One draft PO per vendor for the job's shower bases (or the chosen lines). */
export async function createFromJob(em: EntityManager, actor: AuditActor, input: PoFromJobInput): Promise<number[]> {
  const job = await em.findOneBy(Job, { id: input.jobId })
  if (!job) throw AppError.badRequest('job_not_found', 'Choose a job.', { fields: { jobId: problem('job_not_found') } })
  // Ship to the job's own warehouse unless the buyer chose another.
  const warehouseId = input.warehouseId ?? (await jobWarehouse(em, job.id))
  if (!warehouseId) {
    throw AppError.badRequest('ship_to_needed', 'Choose the warehouse to ship to: this job has no pick list yet.', { fields: { warehouseId: problem('ship_to_needed') } })
  }
  const lines = await chosenLines(em, job.id, input.bomLineIds)
  const due = job.dueDate ? ` (due ${isoDay(job.dueDate)})` : ''
  const { poIds } = await orderSpecialLines(
    em, actor, { warehouseId, jobId: job.id, notes: `Special order for job ${job.name}${due}`, joinDraft: true, source: 'job' },
    lines.map((l) => ({ itemId: l.itemId!, qty: l.qty - l.orderedQty, specJson: l.specJson, bomLineId: l.id })),
    input.vendorId,
  )
  return poIds
}

/** What the counter sees on a job: its purchase lines with dates against the due date, and what is still to order. */
export async function jobPurchaseLines(ds: DataSource, jobId: number): Promise<JobPurchaseLines> {
  const [job]: { id: number; name: string; due_date: Date | string | null; status: string; customer_name: string | null }[] = await ds.query(
    'SELECT j.id, j.name, j.due_date, j.status, c.name AS customer_name FROM jobs j LEFT JOIN customers c ON c.id = j.customer_id WHERE j.id = ?',
    [jobId],
  )
  if (!job) throw AppError.notFound('job_not_found', 'That job was not found.')
  const dueDate = isoDay(job.due_date)
  const rows: { po_id: number; number: string; status: JobPurchaseLines['lines'][number]['status']; vendor_name: string; expected_date: Date | string | null;
    line_id: number; description: string; spec_json: string | null; qty_ordered: number; qty_received: number }[] = await ds.query(
    `SELECT o.id AS po_id, o.number, o.status, v.name AS vendor_name, o.expected_date, l.id AS line_id, l.description, l.spec_json,
            l.qty_ordered, l.qty_received
       FROM purchase_order_lines l JOIN purchase_orders o ON o.id = l.po_id JOIN vendors v ON v.id = o.vendor_id
      WHERE o.job_id = ? OR l.bom_line_id IN (SELECT bl.id FROM bom_lines bl JOIN boms b ON b.id = bl.bom_id WHERE b.job_id = ?)
      ORDER BY o.id, l.line_no`,
    [jobId, jobId],
  )
  const toOrder = await openSpecialLines(ds, jobId)
  return {
    job: { id: job.id, name: job.name, dueDate, status: job.status, customerName: job.customer_name },
    lines: rows.map((r) => {
      const expected = isoDay(r.expected_date)
      return {
        poId: r.po_id, poNumber: r.number, status: r.status, vendorName: r.vendor_name, expectedDate: expected, poLineId: r.line_id,
        description: r.description, specText: specText(parseSpec(r.spec_json)), qtyOrdered: r.qty_ordered, qtyReceived: r.qty_received,
        late: !!(expected && dueDate && expected > dueDate && r.status !== 'cancelled'),
      }
    }),
    toOrder: toOrder.map((l) => ({
      bomLineId: l.id, itemId: l.itemId, sku: l.sku, description: l.description, specText: specText(parseSpec(l.specJson)), qty: l.qty, orderedQty: l.orderedQty,
    })),
  }
}

/** Jobs with made-to-order lines still to order, soonest due first. */
export async function specialOrderJobs(ds: DataSource): Promise<SpecialOrderJob[]> {
  const rows: { job_id: number; job_name: string; customer_name: string | null; due_date: Date | string | null; n: string; warehouse_id: number | null }[] = await ds.query(
    `SELECT j.id AS job_id, j.name AS job_name, c.name AS customer_name, j.due_date, COUNT(*) AS n,
            (SELECT p.warehouse_id FROM pick_lists p WHERE p.job_id = j.id ORDER BY p.id DESC LIMIT 1) AS warehouse_id
       FROM jobs j LEFT JOIN customers c ON c.id = j.customer_id
       JOIN boms b ON b.job_id = j.id AND b.revision = (SELECT MAX(b2.revision) FROM boms b2 WHERE b2.job_id = j.id)
       JOIN bom_lines l ON l.bom_id = b.id AND l.made_to_order = 1 AND l.qty > l.ordered_qty
      WHERE j.status NOT IN ('complete', 'cancelled')
      GROUP BY j.id, j.name, c.name, j.due_date
      ORDER BY j.due_date IS NULL, j.due_date, j.id`,
  )
  return rows.map((r) => ({
    jobId: r.job_id, jobName: r.job_name, customerName: r.customer_name, dueDate: isoDay(r.due_date), linesToOrder: Number(r.n), warehouseId: r.warehouse_id,
  }))
}
