// Statements sent straight on a transaction's connection (server/db/onConnection.ts, the stock ledger's hot
// statements) must behave as the ORM's own em.query in that transaction: the same connection, inside the same
// transaction (rolled back with it), the same answer shapes and the same driver error numbers. Real MariaDB.
// source: MariaDB Knowledge Base, "CONNECTION_ID" (one id per client connection), "START TRANSACTION" and
// "ROLLBACK" (a rollback undoes the transaction's changes), and "MariaDB Error Codes" (1062 ER_DUP_ENTRY).
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { sqlOn } from '../../server/db/onConnection.js'
import { isDuplicateKey } from '../../server/db/transaction.js'
import { startApiHarness, type ApiHarness } from '../support/apiHarness.js'

let h: ApiHarness
let userId: number
beforeAll(async () => {
  h = await startApiHarness()
  userId = (await h.user('onconn-warehouse', ['warehouse'])).id
})
afterAll(() => h?.close())

const key = (what: string) => `onconn-${what}-${Date.now()}-${Math.random().toString(36).slice(2, 8)}`
const insertRecord = 'INSERT INTO idempotency_records (user_id, idem_key, scope, request_hash, response_status, response_body) VALUES (?, ?, ?, ?, 0, ?)'
const countKey = async (k: string) =>
  Number((await h.ds.query('SELECT COUNT(*) AS n FROM idempotency_records WHERE user_id = ? AND idem_key = ?', [userId, k]))[0].n)

describe('statements on the transaction connection', () => {
  it('run on the connection of the transaction they are given, and answer as em.query does', async () => {
    const k = key('same')
    await h.ds.transaction(async (em) => {
      const [viaOrm] = await em.query('SELECT CONNECTION_ID() AS id')
      const [direct] = await sqlOn<{ id: number }[]>(em, 'SELECT CONNECTION_ID() AS id')
      expect(Number(direct.id)).toBe(Number(viaOrm.id))
      const header = await sqlOn<{ affectedRows: number }>(em, insertRecord, [userId, k, 'test', 'x', 'null'])
      expect(header.affectedRows).toBe(1)
      // The ORM's read in the same transaction sees the uncommitted row: one transaction, not two.
      const rows = await em.query('SELECT idem_key FROM idempotency_records WHERE user_id = ? AND idem_key = ?', [userId, k])
      expect(rows).toEqual([{ idem_key: k }])
    })
    expect(await countKey(k)).toBe(1)
  })

  it('are undone with their transaction when the work fails', async () => {
    const k = key('rollback')
    await expect(
      h.ds.transaction(async (em) => {
        await sqlOn(em, insertRecord, [userId, k, 'test', 'x', 'null'])
        throw new Error('work failed after the write')
      }),
    ).rejects.toThrow('work failed after the write')
    expect(await countKey(k)).toBe(0)
  })

  it('fail with the driver error number the callers look for (a duplicate key for a replayed Idempotency-Key)', async () => {
    const k = key('dup')
    await h.ds.query(insertRecord, [userId, k, 'test', 'x', 'null'])
    const err = await h.ds.transaction((em) => sqlOn(em, insertRecord, [userId, k, 'test', 'x', 'null'])).catch((e: unknown) => e)
    expect(isDuplicateKey(err)).toBe(true)
    expect(String((err as Error).message)).toContain('PRIMARY')
  })

  it('outside a transaction run as em.query on the pool', async () => {
    const [row] = await sqlOn<{ two: number }[]>(h.ds.manager, 'SELECT 1 + 1 AS two')
    expect(Number(row.two)).toBe(2)
  })
})
