// An import checked on one app process and committed on another, against the real MariaDB (two apps on one
// database, as behind one proxy): the check keeps the file in the database, the commit names the check and
// sends nothing again; two commits of it at once (a double click sent to both processes) write once and answer
// alike; a kept file past its time is refused and deleted.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { dataImportPreviewShape, dataImportResultShape } from '../../shared/schemas/answers/dataImports.js'
import { CSRF, startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import { tagOf } from '../support/fixtureRows.js'
import { createOpeningStockTarget } from '../support/stockFixtures.js'

let a: ApiHarness
let b: ApiHarness
const tag = tagOf()
const SKU = `XP-BLK-${tag}`
const WH = `XP${tag}`
let itemId = 0

beforeAll(async () => {
  a = await startApiHarness()
  b = await startApiHarness()
  itemId = await createOpeningStockTarget(a.ds, SKU, WH)
})
afterAll(async () => {
  await b?.close()
  await a?.close()
})

/** 40 rows, lot i holding i + 1 blocks: 820 blocks in all (1 + 2 + … + 40). */
const file = (salt: string) => Buffer.from(['SKU,Warehouse,Bin,Lot,Quantity,Unit cost',
  ...Array.from({ length: 40 }, (_, i) => `${SKU},${WH},A-01-1,${salt}-${i},${i + 1},2.5000`)].join('\r\n') + '\r\n', 'utf8')
const onHand = async () => Number((await a.ds.query('SELECT COALESCE(SUM(on_hand), 0) AS n FROM stock_balances WHERE item_id = ?', [itemId]))[0].n)

describe('an import across app processes', () => {
  it('commits on one process the file checked on another, once for two commits at once', async () => {
    const onA = await a.as('admin')
    const onB = await b.as('admin')
    const checked = await onA.post('/api/imports/opening_stock/preview').set(CSRF).attach('file', file(`X${tag}`), 'opening-two.csv')
    expect(checked.status).toBe(200)
    const runId = dataImportPreviewShape.parse(checked.body).checkRun!
    expect(runId).toMatch(/^[0-9a-f-]{36}$/)
    // The checked file is in the database, not in the memory or on the disk of process A.
    const [kept] = await a.ds.query('SELECT f.bytes FROM data_import_runs r JOIN stored_files f ON f.id = r.upload_id WHERE r.id = ?', [runId])
    expect(Number(kept.bytes)).toBe(file(`X${tag}`).length)

    const before = await onHand()
    const records = async () => Number((await a.ds.query("SELECT COUNT(*) AS n FROM data_imports WHERE file_name = 'opening-two.csv'"))[0].n)
    const [first, second] = await Promise.all([onB.post(`/api/imports/runs/${runId}/commit`).set(CSRF), onA.post(`/api/imports/runs/${runId}/commit`).set(CSRF)])
    expect([first.status, second.status], JSON.stringify(first.body).slice(0, 300)).toEqual([200, 200])
    const result = dataImportResultShape.parse(first.body)
    expect(second.body.record.id).toBe(result.record.id)
    // 1 + 2 + … + 40 = 40 × 41 / 2 = 820 blocks (arithmetic series), written once.
    expect((await onHand()) - before).toBe(820)
    expect(result.record.rows).toBe(40)
    expect(await records()).toBe(1)
    // Two runs for the two commits would be a second commit: one commit run of the check.
    expect(Number((await a.ds.query("SELECT COUNT(*) AS n FROM data_import_runs WHERE step = 'commit' AND file_name = 'opening-two.csv'"))[0].n)).toBe(1)
  }, 60_000)

  it('refuses a check that is not this person\'s, not a check, or past its keeping, and deletes the expired file', async () => {
    const onA = await a.as('admin')
    const checked = await onA.post('/api/imports/opening_stock/preview').set(CSRF).attach('file', file(`Y${tag}`), 'opening-late.csv')
    const runId = dataImportPreviewShape.parse(checked.body).checkRun!
    expect((await (await b.as('admin')).post('/api/imports/runs/no-such-run/commit').set(CSRF)).body.error.code).toBe('import_run_not_found')
    const [run] = await a.ds.query('SELECT user_id, upload_id FROM data_import_runs WHERE id = ?', [runId])
    const [other] = await a.ds.query('SELECT id FROM users WHERE id <> ? LIMIT 1', [run.user_id])
    await a.ds.query('UPDATE data_import_runs SET user_id = ? WHERE id = ?', [other.id, runId])
    expect((await onA.post(`/api/imports/runs/${runId}/commit`).set(CSRF)).status).toBe(404)
    await a.ds.query('UPDATE data_import_runs SET user_id = ? WHERE id = ?', [run.user_id, runId])
    // Past its time: refused, nothing written, and the next check deletes it, parts and all.
    await a.ds.query('UPDATE stored_files SET expires_at = CURRENT_TIMESTAMP(3) - INTERVAL 1 SECOND WHERE id = ?', [run.upload_id])
    const before = await onHand()
    const late = await onA.post(`/api/imports/runs/${runId}/commit`).set(CSRF)
    expect([late.status, late.body.error.code]).toEqual([404, 'import_run_not_found'])
    expect(await onHand()).toBe(before)
    await onA.post('/api/imports/opening_stock/preview').set(CSRF).attach('file', file(`Z${tag}`), 'opening-next.csv')
    expect(Number((await a.ds.query('SELECT COUNT(*) AS n FROM stored_file_parts WHERE file_id = ?', [run.upload_id]))[0].n)).toBe(0)
  }, 60_000)
})
