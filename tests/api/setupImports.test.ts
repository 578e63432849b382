// What a new business sets up before its stock comes in, brought in from its own sheets against the real
// database: warehouses, bins, price levels with their breaks, vendors with contact and terms, reorder settings
// and lead times seen before. Each bad file is refused with the problem on its row and column and writes
// nothing; the same file committed twice changes nothing the second time; a reversal takes the import back
// whole, and is refused while something made since refers to what it wrote.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { ReorderLineDetail } from '../../shared/schemas/reorder.js'
import { CSRF, startApiHarness, type ApiHarness } from '../support/apiHarness.js'
import { countRows, insertId, tagOf } from '../support/fixtureRows.js'

let h: ApiHarness
const tag = tagOf()
const WH = `SW${tag}`
const today = new Date().toISOString().slice(0, 10)

beforeAll(async () => {
  h = await startApiHarness()
})
afterAll(() => h?.close())

const send = async (kind: string, lines: string[], name = `${kind}.csv`) =>
  (await h.as('admin')).post(`/api/imports/${kind}/commit`).set(CSRF).attach('file', Buffer.from(lines.join('\n') + '\n', 'utf8'), name)
const reverse = async (id: number) => (await h.as('admin')).post(`/api/imports/${id}/reverse`).set(CSRF)
/** The refusal's problems as "row column code", in row order. */
const problemsOf = (res: { body: { error: { fields: Record<string, { code: string }> } } }) => Object.entries(res.body.error.fields).map(([row, p]) => `${row} ${p.code}`)
const checkRows = async (kind: string, lines: string[]) => {
  const res = await (await h.as('admin')).post(`/api/imports/${kind}/preview`).set(CSRF).attach('file', Buffer.from(lines.join('\n') + '\n', 'utf8'), `${kind}.csv`)
  expect(res.status, JSON.stringify(res.body).slice(0, 300)).toBe(200)
  return (res.body.rows as { row: number; errors: { column: string | null; problem: { code: string } }[] }[])
    .flatMap((r) => r.errors.map((e) => `${r.row} ${e.column ?? '-'} ${e.problem.code}`))
}

describe('warehouses and bins import', () => {
  const whHead = 'Code,Name,Address,Bin pattern,Active'
  const binHead = 'Warehouse,Bin,Kind,Active'

  it('refuses bad warehouse and bin rows with row and column, and writes nothing', async () => {
    const before = await countRows(h.ds, 'warehouses')
    // common practice: a warehouse code is short and plain; our rule is 2 to 12 capital letters or digits
    expect(await checkRows('warehouses', [whHead, `${WH}-X,Bad code yard,,,`, `${WH}B,,,,`, `${WH}C,Pattern yard,,^A$,`])).toEqual([
      '2 Code invalid_format', '3 Name required', '4 Bin pattern bin_pattern_groups',
    ])
    const bad = await send('warehouses', [whHead, `${WH}-X,Bad code yard,,,`])
    expect(bad.status).toBe(422)
    expect(await countRows(h.ds, 'warehouses')).toBe(before)
  })

  it('brings warehouses and then their bins in once, skips transit bins, and reverses bins before warehouses', async () => {
    const whFile = [whHead, `${WH},Brightcourse north yard ${tag},12 Kiln Road,,yes`, `${WH.toLowerCase()}2,Brightcourse annex ${tag},,,no`]
    const first = await send('warehouses', whFile)
    expect(first.status, JSON.stringify(first.body)).toBe(200)
    expect(first.body.record.summary).toEqual({ warehouses: 2 })
    const rows = await h.ds.query('SELECT code, address, active FROM warehouses WHERE code IN (?, ?) ORDER BY code', [WH, `${WH}2`])
    expect(rows).toEqual([{ code: WH, address: '12 Kiln Road', active: 1 }, { code: `${WH}2`, address: null, active: 0 }])
    // The same file again: nothing changes, and the answer says so.
    const again = await send('warehouses', whFile)
    expect(again.status).toBe(200)
    expect(again.body.repeated).toBe(true)
    expect(await countRows(h.ds, 'warehouses', 'code LIKE ?', [`${WH}%`])).toBe(2)

    // A storage bin must fit the warehouse's pattern (default: aisle letters, bay digits, level digits).
    expect(await checkRows('bins', [binHead, `NOPE${tag},A-01-1,storage,`, `${WH},SHELF9,storage,`, `${WH},SHELF 9,receiving,`, `${WH},A-01-1,shelf,`])).toEqual([
      `2 Warehouse import_warehouse_unknown`, '3 Bin bin_code_misfit', '4 Bin bin_code_chars', '5 Kind invalid_choice',
    ])
    const binFile = [binHead, `${WH},A-01-1,storage,yes`, `${WH},A-01-2,,`, `${WH},RCV,receiving,yes`, `${WH},IN-TRANSIT,transit,yes`]
    const bins = await send('bins', binFile)
    expect(bins.status, JSON.stringify(bins.body)).toBe(200)
    expect(bins.body).toMatchObject({ ready: 3, skipped: 1 })
    expect(await h.ds.query('SELECT b.code, b.kind FROM bins b JOIN warehouses w ON w.id = b.warehouse_id WHERE w.code = ? ORDER BY b.code', [WH]))
      .toEqual([{ code: 'A-01-1', kind: 'storage' }, { code: 'A-01-2', kind: 'storage' }, { code: 'RCV', kind: 'receiving' }])
    expect((await send('bins', binFile)).body.repeated).toBe(true)
    expect(await countRows(h.ds, 'bins b JOIN warehouses w ON w.id = b.warehouse_id', 'w.code = ?', [WH])).toBe(3)
    // A bin named again in a new file is refused on its row.
    expect(await checkRows('bins', [binHead, `${WH},A-01-1,storage,`])).toEqual(['2 Bin import_code_exists'])

    // The warehouses cannot go while their bins stand; the bins go first, then the warehouses.
    const refused = await reverse(first.body.record.id)
    expect(refused.status).toBe(409)
    expect(refused.body.error.code).toBe('import_records_in_use')
    expect((await reverse(bins.body.record.id)).status).toBe(200)
    expect((await reverse(first.body.record.id)).status).toBe(200)
    expect(await countRows(h.ds, 'warehouses', 'code LIKE ?', [`${WH}%`])).toBe(0)
  })
})

