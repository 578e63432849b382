// Sales tax rates import against the real MariaDB: the rate the counter charges at each warehouse comes in a row
// per warehouse. A file per refusal changes nothing; the same file committed twice changes nothing the second
// time; the counter's tax list shows the rates; a reversal takes them back, and is refused once a rate was
// set on the prices screen since.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { CSRF, startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import { countRows, tagOf } from '../support/fixtureRows.js'
import { createWarehouse } from '../support/stockFixtures.js'

let h: ApiHarness
const tag = tagOf()
const W1 = `T1${tag}`
const W2 = `T2${tag}`
const W3 = `T3${tag}`
const ids = { w1: 0, w2: 0, w3: 0 }

const HEAD = 'Warehouse,Rate percent,Label'
const csv = (...rows: string[]) => Buffer.from([HEAD, ...rows].join('\r\n') + '\r\n', 'utf8')
const send = async (step: 'preview' | 'commit', file: Buffer, name = 'tax.csv') =>
  (await h.as('admin')).post(`/api/imports/sales_tax/${step}`).set(CSRF).attach('file', file, name)
const rates = () => h.ds.query('SELECT warehouse_id, rate_percent, label FROM sales_tax_rates WHERE warehouse_id IN (?) ORDER BY warehouse_id', [[ids.w1, ids.w2, ids.w3]])

beforeAll(async () => {
  h = await startApiHarness()
  ids.w1 = (await createWarehouse(h.ds, W1, ['A-01-1'])).id
  ids.w2 = (await createWarehouse(h.ds, W2, ['A-01-1'])).id
  ids.w3 = (await createWarehouse(h.ds, W3, ['A-01-1'])).id
  // W3 already charges 6 % (set on the prices screen).
  const set = await (await h.as('admin')).put(`/api/pricing/tax-rates/${ids.w3}`).set(CSRF).send({ ratePercent: '6', label: 'State' })
  expect(set.status).toBe(200)
})
afterAll(() => h?.close())

describe('sales tax rates import', () => {
  it('refuses each bad file with the problem on its row, and writes nothing', async () => {
    const before = { rates: await rates(), imports: await countRows(h.ds, 'data_imports') }
    const good = `${W1},8.25,State and county`
    const cases: [string, string, string, string][] = [
      ['unknown warehouse', `NOPE${tag},5,`, 'Warehouse', 'import_warehouse_unknown'],
      ['negative rate', `${W2},-1,`, 'Rate percent', 'tax_rate_format'],
      ['rate over 100 %', `${W2},101,`, 'Rate percent', 'tax_rate_format'],
      // The prices screen's own limit (sales tax rates are well under a third of the price: common practice).
      ['rate over the screen\'s 30 %', `${W2},30.5,`, 'Rate percent', 'tax_rate_format'],
      ['rate past 4 decimals', `${W2},7.12345,`, 'Rate percent', 'tax_rate_format'],
      ['rate not a number', `${W2},7%,`, 'Rate percent', 'cell_number'],
      ['missing rate', `${W2},,City`, 'Rate percent', 'required'],
      ['label too long', `${W2},5,${'x'.repeat(81)}`, 'Label', 'too_long'],
      ['the same warehouse twice', `${W1.toLowerCase()},8.5,`, '-', 'import_row_repeated'],
      ['a rate already set', `${W3},6.5,`, 'Warehouse', 'import_tax_rate_set'],
    ]
    for (const [name, row, column, code] of cases) {
      const preview = await send('preview', csv(good, row), `${name}.csv`)
      expect(preview.status, name).toBe(200)
      const errors = (preview.body.rows as { row: number; errors: { column: string | null; problem: { code: string } }[] }[])
        .flatMap((r) => r.errors.map((e) => `${r.row} ${e.column ?? '-'} ${e.problem.code}`))
      expect(errors, name).toEqual([`3 ${column} ${code}`])
      const commit = await send('commit', csv(good, row), `${name}.csv`)
      expect(commit.status, name).toBe(422)
    }
    // The refusal of a rate already set names the warehouse and its rate, so the screen can say where to change it.
    const taken = await send('preview', csv(`${W3},6.5,`))
    expect(taken.body.rows[0].errors[0].problem).toEqual({ code: 'import_tax_rate_set', params: { warehouse: W3, rate: '6.0000' } })
    expect({ rates: await rates(), imports: await countRows(h.ds, 'data_imports') }).toEqual(before)
  })

  it('brings rates in once, shows them at the counter, and reverses them', async () => {
    const file = csv(`${W1},8.25,State and county`, `${W2},0,`)
    const done = await send('commit', file)
    expect(done.status, JSON.stringify(done.body).slice(0, 400)).toBe(200)
    expect(done.body.record.summary).toEqual({ taxRates: 2 })
    const after = [
      { warehouse_id: ids.w1, rate_percent: '8.2500', label: 'State and county' },
      { warehouse_id: ids.w2, rate_percent: '0.0000', label: null },
      { warehouse_id: ids.w3, rate_percent: '6.0000', label: 'State' },
    ]
    expect(await rates()).toEqual(after)
    const counter = await (await h.as('counter')).get('/api/pricing/tax-rates')
    expect(counter.body.filter((r: { warehouseCode: string }) => [W1, W2].includes(r.warehouseCode)).map((r: { ratePercent: string }) => r.ratePercent)).toEqual(['8.2500', '0.0000'])
    const again = await send('commit', file)
    expect(again.status).toBe(200)
    expect(again.body.repeated).toBe(true)
    expect(await rates()).toEqual(after)

    // Once the admin sets W2's rate on the prices screen, the import can no longer be taken back whole.
    await (await h.as('admin')).put(`/api/pricing/tax-rates/${ids.w2}`).set(CSRF).send({ ratePercent: '0', label: null })
    const refused = await (await h.as('admin')).post(`/api/imports/${done.body.record.id}/reverse`).set(CSRF)
    expect(refused.status).toBe(409)
    expect(refused.body.error).toMatchObject({ code: 'import_records_in_use', params: { code: W2 } })
    await h.ds.query('UPDATE sales_tax_rates SET updated_by = NULL WHERE warehouse_id = ?', [ids.w2])
    const reversed = await (await h.as('admin')).post(`/api/imports/${done.body.record.id}/reverse`).set(CSRF)
    expect(reversed.status, JSON.stringify(reversed.body)).toBe(200)
    expect(await rates()).toEqual([after[2]])
  })
})
