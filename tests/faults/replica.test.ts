// A read replica: a second private mariadbd replicating from the first by binlog with GTID, and the app with
// its read-only DataSource (ctx.readDs) on the replica. With the replica's SQL thread stopped, a stock move
// goes to the primary while the stock movements report (read from the replica) does not show it yet; once
// replication resumes, it does.
// source: MariaDB documentation, "Setting up Replication" and "Global Transaction ID" (CHANGE MASTER TO …
// MASTER_USE_GTID=slave_pos; MASTER_GTID_WAIT(pos, timeout) waits until the replica has applied pos).
import path from 'node:path'
import supertest from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { DataSource } from 'typeorm'
import { createApp, type BuiltApp } from '../../server/app.js'
import { loadConfig } from '../../server/config.js'
import { createDataSource } from '../../server/db/dataSource.js'
import { hashPassword } from '../../server/services/userService.js'
import { adminSql, dataRoot, dbEnv, ensureAppDatabase, ensureEmbeddedServer, shutdownEmbeddedServer, type EmbeddedServer } from '../../scripts/embeddedMariadb.js'
import { insertId } from '../support/fixtureRows.js'
import { freePort } from '../support/processes.js'

const DATABASE = 'lumenyard_replicated'
const REPL_PASSWORD = 'replication-test-only'
let primary: EmbeddedServer
let replica: EmbeddedServer
let ds: DataSource
let readDs: DataSource
let built: BuiltApp

async function caughtUp(): Promise<void> {
  const [pos] = (await adminSql(primary, 'SELECT @@GLOBAL.gtid_binlog_pos')).trim().split('\n')
  const waited = (await adminSql(replica, `SELECT MASTER_GTID_WAIT('${pos}', 60)`)).trim()
  if (waited !== '0') throw new Error(`the replica did not reach ${pos} (MASTER_GTID_WAIT gave ${waited})`)
}

beforeAll(async () => {
  const p = { name: 'replica-primary', port: await freePort('LUMENYARD_PRIMARY_DB_PORT'), extraArgs: ['--log-bin=primary-bin', '--server-id=1', '--binlog-format=ROW', '--gtid-strict-mode=ON'] }
  const r = { name: 'replica-copy', port: await freePort('LUMENYARD_REPLICA_DB_PORT'), extraArgs: ['--server-id=2', '--read-only=ON', '--relay-log=replica-relay', '--gtid-strict-mode=ON'] }
  primary = await ensureEmbeddedServer(p)
  await adminSql(primary, `CREATE USER IF NOT EXISTS 'repl'@'127.0.0.1' IDENTIFIED BY '${REPL_PASSWORD}'; GRANT REPLICATION SLAVE ON *.* TO 'repl'@'127.0.0.1'`)
  const creds = await ensureAppDatabase(primary, p, DATABASE, { reset: true })
  replica = await ensureEmbeddedServer(r)
  await adminSql(replica, `STOP SLAVE; RESET SLAVE ALL; SET GLOBAL gtid_slave_pos = ''; DROP DATABASE IF EXISTS ${DATABASE};
    CHANGE MASTER TO MASTER_HOST='127.0.0.1', MASTER_PORT=${p.port}, MASTER_USER='repl', MASTER_PASSWORD='${REPL_PASSWORD}', MASTER_USE_GTID=slave_pos; START SLAVE`)
  const env = { ...dbEnv(creds), LUMENYARD_DB_READ_PORT: String(r.port), NODE_ENV: 'test', LUMENYARD_SESSION_SECRET: 'replica-session-secret-of-32-chars-or-more', LUMENYARD_LOG_LEVEL: 'silent' }
  const config = loadConfig({ ...process.env, ...env })
  ds = createDataSource({ db: { ...config.db, pool: 6 } })
  await ds.initialize()
  await ds.runMigrations({ transaction: 'each' })
  await caughtUp() // the replica now has the app's user, database and tables
  readDs = createDataSource({ db: { ...config.readDb!, pool: 4 } })
  await readDs.initialize()
  built = createApp({ config, ds, readDs })
}, 240_000)

afterAll(async () => {
  await built?.close()
  await readDs?.destroy().catch(() => undefined)
  await ds?.destroy().catch(() => undefined)
  await shutdownEmbeddedServer(path.join(dataRoot, 'replica-copy', 'mysqld.sock')).catch(() => undefined)
  await shutdownEmbeddedServer(path.join(dataRoot, 'replica-primary', 'mysqld.sock')).catch(() => undefined)
}, 60_000)

describe('reports on the replica, stock moves on the primary', () => {
  it('shows a move in the report only once the replica has applied it', async () => {
    await ds.query(`INSERT INTO users (username, display_name, roles, password_hash, active) VALUES ('replica-crew', 'Replica crew', 'warehouse', ?, 1)`, [await hashPassword('replica-password-1')])
    const itemId = await insertId(ds, `INSERT INTO items (sku, name, family, stock_unit, cost) VALUES ('REPL-1', 'Replica test block', 'glass_block', 'each', 0)`, [])
    const whId = await insertId(ds, `INSERT INTO warehouses (code, name) VALUES ('RP', 'Replica yard')`, [])
    const binId = await insertId(ds, `INSERT INTO bins (warehouse_id, code, kind) VALUES (?, 'A-01-1', 'storage')`, [whId])
    await caughtUp()
    const agent = supertest.agent(built.app)
    expect((await agent.post('/api/session').set('X-Lumenyard-Request', '1').send({ username: 'replica-crew', password: 'replica-password-1' })).status).toBe(200)
    const report = async () => (await agent.get(`/api/stock/ledger?itemId=${itemId}`)).body as { total: number }

    await adminSql(replica, 'STOP SLAVE SQL_THREAD')
    const moved = await agent.post('/api/stock/receipts').set('X-Lumenyard-Request', '1').set('Idempotency-Key', 'replica-receipt-1')
      .send({ warehouseId: whId, lines: [{ itemId, binId, qty: 12, unitCost: '3.10' }] })
    expect(moved.status).toBe(201)
    const [onPrimary] = (await ds.query('SELECT COUNT(*) AS n FROM stock_moves WHERE item_id = ?', [itemId])) as { n: string }[]
    const [onReplica] = (await readDs.query('SELECT COUNT(*) AS n FROM stock_moves WHERE item_id = ?', [itemId])) as { n: string }[]
    const before = await report()
    console.log(`replica paused: move on the primary ${onPrimary.n}, on the replica ${onReplica.n}, report shows ${before.total}`)
    expect(Number(onPrimary.n)).toBe(1)
    expect(before.total).toBe(0)

    await adminSql(replica, 'START SLAVE SQL_THREAD')
    await caughtUp()
    const after = await report()
    console.log(`replica resumed: report shows ${after.total}`)
    expect(after.total).toBe(1)
    // The replica is read-only for the app's user: a stray write there fails instead of diverging.
    await expect(readDs.query(`UPDATE items SET name = 'x' WHERE id = ?`, [itemId])).rejects.toThrow(/read-only|READ-ONLY|read_only/i)
  })
})
