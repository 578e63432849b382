// Contractor accounts: list and search, create, change, remove (only while no job refers to them).
import type { DataSource } from 'typeorm'
import type { CustomerCreateInput, CustomerSummary, CustomerUpdateInput } from '../../../shared/schemas/counter.js'
import { Customer, Job } from '../../entities/Customer.js'
import { containsPattern } from '../../db/likePattern.js'
import { inTransaction, isDuplicateKey } from '../../db/transaction.js'
import { AppError, problem } from '../../errors.js'
import { audit, type AuditActor } from '../auditService.js'
import { lockAtVersion } from '../editVersion.js'

export function toCustomerSummary(c: Customer, openJobs = 0): CustomerSummary {
  return {
    id: c.id,
    code: c.code,
    name: c.name,
    contactName: c.contactName,
    email: c.email,
    phone: c.phone,
    address: c.address,
    notes: c.notes,
    active: c.active,
    openJobs,
    createdAt: c.createdAt.toISOString(),
    version: c.version,
  }
}

/** LIKE wildcards in the user's text match themselves, not anything. */

async function openJobCounts(ds: DataSource, ids: number[]): Promise<Map<number, number>> {
  if (ids.length === 0) return new Map()
  const rows: { customerId: number; n: string }[] = await ds
    .getRepository(Job)
    .createQueryBuilder('j')
    .select('j.customer_id', 'customerId')
    .addSelect('COUNT(*)', 'n')
    .where('j.customer_id IN (:...ids)', { ids })
    .andWhere("j.status NOT IN ('complete', 'cancelled')")
    .groupBy('j.customer_id')
    .getRawMany()
  return new Map(rows.map((r) => [Number(r.customerId), Number(r.n)]))
}

export async function listCustomers(ds: DataSource, query: { q?: string; active: 'true' | 'false' | 'all' }): Promise<CustomerSummary[]> {
  const qb = ds.getRepository(Customer).createQueryBuilder('c').orderBy('c.name', 'ASC').limit(200)
  if (query.active !== 'all') qb.andWhere('c.active = :active', { active: query.active === 'true' })
  if (query.q) {
    qb.andWhere('(c.code LIKE :q OR c.name LIKE :q OR c.contact_name LIKE :q OR c.email LIKE :q OR c.phone LIKE :q)', { q: containsPattern(query.q) })
  }
  const customers = await qb.getMany()
  const counts = await openJobCounts(ds, customers.map((c) => c.id))
  return customers.map((c) => toCustomerSummary(c, counts.get(c.id) ?? 0))
}

export async function getCustomer(ds: DataSource, id: number): Promise<CustomerSummary> {
  const c = await ds.getRepository(Customer).findOneBy({ id })
  if (!c) throw AppError.notFound('customer_not_found', 'That customer was not found.')
  const counts = await openJobCounts(ds, [id])
  return toCustomerSummary(c, counts.get(id) ?? 0)
}

const duplicateCode = () => AppError.conflict('customer_code_taken', 'Another account already uses that code.', { fields: { code: problem('customer_code_taken') } })

export async function createCustomer(ds: DataSource, actor: AuditActor, input: CustomerCreateInput): Promise<CustomerSummary> {
  try {
    return await inTransaction(ds, async (em) => {
      const c = em.create(Customer, { ...input, active: true })
      await em.save(c)
      await audit(em, actor, 'customer.create', 'customer', c.id, { code: c.code, name: c.name })
      return toCustomerSummary(c)
    })
  } catch (err) {
    if (isDuplicateKey(err)) throw duplicateCode()
    throw err
  }
}

export async function updateCustomer(ds: DataSource, actor: AuditActor, id: number, input: CustomerUpdateInput): Promise<CustomerSummary> {
  try {
    await inTransaction(ds, async (em) => {
      const { version, ...changes } = input
      const c = await lockAtVersion(em, Customer, id, version, {
        notFound: () => AppError.notFound('customer_not_found', 'That customer was not found.'),
        name: (row) => row.name,
      })
      Object.assign(c, Object.fromEntries(Object.entries(changes).filter(([, v]) => v !== undefined)))
      await em.save(c)
      await audit(em, actor, 'customer.update', 'customer', id, changes)
    })
  } catch (err) {
    if (isDuplicateKey(err)) throw duplicateCode()
    throw err
  }
  return getCustomer(ds, id)
}

/** Accounts with jobs keep their history: deactivate them instead. */
export async function deleteCustomer(ds: DataSource, actor: AuditActor, id: number): Promise<{ ok: true }> {
  return inTransaction(ds, async (em) => {
    const c = await em.findOne(Customer, { where: { id }, lock: { mode: 'pessimistic_write' } })
    if (!c) throw AppError.notFound('customer_not_found', 'That customer was not found.')
    if ((await em.countBy(Job, { customerId: id })) > 0) {
      throw AppError.conflict('has_jobs', 'This account has jobs; deactivate it instead of removing it.')
    }
    await em.delete(Customer, { id })
    await audit(em, actor, 'customer.delete', 'customer', id, { code: c.code })
    return { ok: true as const }
  })
}
