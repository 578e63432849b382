// Backup and restore of Lumenyard's database with Debian's MariaDB client tools.
// The dump is one consistent snapshot taken while the app keeps running: mariadb-dump --single-transaction
// reads every InnoDB table in one REPEATABLE READ transaction without locking them.
// source: MariaDB documentation, mariadb-dump, option --single-transaction.
import { spawn } from 'node:child_process'
import { createReadStream, createWriteStream, mkdirSync, statSync } from 'node:fs'
import path from 'node:path'
import { pipeline } from 'node:stream/promises'
import { createGunzip, createGzip } from 'node:zlib'
import { dataRoot } from './embeddedMariadb.js'

export interface DbTarget { host: string; port: number; user: string; password: string; database: string }

const tool = (name: string) => ['/usr/bin', '/usr/local/bin'].map((d) => path.join(d, name)).find((p) => { try { return statSync(p).isFile() } catch { return false } }) ?? name

// The password travels in the child's environment (MYSQL_PWD), never on its command line, where `ps` shows it.
function clientArgs(t: DbTarget): { args: string[]; env: NodeJS.ProcessEnv } {
  return {
    args: ['--no-defaults', `--host=${t.host}`, `--port=${t.port}`, `--user=${t.user}`, '--protocol=TCP', '--default-character-set=utf8mb4'],
    env: { ...process.env, MYSQL_PWD: t.password },
  }
}

export const backupDir = path.join(dataRoot, 'backups')

/** A dated file name such as lumenyard-2026-12-04T15-30-00Z.sql.gz. */
export function backupFileName(database: string, at = new Date()): string {
  return `${database}-${at.toISOString().slice(0, 19).replace(/:/g, '-')}Z.sql.gz`
}

export async function backupDatabase(t: DbTarget, file = path.join(backupDir, backupFileName(t.database))): Promise<{ file: string; bytes: number; ms: number }> {
  const started = Date.now()
  mkdirSync(path.dirname(file), { recursive: true })
  const { args, env } = clientArgs(t)
  const child = spawn(tool('mariadb-dump'), [...args, '--single-transaction', '--quick', '--hex-blob', '--skip-lock-tables', '--no-tablespaces', '--triggers', t.database], { env, stdio: ['ignore', 'pipe', 'pipe'] })
  const errors: string[] = []
  child.stderr.on('data', (d: Buffer) => errors.push(d.toString()))
  const exited = new Promise<number>((resolve) => child.once('close', (code) => resolve(code ?? 1)))
  await pipeline(child.stdout, createGzip(), createWriteStream(file, { mode: 0o600 }))
  const code = await exited
  if (code !== 0) throw new Error(`mariadb-dump failed (${code}): ${errors.join('').trim()}`)
  return { file, bytes: statSync(file).size, ms: Date.now() - started }
}

/** Replaces the database with the dump's content: drops it, creates it empty, loads the dump. */
export async function restoreDatabase(t: DbTarget, file: string): Promise<{ ms: number }> {
  const started = Date.now()
  if (!/^[A-Za-z0-9_]+$/.test(t.database)) throw new Error(`Database name "${t.database}" may hold only letters, digits and _`)
  await runClient(t, null, `DROP DATABASE IF EXISTS \`${t.database}\`; CREATE DATABASE \`${t.database}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;`)
  await runClient(t, file)
  return { ms: Date.now() - started }
}

function runClient(t: DbTarget, dumpFile: string | null, sql?: string): Promise<void> {
  const { args, env } = clientArgs(t)
  const child = spawn(tool('mariadb'), [...args, ...(sql ? ['-e', sql] : [t.database])], { env, stdio: [dumpFile ? 'pipe' : 'ignore', 'ignore', 'pipe'] })
  const errors: string[] = []
  child.stderr!.on('data', (d: Buffer) => errors.push(d.toString()))
  const exited = new Promise<number>((resolve) => child.once('close', (code) => resolve(code ?? 1)))
  const fed = dumpFile ? pipeline(createReadStream(dumpFile), createGunzip(), child.stdin!) : Promise.resolve()
  return Promise.all([fed, exited]).then(([, code]) => {
    if (code !== 0) throw new Error(`mariadb failed (${code}): ${errors.join('').trim()}`)
  })
}
