// Saving a job's bill of materials: the server computes it again from the takeoff (never trusting the
// client's lines) and writes a new revision, its lines with their explanations, the snapshot and the
// audit entry in one transaction. Pick lists and purchase lines read bom_lines from here on.
import type { DataSource, EntityManager } from 'typeorm'
import { saveBlockers, type CounterBill, type CounterBillLine } from '../../../shared/counter/counterBill.js'
import type { BomLineRecord, BomRecord, BomSaveInput, StoredExplanation } from '../../../shared/schemas/counter.js'
import { takeoffSchema, type LengthUnitName } from '../../../shared/schemas/takeoff.js'
import { baseSpec } from '../../../shared/takeoff/showerBaseLine.js'
import { Bom, BomLine } from '../../entities/Bom.js'
import { Job, Takeoff } from '../../entities/Customer.js'
import { BomSnapshot } from '../../entities/TakeoffSettings.js'
import { User } from '../../entities/User.js'
import { inTransaction } from '../../db/transaction.js'
import { AppError, problem } from '../../errors.js'
import { audit, type AuditActor } from '../auditService.js'
import { salesOrderOfBill } from '../picking/pickPlanContext.js'
import { availabilityFor } from './availability.js'
import { computeOffThread } from './computeRunner.js'
import { loadCounterCatalog } from './counterCatalog.js'
import { getJobSummary } from './jobService.js'
import { replaceTakeoffInput } from './takeoffService.js'

function storedExplanation(line: CounterBillLine): StoredExplanation {
  return {
    ...line.explanation,
    needed: line.needed,
    walls: line.walls,
    ...(line.packs !== undefined ? { packs: line.packs } : {}),
    ...(line.packSize !== undefined ? { packSize: line.packSize } : {}),
  }
}

function lineRows(bill: CounterBill, bomId: number): Partial<BomLine>[] {
  return bill.lines.map((line, i) => ({
    bomId,
    lineNo: i + 1,
    itemId: line.itemId,
    role: line.role,
    sku: line.sku,
    description: line.name.slice(0, 200),
    qty: line.quantity,
    unit: line.unit.slice(0, 10),
    madeToOrder: line.madeToOrder,
    specJson: line.role === 'showerBase' && bill.showerBase ? JSON.stringify(baseSpec(bill.showerBase, bill.unit)) : null,
    explanationJson: JSON.stringify(storedExplanation(line)),
  }))
}

async function lockedJob(em: EntityManager, jobId: number): Promise<Job> {
  // The job row lock serialises saves, so two counters saving at once get revisions n and n + 1.
  const job = await em.findOne(Job, { where: { id: jobId }, lock: { mode: 'pessimistic_write' } })
  if (!job) throw AppError.notFound('job_not_found', 'That job was not found.')
  if (job.status === 'cancelled' || job.status === 'complete') {
    throw AppError.conflict('job_closed', `The job is ${job.status}; reopen it before saving a bill.`)
  }
  return job
}

async function takeoffOfJob(em: EntityManager, actor: AuditActor, jobId: number, input: BomSaveInput): Promise<Takeoff> {
  const takeoff = await em.findOneBy(Takeoff, { id: input.takeoffId })
  if (!takeoff || takeoff.jobId !== jobId) throw AppError.badRequest('takeoff_not_in_job', 'Choose a takeoff of this job.', { fields: { takeoffId: problem('takeoff_not_in_job') } })
  return input.input ? replaceTakeoffInput(em, actor, takeoff.id, input.version, input.input) : takeoff
}

