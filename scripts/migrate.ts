// `npm run migrate`: applies pending migrations to the configured database (LUMENYARD_DB_*), or to
// the embedded development database when none is configured.
import { loadConfig } from '../server/config.js'
import { createDataSource } from '../server/db/dataSource.js'
import { prepareEnvironment } from './environment.js'

const prepared = await prepareEnvironment('dev', { database: process.env.LUMENYARD_DB_NAME ?? 'lumenyard' })
Object.assign(process.env, prepared.env)
const ds = createDataSource(loadConfig())
await ds.initialize()
const ran = await ds.runMigrations({ transaction: 'each' })
console.log(ran.length ? `applied: ${ran.map((m) => m.name).join(', ')}` : 'the database is up to date')
await ds.destroy()
await prepared.stop()
