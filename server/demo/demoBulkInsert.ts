// Multi-row INSERTs in chunks: the demo history writes tens of thousands of ledger rows in seconds.
import type { EntityManager } from 'typeorm'

export async function bulkInsert(
  em: EntityManager,
  table: string,
  columns: readonly string[],
  rows: readonly (readonly unknown[])[],
  chunkSize = 1000,
): Promise<void> {
  const tuple = `(${columns.map(() => '?').join(', ')})`
  for (let start = 0; start < rows.length; start += chunkSize) {
    const chunk = rows.slice(start, start + chunkSize)
    await em.query(
      `INSERT INTO ${table} (${columns.join(', ')}) VALUES ${chunk.map(() => tuple).join(', ')}`,
      chunk.flat(),
    )
  }
}
