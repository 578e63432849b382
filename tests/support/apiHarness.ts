// API tests run the real app in-process against the real MariaDB test database that
// scripts/testRun.ts prepared (its settings arrive in the environment).
import bcrypt from 'bcryptjs'
import supertest from 'supertest'
import type { DataSource } from 'typeorm'
import type { Role } from '../../shared/roles.js'
import { createApp, type BuiltApp } from '../../server/app.js'
import { loadConfig, type AppConfig } from '../../server/config.js'
import { createDataSource } from '../../server/db/dataSource.js'
import { User } from '../../server/entities/User.js'
import { isDuplicateKey } from '../../server/db/transaction.js'
import { unknownErrorCodes } from './errorCodeCheck.js'
import { TEST_HASH_COST } from './testHashCost.js'

export const TEST_PASSWORD = 'test-password-123'
export const CSRF = { 'X-Lumenyard-Request': '1' }

export interface ApiHarness {
  ds: DataSource
  built: BuiltApp
  config: AppConfig
  /** A fresh supertest agent (keeps cookies), signed out. */
  agent(): supertest.Agent
  /** An agent signed in as a user holding exactly these roles (created on first use). */
  as(...roles: Role[]): Promise<supertest.Agent>
  /** Ensures a user with these roles exists; returns it. */
  user(username: string, roles: Role[]): Promise<User>
  close(): Promise<void>
}

let hashed: string | null = null

/**
 * `pool` sets the app's own connection pool size below the configured minimum: with one connection every
 * statement the app sends runs on it, so the test can read that connection's counters (SHOW SESSION STATUS).
 */
export async function startApiHarness(overrides: Partial<NodeJS.ProcessEnv> = {}, opts: { pool?: number } = {}): Promise<ApiHarness> {
  const config = loadConfig({ LUMENYARD_SIGNIN_FAILS_PER_IP: '100000', ...process.env, ...overrides })
  const ds = createDataSource(opts.pool ? { db: { ...config.db, pool: opts.pool } } : config)
  await ds.initialize()
  const built = createApp({ config, ds })
  const signedIn = new Map<string, supertest.Agent>()
  // Every error any API test provokes must carry a code the client can word in both languages.
  const unknown = new Set<string>()
  const json = built.app.response.json
  built.app.response.json = function (this: typeof built.app.response, body: unknown) {
    if (this.statusCode >= 400) for (const problem of unknownErrorCodes(body)) unknown.add(`${this.statusCode} ${problem}`)
    return json.call(this, body)
  }

  async function user(username: string, roles: Role[]): Promise<User> {
    const repo = ds.getRepository(User)
    const existing = await repo.findOneBy({ username })
    if (existing) return existing
    hashed ??= await bcrypt.hash(TEST_PASSWORD, TEST_HASH_COST)
    try {
      return await repo.save(repo.create({ username, displayName: `Test ${username}`, roles, passwordHash: hashed, active: true }))
    } catch (err) {
      // Another test file running at the same time created it first.
      if (!isDuplicateKey(err)) throw err
      return repo.findOneByOrFail({ username })
    }
  }

  async function as(...roles: Role[]): Promise<supertest.Agent> {
    const username = `t-${[...roles].sort().join('-')}`
    const cached = signedIn.get(username)
    if (cached) return cached
    await user(username, roles)
    const agent = supertest.agent(built.app)
    const res = await agent.post('/api/session').set(CSRF).send({ username, password: TEST_PASSWORD })
    if (res.status !== 200) throw new Error(`test sign-in as ${username} failed: ${res.status} ${JSON.stringify(res.body)}`)
    signedIn.set(username, agent)
    return agent
  }

  return {
    ds,
    built,
    config,
    agent: () => supertest.agent(built.app),
    as,
    user,
    close: async () => {
      await built.close()
      await ds.destroy()
      if (unknown.size) throw new Error(`error answers with codes the client cannot word: ${[...unknown].join('; ')}`)
    },
  }
}