describe('price levels and price breaks import', () => {
  const levelHead = 'Code,Name,Percent off,Active'
  const ruleHead = 'Price level,SKU,From quantity,Basis,Price,Percent off'
  let itemSku = ''

  beforeAll(async () => {
    itemSku = `PB${tag}`
    await h.ds.query("INSERT INTO items (sku, name, family, stock_unit, cost, list_price) VALUES (?, 'Test glass block 8 in', 'glass_block', 'each', 4, 9.5)", [itemSku])
  })

  it('refuses a bad percent, an unknown level, a rule with both a price and a percent, and writes nothing', async () => {
    expect(await checkRows('price_levels', [levelHead, `T${tag},Trade,120,`])).toEqual(['2 Percent off percent_format'])
    const before = await countRows(h.ds, 'price_rules')
    const bad = await send('price_rules', [ruleHead, `NOLEVEL${tag},${itemSku},1,unit,9.00,`, `,${itemSku},10,unit,8.50,5`, `,NOSKU${tag},1,unit,1,`])
    expect(bad.status).toBe(422)
    expect(problemsOf(bad)).toEqual(['2 import_price_level_unknown', '3 price_rule_one_of', '4 sku_not_in_catalog'])
    expect(await countRows(h.ds, 'price_rules')).toBe(before)
  })

  it('brings levels and breaks in once and reverses them, rules before the level they name', async () => {
    const levels = await send('price_levels', [levelHead, `T${tag},Trade ${tag},10,yes`, `V${tag},Volume ${tag},,yes`])
    expect(levels.status, JSON.stringify(levels.body)).toBe(200)
    expect(await h.ds.query('SELECT code, percent_off FROM price_levels WHERE code IN (?, ?) ORDER BY code', [`T${tag}`, `V${tag}`]))
      .toEqual([{ code: `T${tag}`, percent_off: '10.00' }, { code: `V${tag}`, percent_off: null }])
    // Breaks worked by hand: from 1 at 9.00, from 100 at 8.25, and 12 % off for the volume level from 50.
    const ruleFile = [ruleHead, `,${itemSku},1,unit,9.00,`, `,${itemSku},100,unit,8.25,`, `V${tag},${itemSku},50,unit,,12`]
    const rules = await send('price_rules', ruleFile)
    expect(rules.status, JSON.stringify(rules.body)).toBe(200)
    expect(rules.body.record.summary).toEqual({ priceRules: 3, items: 1 })
    expect((await send('price_rules', ruleFile)).body.repeated).toBe(true)
    expect(await h.ds.query(
      'SELECT l.code AS level, r.min_qty, r.price, r.percent_off FROM price_rules r JOIN items i ON i.id = r.item_id LEFT JOIN price_levels l ON l.id = r.level_id WHERE i.sku = ? ORDER BY r.min_qty',
      [itemSku])).toEqual([
      { level: null, min_qty: 1, price: '9.00', percent_off: null },
      { level: `V${tag}`, min_qty: 50, price: null, percent_off: '12.00' },
      { level: null, min_qty: 100, price: '8.25', percent_off: null },
    ])
    expect((await reverse(levels.body.record.id)).status).toBe(409)
    expect((await reverse(rules.body.record.id)).status).toBe(200)
    expect((await reverse(levels.body.record.id)).status).toBe(200)
    expect(await countRows(h.ds, 'price_levels', 'code IN (?, ?)', [`T${tag}`, `V${tag}`])).toBe(0)
  })
})

