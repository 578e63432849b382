// A statement sent straight on the transaction's own connection. Inside a transaction, `em.query` goes through
// TypeORM's query runner, which per statement asks the pool for the connection again, wraps it in a fresh
// promise object, tells its subscribers before and after, and copies the rows into a result it then drops: on
// a stock issue, about a tenth of the server's CPU besides the statements themselves (npm run bench --
// --only=issue --cpu-prof). Here the runner's connection is taken once through its public `connect()` and the
// statement goes to mysql2 as TypeORM would send it (the same text, the same parameter escaping, the same
// connection settings), so the answer is the one `em.query` gives: rows for a read, the result header for a
// write. Outside a transaction, or on another driver, it is `em.query` itself.
// Text protocol only: nothing is prepared, so a statement of any size (a big import's multi-row insert) works
// as it did, with no prepared-statement parameter cap and no statement cache growing on the connection.
import type { EntityManager, QueryRunner } from 'typeorm'

interface CallbackConnection {
  query(sql: string, values: unknown[], callback: (err: Error | null, result: unknown) => void): unknown
}

const connections = new WeakMap<QueryRunner, CallbackConnection>()

function isMysql(em: EntityManager): boolean {
  const type = em.connection.options.type
  return type === 'mysql' || type === 'mariadb'
}

/** The statement on the transaction's connection (em.query's answer); `em.query` outside a transaction. */
export async function sqlOn<T = unknown>(em: EntityManager, sql: string, params: readonly unknown[] = []): Promise<T> {
  const runner = em.queryRunner
  if (!runner || runner.isReleased || !runner.isTransactionActive || !isMysql(em)) return em.query(sql, params as unknown[])
  let conn = connections.get(runner)
  if (!conn) connections.set(runner, (conn = (await runner.connect()) as CallbackConnection))
  const c = conn
  return new Promise<T>((resolve, reject) => {
    c.query(sql, params as unknown[], (err, result) => (err ? reject(err) : resolve(result as T)))
  })
}
