// A hot read as a prepared statement: each pooled connection prepares the statement once and then only executes
// it, so MariaDB skips parsing it from its text on every call (measured on the signed-in scan lookup: about a
// quarter less CPU in MariaDB per statement). For the few reads a scanner makes many times a second; everything
// else goes through TypeORM as usual. Parameters are scalars: an `IN` list needs one placeholder per value, since
// a prepared statement cannot expand an array.
//
// The statements run on a small mysql2 pool of their own, opened from the DataSource's public options with the
// settings TypeORM gives its own pool (charset, time zone, number handling and the `extra` options), rather than
// on TypeORM's pool, which it does not expose. The pool opens on the first such read and is closed with the app
// (`closePreparedReads`, called by BuiltApp.close); after that the DataSource's reads go through TypeORM again.
import mysql, { type Pool, type PoolOptions } from 'mysql2'
import type { DataSource } from 'typeorm'

/** At most this many connections for prepared reads per DataSource (its own pool keeps the rest). */
const MAX_CONNECTIONS = 8

const pools = new WeakMap<DataSource, Pool>()
const closed = new WeakSet<DataSource>()

/** The mysql2 pool options for a DataSource's prepared reads, or null when it is not one plain MySQL/MariaDB server. */
export function preparedPoolOptions(ds: DataSource): PoolOptions | null {
  const o = ds.options
  if ((o.type !== 'mysql' && o.type !== 'mariadb') || o.replication || o.url) return null
  return {
    host: o.host,
    port: o.port,
    user: o.username,
    password: o.password,
    database: o.database,
    socketPath: o.socketPath,
    charset: o.charset,
    timezone: o.timezone,
    connectTimeout: o.connectTimeout,
    supportBigNumbers: o.supportBigNumbers ?? true,
    bigNumberStrings: o.bigNumberStrings ?? true,
    dateStrings: o.dateStrings as PoolOptions['dateStrings'],
    ssl: o.ssl as PoolOptions['ssl'],
    connectionLimit: Math.min(o.poolSize ?? MAX_CONNECTIONS, MAX_CONNECTIONS),
    ...(o.extra as PoolOptions | undefined),
  }
}

function poolFor(ds: DataSource): Pool | null {
  const open = pools.get(ds)
  if (open) return open
  if (closed.has(ds) || !ds.isInitialized) return null
  const options = preparedPoolOptions(ds)
  if (!options) return null
  const pool = mysql.createPool(options)
  pools.set(ds, pool)
  return pool
}

export function executeRows<T>(ds: DataSource, sql: string, params: unknown[]): Promise<T[]> {
  const pool = poolFor(ds)
  if (!pool) return ds.query(sql, params) // replication, another driver, or the app closed: the ordinary path
  return new Promise((resolve, reject) =>
    pool.execute(sql, params as never, (err, rows) => (err ? reject(err) : resolve(rows as unknown as T[]))),
  )
}

/** Ends the DataSource's prepared-read pool (its connections close once their statements have answered). */
export async function closePreparedReads(ds: DataSource): Promise<void> {
  closed.add(ds)
  const pool = pools.get(ds)
  if (!pool) return
  pools.delete(ds)
  await new Promise<void>((resolve) => pool.end(() => resolve()))
}

/** Whether the DataSource's prepared reads have a pool open now (for tests of the app's shutdown). */
export function preparedReadsOpen(ds: DataSource): boolean {
  return pools.has(ds)
}
