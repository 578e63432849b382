// Jobs of a contractor account: list (recent first), create, change status and due date, and the
// job's page: its takeoffs and saved bills of materials.
import type { DataSource } from 'typeorm'
import type {
  BomSummary,
  JobCreateInput,
  JobDetail,
  JobStatusName,
  JobSummary,
  JobUpdateInput,
  TakeoffSummary,
} from '../../../shared/schemas/counter.js'
import { Customer, Job } from '../../entities/Customer.js'
import { inTransaction } from '../../db/transaction.js'
import { AppError, problem } from '../../errors.js'
import { audit, type AuditActor } from '../auditService.js'
import { lockAtVersion } from '../editVersion.js'
import { containsPattern } from '../../db/likePattern.js'
import { SqlWhere } from '../../db/sqlWhere.js'
import { getCustomer } from './customerService.js'

interface JobRow {
  id: number
  customerId: number
  customerCode: string
  customerName: string
  name: string
  siteAddress: string | null
  status: JobStatusName
  dueDate: string | Date | null
  notes: string | null
  updatedAt: Date | string
  latestRevision: number | string | null
  takeoffs: number | string
  version: number | string
}

const isoDate = (d: string | Date | null): string | null =>
  d === null ? null : typeof d === 'string' ? d.slice(0, 10) : d.toISOString().slice(0, 10)

function toJobSummary(r: JobRow): JobSummary {
  return {
    id: Number(r.id),
    customerId: Number(r.customerId),
    customerCode: r.customerCode,
    customerName: r.customerName,
    name: r.name,
    siteAddress: r.siteAddress,
    status: r.status,
    dueDate: isoDate(r.dueDate),
    notes: r.notes,
    latestRevision: r.latestRevision === null ? null : Number(r.latestRevision),
    takeoffs: Number(r.takeoffs),
    updatedAt: new Date(r.updatedAt).toISOString(),
    version: Number(r.version),
  }
}

// DATE columns are read as text so a due date never shifts with the server's time zone.
const JOB_SELECT = `SELECT j.id, j.customer_id AS customerId, c.code AS customerCode, c.name AS customerName, j.name,
  j.site_address AS siteAddress, j.status, DATE_FORMAT(j.due_date, '%Y-%m-%d') AS dueDate, j.notes, j.updated_at AS updatedAt, j.version,
  (SELECT MAX(b.revision) FROM boms b WHERE b.job_id = j.id) AS latestRevision,
  (SELECT COUNT(*) FROM takeoffs t WHERE t.job_id = j.id) AS takeoffs
  FROM jobs j JOIN customers c ON c.id = j.customer_id`

/**
 * A job whose special order is due: still going (not complete or cancelled), due on or before the day given
 * (one `?`), and its latest bill has a made-to-order line not yet all received on a live purchase order.
 * The Counter's start-page figure counts with this, and the jobs list filters with it.
 */
export const SPECIAL_ORDER_DUE_SQL = `j.status NOT IN ('complete', 'cancelled') AND j.due_date <= ? AND EXISTS (
  SELECT 1 FROM boms b JOIN bom_lines bl ON bl.bom_id = b.id AND bl.made_to_order = 1
   WHERE b.job_id = j.id AND b.revision = (SELECT MAX(b2.revision) FROM boms b2 WHERE b2.job_id = j.id)
     AND bl.qty > (SELECT COALESCE(SUM(pol.qty_received), 0) FROM purchase_order_lines pol
                     JOIN purchase_orders po ON po.id = pol.po_id AND po.status <> 'cancelled' WHERE pol.bom_line_id = bl.id))`

export async function listJobs(
  ds: DataSource,
  query: { customerId?: number; status?: JobStatusName; q?: string; specialDueBy?: string; limit: number },
): Promise<JobSummary[]> {
  const where = new SqlWhere()
  if (query.customerId) where.add('j.customer_id = ?', [query.customerId])
  if (query.status) where.add('j.status = ?', [query.status])
  if (query.q) where.add('(j.name LIKE ? OR c.name LIKE ? OR c.code LIKE ? OR j.site_address LIKE ?)', Array(4).fill(containsPattern(query.q)))
  if (query.specialDueBy) where.add(SPECIAL_ORDER_DUE_SQL, [query.specialDueBy])
  const sql = `${JOB_SELECT} ${where.sql()} ORDER BY j.updated_at DESC, j.id DESC LIMIT ${query.limit}`
  const rows: JobRow[] = await ds.query(sql, where.params)
  return rows.map(toJobSummary)
}

