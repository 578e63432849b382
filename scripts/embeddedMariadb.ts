// A private MariaDB instance on loopback for `npm start`, `npm test` and `npm run bench`.
// It never touches a system instance: its own data directory under .data/, its own socket,
// a non-standard port, bound to 127.0.0.1. Root is reachable only through the socket by the OS
// user who runs it; the app connects as its own user with a generated password.
import { spawn, execFile } from 'node:child_process'
import { randomBytes } from 'node:crypto'
import { existsSync, mkdirSync, openSync, readFileSync, writeFileSync } from 'node:fs'
import net from 'node:net'
import os from 'node:os'
import path from 'node:path'
import { promisify } from 'node:util'

const run = promisify(execFile)
export const projectRoot = path.resolve(import.meta.dirname, '..')
export const dataRoot = path.join(projectRoot, '.data')

export interface EmbeddedProfile {
  name: string
  port: number
  /** More mariadbd options (a replication pair: --log-bin, --server-id, --read-only …). */
  extraArgs?: string[]
}

export interface EmbeddedServer {
  socket: string
  port: number
  startedHere: boolean
  stop(): Promise<void>
}

export interface AppDbCredentials {
  host: string
  port: number
  user: string
  password: string
  database: string
}

function findBinary(name: string): string {
  for (const dir of ['/usr/sbin', '/usr/bin', '/usr/local/sbin', '/usr/local/bin']) {
    const candidate = path.join(dir, name)
    if (existsSync(candidate)) return candidate
  }
  throw new Error(
    `${name} was not found. Install Debian's MariaDB server: sudo apt-get update && sudo apt-get install -y mariadb-server`,
  )
}

function profileDirs(profile: EmbeddedProfile) {
  const base = path.join(dataRoot, profile.name)
  return {
    base,
    dataDir: path.join(base, 'mariadb'),
    socket: path.join(base, 'mysqld.sock'),
    pidFile: path.join(base, 'mysqld.pid'),
    logFile: path.join(base, 'mariadb.log'),
    // Its own temporary files (large sorts, temporary tables): the machine's /tmp is shared with every other
    // program, which may clean it while a query still needs a file there.
    tmpDir: path.join(base, 'tmp'),
    credentials: path.join(base, 'app-credentials.json'),
  }
}

const osUser = () => os.userInfo().username
const isRoot = () => process.getuid?.() === 0

/** Runs SQL as the instance's admin account over the unix socket. */
export async function adminSql(server: Pick<EmbeddedServer, 'socket'>, sql: string): Promise<string> {
  const client = findBinary('mariadb')
  const { stdout } = await run(client, ['--no-defaults', '-S', server.socket, '-u', osUser(), '-N', '-B', '-e', sql])
  return stdout
}

async function ping(socket: string): Promise<boolean> {
  if (!existsSync(socket)) return false
  try {
    await run(findBinary('mariadb-admin'), ['--no-defaults', '-S', socket, '-u', osUser(), '--connect-timeout=2', 'ping'])
    return true
  } catch {
    return false
  }
}

function portAnswers(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const sock = net.connect({ host: '127.0.0.1', port })
    sock.once('connect', () => { sock.destroy(); resolve(true) })
    sock.once('error', () => resolve(false))
    sock.setTimeout(1000, () => { sock.destroy(); resolve(false) })
  })
}

async function initialise(dirs: ReturnType<typeof profileDirs>): Promise<void> {
  mkdirSync(dirs.dataDir, { recursive: true })
  const args = [
    '--no-defaults',
    `--datadir=${dirs.dataDir}`,
    '--auth-root-authentication-method=socket',
    `--auth-root-socket-user=${osUser()}`,
    '--skip-test-db',
  ]
  if (isRoot()) args.push('--user=root')
  await run(findBinary('mariadb-install-db'), args)
}