describe('vendors import', () => {
  const head = 'Vendor code,Name,Contact,E-mail,Phone,Address,Terms,Currency,Lead time days,Active'

  it('refuses a bad e-mail, a currency that is no ISO 4217 code and a lead time beyond a year, and writes nothing', async () => {
    const before = await countRows(h.ds, 'vendors')
    // source: ISO 4217 (three capital letters)
    expect(await checkRows('vendors', [head, `VA${tag},Glassworks,,not-mail,,,,,,`, `VB${tag},Glassworks,,,,,,dollars,,`, `VC${tag},Glassworks,,,,,,,400,`])).toEqual([
      '2 E-mail invalid_email', '3 Currency currency_code', '4 Lead time days at_most',
    ])
    expect((await send('vendors', [head, `VA${tag},Glassworks,,not-mail,,,,,,`])).status).toBe(422)
    expect(await countRows(h.ds, 'vendors')).toBe(before)
  })

  it('keeps contact, terms, currency and lead time; once; and reverses while no order names the vendor', async () => {
    const file = [head, `VN${tag},Northlight Glassworks,Mara Quell,orders@northlight.example,555-0190,4 Furnace Row,30 days net,CAD,21,yes`]
    const done = await send('vendors', file)
    expect(done.status, JSON.stringify(done.body)).toBe(200)
    expect(await h.ds.query('SELECT contact_name, email, terms, currency, lead_time_days FROM vendors WHERE code = ?', [`VN${tag}`]))
      .toEqual([{ contact_name: 'Mara Quell', email: 'orders@northlight.example', terms: '30 days net', currency: 'CAD', lead_time_days: 21 }])
    expect((await send('vendors', file)).body.repeated).toBe(true)
    expect(await countRows(h.ds, 'vendors', 'code = ?', [`VN${tag}`])).toBe(1)
    expect((await reverse(done.body.record.id)).status).toBe(200)
    expect(await countRows(h.ds, 'vendors', 'code = ?', [`VN${tag}`])).toBe(0)
  })
})

