// Two app processes on one database behind nginx (from Debian): the conservation workload of
// tests/api/stockConservation.test.ts sent through the proxy, so requests of one client land on both
// processes. Sessions, throttle counters and Idempotency-Key records live in MariaDB, so it must pass as it
// does against one process.
// source: Jepsen's bank workload (conserved totals under concurrent transfers, checked in every snapshot).
import path from 'node:path'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { DataSource } from 'typeorm'
import type { Role } from '../../shared/roles.js'
import { loadConfig } from '../../server/config.js'
import { createDataSource } from '../../server/db/dataSource.js'
import { hashPassword } from '../../server/services/userService.js'
import { dataRoot, dbEnv, ensureAppDatabase, ensureEmbeddedServer, shutdownEmbeddedServer } from '../../scripts/embeddedMariadb.js'
import { startNginx, type NginxProxy } from '../../scripts/nginxProxy.js'
import { TEST_PASSWORD } from '../support/apiHarness.js'
import { freePort, startAppProcess, type AppProcess } from '../support/processes.js'
import { checkConservation, createWorkloadFixture, innodbDeadlocks, runWorkload, signedInClients } from '../support/stockWorkload.js'

const PROFILE = 'scale'
let ds: DataSource
const apps: AppProcess[] = []
let proxy: NginxProxy | null = null

beforeAll(async () => {
  const profile = { name: PROFILE, port: await freePort('LUMENYARD_SCALE_DB_PORT') }
  const server = await ensureEmbeddedServer(profile)
  const creds = await ensureAppDatabase(server, profile, 'lumenyard_scale', { reset: true })
  const env = { ...dbEnv(creds), NODE_ENV: 'test', LUMENYARD_SESSION_SECRET: 'scale-session-secret-of-at-least-32-chars', LUMENYARD_LOG_LEVEL: 'info', LUMENYARD_SIGNIN_FAILS_PER_IP: '100000', LUMENYARD_TRUST_PROXY: 'true', LUMENYARD_DB_POOL: '20' }
  ds = createDataSource({ db: { ...loadConfig({ ...process.env, ...env }).db, pool: 6 } })
  await ds.initialize()
  await ds.runMigrations({ transaction: 'each' })
  // One after the other: the first runs the migrations (none left by now), the second finds them done.
  for (let i = 0; i < 2; i++) apps.push(await startAppProcess(env, await freePort()))
  proxy = await startNginx(PROFILE, await freePort('LUMENYARD_PROXY_PORT'), apps.map((a) => a.url.replace('http://', '')))
}, 240_000)

afterAll(async () => {
  await proxy?.stop()
  for (const a of apps) await a.stop()
  await ds?.destroy().catch(() => undefined)
  await shutdownEmbeddedServer(path.join(dataRoot, PROFILE, 'mysqld.sock')).catch(() => undefined)
}, 60_000)

async function user(username: string, roles: Role[]): Promise<void> {
  await ds.query('INSERT IGNORE INTO users (username, display_name, roles, password_hash, active) VALUES (?, ?, ?, ?, 1)', [username, username, roles.join(','), await hashPassword(TEST_PASSWORD)])
}

describe('two app processes behind nginx', () => {
  it('conserves every unit through the proxy, with no 5xx', async () => {
    const seed = Number(process.env.LUMENYARD_LOAD_SEED) || Date.now() % 1_000_000
    const clients = await signedInClients({ user: async (n, r) => { await user(n, r); return undefined as never } }, proxy!.url, 'warehouse', 16, 4, 'proxy')
    const [counter] = await signedInClients({ user: async (n, r) => { await user(n, r); return undefined as never } }, proxy!.url, 'counter', 1, 1, 'proxy')
    const fx = await createWorkloadFixture(ds, clients[0], counter)
    const served = () => apps.map((a) => a.output.join('').split('"url":"/api/').length - 1)
    const servedBefore = served()
    const deadlocksBefore = await innodbDeadlocks(ds)
    const stats = await runWorkload(ds, fx, clients, { seed, opsPerClient: 15, readers: 1 })
    const report = await checkConservation(ds, fx, stats)
    const perProcess = served().map((n, i) => n - servedBefore[i])
    console.log(`two processes behind nginx (seed ${seed}): ${JSON.stringify({ ...report.figures, 'requests per process': perProcess.join(' / '), 'InnoDB deadlocks': (await innodbDeadlocks(ds)) - deadlocksBefore })}`)
    expect(report.violations).toEqual([])
    expect(stats.serverErrors).toEqual([])
    for (const n of perProcess) expect(n).toBeGreaterThan(stats.requests / 5) // both processes did real work
    expect(stats.acked.receipts + stats.acked.issues).toBeGreaterThan(30)
  })
})