/** Starts the profile's instance, or reuses it when it is already running. */
export async function ensureEmbeddedServer(profile: EmbeddedProfile): Promise<EmbeddedServer> {
  const dirs = profileDirs(profile)
  const existing = { socket: dirs.socket, port: profile.port, startedHere: false, stop: async () => {} }
  if (await ping(dirs.socket)) return existing
  if (await portAnswers(profile.port)) {
    throw new Error(
      `Port ${profile.port} on 127.0.0.1 is already taken by another program. ` +
        `Stop it, or choose another port with LUMENYARD_DB_PORT.`,
    )
  }
  if (!existsSync(path.join(dirs.dataDir, 'mysql'))) await initialise(dirs)
  mkdirSync(dirs.tmpDir, { recursive: true, mode: 0o700 })
  const args = [
    '--no-defaults',
    `--datadir=${dirs.dataDir}`,
    `--socket=${dirs.socket}`,
    `--pid-file=${dirs.pidFile}`,
    `--tmpdir=${dirs.tmpDir}`,
    `--port=${profile.port}`,
    '--bind-address=127.0.0.1',
    ...(profile.extraArgs?.some((a) => a.startsWith('--log-bin')) ? [] : ['--skip-log-bin']),
    '--skip-name-resolve',
    '--innodb-flush-log-at-trx-commit=1',
    '--innodb-buffer-pool-size=256M',
    '--max-connections=400',
    '--character-set-server=utf8mb4',
    '--collation-server=utf8mb4_unicode_ci',
    `--log-error=${dirs.logFile}`,
    ...(profile.extraArgs ?? []),
  ]
  if (isRoot()) args.push('--user=root')
  const out = openSync(dirs.logFile, 'a')
  // Its own process group: Ctrl-C in the terminal reaches us, and we shut it down in order.
  const child = spawn(findBinary('mariadbd'), args, { detached: true, stdio: ['ignore', out, out] })
  child.unref()
  let exited: number | null = null
  child.once('exit', (code) => { exited = code ?? -1 })
  for (let i = 0; i < 300; i++) {
    if (await ping(dirs.socket)) break
    if (exited !== null) throw new Error(`MariaDB exited during start (code ${exited}); see ${dirs.logFile}`)
    await new Promise((r) => setTimeout(r, 100))
    if (i === 299) throw new Error(`MariaDB did not answer within 30 s; see ${dirs.logFile}`)
  }
  return {
    socket: dirs.socket,
    port: profile.port,
    startedHere: true,
    stop: () => shutdownEmbeddedServer(dirs.socket),
  }
}

export async function shutdownEmbeddedServer(socket: string): Promise<void> {
  if (!(await ping(socket))) return
  await run(findBinary('mariadb-admin'), ['--no-defaults', '-S', socket, '-u', osUser(), 'shutdown'])
}

const quoteIdent = (name: string) => {
  if (!/^[A-Za-z0-9_]+$/.test(name)) throw new Error(`Database name "${name}" may hold only letters, digits and _`)
  return '`' + name + '`'
}

/**
 * Creates the application user (password generated once, kept in .data/<profile>/) and the
 * database. With reset, the database is dropped first (the test run's clean slate).
 */
export async function ensureAppDatabase(
  server: EmbeddedServer,
  profile: EmbeddedProfile,
  database: string,
  opts: { reset?: boolean } = {},
): Promise<AppDbCredentials> {
  const dirs = profileDirs(profile)
  let stored: { user: string; password: string }
  if (existsSync(dirs.credentials)) {
    stored = JSON.parse(readFileSync(dirs.credentials, 'utf8'))
  } else {
    stored = { user: 'lumenyard_app', password: randomBytes(18).toString('base64url') }
    writeFileSync(dirs.credentials, JSON.stringify(stored, null, 2), { mode: 0o600 })
  }
  const db = quoteIdent(database)
  const pw = stored.password.replace(/'/g, "''")
  const statements = [
    `CREATE USER IF NOT EXISTS '${stored.user}'@'127.0.0.1' IDENTIFIED BY '${pw}'`,
    `ALTER USER '${stored.user}'@'127.0.0.1' IDENTIFIED BY '${pw}'`,
    opts.reset ? `DROP DATABASE IF EXISTS ${db}` : '',
    `CREATE DATABASE IF NOT EXISTS ${db} CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`,
    `GRANT ALL PRIVILEGES ON ${db}.* TO '${stored.user}'@'127.0.0.1'`,
  ].filter(Boolean)
  await adminSql(server, statements.join(';\n'))
  return { host: '127.0.0.1', port: server.port, user: stored.user, password: stored.password, database }
}

/** The environment variables the app reads (server/config.ts) for these credentials. */
export function dbEnv(c: AppDbCredentials): Record<string, string> {
  return {
    LUMENYARD_DB_HOST: c.host,
    LUMENYARD_DB_PORT: String(c.port),
    LUMENYARD_DB_USER: c.user,
    LUMENYARD_DB_PASSWORD: c.password,
    LUMENYARD_DB_NAME: c.database,
  }
}
