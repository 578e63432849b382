// Backup and restore round trip of the test database (the demo scenario and everything the tests
// before it wrote): `npm run backup`'s dump restored into a second database, then every table compared
// by row count and a hash of every column of every row.
// source: MariaDB documentation, mariadb-dump --single-transaction (a consistent snapshot of InnoDB tables).
// CHECKSUM TABLE is not used: it hashes the stored record, which differs for tables with stored generated
// columns even when every value is equal.
import { existsSync, rmSync } from 'node:fs'
import path from 'node:path'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { adminSql, dataRoot } from '../../scripts/embeddedMariadb.js'
import { backupDatabase, backupDir, restoreDatabase } from '../../scripts/backupTools.js'
import { startApiHarness, type ApiHarness } from '../support/apiHarness.js'

let h: ApiHarness
const socket = path.join(dataRoot, 'test', 'mysqld.sock')
beforeAll(async () => {
  h = await startApiHarness()
})
afterAll(() => h?.close())

describe('backup and restore', () => {
  it.skipIf(!existsSync(socket))('round-trips the database: every table equal in rows and content', async () => {
    const source = h.config.db
    const copy = { ...source, database: `${source.database}_restore` }
    // The app user may create only its own database: the copy's rights come from the instance admin.
    await adminSql({ socket }, `CREATE DATABASE IF NOT EXISTS \`${copy.database}\`; GRANT ALL PRIVILEGES ON \`${copy.database}\`.* TO '${source.user}'@'127.0.0.1'`)
    const file = path.join(backupDir, `roundtrip-${Date.now()}.sql.gz`)
    const dumped = await backupDatabase(source, file)
    const restored = await restoreDatabase(copy, file)
    const tables = (await h.ds.query("SELECT table_name AS t FROM information_schema.tables WHERE table_schema = ? AND table_type = 'BASE TABLE' ORDER BY 1", [source.database])) as { t: string }[]
    const differing: string[] = []
    let rows = 0
    for (const { t } of tables) {
      const columns = (await h.ds.query('SELECT column_name AS c FROM information_schema.columns WHERE table_schema = ? AND table_name = ? ORDER BY ordinal_position', [source.database, t])) as { c: string }[]
      // One MD5 per row over every column (NULL kept apart from empty), summed: equal contents, equal sums.
      const row = `MD5(CONCAT_WS('|', ${columns.map(({ c }) => `IFNULL(HEX(\`${c}\`), 'NULL')`).join(', ')}))`
      const digest = async (db: string) => ((await h.ds.query(`SELECT COUNT(*) AS n, SUM(CONV(SUBSTR(${row}, 1, 12), 16, 10)) AS h FROM \`${db}\`.\`${t}\``)) as { n: string; h: string | null }[])[0]
      const a = await digest(source.database)
      const b = await digest(copy.database)
      rows += Number(a.n)
      if (a.n !== b.n || a.h !== b.h) differing.push(`${t}: ${a.n} rows / ${a.h} vs ${b.n} / ${b.h}`)
    }
    console.log(`backup round trip: ${tables.length} tables, ${rows} rows, dump ${(dumped.bytes / 1024).toFixed(0)} KiB in ${dumped.ms} ms, restore ${restored.ms} ms`)
    expect(tables.length).toBeGreaterThan(20)
    expect(rows).toBeGreaterThan(1000)
    expect(differing, differing.join("; ")).toEqual([])
    await adminSql({ socket }, `DROP DATABASE \`${copy.database}\``)
    rmSync(file)
  })
})
