// Telling a database outage from a bug: connection-level failures of mysql2 (the server is down,
// restarting, unreachable, or dropped the connection) answer 503 with the code db_unavailable, so the
// client shows its outage banner and reads again by itself. The pools reconnect on their own: a broken
// connection is discarded and the next request opens a new one.
import type { DataSource } from 'typeorm'
import type { Logger } from 'pino'

const CONNECTION_CODES = new Set([
  'ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', 'EPIPE', 'EHOSTUNREACH', 'ENETUNREACH', 'ENOTFOUND', 'EAI_AGAIN',
  'PROTOCOL_CONNECTION_LOST', 'PROTOCOL_SEQUENCE_TIMEOUT', 'PROTOCOL_ENQUEUE_AFTER_FATAL_ERROR', 'PROTOCOL_ENQUEUE_AFTER_QUIT',
  'ER_SERVER_SHUTDOWN', 'ER_NORMAL_SHUTDOWN', 'ER_CON_COUNT_ERROR', 'ER_CONNECTION_KILLED', 'ER_QUERY_INTERRUPTED',
])
// source: MariaDB error codes (mariadb.com/kb, "MariaDB Error Codes"): 1040 too many connections,
// 1053 server shutdown in progress, 1077 normal shutdown, 1317 query interrupted, 1927 connection killed;
// client errors 2002/2003 can't connect, 2006 server has gone away, 2013 lost connection during query.
const CONNECTION_ERRNOS = new Set([1040, 1053, 1077, 1317, 1927, 2002, 2003, 2006, 2013])

interface DriverError { code?: unknown; errno?: unknown; fatal?: unknown; message?: unknown; driverError?: DriverError }

export function isDatabaseUnavailable(err: unknown): boolean {
  for (let e = err as DriverError | undefined, depth = 0; e && depth < 3; e = e.driverError, depth++) {
    if (typeof e.code === 'string' && CONNECTION_CODES.has(e.code)) return true
    if (typeof e.errno === 'number' && CONNECTION_ERRNOS.has(e.errno)) return true
    if (e.fatal === true) return true // mysql2 marks errors that closed the connection
    if (typeof e.message === 'string' && /connection is in closed state|Pool is closed/i.test(e.message)) return true
  }
  return false
}

/**
 * Durability check at start: an acknowledged stock move must survive a crash of the database server,
 * which needs the redo log flushed at every commit.
 * source: MariaDB documentation, innodb_flush_log_at_trx_commit ("1: the log is written and flushed to
 * disk at each transaction commit; required for full ACID compliance").
 */
export async function checkDurability(ds: DataSource, logger: Pick<Logger, 'warn' | 'info'>): Promise<boolean> {
  const [row] = (await ds.query('SELECT @@GLOBAL.innodb_flush_log_at_trx_commit AS flush')) as { flush: number | string }[]
  const value = Number(row?.flush)
  if (value !== 1) {
    logger.warn(
      { innodb_flush_log_at_trx_commit: value },
      `innodb_flush_log_at_trx_commit is ${value}, not 1: stock moves acknowledged in the last second may be lost if the database server crashes. Set it to 1 in the MariaDB configuration.`,
    )
    return false
  }
  logger.info({ innodb_flush_log_at_trx_commit: value }, 'database durability: the redo log is flushed at every commit')
  return true
}
