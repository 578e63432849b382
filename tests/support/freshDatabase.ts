// A database of a test's own on the test MariaDB, made by the instance's administrator (the app user may
// create only its own database), migrated, and with the demo scenario when asked; dropped the same way.
import path from 'node:path'
import { adminSql, dataRoot } from '../../scripts/embeddedMariadb.js'
import { loadConfig } from '../../server/config.js'
import { createDataSource } from '../../server/db/dataSource.js'
import { loadDemoScenario } from '../../server/demo/index.js'
import type { DataSource } from 'typeorm'

const socket = path.join(dataRoot, 'test', 'mysqld.sock')

/** The test database's name with a suffix: a name of the test's own. */
export const databaseNamed = (suffix: string) => `${loadConfig(process.env).db.database}_${suffix}`

export async function freshDatabase(name: string, opts: { demo?: boolean; then?: (ds: DataSource) => Promise<void> } = {}): Promise<void> {
  const user = loadConfig(process.env).db.user
  await adminSql({ socket }, `DROP DATABASE IF EXISTS \`${name}\`; CREATE DATABASE \`${name}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci; GRANT ALL PRIVILEGES ON \`${name}\`.* TO '${user}'@'127.0.0.1'`)
  const ds = createDataSource(loadConfig({ ...process.env, LUMENYARD_DB_NAME: name }))
  await ds.initialize()
  try {
    await ds.runMigrations({ transaction: 'each' })
    if (opts.demo) await loadDemoScenario(ds)
    await opts.then?.(ds)
  } finally {
    await ds.destroy()
  }
}

export const dropDatabases = (...names: string[]) => adminSql({ socket }, names.map((n) => `DROP DATABASE IF EXISTS \`${n}\`;`).join(' '))
