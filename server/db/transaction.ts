import type { DataSource, EntityManager } from 'typeorm'

const RETRYABLE = new Set([1213, 1205, 1020]) // deadlock, lock wait timeout, record changed (MariaDB 11.6+)

function errnoOf(err: unknown): number | undefined {
  const e = err as { errno?: number; driverError?: { errno?: number } }
  return e?.errno ?? e?.driverError?.errno
}

/** How many transactions were run again after a deadlock or lock wait (the load tests print it). */
export const transactionRetries = { count: 0 }

/** Runs work in one transaction and retries the whole of it on a deadlock. */
export async function inTransaction<T>(
  ds: DataSource,
  work: (em: EntityManager) => Promise<T>,
  attempts = 5,
): Promise<T> {
  for (let attempt = 1; ; attempt++) {
    try {
      return await ds.transaction(work)
    } catch (err) {
      const errno = errnoOf(err)
      if (attempt >= attempts || errno === undefined || !RETRYABLE.has(errno)) throw err
      transactionRetries.count++
      await new Promise((r) => setTimeout(r, 5 + Math.random() * 20 * attempt))
    }
  }
}

/**
 * A value too large for its column (MariaDB 1264 out of range, 1690 numeric overflow): the request asked for more than the record can hold, not a server fault.
 */
export function isOutOfRange(err: unknown): boolean {
  const errno = errnoOf(err)
  return errno === 1264 || errno === 1690
}

/** A row other rows still point at (MariaDB 1451): it has history and cannot be deleted. */
export function isReferenced(err: unknown): boolean {
  return errnoOf(err) === 1451
}

export function isDuplicateKey(err: unknown): boolean {
  return errnoOf(err) === 1062
}
