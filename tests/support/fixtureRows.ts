// Rows written straight into the tables by test fixtures: a fresh tag so test files and reruns never
// collide, the id of an INSERT, and a row count for "nothing was written" checks.
import { randomBytes } from 'node:crypto'
import type { DataSource } from 'typeorm'

export const tagOf = () => randomBytes(3).toString('hex').toUpperCase()

export async function insertId(ds: DataSource, sql: string, params: unknown[]): Promise<number> {
  const res = (await ds.query(sql, params)) as { insertId: number | string }
  return Number(res.insertId)
}

export async function countRows(ds: DataSource, table: string, where = '1=1', params: unknown[] = []): Promise<number> {
  const [row] = (await ds.query(`SELECT COUNT(*) AS n FROM ${table} WHERE ${where}`, params)) as { n: string }[]
  return Number(row.n)
}
