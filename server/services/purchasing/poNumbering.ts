// PO numbers without gaps: one counter row per year, bumped inside the PO's own transaction. The
// bump holds the row lock until commit, so concurrent creations queue, and a rolled-back creation
// gives its number back.
import type { EntityManager } from 'typeorm'
import { formatPoNumber } from '../../../shared/purchasing/poMoney.js'

export async function nextPoNumber(em: EntityManager, now = new Date()): Promise<string> {
  const year = now.getFullYear()
  await em.query(
    `INSERT INTO po_number_counters (po_year, last_number) VALUES (?, LAST_INSERT_ID(1))
     ON DUPLICATE KEY UPDATE last_number = LAST_INSERT_ID(last_number + 1)`,
    [year],
  )
  const [row]: { n: string | number }[] = await em.query('SELECT LAST_INSERT_ID() AS n')
  return formatPoNumber(year, Number(row.n))
}
