// `npm run restore -- FILE`: replaces the database with a backup made by `npm run backup`. Everything
// written since that backup is gone afterwards, so it asks first (or takes --yes). Stop the app first.
import { existsSync } from 'node:fs'
import { createInterface } from 'node:readline/promises'
import { loadConfig } from '../server/config.js'
import { restoreDatabase } from './backupTools.js'
import { prepareEnvironment } from './environment.js'

const args = process.argv.slice(2)
const file = args.find((a) => !a.startsWith('--'))
if (!file || !existsSync(file)) {
  console.error(file ? `lumenyard restore: no such file ${file}` : 'usage: npm run restore -- FILE [--yes]   (FILE from npm run backup, under .data/backups/)')
  process.exit(2)
}
const prepared = await prepareEnvironment('dev', { database: process.env.LUMENYARD_DB_NAME ?? 'lumenyard' })
try {
  const { db } = loadConfig({ ...process.env, ...prepared.env })
  if (!args.includes('--yes')) {
    if (!process.stdin.isTTY) throw new Error('add --yes to restore without a question (no terminal to ask on)')
    const rl = createInterface({ input: process.stdin, output: process.stdout })
    const answer = await rl.question(`Replace database ${db.database} on ${db.host}:${db.port} with ${file}? Everything written since that backup is lost. Type yes: `)
    rl.close()
    if (answer.trim().toLowerCase() !== 'yes') throw new Error('nothing was changed')
  }
  const done = await restoreDatabase(db, file)
  console.log(`lumenyard restore: ${file} → database ${db.database} (${done.ms} ms). Start the app again; it applies any newer migrations.`)
} catch (err) {
  console.error(`lumenyard restore: ${err instanceof Error ? err.message : err}`)
  process.exitCode = 1
} finally {
  if (prepared.server?.startedHere) await prepared.stop()
}