/** Writes the next revision inside the caller's transaction, in the takeoff's own unit (else `unit`); returns the new bom's id. */
export async function writeBomRevision(em: EntityManager, actor: AuditActor, jobId: number, input: BomSaveInput, unit: LengthUnitName): Promise<number> {
  await lockedJob(em, jobId)
  const takeoff = await takeoffOfJob(em, actor, jobId, input)
  const takeoffInput = takeoffSchema.parse(JSON.parse(takeoff.inputJson))
  const bill = await computeOffThread(takeoffInput, await loadCounterCatalog(em), unit, 'full')
  const blockers = saveBlockers(bill)
  if (blockers.length > 0) throw AppError.unprocessable('bill_not_ready', `The bill cannot be saved yet: ${blockers.join(' ')}`)
  if (bill.lines.length === 0) throw AppError.unprocessable('bill_empty', 'The takeoff gives no lines: add a wall or an item first.')
  const last: { revision: number | null } | undefined = await em
    .createQueryBuilder(Bom, 'b')
    .select('MAX(b.revision)', 'revision')
    .where('b.job_id = :jobId', { jobId })
    .getRawOne()
  const revision = Number(last?.revision ?? 0) + 1
  const bom = em.create(Bom, {
    jobId,
    takeoffId: takeoff.id,
    revision,
    status: 'saved',
    cautionsJson: JSON.stringify(bill.cautions),
    totalsJson: JSON.stringify(bill.totals),
    createdBy: actor.userId,
  })
  await em.save(bom)
  await em.insert(BomLine, lineRows(bill, bom.id))
  await em.insert(BomSnapshot, { bomId: bom.id, unit: bill.unit, inputJson: JSON.stringify(bill.bound), wallsJson: JSON.stringify(bill.walls) })
  await audit(em, actor, 'bom.save', 'bom', bom.id, { jobId, revision, takeoffId: takeoff.id, lines: bill.lines.length })
  return bom.id
}

export async function saveBom(ds: DataSource, actor: AuditActor, jobId: number, input: BomSaveInput, unit: LengthUnitName): Promise<BomRecord> {
  const bomId = await inTransaction(ds, (em) => writeBomRevision(em, actor, jobId, input, unit))
  return getBom(ds, bomId)
}

function toLineRecord(l: BomLine): BomLineRecord {
  return {
    id: l.id,
    lineNo: l.lineNo,
    itemId: l.itemId,
    role: l.role,
    sku: l.sku,
    description: l.description,
    qty: l.qty,
    unit: l.unit,
    madeToOrder: l.madeToOrder,
    spec: l.specJson ? JSON.parse(l.specJson) : null,
    explanation: l.explanationJson ? (JSON.parse(l.explanationJson) as StoredExplanation) : null,
    pickedQty: l.pickedQty,
    orderedQty: l.orderedQty,
  }
}

export async function getBom(ds: DataSource, id: number): Promise<BomRecord> {
  const bom = await ds.getRepository(Bom).findOneBy({ id })
  if (!bom) throw AppError.notFound('bom_not_found', 'That bill of materials was not found.')
  const [lines, snapshot, takeoff, job, author] = await Promise.all([
    ds.getRepository(BomLine).find({ where: { bomId: id }, order: { lineNo: 'ASC' } }),
    ds.getRepository(BomSnapshot).findOneBy({ bomId: id }),
    bom.takeoffId ? ds.getRepository(Takeoff).findOneBy({ id: bom.takeoffId }) : Promise.resolve(null),
    getJobSummary(ds, bom.jobId),
    bom.createdBy ? ds.getRepository(User).findOneBy({ id: bom.createdBy }) : Promise.resolve(null),
  ])
  const stocked = lines.filter((l) => l.itemId !== null && !l.madeToOrder).map((l) => l.itemId as number)
  const availability = await availabilityFor(ds.manager, stocked)
  // A bill whose quote became a sales order is picked through that order, never on a list of its own.
  const salesOrder = await salesOrderOfBill(ds.manager, id)
  return {
    id: bom.id,
    jobId: bom.jobId,
    revision: bom.revision,
    takeoffId: bom.takeoffId,
    takeoffName: takeoff?.name ?? null,
    createdAt: bom.createdAt.toISOString(),
    createdBy: author?.displayName ?? null,
    job,
    unit: snapshot?.unit ?? 'in',
    lines: lines.map(toLineRecord),
    cautions: bom.cautionsJson ? JSON.parse(bom.cautionsJson) : [],
    totals: bom.totalsJson ? JSON.parse(bom.totalsJson) : null,
    walls: snapshot ? JSON.parse(snapshot.wallsJson) : [],
    availability: [...availability.values()],
    salesOrder,
  }
}
