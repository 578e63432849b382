// The scanner's prepared reads run on a pool of their own beside TypeORM's, and closing the app closes it: its
// connections leave the server's process list, and later reads go through TypeORM. Real MariaDB.
// source: MariaDB Knowledge Base, "Information Schema PROCESSLIST Table" (one row per open connection, ID as
// CONNECTION_ID() reports it) and "Server Status Variables" (Com_stmt_prepare, Com_stmt_execute: the server's
// own count of prepared statements prepared and executed on a connection).
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createApp } from '../../server/app.js'
import { executeRows, preparedReadsOpen } from '../../server/db/prepared.js'
import { startApiHarness, type ApiHarness } from '../support/apiHarness.js'

let h: ApiHarness
beforeAll(async () => {
  h = await startApiHarness()
})
afterAll(() => h?.close())

const connectionAlive = async (id: number) =>
  (await h.ds.query('SELECT COUNT(*) AS n FROM information_schema.PROCESSLIST WHERE ID = ?', [id]))[0].n > 0

describe('prepared reads', () => {
  it('run as prepared statements on their own connection, which the app closes with itself', async () => {
    const built = createApp({ config: h.config, ds: h.ds }) // a second app on the harness's DataSource
    const [first] = await executeRows<{ id: number }>(h.ds, 'SELECT CONNECTION_ID() AS id', [])
    expect(preparedReadsOpen(h.ds)).toBe(true)
    expect(await connectionAlive(first.id)).toBe(true)
    // The same statement again on that connection: executed from its prepared form, not sent as text.
    const [counters] = await executeRows<{ prepared: string; executed: string }>(
      h.ds,
      `SELECT (SELECT VARIABLE_VALUE FROM information_schema.SESSION_STATUS WHERE VARIABLE_NAME = 'COM_STMT_PREPARE') AS prepared,
              (SELECT VARIABLE_VALUE FROM information_schema.SESSION_STATUS WHERE VARIABLE_NAME = 'COM_STMT_EXECUTE') AS executed`,
      [],
    )
    expect(Number(counters.prepared)).toBeGreaterThanOrEqual(1)
    expect(Number(counters.executed)).toBeGreaterThanOrEqual(1)

    await built.close()
    expect(preparedReadsOpen(h.ds)).toBe(false)
    // The pool ended its connections; the server drops them from its list a moment later.
    for (let i = 0; i < 50 && (await connectionAlive(first.id)); i++) await new Promise((r) => setTimeout(r, 20))
    expect(await connectionAlive(first.id)).toBe(false)
    // Afterwards the DataSource's reads still answer, through TypeORM's own pool and not a new one.
    const [after] = await executeRows<{ id: number }>(h.ds, 'SELECT CONNECTION_ID() AS id', [])
    expect(Number(after.id)).not.toBe(Number(first.id))
    expect(preparedReadsOpen(h.ds)).toBe(false)
  })
})