describe('reorder settings and lead times import', () => {
  const ids = { wh: 0, item: 0, item2: 0, vendor: 0 }
  const setHead = 'Applies to,Family,ABC class,SKU,Warehouse,Service level,Review days,Reorder point set by hand,Why set by hand'
  const leadHead = 'Vendor code,SKU,Order number,Lead time days'

  beforeAll(async () => {
    ids.wh = await insertId(h.ds, 'INSERT INTO warehouses (code, name) VALUES (?, ?)', [`RS${tag}`, `Reorder yard ${tag}`])
    ids.item = await insertId(h.ds, "INSERT INTO items (sku, name, family, stock_unit, cost) VALUES (?, 'Test spacer', 'spacer', 'each', 0.2)", [`RS${tag}-1`])
    ids.item2 = await insertId(h.ds, "INSERT INTO items (sku, name, family, stock_unit, cost) VALUES (?, 'Test sealant', 'sealant', 'each', 6)", [`RS${tag}-2`])
    ids.vendor = await insertId(h.ds, 'INSERT INTO vendors (code, name, lead_time_days) VALUES (?, ?, 30)', [`RV${tag}`, `Test vendor ${tag}`])
    await h.ds.query('INSERT INTO vendor_items (vendor_id, item_id, vendor_sku, unit_cost, preferred) VALUES (?, ?, ?, 0.2, 1), (?, ?, ?, 6, 1)',
      [ids.vendor, ids.item, `X${tag}-1`, ids.vendor, ids.item2, `X${tag}-2`])
    await h.ds.query('INSERT INTO item_warehouses (item_id, warehouse_id, avg_cost) VALUES (?, ?, 0.2), (?, ?, 6)', [ids.item, ids.wh, ids.item2, ids.wh])
    await h.ds.query("INSERT INTO reorder_policies (scope, scope_key, item_id, warehouse_id, service_level) VALUES ('item_warehouse', ?, ?, ?, 0.9)",
      [`${ids.item2}:${ids.wh}`, ids.item2, ids.wh])
  })

  const detail = async (itemId: number) => {
    const res = await (await h.as('buyer')).get(`/api/reorder/lines/${itemId}/${ids.wh}`)
    expect(res.status, JSON.stringify(res.body).slice(0, 300)).toBe(200)
    return res.body as ReorderLineDetail
  }

  it('refuses a figure set by hand without its reason or outside one item, a target already set and an unknown item, and writes nothing', async () => {
    const before = await countRows(h.ds, 'reorder_policies')
    expect(await checkRows('reorder_settings', [setHead,
      `item_warehouse,,,RS${tag}-1,RS${tag},0.95,,40,`,
      `family,spacer,,,,,,40,Counted`,
      `item_warehouse,,,RS${tag}-2,RS${tag},0.97,,,`,
      `item_warehouse,,,NOSKU${tag},RS${tag},0.97,,,`,
      `sometimes,,,,,0.97,,,`,
    ])).toEqual([
      '2 Why set by hand override_reason_needed',
      '3 Reorder point set by hand override_item_only',
      '4 Applies to import_code_exists',
      '5 SKU sku_not_in_catalog',
      '6 Applies to invalid_choice',
    ])
    expect((await send('reorder_settings', [setHead, `item_warehouse,,,RS${tag}-1,RS${tag},0.95,,40,`])).status).toBe(422)
    expect(await countRows(h.ds, 'reorder_policies')).toBe(before)
  })

  it('makes the reorder line read the settings and the lead times brought in, once, and reverses them', async () => {
    const settings = [setHead, `item_warehouse,,,RS${tag}-1,RS${tag},0.95,14,40,Counted after a site job`]
    const set = await send('reorder_settings', settings)
    expect(set.status, JSON.stringify(set.body)).toBe(200)
    // Observed lead times 10, 14 and 18 days: mean 14, sample standard deviation √((16 + 0 + 16) / 2) = 4
    // (worked by hand; source: the sample standard deviation, any statistics textbook).
    const leads = [leadHead, `RV${tag},RS${tag}-1,P-${tag}-1,10`, `RV${tag},RS${tag}-1,P-${tag}-2,14`, `RV${tag},RS${tag}-1,P-${tag}-3,18`]
    expect(await checkRows('lead_times', [leadHead, `NOV${tag},RS${tag}-1,P-1,10`, `RV${tag},RS${tag}-1,P-1,-2`, `RV${tag},RS${tag}-1,P-1,1e9`])).toEqual([
      '2 Vendor code import_vendor_unknown', '3 Lead time days at_least', '4 Lead time days cell_number',
    ])
    const lead = await send('lead_times', leads)
    expect(lead.status, JSON.stringify(lead.body)).toBe(200)
    const line = await detail(ids.item)
    expect(line.policy.serviceLevel).toBe(0.95)
    expect(line.policy.reviewPeriodDays).toBe(14)
    expect(line.leadTime).toMatchObject({ source: 'observed', meanDays: 14, sdDays: 4, observations: 3 })
    expect(line.line.reorderPoint).toBe(40)
    expect(line.line.overridden).toBe(true)

    // The same files again change nothing.
    expect((await send('reorder_settings', settings)).body.repeated).toBe(true)
    expect((await send('lead_times', leads)).body.repeated).toBe(true)
    expect(await countRows(h.ds, 'lead_time_history', 'item_id = ?', [ids.item])).toBe(3)
    // A lead time already held is refused on its row when it comes in another file.
    expect(await checkRows('lead_times', [leadHead, `RV${tag},RS${tag}-1,P-${tag}-2,15`])).toEqual(['2 Order number import_code_exists'])

    expect((await reverse(lead.body.record.id)).status).toBe(200)
    expect((await reverse(set.body.record.id)).status).toBe(200)
    const after = await detail(ids.item)
    // back to the vendor's stated 30 days with no spread, and no figure set by hand
    expect(after.leadTime).toMatchObject({ source: 'vendor', meanDays: 30, sdDays: 0 })
    expect(after.line.overridden).toBe(false)
  })

  it('is refused once a layer it brought in was changed on the reorder screen', async () => {
    const set = await send('reorder_settings', [setHead, `item_warehouse,,,RS${tag}-1,RS${tag},0.9,,,`], 'again.csv')
    expect(set.status, JSON.stringify(set.body)).toBe(200)
    await h.ds.query("UPDATE reorder_policies SET service_level = 0.92, updated_at = NOW() + INTERVAL 5 SECOND WHERE import_id = ?", [set.body.record.id])
    const refused = await reverse(set.body.record.id)
    expect(refused.status).toBe(409)
    expect(refused.body.error.code).toBe('import_records_in_use')
  })
})

void today
