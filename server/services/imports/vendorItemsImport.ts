// Vendors with what they sell us: one row per vendor and item (vendor SKU, pack size, minimum order, cost,
// lead time). A vendor code not yet in Lumenyard is added with the row's name; an item a vendor already
// sells us is refused (change it on the vendor's page), so the import can be reversed whole.
import type { EntityManager } from 'typeorm'
import { problem, type RowProblem } from '../../../shared/errors/errorCodes.js'
import { zodIssueProblem } from '../../../shared/errors/zodProblems.js'
import { vendorCreateSchema, vendorItemSchema } from '../../../shared/schemas/purchasing.js'
import { AppError } from '../../errors.js'
import type { CheckedRow, DataImportDefinition } from './dataImports.js'
import { cellText, distinctOf, headerOf, inChunks, itemsBySku, marks, namedItem, notOwn, parserProblems, repeatedRows } from './importFacts.js'
import { insertRows } from './recordsImport.js'
import type { ImportSpec, ParsedSheet } from './importTypes.js'

export const VENDOR_ITEMS_SPEC: ImportSpec = {
  columns: [
    { key: 'vendor', header: 'Vendor code', aliases: ['Vendor'], required: true, kind: 'text' },
    { key: 'vendorName', header: 'Vendor name', kind: 'text' },
    { key: 'sku', header: 'SKU', aliases: ['Item SKU'], required: true, kind: 'text' },
    { key: 'vendorSku', header: 'Vendor SKU', aliases: ['Vendor item', 'Vendor part'], required: true, kind: 'text' },
    { key: 'packQty', header: 'Pack size', aliases: ['Pack', 'Pack qty'], kind: 'integer' },
    { key: 'minOrder', header: 'Minimum order', aliases: ['Minimum', 'Min order'], kind: 'integer' },
    { key: 'unitCost', header: 'Cost per stock unit', aliases: ['Unit cost', 'Cost'], required: true, kind: 'decimal' },
    { key: 'leadTimeDays', header: 'Lead time days', aliases: ['Lead time'], kind: 'integer' },
    { key: 'preferred', header: 'Preferred', kind: 'boolean' },
  ],
  ignore: ['Name', 'Item', 'Description', 'Notes'],
  maxRows: 20_000,
  maxColumns: 30,
}

export const VENDOR_ITEMS_GUIDE: Record<string, string> = {
  vendor: 'Your code for the vendor (letters, digits, . _ -; up to 20). A code not yet in Lumenyard adds that vendor.',
  vendorName: 'The vendor\'s name. Needed on the rows of a vendor not yet in Lumenyard; ignored for one already here.',
  sku: 'An item already in the catalog (import items first).',
  vendorSku: 'The vendor\'s own code for the item, as it goes on your purchase orders (up to 40 characters).',
  packQty: 'Stock units in one of the vendor\'s packs (blank: 1). Orders go out in whole packs.',
  minOrder: 'The fewest packs the vendor takes on one order (blank: 1).',
  unitCost: 'What one stock unit costs from this vendor, up to 4 decimals, no currency sign.',
  leadTimeDays: 'Days from order to arrival for this item (blank: the vendor\'s usual lead time).',
  preferred: 'yes for the vendor reorder suggestions should buy this item from (one per item; blank: no).',
}

interface VendorItemWrite {
  vendorCode: string
  vendorId: number | null
  vendorName: string
  itemId: number
  vendorSku: string
  packQty: number
  minOrderQty: number
  unitCost: string
  leadTimeDays: number | null
  preferred: boolean
}

const col = headerOf(VENDOR_ITEMS_SPEC)
/** The vendor item schema's fields by this sheet's keys. */
const FIELD_KEY: Record<string, string> = { itemId: 'sku', minOrderQty: 'minOrder' }

/**
 * What a pass carries from chunk to chunk: the row keys seen (for repeats), each new vendor's name (given on its
 * first row), and the items the file has named a preferred vendor for. A few keys per vendor or item, never rows.
 */
interface Carried { repeated: ReturnType<typeof repeatedRows>; newVendorNames: Map<string, string>; preferredBy: Map<number, string> }

