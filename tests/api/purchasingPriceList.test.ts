// Vendor price lists from .xlsx and .csv through the shared upload guard and parser: a preview with
// per-row errors that writes nothing, a commit that writes every row or none.
import ExcelJS from 'exceljs'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { CSRF, startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import { count, createPurchasingFixture, type PurchasingFixture } from '../support/purchasingFixtures.js'

let h: ApiHarness
let f: PurchasingFixture
beforeAll(async () => {
  h = await startApiHarness()
  f = await createPurchasingFixture(h.ds)
})
afterAll(() => h?.close())

async function workbook(rows: (string | number | null)[][]): Promise<Buffer> {
  const book = new ExcelJS.Workbook()
  const sheet = book.addWorksheet('Prices')
  for (const r of rows) sheet.addRow(r)
  return Buffer.from(await book.xlsx.writeBuffer())
}

const HEADER = ['Our SKU', 'Vendor SKU', 'Cost per stock unit', 'Pack size', 'Minimum order', 'Preferred', 'Description']

async function upload(step: 'preview' | 'commit', data: Buffer, name: string) {
  return (await h.as('buyer')).post(`/api/vendors/${f.vendorB}/price-list/${step}`).set(CSRF).attach('file', data, name)
}

describe('vendor price-list import', () => {
  it('previews every row with its errors and writes nothing; a commit with errors writes nothing either', async () => {
    const data = await workbook([
      HEADER,
      [f.block.sku, 'NB-GB8', '2.4400', 40, 80, 'yes', 'Block, clear'],
      [f.sealant.sku, 'NB-S2', '6.05', null, null, null, 'updates the existing line'],
      ['NO-SUCH-SKU', 'NB-X', '1.00', 1, 1, null, null],
      [f.base.sku, 'NB-SB', '12,50', 1, 1, null, 'comma decimal'],
      [f.block.sku, 'NB-GB8-2', '2.50', 40, 40, null, 'repeated'],
    ])
    const before = await count(h.ds, 'vendor_items')
    const res = await upload('preview', data, 'prices.xlsx')
    expect(res.status, JSON.stringify(res.body)).toBe(200)
    expect(res.body).toMatchObject({ filename: 'prices.xlsx', total: 5, errorRows: 3, updates: 1, adds: 4 })
    const byRow = new Map(res.body.rows.map((r: { row: number }) => [r.row, r]))
    expect(byRow.get(4)).toMatchObject({ errors: [{ column: 'Our SKU', problem: { code: 'sku_not_in_catalog', params: { sku: 'NO-SUCH-SKU' } } }] })
    expect((byRow.get(5) as { errors: { column: string }[] }).errors[0].column).toBe('Cost per stock unit')
    expect(byRow.get(6)).toMatchObject({ errors: [{ column: 'Our SKU', problem: { code: 'sku_repeated', params: { sku: f.block.sku, row: 2 } } }] })
    expect(byRow.get(3)).toMatchObject({ action: 'update', unitCost: '6.05', previousCost: '6.1000', errors: [] })
    expect(await count(h.ds, 'vendor_items')).toBe(before)
    const refused = await upload('commit', data, 'prices.xlsx')
    expect(refused.status).toBe(422)
    expect(refused.body.error.code).toBe('import_invalid')
    expect(await count(h.ds, 'vendor_items')).toBe(before)
  })

  it('commits a clean list: adds new items, updates existing ones and keeps one preferred vendor per item', async () => {
    const csv = [HEADER.slice(0, 6).join(','), `${f.block.sku},NB-GB8,2.4400,40,80,yes`, `${f.sealant.sku},NB-S2,6.05,,,`].join('\r\n')
    const versions = async () => new Map(((await h.ds.query('SELECT id, version FROM vendor_items WHERE item_id IN (?, ?)', [f.block.id, f.sealant.id])) as { id: number; version: number }[])
      .map((r) => [r.id, Number(r.version)]))
    const before = await versions()
    const res = await upload('commit', Buffer.from(csv, 'utf8'), 'prices.csv')
    expect(res.status, JSON.stringify(res.body)).toBe(200)
    expect(res.body).toMatchObject({ total: 2, adds: 1, updates: 1, errorRows: 0 })
    const rows = await h.ds.query('SELECT item_id, vendor_sku, pack_qty, min_order_qty, unit_cost, preferred FROM vendor_items WHERE vendor_id = ? ORDER BY item_id', [f.vendorB])
    expect(rows).toEqual([
      { item_id: f.block.id, vendor_sku: 'NB-GB8', pack_qty: 40, min_order_qty: 80, unit_cost: '2.4400', preferred: 1 },
      // pack and minimum absent from the file: the existing values stay (10 and 10)
      { item_id: f.sealant.id, vendor_sku: 'NB-S2', pack_qty: 10, min_order_qty: 10, unit_cost: '6.0500', preferred: 1 },
    ])
    const [other] = await h.ds.query('SELECT id, preferred FROM vendor_items WHERE vendor_id = ? AND item_id = ?', [f.vendorA, f.block.id])
    expect(other.preferred).toBe(0)
    // Every line the list changed (its own updated line, the other vendor's line no longer preferred) moved to its next
    // version, so an edit screen opened before the list came in is refused rather than writing over it.
    const [updated] = await h.ds.query('SELECT id FROM vendor_items WHERE vendor_id = ? AND item_id = ?', [f.vendorB, f.sealant.id])
    const after = await versions()
    expect(before.has(updated.id) && before.has(other.id)).toBe(true)
    expect(after.get(updated.id)).toBe(before.get(updated.id)! + 1)
    expect(after.get(other.id)).toBe(before.get(other.id)! + 1)
  })

  it('refuses a file that is not what its name says, unknown columns, and other roles', async () => {
    const fake = await upload('preview', Buffer.from('this is not a workbook'), 'prices.xlsx')
    expect(fake.status).toBe(415)
    const badColumns = await upload('preview', Buffer.from('Colour,Size\nred,8\n'), 'prices.csv')
    expect(badColumns.status).toBe(422)
    expect(badColumns.body.error.code).toBe('sheet_columns')
    const none = await (await h.as('buyer')).post(`/api/vendors/${f.vendorB}/price-list/preview`).set(CSRF).send({})
    expect(none.status).toBe(400)
    const warehouse = await (await h.as('warehouse')).post(`/api/vendors/${f.vendorB}/price-list/preview`).set(CSRF).attach('file', Buffer.from('a'), 'x.csv')
    expect(warehouse.status).toBe(403)
  })
})
