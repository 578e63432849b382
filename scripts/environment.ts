// Brings up what the app needs for one profile (dev, test, bench): the embedded MariaDB (unless an
// existing server is configured), the app's database and user, and a session secret.
import { randomBytes } from 'node:crypto'
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs'
import path from 'node:path'
import { dataRoot, dbEnv, ensureAppDatabase, ensureEmbeddedServer, type EmbeddedServer } from './embeddedMariadb.js'

export interface PreparedEnvironment {
  env: Record<string, string>
  server: EmbeddedServer | null
  stop(): Promise<void>
}

const DEFAULT_DB_PORTS: Record<string, number> = { dev: 3406, test: 3407, bench: 3407 }

function sessionSecret(profile: string): string {
  const dir = path.join(dataRoot, profile)
  mkdirSync(dir, { recursive: true })
  const file = path.join(dir, 'session-secret')
  if (!existsSync(file)) writeFileSync(file, randomBytes(32).toString('base64url'), { mode: 0o600 })
  return readFileSync(file, 'utf8').trim()
}

export async function prepareEnvironment(
  profile: 'dev' | 'test' | 'bench',
  opts: { database: string; reset?: boolean; serverArgs?: string[] },
): Promise<PreparedEnvironment> {
  const env: Record<string, string> = {}
  if (!process.env.LUMENYARD_SESSION_SECRET) env.LUMENYARD_SESSION_SECRET = sessionSecret(profile)
  if (process.env.LUMENYARD_DB_PASSWORD) {
    // An existing MariaDB server: the operator created the database and user.
    return { env, server: null, stop: async () => {} }
  }
  // serverArgs apply when the server is started here, not to one already running.
  const serverProfile = { name: profile === 'bench' ? 'test' : profile, port: Number(process.env.LUMENYARD_DB_PORT) || DEFAULT_DB_PORTS[profile], extraArgs: opts.serverArgs }
  const server = await ensureEmbeddedServer(serverProfile)
  const creds = await ensureAppDatabase(server, serverProfile, opts.database, { reset: opts.reset })
  Object.assign(env, dbEnv(creds))
  return { env, server, stop: () => server.stop() }
}