/**
 * One chunk against the vendors and vendor items it names. What a commit's earlier chunks wrote (its import id) is
 * the file's own, not held from before: a vendor it added still reads as new, its items as not yet sold.
 */
async function checkChunk(em: EntityManager, importId: number | null, sheet: ParsedSheet, carried: Carried): Promise<CheckedRow<VendorItemWrite>[]> {
  const items = await itemsBySku(em, distinctOf(sheet, 'sku'))
  const [ownVendors, ownId] = notOwn('import_id', importId)
  const vendorRows = await inChunks(distinctOf(sheet, 'vendor'), (c) => em.query(
    `SELECT id, code FROM vendors WHERE code IN (${marks(c.length)})${ownVendors}`, [...c, ownId]) as Promise<{ id: number; code: string }[]>)
  const vendors = new Map(vendorRows.map((v) => [v.code.toUpperCase(), v.id]))
  const itemIds = [...new Set([...items.values()].map((i) => i.id))]
  const [ownLines] = notOwn('vi.import_id', importId)
  const held = await inChunks(itemIds, (c) => em.query(
    `SELECT vi.vendor_id, vi.item_id, vi.preferred, v.code FROM vendor_items vi JOIN vendors v ON v.id = vi.vendor_id
      WHERE vi.item_id IN (${marks(c.length)})${ownLines}`, [...c, ownId],
  ) as Promise<{ vendor_id: number; item_id: number; preferred: number; code: string }[]>)
  const sold = new Set(held.map((h) => `${h.vendor_id}:${h.item_id}`))
  const preferredBy = new Map(held.filter((h) => Number(h.preferred)).map((h) => [h.item_id, h.code]))
  const problemsOf = parserProblems(sheet, col)
  return sheet.rows.map((r): CheckedRow<VendorItemWrite> => {
    const errors = problemsOf(r.row)
    const add = (key: string, p: RowProblem['problem']) => errors.push({ column: col(key), problem: p })
    const code = cellText(r.values.vendor)
    const codeCheck = vendorCreateSchema.shape.code.safeParse(code)
    if (code && !codeCheck.success) add('vendor', zodIssueProblem(codeCheck.error.issues[0]))
    const vendorId = code ? vendors.get(code.toUpperCase()) ?? null : null
    let vendorName = cellText(r.values.vendorName)
    if (code && vendorId === null) {
      vendorName ||= carried.newVendorNames.get(code.toUpperCase()) ?? ''
      const nameCheck = vendorCreateSchema.shape.name.safeParse(vendorName)
      if (!nameCheck.success) add('vendorName', vendorName ? zodIssueProblem(nameCheck.error.issues[0]) : problem('import_vendor_name_needed', { vendor: code }))
      else if (!carried.newVendorNames.has(code.toUpperCase())) carried.newVendorNames.set(code.toUpperCase(), vendorName)
    }
    const { sku, item } = namedItem(r.values.sku, items, { add })
    const parsed = vendorItemSchema.safeParse({
      itemId: item?.id ?? 1,
      vendorSku: cellText(r.values.vendorSku),
      packQty: r.values.packQty ?? 1,
      minOrderQty: r.values.minOrder ?? 1,
      unitCost: r.values.unitCost === null || r.values.unitCost === undefined ? undefined : cellText(r.values.unitCost),
      leadTimeDays: r.values.leadTimeDays ?? null,
      preferred: r.values.preferred === true,
    })
    if (!parsed.success) {
      for (const issue of parsed.error.issues) {
        const field = String(issue.path[0] ?? '')
        add(FIELD_KEY[field] ?? field, zodIssueProblem(issue))
      }
    }
    if (item && code) {
      const again = carried.repeated(`${code.toUpperCase()}:${item.id}`, r.row)
      if (again) errors.push(again)
      if (vendorId !== null && sold.has(`${vendorId}:${item.id}`)) add('sku', problem('import_vendor_item_exists', { vendor: code, sku }))
      if (r.values.preferred === true) {
        const other = preferredBy.get(item.id) ?? carried.preferredBy.get(item.id)
        if (other !== undefined) add('preferred', problem('import_preferred_taken', { sku, vendor: other }))
        else carried.preferredBy.set(item.id, code)
      }
    }
    const preview = { row: r.row, label: sku || null, place: code || null, qty: parsed.success ? parsed.data.packQty : null, unitCost: parsed.success ? parsed.data.unitCost : null, errors }
    if (errors.length || !item || !code || !parsed.success) return { preview, write: null }
    return {
      preview,
      write: {
        vendorCode: code, vendorId, vendorName: vendorName || carried.newVendorNames.get(code.toUpperCase()) || '', itemId: item.id,
        vendorSku: parsed.data.vendorSku, packQty: parsed.data.packQty, minOrderQty: parsed.data.minOrderQty,
        unitCost: String(parsed.data.unitCost), leadTimeDays: parsed.data.leadTimeDays, preferred: parsed.data.preferred,
      },
    }
  })
}