export async function getJobSummary(ds: DataSource, id: number): Promise<JobSummary> {
  const rows: JobRow[] = await ds.query(`${JOB_SELECT} WHERE j.id = ?`, [id])
  if (rows.length === 0) throw AppError.notFound('job_not_found', 'That job was not found.')
  return toJobSummary(rows[0])
}

async function takeoffList(ds: DataSource, jobId: number): Promise<TakeoffSummary[]> {
  const rows: { id: number; name: string; inputJson: string; updatedAt: Date }[] = await ds.query(
    'SELECT id, name, input_json AS inputJson, updated_at AS updatedAt FROM takeoffs WHERE job_id = ? ORDER BY updated_at DESC, id DESC',
    [jobId],
  )
  return rows.map((r) => ({
    id: r.id,
    jobId,
    name: r.name,
    walls: (JSON.parse(r.inputJson) as { walls?: unknown[] }).walls?.length ?? 0,
    updatedAt: new Date(r.updatedAt).toISOString(),
  }))
}

async function bomList(ds: DataSource, jobId: number): Promise<BomSummary[]> {
  const rows: { id: number; revision: number; takeoffId: number | null; lineCount: string; createdAt: Date; createdBy: string | null }[] = await ds.query(
    `SELECT b.id, b.revision, b.takeoff_id AS takeoffId, b.created_at AS createdAt, u.display_name AS createdBy,
       (SELECT COUNT(*) FROM bom_lines l WHERE l.bom_id = b.id) AS lineCount
     FROM boms b LEFT JOIN users u ON u.id = b.created_by WHERE b.job_id = ? ORDER BY b.revision DESC`,
    [jobId],
  )
  return rows.map(({ lineCount, ...r }) => ({ ...r, lines: Number(lineCount), createdAt: new Date(r.createdAt).toISOString() }))
}

export async function getJob(ds: DataSource, id: number): Promise<JobDetail> {
  const summary = await getJobSummary(ds, id)
  const [customer, takeoffs, boms] = await Promise.all([getCustomer(ds, summary.customerId), takeoffList(ds, id), bomList(ds, id)])
  return { ...summary, customer, takeoffList: takeoffs, boms }
}

export async function createJob(ds: DataSource, actor: AuditActor, input: JobCreateInput): Promise<JobSummary> {
  const id = await inTransaction(ds, async (em) => {
    const customer = await em.findOneBy(Customer, { id: input.customerId })
    if (!customer) throw AppError.badRequest('customer_not_found', 'Choose an existing customer.', { fields: { customerId: problem('customer_not_found') } })
    if (!customer.active) throw AppError.badRequest('customer_inactive', 'That account is deactivated.', { fields: { customerId: problem('customer_inactive') } })
    const job = em.create(Job, { ...input, createdBy: actor.userId })
    await em.save(job)
    await audit(em, actor, 'job.create', 'job', job.id, { customerId: input.customerId, name: input.name })
    return job.id
  })
  return getJobSummary(ds, id)
}

export async function updateJob(ds: DataSource, actor: AuditActor, id: number, input: JobUpdateInput): Promise<JobSummary> {
  await inTransaction(ds, async (em) => {
    const { version, ...changes } = input
    const job = await lockAtVersion(em, Job, id, version, {
      notFound: () => AppError.notFound('job_not_found', 'That job was not found.'),
      name: (row) => row.name,
    })
    Object.assign(job, Object.fromEntries(Object.entries(changes).filter(([, v]) => v !== undefined)))
    await em.save(job)
    await audit(em, actor, 'job.update', 'job', id, changes)
  })
  return getJobSummary(ds, id)
}
