// Saved takeoffs of a job: the contractor's walls as entered (the shared takeoff schema's JSON).
import type { DataSource, EntityManager } from 'typeorm'
import type { TakeoffRecord, TakeoffSaveInput, TakeoffUpdateInput } from '../../../shared/schemas/counter.js'
import { takeoffSchema, type Takeoff as TakeoffInput } from '../../../shared/schemas/takeoff.js'
import { Bom } from '../../entities/Bom.js'
import { Job, Takeoff } from '../../entities/Customer.js'
import { inTransaction } from '../../db/transaction.js'
import { AppError } from '../../errors.js'
import { audit, type AuditActor } from '../auditService.js'
import { lockAtVersion } from '../editVersion.js'

export function toTakeoffRecord(t: Takeoff): TakeoffRecord {
  // Parsed again on the way out so an old row that no longer fits the schema fails loudly, not in the form.
  const input = takeoffSchema.parse(JSON.parse(t.inputJson))
  return { id: t.id, jobId: t.jobId, name: t.name, walls: input.walls.length, updatedAt: t.updatedAt.toISOString(), version: t.version, input }
}

export async function getTakeoff(ds: DataSource, id: number): Promise<TakeoffRecord> {
  const t = await ds.getRepository(Takeoff).findOneBy({ id })
  if (!t) throw AppError.notFound('takeoff_not_found', 'That takeoff was not found.')
  return toTakeoffRecord(t)
}

async function openJob(em: EntityManager, jobId: number): Promise<Job> {
  const job = await em.findOneBy(Job, { id: jobId })
  if (!job) throw AppError.notFound('job_not_found', 'That job was not found.')
  if (job.status === 'cancelled' || job.status === 'complete') {
    throw AppError.conflict('job_closed', `The job is ${job.status}; reopen it before changing its takeoffs.`)
  }
  return job
}

/** Inside the caller's transaction (the spreadsheet import creates takeoffs too). */
export async function insertTakeoff(em: EntityManager, actor: AuditActor, jobId: number, name: string, input: TakeoffInput, action: 'takeoff.create' | 'takeoff.import' = 'takeoff.create'): Promise<Takeoff> {
  await openJob(em, jobId)
  const t = em.create(Takeoff, { jobId, name, inputJson: JSON.stringify(input), createdBy: actor.userId })
  await em.save(t)
  await audit(em, actor, action, 'takeoff', t.id, { jobId, name, walls: input.walls.length })
  return t
}

export async function createTakeoff(ds: DataSource, actor: AuditActor, jobId: number, input: TakeoffSaveInput): Promise<TakeoffRecord> {
  const t = await inTransaction(ds, (em) => insertTakeoff(em, actor, jobId, input.name, input.input))
  return getTakeoff(ds, t.id)
}

/**
 * Replaces a takeoff's input inside the caller's transaction, as the editor loaded it (`seenVersion`: a save made
 * meanwhile is refused, not overwritten); the row stays locked until it commits.
 */
export async function replaceTakeoffInput(em: EntityManager, actor: AuditActor, id: number, seenVersion: number | undefined, input: TakeoffInput, name?: string): Promise<Takeoff> {
  const t = await lockAtVersion(em, Takeoff, id, seenVersion, {
    notFound: () => AppError.notFound('takeoff_not_found', 'That takeoff was not found.'),
    name: (row) => row.name,
  })
  await openJob(em, t.jobId)
  t.inputJson = JSON.stringify(input)
  if (name) t.name = name
  await em.save(t)
  await audit(em, actor, 'takeoff.update', 'takeoff', id, { name: t.name, walls: input.walls.length })
  return t
}

export async function updateTakeoff(ds: DataSource, actor: AuditActor, id: number, input: TakeoffUpdateInput): Promise<TakeoffRecord> {
  await inTransaction(ds, (em) => replaceTakeoffInput(em, actor, id, input.version, input.input, input.name))
  return getTakeoff(ds, id)
}

/** A takeoff a saved bill came from stays, so the bill can always show what it was computed from. */
export async function deleteTakeoff(ds: DataSource, actor: AuditActor, id: number): Promise<{ ok: true }> {
  return inTransaction(ds, async (em) => {
    const t = await em.findOne(Takeoff, { where: { id }, lock: { mode: 'pessimistic_write' } })
    if (!t) throw AppError.notFound('takeoff_not_found', 'That takeoff was not found.')
    if ((await em.countBy(Bom, { takeoffId: id })) > 0) {
      throw AppError.conflict('has_bom', 'A saved bill of materials was computed from this takeoff; it is kept with the bill.')
    }
    await em.delete(Takeoff, { id })
    await audit(em, actor, 'takeoff.delete', 'takeoff', id, { jobId: t.jobId, name: t.name })
    return { ok: true as const }
  })
}
