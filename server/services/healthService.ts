import type { DataSource } from 'typeorm'
import { AppError } from '../errors.js'

/** Whether the database answers; 503 db_unavailable when it does not. */
export async function databaseHealth(ds: DataSource): Promise<{ status: 'ok'; database: 'ok'; time: string }> {
  try {
    await ds.query('SELECT 1')
  } catch {
    throw new AppError(503, 'db_unavailable', 'The database is not answering.')
  }
  return { status: 'ok', database: 'ok', time: new Date().toISOString() }
}
