// Contractor accounts and open purchase orders from the business's own sheets, against the real database:
// refusals change nothing; imported open orders make "on order" = ordered − received at once; each import
// reverses whole while untouched; the same file committed twice changes nothing the second time.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { SuggestionList } from '../../shared/schemas/reorder.js'
import { CSRF, startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import { countRows, insertId, tagOf } from '../support/fixtureRows.js'

let h: ApiHarness
const tag = tagOf()
const WH = `AO${tag}`
const VENDOR = `AOV${tag}`
const ids = { item: 0, item2: 0, wh: 0, level: 0 }
const today = new Date().toISOString().slice(0, 10)

beforeAll(async () => {
  h = await startApiHarness()
  ids.wh = await insertId(h.ds, 'INSERT INTO warehouses (code, name) VALUES (?, ?)', [WH, `Test order yard ${tag}`])
  await h.ds.query('INSERT INTO vendors (code, name) VALUES (?, ?)', [VENDOR, `Test glassworks ${tag}`])
  ids.level = await insertId(h.ds, 'INSERT INTO price_levels (code, name) VALUES (?, ?)', [`L${tag}`, `Test trade level ${tag}`])
  ids.item = await insertId(h.ds, "INSERT INTO items (sku, name, family, stock_unit, cost) VALUES (?, 'Test arc spacer', 'arc_spacer', 'each', 1)", [`AO${tag}-1`])
  ids.item2 = await insertId(h.ds, "INSERT INTO items (sku, name, family, stock_unit, cost) VALUES (?, 'Test grout', 'grout', 'bag', 1)", [`AO${tag}-2`])
})
afterAll(() => h?.close())

const send = async (kind: string, lines: string[]) =>
  (await h.as('admin')).post(`/api/imports/${kind}/commit`).set(CSRF).attach('file', Buffer.from(lines.join('\n') + '\n', 'utf8'), `${kind}.csv`)
const codesOf = (res: { body: { error: { fields: Record<string, { code: string }> } } }) => Object.values(res.body.error.fields).map((p) => p.code)

describe('contractor accounts import', () => {
  it('refuses a code already here, a bad e-mail and an unknown price level, then brings new accounts in with their terms and reverses them', async () => {
    const head = 'Account code,Name,Contact,E-mail,Phone,Price level,Tax-exempt certificate,Exempt until'
    const file = [head, `A${tag}-1,Harbor Lane Masonry,Ines Calder,ines@harborlane.example,555-0140,l${tag},EX-40771,2027-06-30`, `A${tag}-2,Quarry Row Builders,,,,,,`]
    const first = await send('accounts', file)
    expect(first.status, JSON.stringify(first.body)).toBe(200)
    expect(first.body.record.summary).toEqual({ accounts: 2, withTerms: 1 })
    // The same file committed again changes nothing: no account, terms or import record is added.
    const counts = () => Promise.all(['customers', 'customer_terms', 'data_imports'].map((t) => countRows(h.ds, t)))
    const held = await counts()
    const again = await send('accounts', file)
    expect(again.status).toBe(200)
    expect(again.body).toMatchObject({ repeated: true, record: { id: first.body.record.id } })
    expect(await counts()).toEqual(held)
    const [acct] = await h.ds.query('SELECT name, contact_name, email FROM customers WHERE code = ?', [`A${tag}-1`])
    expect(acct).toEqual({ name: 'Harbor Lane Masonry', contact_name: 'Ines Calder', email: 'ines@harborlane.example' })
    const [terms] = await h.ds.query("SELECT t.price_level_id, t.exempt_certificate, DATE_FORMAT(t.exempt_until, '%Y-%m-%d') AS until FROM customer_terms t JOIN customers c ON c.id = t.customer_id WHERE c.code = ?", [`A${tag}-1`])
    expect(terms).toEqual({ price_level_id: ids.level, exempt_certificate: 'EX-40771', until: '2027-06-30' })

    const before = await countRows(h.ds, 'customers')
    const bad = await send('accounts', [head, `A${tag}-1,Again,,,,,,`, `A${tag}-3,Fine,,not-an-email,,,,`, `A${tag}-4,Fine,,,,NOLEVEL${tag},,`])
    expect(bad.status).toBe(422)
    expect(codesOf(bad)).toEqual(['import_code_exists', 'invalid_email', 'import_price_level_unknown'])
    expect(await countRows(h.ds, 'customers')).toBe(before)

    const reversed = await (await h.as('admin')).post(`/api/imports/${first.body.record.id}/reverse`).set(CSRF)
    expect(reversed.status, JSON.stringify(reversed.body)).toBe(200)
    expect(await countRows(h.ds, 'customers', 'code LIKE ?', [`A${tag}-%`])).toBe(0)
  })
})

describe('open purchase orders import', () => {
  const head = 'Order number,Vendor code,Ship to warehouse,Ordered on,Expected,SKU,Quantity ordered,Received so far,Cost per stock unit'
  const onOrder = async (itemId: number) => {
    const list = (await (await h.as('admin')).get(`/api/reorder/suggestions?warehouseId=${ids.wh}`)).body as SuggestionList
    return list.lines.find((l) => l.itemId === itemId)?.onOrder ?? 0
  }

  it('refuses closed, mixed and over-received orders, writing nothing', async () => {
    const before = await countRows(h.ds, 'purchase_orders')
    const res = await send('purchase_orders', [head,
      `X${tag}-1,${VENDOR},${WH},${today},,AO${tag}-1,10,10,1.00`, // everything received: not open
      `X${tag}-2,${VENDOR},${WH},${today},,AO${tag}-1,10,0,1.00`,
      `X${tag}-2,NOPE${tag},${WH},${today},,AO${tag}-2,10,0,1.00`, // an unknown vendor on a known order
      `X${tag}-3,${VENDOR},${WH},${today},,AO${tag}-2,10,12,1.00`, // more received than ordered
    ])
    expect(res.status).toBe(422)
    expect(codesOf(res)).toEqual(['import_order_closed', 'import_vendor_unknown', 'import_received_over'])
    expect(await countRows(h.ds, 'purchase_orders')).toBe(before)
  })

  it('makes on order = ordered − received from the first day, changes nothing when the file comes again, and reverses whole', async () => {
    const file = [head,
      `P${tag}-1,${VENDOR},${WH},2026-11-20,2026-12-18,AO${tag}-1,40,15,0.8500`,
      `P${tag}-1,${VENDOR},${WH},2026-11-20,2026-12-18,AO${tag}-2,30,0,7.25`,
      `P${tag}-2,${VENDOR},${WH},2026-11-28,,AO${tag}-1,12,0,0.85`,
    ]
    const res = await send('purchase_orders', file)
    expect(res.status, JSON.stringify(res.body)).toBe(200)
    const counts = () => Promise.all(['purchase_orders', 'purchase_order_lines', 'data_imports'].map((t) => countRows(h.ds, t)))
    const held = await counts()
    const again = await send('purchase_orders', file)
    expect(again.status).toBe(200)
    expect(again.body).toMatchObject({ repeated: true, record: { id: res.body.record.id } })
    expect(await counts()).toEqual(held)
    // worked by hand: item 1 is 40 − 15 + 12 = 37 on order; item 2 is 30; 67 units in all
    expect(res.body.record.summary).toEqual({ orders: 2, lines: 3, units: 67 })
    expect(await onOrder(ids.item)).toBe(37)
    expect(await onOrder(ids.item2)).toBe(30)
    const orders = await h.ds.query('SELECT number, status, total FROM purchase_orders WHERE number LIKE ? ORDER BY number', [`P${tag}-%`])
    // totals worked by hand: 40 × 0.85 + 30 × 7.25 = 34.00 + 217.50 = 251.50; 12 × 0.85 = 10.20
    expect(orders).toEqual([{ number: `P${tag}-1`, status: 'partly_received', total: '251.50' }, { number: `P${tag}-2`, status: 'sent', total: '10.20' }])

    const reversed = await (await h.as('admin')).post(`/api/imports/${res.body.record.id}/reverse`).set(CSRF)
    expect(reversed.status, JSON.stringify(reversed.body)).toBe(200)
    expect(await countRows(h.ds, 'purchase_orders', 'number LIKE ?', [`P${tag}-%`])).toBe(0)
    expect(await onOrder(ids.item)).toBe(0)
  })
})