export const vendorItemsImport: DataImportDefinition<VendorItemWrite> = {
  kind: 'vendor_items',
  spec: VENDOR_ITEMS_SPEC,
  checker(em, importId) {
    const carried: Carried = { repeated: repeatedRows(), newVendorNames: new Map(), preferredBy: new Map() }
    return { check: (sheet) => checkChunk(em, importId, sheet, carried) }
  },
  // A chunk at a time: a vendor new to Lumenyard is added by the first chunk that names it (a later chunk finds it).
  async write(em, _actor, importId, rows) {
    const fresh = new Map<string, string>()
    for (const r of rows) if (r.vendorId === null && !fresh.has(r.vendorCode.toUpperCase())) fresh.set(r.vendorCode.toUpperCase(), r.vendorName)
    const firstCode = new Map<string, string>()
    for (const r of rows) if (!firstCode.has(r.vendorCode.toUpperCase())) firstCode.set(r.vendorCode.toUpperCase(), r.vendorCode)
    const byCode = async () => new Map((await inChunks([...firstCode.values()], (c) => em.query(`SELECT id, code FROM vendors WHERE code IN (${marks(c.length)})`, c) as Promise<{ id: number; code: string }[]>))
      .map((v) => [v.code.toUpperCase(), v.id]))
    const present = await byCode()
    let added = 0
    for (const [upper, name] of fresh) {
      if (present.has(upper)) continue
      await em.query('INSERT INTO vendors (code, name, import_id) VALUES (?, ?, ?)', [firstCode.get(upper), name, importId])
      added++
    }
    const ids = added ? await byCode() : present
    await insertRows(em, 'vendor_items', ['vendor_id', 'item_id', 'vendor_sku', 'pack_qty', 'min_order_qty', 'unit_cost', 'lead_time_days', 'preferred'], importId, rows,
      (r) => [ids.get(r.vendorCode.toUpperCase()), r.itemId, r.vendorSku, r.packQty, r.minOrderQty, r.unitCost, r.leadTimeDays, r.preferred ? 1 : 0])
    return { vendorItems: rows.length, vendors: added }
  },
  async reverse(em, _actor, importId) {
    // A vendor the import added that now has purchase orders, or an imported item already ordered from its vendor, stays.
    const [used]: { code: string }[] = await em.query(
      `SELECT v.code FROM vendors v JOIN purchase_orders o ON o.vendor_id = v.id WHERE v.import_id = ?
       UNION SELECT v.code FROM vendor_items vi JOIN vendors v ON v.id = vi.vendor_id JOIN purchase_orders o ON o.vendor_id = vi.vendor_id
         JOIN purchase_order_lines l ON l.po_id = o.id AND l.item_id = vi.item_id WHERE vi.import_id = ? LIMIT 1`, [importId, importId])
    if (used) throw AppError.conflict('import_records_in_use', `Vendor ${used.code} has purchase orders now; the import can no longer be reversed as a whole.`, { params: { code: used.code } })
    await em.query('DELETE FROM vendor_items WHERE import_id = ?', [importId])
    await em.query('DELETE FROM vendors WHERE import_id = ? AND NOT EXISTS (SELECT 1 FROM vendor_items vi WHERE vi.vendor_id = vendors.id)', [importId])
  },
}
