// One guard for every edit screen's save: the row is locked, the version the screen loaded is compared with the
// row's, and a stale save is refused before anything is written. Each write moves the row to its next version.
import type { EntityManager, EntityTarget, FindOptionsWhere } from 'typeorm'
import type { QueryDeepPartialEntity } from 'typeorm/query-builder/QueryPartialEntity.js'
import { AppError } from '../errors.js'

interface Versioned {
  id: number
  version: number
}

interface LockOptions<T> {
  /** The record's own not-found error. */
  notFound: () => AppError
  /** How the person knows the record (a number, a name, a SKU): the refusal names it. */
  name: (row: T) => string
}

/**
 * Locks the row for a change and moves it to its next version. With `seenVersion` (what the screen loaded), a
 * change saved meanwhile is refused with 409 changed_meanwhile, never overwritten. The returned row carries the
 * new version, so a later `em.save(row)` keeps it.
 */
export async function lockAtVersion<T extends Versioned>(em: EntityManager, target: EntityTarget<T>, id: number, seenVersion: number | undefined, options: LockOptions<T>): Promise<T> {
  const where = { id } as FindOptionsWhere<T>
  const row = await em.findOne(target, { where, lock: { mode: 'pessimistic_write' } })
  if (!row) throw options.notFound()
  if (seenVersion !== undefined && seenVersion !== row.version) {
    const name = options.name(row)
    throw AppError.conflict('changed_meanwhile', `${name} was changed meanwhile (by another tab or person); nothing was saved. Reload it to see the changes, then try again.`, { params: { name } })
  }
  row.version += 1
  await em.update(target, where, { version: row.version } as unknown as QueryDeepPartialEntity<T>)
  return row
}
