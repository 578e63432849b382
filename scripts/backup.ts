// `npm run backup`: one consistent snapshot of the database (mariadb-dump --single-transaction) into a
// dated, gzipped file under .data/backups/, while the app may keep running. The embedded development
// database by default; an existing server when LUMENYARD_DB_PASSWORD and friends are set.
// `npm run backup -- FILE` writes to that file instead.
import { loadConfig } from '../server/config.js'
import { backupDatabase } from './backupTools.js'
import { prepareEnvironment } from './environment.js'

const prepared = await prepareEnvironment('dev', { database: process.env.LUMENYARD_DB_NAME ?? 'lumenyard' })
try {
  const { db } = loadConfig({ ...process.env, ...prepared.env })
  const done = await backupDatabase(db, process.argv[2])
  console.log(`lumenyard backup: database ${db.database} → ${done.file} (${(done.bytes / 1024).toFixed(0)} KiB, ${done.ms} ms)`)
  console.log(`Restore it with: npm run restore -- ${done.file}`)
} catch (err) {
  console.error(`lumenyard backup failed: ${err instanceof Error ? err.message : err}`)
  process.exitCode = 1
} finally {
  if (prepared.server?.startedHere) await prepared.stop()
}
