// The whole business in one zip: first a README workbook that says what each file and each column holds (its
// meaning, what it allows and which import reads it back), then one workbook per kind of record. Where an import reads a kind (items,
// warehouses and bins, stock by bin and lot, averages, usage history, prices and tax, accounts, vendors and their items, reorder
// settings, lead times, open purchase orders), its file uses that import's columns, so the zip can be brought into another Lumenyard.
// Everything is read in one consistent snapshot and streamed: rows go from the database cursor to the
// workbook to the zip to the answer, and the writer waits whenever the reader is slower, so memory does not
// grow with the ledger. Users go out without password hashes or session data; no setting holds a secret.
import { once } from 'node:events'
import { PassThrough, type Writable } from 'node:stream'
import { ZipArchive, type Archiver } from 'archiver'
import type { DataSource, QueryRunner } from 'typeorm'
import { audit, type AuditActor } from '../auditService.js'
import { ITEM_COLUMNS, columnOf, itemColumnAllowed } from '../catalogSheet.js'
import { OPENING_STOCK_GUIDE, OPENING_STOCK_SPEC } from '../imports/openingStockImport.js'
import { ACCOUNTS_GUIDE, ACCOUNTS_SPEC } from '../imports/accountsImport.js'
import { PURCHASE_ORDERS_GUIDE, PURCHASE_ORDERS_SPEC } from '../imports/purchaseOrdersImport.js'
import { USAGE_HISTORY_GUIDE, USAGE_HISTORY_SPEC } from '../imports/usageHistoryImport.js'
import { VENDOR_ITEMS_GUIDE, VENDOR_ITEMS_SPEC } from '../imports/vendorItemsImport.js'
import type { ImportSpec } from '../imports/importTypes.js'
import { AVERAGES_SPEC } from '../imports/averagesImport.js'
import { PRICE_LEVELS_SPEC, PRICE_RULES_SPEC } from '../imports/pricingImport.js'
import { LEAD_TIMES_SPEC, REORDER_SETTINGS_SPEC } from '../imports/reorderSettingsImport.js'
import { SALES_TAX_SPEC } from '../imports/salesTaxImport.js'
import { VENDORS_SPEC } from '../imports/vendorsImport.js'
import { BINS_SPEC, WAREHOUSES_SPEC } from '../imports/warehousesImport.js'
import { buildXlsx, fieldsSheet, newStreamingBook, openSheet, sheet, type CellInput, type CellKind, type SheetColumn } from './xlsxWriter.js'
import { DAY, col, formatOf, oneOf, v, type ExportPart, type PartColumn, type Raw } from './exportParts.js'
import { LEFT_OUT, RECORD_PARTS } from './recordParts.js'
import { readmeText, readmeWord, type ReadmeLang } from './readmeWords.js'
import { OPEN_PO_STATUSES } from '../../entities/PurchaseOrder.js'
import { USAGE_MOVE_TYPES } from '../reorder/usageQueries.js'
import { ADJUSTMENT_REASONS, BIN_KINDS, MOVE_TYPES } from '../../../shared/catalog.js'
import { ROLES } from '../../../shared/roles.js'
import { localeSchema, unitPreferenceSchema, weightUnitSchema } from '../../../shared/schemas/auth.js'
import { JOB_STATUSES } from '../../../shared/schemas/counter.js'
import { PO_STATUSES } from '../../../shared/schemas/purchasing.js'
import { QUOTE_STATUSES } from '../../../shared/sales/quoteStatus.js'

/** The import that reads a file back in: its name in the README, its spec and what its template says each column takes. */
interface ReadBack { name: string; spec: ImportSpec; guide: Record<string, string> }

const OPENING_STOCK: ReadBack = { name: 'opening stock import', spec: OPENING_STOCK_SPEC, guide: OPENING_STOCK_GUIDE }
const USAGE_HISTORY: ReadBack = { name: 'usage history import', spec: USAGE_HISTORY_SPEC, guide: USAGE_HISTORY_GUIDE }
const ACCOUNTS: ReadBack = { name: 'accounts import', spec: ACCOUNTS_SPEC, guide: ACCOUNTS_GUIDE }
const VENDOR_ITEMS: ReadBack = { name: 'vendors with their items import', spec: VENDOR_ITEMS_SPEC, guide: VENDOR_ITEMS_GUIDE }
const PURCHASE_ORDERS: ReadBack = { name: 'open purchase orders import', spec: PURCHASE_ORDERS_SPEC, guide: PURCHASE_ORDERS_GUIDE }
const ITEM_IMPORT_NAME = 'item import'

/** The columns of an import, in its own order and headers: the exported file reads back in. */
function importColumns(by: ReadBack, kinds: Record<string, { kind: CellKind; key: string; about: string; places?: number }>): PartColumn[] {
  return by.spec.columns.filter((c) => kinds[c.key]).map((c) => ({
    header: c.header, ...kinds[c.key], value: v(kinds[c.key].key), allowed: by.guide[c.key] || undefined, readBy: by.name,
  }))
}

/**
 * Files written as plain records that an import also reads: each column whose header the import's template has
 * is read back by it (the round trip brings the zip in through these imports).
 */
const READ_AS_RECORDS: Readonly<Record<string, { name: string; spec: ImportSpec }>> = {
  warehouses: { name: 'warehouses import', spec: WAREHOUSES_SPEC },
  bins: { name: 'bins import', spec: BINS_SPEC },
  'averages-and-minimums': { name: 'averages and minimums import', spec: AVERAGES_SPEC },
  'price-levels': { name: 'price levels import', spec: PRICE_LEVELS_SPEC },
  'price-rules': { name: 'price rules import', spec: PRICE_RULES_SPEC },
  vendors: { name: 'vendors import', spec: VENDORS_SPEC },
  'reorder-settings': { name: 'reorder settings import', spec: REORDER_SETTINGS_SPEC },
  'lead-times': { name: 'lead times import', spec: LEAD_TIMES_SPEC },
  'sales-tax': { name: 'sales tax import', spec: SALES_TAX_SPEC },
}

function readBackAsRecords(part: ExportPart): ExportPart {
  const by = READ_AS_RECORDS[part.file]
  if (!by) return part
  const headers = new Set(by.spec.columns.map((c) => c.header.toLowerCase()))
  return { ...part, columns: part.columns.map((c) => (headers.has(c.header.toLowerCase()) ? { ...c, readBy: by.name } : c)) }
}

export type { ExportPart } from './exportParts.js'

export const EXPORT_PARTS: readonly ExportPart[] = ([
  {
    file: 'items', sheet: 'Items',
    about: 'The catalog, one row per item, in the columns of the item import (Stock → Import items reads this file back).',
    columns: ITEM_COLUMNS.map((c) => ({
      header: c.header,
      kind: c.kind === 'decimal' ? 'decimal' : c.kind,
      places: c.places,
      about: c.required ? 'As in the item import template (required there).' : 'As in the item import template.',
      allowed: itemColumnAllowed(c) || undefined,
      readBy: ITEM_IMPORT_NAME,
      value: (row: Raw) => (c.kind === 'boolean' ? Boolean(Number(row[columnOf(c.key)])) : (row[columnOf(c.key)] as CellInput)),
    })),
    sql: 'SELECT * FROM items ORDER BY sku',
  },
  {
    file: 'warehouses', sheet: 'Warehouses',
    about: 'Each warehouse.',
    columns: [
      col('Code', 'text', 'code', 'The warehouse code used in every other file.'),
      col('Name', 'text', 'name', 'Its name.'),
      col('Address', 'text', 'address', 'Where it is.'),
      col('Bin pattern', 'text', 'bin_pattern', 'How its bin codes are made.'),
      col('Active', 'boolean', 'active', 'no: taken out of use.'),
    ],
    sql: 'SELECT code, name, address, bin_pattern, active FROM warehouses ORDER BY code',
  },
  {
    file: 'bins', sheet: 'Bins',
    about: 'Each bin of each warehouse.',
    columns: [
      col('Warehouse', 'text', 'warehouse', 'The warehouse code.'),
      col('Bin', 'text', 'code', 'The bin code, unique within its warehouse.'),
      oneOf(col('Kind', 'text', 'kind', 'What the bin is for; transit bins hold stock on the way between warehouses.'), BIN_KINDS),
      col('Active', 'boolean', 'active', 'no: taken out of use.'),
    ],
    sql: 'SELECT w.code AS warehouse, b.code, b.kind, b.active FROM bins b JOIN warehouses w ON w.id = b.warehouse_id ORDER BY w.code, b.code',
  },
  {
    file: 'lots', sheet: 'Lots',
    about: 'Production lots of items (blocks of one lot share a tint).',
    columns: [
      col('SKU', 'text', 'sku', 'The item.'),
      col('Lot', 'text', 'code', 'The lot code as printed by the maker.'),
      col('Received', 'datetime', 'received_at', 'When it first came in (UTC).'),
      col('Vendor code', 'text', 'vendor', 'Who supplied it, when known.'),
      col('Tint note', 'text', 'tint_note', 'A note on the lot\'s tint.'),
    ],
    sql: 'SELECT i.sku, l.code, l.received_at, v.code AS vendor, l.tint_note FROM lots l JOIN items i ON i.id = l.item_id LEFT JOIN vendors v ON v.id = l.vendor_id ORDER BY i.sku, l.code',
  },
  {
    file: 'stock-by-bin', sheet: 'Stock by bin',
    about: 'Stock on hand by item, warehouse, bin and lot at each item\'s average cost in that warehouse, in the columns of the opening-stock import (Admin → Bring your data in reads this file back). Stock on the way between warehouses is in stock-on-the-way.xlsx.',
    columns: [
      ...importColumns(OPENING_STOCK, {
        sku: { kind: 'text', key: 'sku', about: 'The item.' },
        warehouse: { kind: 'text', key: 'warehouse', about: 'The warehouse code.' },
        bin: { kind: 'text', key: 'bin', about: 'The bin code.' },
        lot: { kind: 'text', key: 'lot', about: 'The production lot (blank: not kept by lot).' },
        quantity: { kind: 'integer', key: 'on_hand', about: 'On hand, in the item\'s stock unit.' },
        unitCost: { kind: 'cost', key: 'avg_cost', about: 'The moving-average cost of one stock unit in that warehouse.' },
      }),
      col('Value', 'money', 'value', 'Quantity × unit cost (the import skips this column).'),
    ],
    sql: `SELECT i.sku, w.code AS warehouse, b.code AS bin, l.code AS lot, s.on_hand, COALESCE(iw.avg_cost, 0) AS avg_cost,
            ROUND(s.on_hand * COALESCE(iw.avg_cost, 0), 2) AS value
          FROM stock_balances s JOIN items i ON i.id = s.item_id JOIN bins b ON b.id = s.bin_id JOIN warehouses w ON w.id = s.warehouse_id
          LEFT JOIN lots l ON l.id = s.lot_id LEFT JOIN item_warehouses iw ON iw.item_id = s.item_id AND iw.warehouse_id = s.warehouse_id
          WHERE s.on_hand <> 0 AND b.kind <> 'transit' ORDER BY w.code, b.code, i.sku, l.code`,
  },
  {
    file: 'stock-on-the-way', sheet: 'On the way',
    about: 'Stock shipped from one warehouse and not yet put away at the other (in the transit bins).',
    columns: [
      col('SKU', 'text', 'sku', 'The item.'),
      col('Warehouse', 'text', 'warehouse', 'The warehouse whose transit bin holds it.'),
      col('Bin', 'text', 'bin', 'The transit bin.'),
      col('Lot', 'text', 'lot', 'The production lot.'),
      col('Quantity', 'integer', 'on_hand', 'In the item\'s stock unit.'),
    ],
    sql: `SELECT i.sku, w.code AS warehouse, b.code AS bin, l.code AS lot, s.on_hand
          FROM stock_balances s JOIN items i ON i.id = s.item_id JOIN bins b ON b.id = s.bin_id JOIN warehouses w ON w.id = s.warehouse_id
          LEFT JOIN lots l ON l.id = s.lot_id WHERE s.on_hand <> 0 AND b.kind = 'transit' ORDER BY w.code, i.sku`,
  },
  {
    file: 'averages-and-minimums', sheet: 'Averages',
    about: 'Per item and warehouse: the moving-average cost and the manual minimum, in the columns of the averages and minimums import (read back after the stock, it keeps the average of a warehouse that holds none of the item now).',
    columns: [
      col('SKU', 'text', 'sku', 'The item.'),
      col('Warehouse', 'text', 'warehouse', 'The warehouse code.'),
      col('Average cost', 'cost', 'avg_cost', 'Moving-average cost of one stock unit.'),
      col('Manual minimum', 'integer', 'min_qty', 'The minimum set by hand (blank: none).'),
    ],
    sql: 'SELECT i.sku, w.code AS warehouse, iw.avg_cost, iw.min_qty FROM item_warehouses iw JOIN items i ON i.id = iw.item_id JOIN warehouses w ON w.id = iw.warehouse_id ORDER BY i.sku, w.code',
  },
  {
    file: 'moves', sheet: 'Moves',
    about: 'Stock movements: every move of stock, oldest first. The sum of a bin\'s moves is its stock.',
    columns: [
      col('Move', 'integer', 'id', 'The move\'s number.'),
      col('At', 'datetime', 'at', 'When (UTC).'),
      oneOf(col('Type', 'text', 'move_type', 'What moved the stock.'), MOVE_TYPES),
      col('SKU', 'text', 'sku', 'The item.'),
      col('Warehouse', 'text', 'warehouse', 'The warehouse code.'),
      col('Bin', 'text', 'bin', 'The bin code.'),
      col('Lot', 'text', 'lot', 'The production lot.'),
      col('Quantity', 'integer', 'qty', 'Stock units in (positive) or out (negative).'),
      col('Unit cost', 'cost', 'unit_cost', 'Cost of one stock unit on this move.'),
      col('Document', 'text', 'doc_type', 'What the move belongs to (a receipt, a pick list, a count, a transfer…).'),
      col('Document id', 'integer', 'doc_id', 'That document\'s number.'),
      oneOf(col('Reason', 'text', 'reason', 'Why (adjustments).'), ADJUSTMENT_REASONS),
      col('Note', 'text', 'note', 'A note typed with the move.'),
      col('By', 'text', 'username', 'Who made it (user name).'),
    ],
    sql: `SELECT STRAIGHT_JOIN m.id, m.at, m.move_type, i.sku, w.code AS warehouse, b.code AS bin, l.code AS lot, m.qty, m.unit_cost, m.doc_type, m.doc_id, m.reason, m.note, u.username
          FROM stock_moves m JOIN items i ON i.id = m.item_id JOIN warehouses w ON w.id = m.warehouse_id JOIN bins b ON b.id = m.bin_id
          LEFT JOIN lots l ON l.id = m.lot_id LEFT JOIN users u ON u.id = m.user_id ORDER BY m.id`,
  },
  {
    file: 'usage-history', sheet: 'Usage history',
    about: 'Usage per item, warehouse and day: the issues and picks of the ledger added to any usage history brought in earlier, in the columns of the usage-history import. Read back into another Lumenyard, its reorder points start from the same use.',
    columns: importColumns(USAGE_HISTORY, {
      sku: { kind: 'text', key: 'sku', about: 'The item.' },
      warehouse: { kind: 'text', key: 'warehouse', about: 'The warehouse code.' },
      day: { kind: 'text', key: 'day', about: 'The day, YYYY-MM-DD.' },
      quantity: { kind: 'integer', key: 'qty', about: 'Stock units used that day (issues and picks less what was put back the same way).' },
    }),
    // The same sums the reorder statistics read (usageQueries.ts): issues and picks by day, plus imported history,
    // summed once by ids (a second grouping by codes after the joins doubled the database's work on a long ledger).
    sql: `SELECT i.sku, w.code AS warehouse, ${DAY('u.day')} AS day, u.qty FROM (
            SELECT item_id, warehouse_id, day, SUM(qty) AS qty FROM (
              SELECT m.item_id, m.warehouse_id, DATE(m.at) AS day, -m.qty AS qty FROM stock_moves m
               WHERE m.move_type IN (${USAGE_MOVE_TYPES.map((t) => `'${t}'`).join(', ')})
              UNION ALL SELECT h.item_id, h.warehouse_id, h.day, h.qty FROM usage_history h) x
            GROUP BY item_id, warehouse_id, day HAVING qty <> 0) u
          JOIN items i ON i.id = u.item_id JOIN warehouses w ON w.id = u.warehouse_id ORDER BY u.day, i.sku, w.code`,
  },
  {
    file: 'price-levels', sheet: 'Price levels',
    about: 'Selling price levels an account can be given (the accounts file names them by code).',
    columns: [
      col('Code', 'text', 'code', 'The level\'s code.'),
      col('Name', 'text', 'name', 'Its name.'),
      col('Percent off', 'decimal', 'percent_off', 'Percent off list price.', 2),
      col('Active', 'boolean', 'active', 'no: no longer offered.'),
    ],
    sql: 'SELECT code, name, percent_off, active FROM price_levels ORDER BY code',
  },
  {
    file: 'accounts', sheet: 'Accounts',
    about: 'Contractor accounts with their price level and tax exemption, in the columns of the accounts import.',
    columns: [
      ...importColumns(ACCOUNTS, {
        code: { kind: 'text', key: 'code', about: 'The account code.' },
        name: { kind: 'text', key: 'name', about: 'The contractor\'s name.' },
        contactName: { kind: 'text', key: 'contact_name', about: 'Who to ask for.' },
        email: { kind: 'text', key: 'email', about: 'E-mail.' },
        phone: { kind: 'text', key: 'phone', about: 'Phone.' },
        address: { kind: 'text', key: 'address', about: 'Address.' },
        notes: { kind: 'text', key: 'notes', about: 'Notes.' },
        priceLevel: { kind: 'text', key: 'price_level', about: 'The price level code (blank: list prices).' },
        exemptCertificate: { kind: 'text', key: 'exempt_certificate', about: 'Tax-exempt certificate number.' },
        exemptUntil: { kind: 'text', key: 'exempt_until', about: 'Last day the certificate holds, YYYY-MM-DD.' },
      }),
      col('Active', 'boolean', 'active', 'no: closed (the import skips this column).'),
    ],
    sql: `SELECT c.code, c.name, c.contact_name, c.email, c.phone, c.address, c.notes, pl.code AS price_level, t.exempt_certificate,
            ${DAY('t.exempt_until')} AS exempt_until, c.active
          FROM customers c LEFT JOIN customer_terms t ON t.customer_id = c.id LEFT JOIN price_levels pl ON pl.id = t.price_level_id ORDER BY c.code`,
  },
  {
    file: 'jobs', sheet: 'Jobs',
    about: 'Contractors\' jobs.',
    columns: [
      col('Account code', 'text', 'account', 'Whose job.'),
      col('Job', 'text', 'name', 'The job\'s name.'),
      col('Site address', 'text', 'site_address', 'Where the work is.'),
      oneOf(col('Status', 'text', 'status', 'Where the job stands.'), JOB_STATUSES),
      col('Due', 'text', 'due', 'When it is due, YYYY-MM-DD.'),
      col('Notes', 'text', 'notes', 'Notes.'),
      col('Created', 'datetime', 'created_at', 'When it was entered (UTC).'),
    ],
    sql: `SELECT c.code AS account, j.name, j.site_address, j.status, ${DAY('j.due_date')} AS due, j.notes, j.created_at FROM jobs j JOIN customers c ON c.id = j.customer_id ORDER BY c.code, j.id`,
  },
  {
    file: 'vendors', sheet: 'Vendors',
    about: 'Vendors.',
    columns: [
      col('Vendor code', 'text', 'code', 'The vendor code used in every other file.'),
      col('Name', 'text', 'name', 'Its name.'),
      col('Contact', 'text', 'contact_name', 'Who to ask for.'),
      col('E-mail', 'text', 'email', 'Where orders go.'),
      col('Phone', 'text', 'phone', 'Phone.'),
      col('Address', 'text', 'address', 'Address.'),
      col('Terms', 'text', 'terms', 'Payment terms.'),
      { ...col('Currency', 'text', 'currency', 'The currency of its prices.'), allowed: 'Three-letter ISO 4217 code (USD, CAD…).' },
      col('Lead time days', 'integer', 'lead_time_days', 'Usual days from order to arrival.'),
      col('Active', 'boolean', 'active', 'no: no longer bought from.'),
    ],
    sql: 'SELECT code, name, contact_name, email, phone, address, terms, currency, lead_time_days, active FROM vendors ORDER BY code',
  },
  {
    file: 'vendor-items', sheet: 'Vendor items',
    about: 'What each vendor sells us, in the columns of the vendors-with-items import.',
    columns: importColumns(VENDOR_ITEMS, {
      vendor: { kind: 'text', key: 'vendor', about: 'The vendor code.' },
      vendorName: { kind: 'text', key: 'vendor_name', about: 'The vendor\'s name.' },
      sku: { kind: 'text', key: 'sku', about: 'Our item.' },
      vendorSku: { kind: 'text', key: 'vendor_sku', about: 'The vendor\'s own code for it.' },
      packQty: { kind: 'integer', key: 'pack_qty', about: 'Stock units in one of the vendor\'s packs.' },
      minOrder: { kind: 'integer', key: 'min_order_qty', about: 'The fewest packs the vendor takes an order for.' },
      unitCost: { kind: 'cost', key: 'unit_cost', about: 'Cost of one stock unit from this vendor.' },
      leadTimeDays: { kind: 'integer', key: 'lead_time_days', about: 'Days from order to arrival for this item: its own, else the vendor\'s usual (what reorder points use).' },
      preferred: { kind: 'boolean', key: 'preferred', about: 'yes: the vendor reorder suggestions use for this item.' },
    }),
    sql: `SELECT v.code AS vendor, v.name AS vendor_name, i.sku, vi.vendor_sku, vi.pack_qty, vi.min_order_qty, vi.unit_cost, COALESCE(vi.lead_time_days, v.lead_time_days) AS lead_time_days, vi.preferred
          FROM vendor_items vi JOIN vendors v ON v.id = vi.vendor_id JOIN items i ON i.id = vi.item_id ORDER BY v.code, i.sku`,
  },
  {
    file: 'open-purchase-orders', sheet: 'Open purchase orders',
    about: 'Lines of the orders approved or sent to vendors and not yet fully received (what is on order), in the columns of the open purchase orders import.',
    columns: importColumns(PURCHASE_ORDERS, {
      number: { kind: 'text', key: 'number', about: 'The order number.' },
      vendor: { kind: 'text', key: 'vendor', about: 'The vendor code.' },
      warehouse: { kind: 'text', key: 'warehouse', about: 'Where it arrives.' },
      orderedOn: { kind: 'text', key: 'ordered_on', about: 'The day it was sent, YYYY-MM-DD.' },
      expected: { kind: 'text', key: 'expected', about: 'The day the vendor said, YYYY-MM-DD.' },
      sku: { kind: 'text', key: 'sku', about: 'The item.' },
      qty: { kind: 'integer', key: 'qty_ordered', about: 'Stock units ordered.' },
      received: { kind: 'integer', key: 'qty_received', about: 'Stock units received so far.' },
      unitCost: { kind: 'cost', key: 'unit_cost', about: 'Cost agreed per stock unit.' },
    }),
    sql: `SELECT o.number, v.code AS vendor, w.code AS warehouse, ${DAY('COALESCE(o.sent_at, o.approved_at, o.created_at)')} AS ordered_on, ${DAY('o.expected_date')} AS expected,
            i.sku, l.qty_ordered, l.qty_received, l.unit_cost
          FROM purchase_orders o JOIN purchase_order_lines l ON l.po_id = o.id JOIN vendors v ON v.id = o.vendor_id JOIN warehouses w ON w.id = o.warehouse_id JOIN items i ON i.id = l.item_id
          WHERE o.status IN (${OPEN_PO_STATUSES.map((st) => `'${st}'`).join(', ')}) ORDER BY o.number, l.line_no`,
  },
  {
    file: 'purchase-orders', sheet: 'Purchase orders',
    about: 'Every purchase order, whatever its status.',
    columns: [
      col('Order number', 'text', 'number', 'The order number.'),
      col('Vendor code', 'text', 'vendor', 'The vendor.'),
      col('Ship to warehouse', 'text', 'warehouse', 'Where it arrives.'),
      oneOf(col('Status', 'text', 'status', 'Where the order stands.'), PO_STATUSES),
      { ...col('Currency', 'text', 'currency', 'The currency of its prices.'), allowed: 'Three-letter ISO 4217 code (USD, CAD…).' },
      col('Expected', 'text', 'expected', 'The day the vendor said, YYYY-MM-DD.'),
      col('Total', 'money', 'total', 'The order\'s total.'),
      col('Created', 'datetime', 'created_at', 'When it was made (UTC).'),
      col('Sent', 'datetime', 'sent_at', 'When it went to the vendor (UTC).'),
      col('Notes', 'text', 'notes', 'Notes.'),
    ],
    sql: `SELECT o.number, v.code AS vendor, w.code AS warehouse, o.status, o.currency, ${DAY('o.expected_date')} AS expected, o.total, o.created_at, o.sent_at, o.notes
          FROM purchase_orders o JOIN vendors v ON v.id = o.vendor_id JOIN warehouses w ON w.id = o.warehouse_id ORDER BY o.number`,
  },
  {
    file: 'purchase-order-lines', sheet: 'Purchase order lines',
    about: 'Every line of every purchase order.',
    columns: [
      col('Order number', 'text', 'number', 'The order.'),
      col('Line', 'integer', 'line_no', 'The line\'s place on the order.'),
      col('SKU', 'text', 'sku', 'The item.'),
      col('Vendor SKU', 'text', 'vendor_sku', 'The vendor\'s code.'),
      col('Description', 'text', 'description', 'As printed on the order.'),
      col('Pack size', 'integer', 'pack_qty', 'Stock units per pack.'),
      col('Packs ordered', 'integer', 'packs_ordered', 'Packs ordered.'),
      col('Quantity ordered', 'integer', 'qty_ordered', 'Stock units ordered.'),
      col('Received so far', 'integer', 'qty_received', 'Stock units received.'),
      col('Damaged', 'integer', 'qty_damaged', 'Stock units that arrived damaged.'),
      col('Cost per stock unit', 'cost', 'unit_cost', 'Cost agreed per stock unit.'),
    ],
    sql: `SELECT o.number, l.line_no, i.sku, l.vendor_sku, l.description, l.pack_qty, l.packs_ordered, l.qty_ordered, l.qty_received, l.qty_damaged, l.unit_cost
          FROM purchase_order_lines l JOIN purchase_orders o ON o.id = l.po_id JOIN items i ON i.id = l.item_id ORDER BY o.number, l.line_no`,
  },
  {
    file: 'receipts', sheet: 'Receipts',
    about: 'What arrived against purchase orders, one row per line received.',
    columns: [
      col('Order number', 'text', 'number', 'The order.'),
      col('Received', 'datetime', 'received_at', 'When (UTC).'),
      col('By', 'text', 'username', 'Who received it.'),
      col('SKU', 'text', 'sku', 'The item.'),
      col('Bin', 'text', 'bin', 'Where it was put.'),
      col('Lot', 'text', 'lot', 'The production lot.'),
      col('Quantity', 'integer', 'qty', 'Stock units received.'),
      col('Damaged', 'integer', 'qty_damaged', 'Stock units damaged.'),
      col('Reason', 'text', 'reason', 'Why the quantity differed, when it did.'),
    ],
    sql: `SELECT o.number, r.received_at, u.username, i.sku, b.code AS bin, lt.code AS lot, rl.qty, rl.qty_damaged, rl.reason
          FROM po_receipt_lines rl JOIN po_receipts r ON r.id = rl.receipt_id JOIN purchase_orders o ON o.id = r.po_id JOIN items i ON i.id = rl.item_id
          LEFT JOIN bins b ON b.id = rl.bin_id LEFT JOIN lots lt ON lt.id = rl.lot_id LEFT JOIN users u ON u.id = r.received_by ORDER BY r.received_at, rl.id`,
  },
  {
    file: 'quotes', sheet: 'Quotes',
    about: 'Quotes given to contractors.',
    columns: [
      col('Quote', 'text', 'number', 'The quote number.'),
      col('Revision', 'integer', 'revision', 'Its revision.'),
      oneOf(col('Status', 'text', 'status', 'Where it stands.'), QUOTE_STATUSES),
      col('Account code', 'text', 'account', 'For whom.'),
      col('Job', 'text', 'job', 'For which job.'),
      col('Warehouse', 'text', 'warehouse', 'Supplied from.'),
      col('Quoted on', 'text', 'quoted_on', 'YYYY-MM-DD.'),
      col('Valid until', 'text', 'valid_until', 'YYYY-MM-DD.'),
      col('Price level', 'text', 'price_level_code', 'The price level used.'),
      col('Subtotal', 'money', 'subtotal', 'Before tax.'),
      col('Tax rate', 'decimal', 'tax_rate', 'Percent.', 3),
      col('Tax', 'money', 'tax_amount', 'Tax.'),
      col('Amount due', 'money', 'amount_due', 'Subtotal plus tax.'),
    ],
    sql: `SELECT q.number, q.revision, q.status, c.code AS account, j.name AS job, w.code AS warehouse, ${DAY('q.quoted_on')} AS quoted_on, ${DAY('q.valid_until')} AS valid_until,
            q.price_level_code, q.subtotal, q.tax_rate, q.tax_amount, q.amount_due
          FROM quotes q LEFT JOIN customers c ON c.id = q.customer_id LEFT JOIN jobs j ON j.id = q.job_id LEFT JOIN warehouses w ON w.id = q.warehouse_id ORDER BY q.number, q.revision`,
  },
  {
    file: 'quote-lines', sheet: 'Quote lines',
    about: 'Every line of every quote.',
    columns: [
      col('Quote', 'text', 'number', 'The quote number.'),
      col('Revision', 'integer', 'revision', 'Its revision.'),
      col('Line', 'integer', 'line_no', 'The line\'s place.'),
      col('SKU', 'text', 'sku', 'The item.'),
      col('Description', 'text', 'description', 'As printed.'),
      col('Quantity', 'integer', 'qty', 'Stock units quoted.'),
      col('Packs', 'integer', 'packs', 'Packs, when sold by the pack.'),
      col('Unit price', 'cost', 'unit_price', 'Price of one stock unit.'),
      col('Extension', 'money', 'extension', 'Quantity × price.'),
    ],
    sql: `SELECT q.number, q.revision, l.line_no, i.sku, l.description, l.qty, l.packs, l.unit_price, l.extension
          FROM quote_lines l JOIN quotes q ON q.id = l.quote_id LEFT JOIN items i ON i.id = l.item_id ORDER BY q.number, q.revision, l.line_no`,
  },
  ...RECORD_PARTS,
  {
    file: 'users', sheet: 'Users',
    about: 'People who sign in, with their roles. No passwords or sign-in sessions are ever exported.',
    columns: [
      col('User name', 'text', 'username', 'What they sign in with.'),
      col('Name', 'text', 'display_name', 'Their name as shown.'),
      col('E-mail', 'text', 'email', 'E-mail.'),
      { ...col('Roles', 'text', 'roles', 'What they may do.'), allowed: `One or more of ${ROLES.join(', ')}, separated by commas.` },
      col('Active', 'boolean', 'active', 'no: can no longer sign in.'),
      oneOf(col('Length unit', 'text', 'unit_preference', 'Lengths shown in inches or millimetres.'), unitPreferenceSchema.options),
      oneOf(col('Weight unit', 'text', 'weight_unit', 'Weights shown in pounds or kilograms.'), weightUnitSchema.options),
      oneOf(col('Language', 'text', 'locale', 'The language of their screens and documents.'), localeSchema.options),
      col('Last sign-in', 'datetime', 'last_sign_in_at', 'UTC.'),
    ],
    sql: 'SELECT username, display_name, email, roles, active, unit_preference, weight_unit, locale, last_sign_in_at FROM users ORDER BY username',
  },
  {
    file: 'settings', sheet: 'Settings',
    about: 'The company profile every document carries, and the administrator\'s settings.',
    columns: [
      col('Setting', 'text', 'k', 'Which one.'),
      col('Value', 'text', 'value', 'Its value.'),
    ],
    sql: `SELECT k, value FROM (
            SELECT 1 AS o, 'company.legal_name' AS k, legal_name AS value FROM company_profile
            UNION ALL SELECT 2, 'company.bill_to_address', bill_to_address FROM company_profile
            UNION ALL SELECT 3, 'company.ship_to_address', ship_to_address FROM company_profile
            UNION ALL SELECT 4, 'company.phone', phone FROM company_profile
            UNION ALL SELECT 5, 'company.email', email FROM company_profile
            UNION ALL SELECT 6, 'company.reply_to', reply_to FROM company_profile
            UNION ALL SELECT 7, 'company.tax_number', tax_number FROM company_profile
            UNION ALL SELECT 8, 'company.document_unit', document_unit FROM company_profile
            UNION ALL SELECT 9, 'company.logo', IF(logo IS NULL, 'no', 'yes: logo file beside this one') FROM company_profile
            UNION ALL SELECT 10, setting_key, value FROM app_settings WHERE setting_key NOT REGEXP 'secret|password|token|credential'
          ) s ORDER BY o, k`,
  },
] satisfies ExportPart[]).map(readBackAsRecords)

/** Rows written, per file. */
export type ExportCounts = Record<string, number>

export const README_FILE = 'README.xlsx'

interface ReadmeColumn { file: string; sheet: string; column: string; meaning: string; allowed: string; readBy: string }

/**
 * The README workbook, the zip's first entry: on its first sheet one row per column of every file (what it
 * means, what it allows, which import reads it back), then the files, what is left out and why, and general notes.
 */
export async function readmeWorkbook(parts: readonly ExportPart[], at: Date, lang: ReadmeLang = 'en'): Promise<Buffer> {
  const w = (key: Parameters<typeof readmeWord>[1], values?: Record<string, string>) => readmeWord(lang, key, values)
  const text = (english: string) => readmeText(lang, english)
  const rows: ReadmeColumn[] = parts.flatMap((p) => p.columns.map((c) => ({
    file: `${p.file}.xlsx`, sheet: p.sheet, column: c.header, meaning: text(c.about), allowed: formatOf(c, lang),
    readBy: c.readBy ? w('yesThe', { name: text(c.readBy) }) : w('no'),
  })))
  const readers = (p: ExportPart) => [...new Set(p.columns.flatMap((c) => (c.readBy ? [c.readBy] : [])))]
  return buildXlsx(
    sheet<ReadmeColumn>({
      name: w('columnsTab'), title: w('columnsTitle'),
      columns: [
        { header: w('file'), kind: 'text', width: 28, value: (r) => r.file },
        { header: w('sheet'), kind: 'text', width: 22, value: (r) => r.sheet },
        { header: w('column'), kind: 'text', width: 26, value: (r) => r.column },
        { header: w('meaning'), kind: 'text', width: 60, value: (r) => r.meaning },
        { header: w('allowed'), kind: 'text', width: 60, value: (r) => r.allowed },
        { header: w('readBy'), kind: 'text', width: 34, value: (r) => r.readBy },
      ],
      rows,
    }),
    sheet<ExportPart>({
      name: w('filesTab'), title: w('filesTitle'),
      columns: [
        { header: w('file'), kind: 'text', width: 28, value: (p) => `${p.file}.xlsx` },
        { header: w('sheet'), kind: 'text', width: 22, value: (p) => p.sheet },
        { header: w('holds'), kind: 'text', width: 90, value: (p) => text(p.about) },
        { header: w('readBackBy'), kind: 'text', width: 34, value: (p) => readers(p).map((r) => w('the', { name: text(r) })).join(', ') || w('noImport') },
      ],
      rows: parts,
    }),
    sheet<{ table: string; why: string }>({
      name: w('leftOutTab'), title: w('leftOutTitle'),
      columns: [
        { header: w('table'), kind: 'text', width: 26, value: (l) => l.table },
        { header: w('why'), kind: 'text', width: 90, value: (l) => text(l.why) },
      ],
      rows: LEFT_OUT,
    }),
    fieldsSheet({
      name: w('aboutTab'), title: w('aboutTitle'),
      fields: [
        { label: w('written'), kind: 'datetime', value: at },
        ...(['moment', 'files', 'readingBack', 'units', 'notIncluded'] as const).map((k) => ({ label: w(`${k}Label`), kind: 'text' as const, value: w(k) })),
      ],
    }),
  )
}

/** Waits while the destination is full, so rows are read no faster than they are taken. */
async function whenRoom(out: Writable): Promise<void> {
  if (out.writableNeedDrain) await once(out, 'drain')
  else await new Promise((resolve) => setImmediate(resolve))
}

/** Rows fetched ahead of the writer: TypeORM's stream asks for 16 at a time, and the socket stops and starts. */
const ROWS_AHEAD = 1000

/** The query's rows from the runner's own connection, as they arrive. */
async function rowsOf(runner: QueryRunner, sql: string): Promise<AsyncIterable<Raw>> {
  const conn = (await runner.connect()) as { query(sql: string): { stream(o: { highWaterMark: number }): AsyncIterable<Raw> } }
  return conn.query(sql).stream({ highWaterMark: ROWS_AHEAD })
}

/** How far an export has gone: the rows it will write (counted first, in the same snapshot), then rows as written. */
export interface ExportProgress {
  total(rows: number): void
  advance(rows: number): void
}

async function writePart(runner: QueryRunner, archive: Archiver, out: Writable, part: ExportPart, progress?: ExportProgress): Promise<number> {
  const entry = new PassThrough()
  archive.append(entry, { name: `${part.file}.xlsx`, store: true })
  const book = newStreamingBook(entry)
  const sheet = openSheet<Raw>(book, { name: part.sheet, columns: part.columns as SheetColumn<Raw>[] })
  let n = 0
  for await (const row of await rowsOf(runner, part.sql)) {
    sheet.add(row)
    if (++n % 200 === 0) await sheet.room()
    if (n % 1000 === 0) {
      progress?.advance(1000)
      await whenRoom(out)
    }
  }
  sheet.done()
  await book.commit()
  progress?.advance(n % 1000)
  return n
}

/** Every row the parts will write, counted in the export's own snapshot (so the count is the rows written). */
async function countRows(runner: QueryRunner): Promise<number> {
  let total = 0
  for (const part of EXPORT_PARTS) total += Number(((await runner.query(`SELECT COUNT(*) AS n FROM (${part.sql}) counted`)) as { n: string }[])[0].n)
  return total
}

/**
 * Streams the zip to `out`. Reads in one read-only transaction with a consistent snapshot, so every file
 * describes the same moment. Answers the rows written per file.
 */
export async function streamBusinessExport(ds: DataSource, out: Writable, onPart?: (file: string, rows: number) => void, lang: ReadmeLang = 'en', progress?: ExportProgress): Promise<ExportCounts> {
  const at = new Date()
  const archive = new ZipArchive({ zlib: { level: 6 } })
  const failed = new Promise<never>((_resolve, reject) => archive.on('error', reject))
  failed.catch(() => undefined)
  archive.pipe(out)
  const runner = ds.createQueryRunner()
  const counts: ExportCounts = {}
  try {
    await runner.connect()
    await runner.query('SET SESSION TRANSACTION ISOLATION LEVEL REPEATABLE READ')
    await runner.query('START TRANSACTION WITH CONSISTENT SNAPSHOT, READ ONLY')
    if (progress) progress.total(await countRows(runner))
    archive.append(await readmeWorkbook(EXPORT_PARTS, at, lang), { name: README_FILE, store: true })
    for (const part of EXPORT_PARTS) {
      counts[part.file] = await Promise.race([writePart(runner, archive, out, part, progress), failed])
      onPart?.(part.file, counts[part.file])
    }
    const logo = (await runner.query('SELECT logo, logo_type FROM company_profile WHERE logo IS NOT NULL LIMIT 1')) as { logo: Buffer; logo_type: string }[]
    if (logo[0]) archive.append(logo[0].logo, { name: `logo.${logo[0].logo_type.includes('png') ? 'png' : 'jpg'}` })
    await runner.query('COMMIT')
    await Promise.race([archive.finalize(), failed])
  } catch (err) {
    archive.abort()
    throw err
  } finally {
    await runner.release()
  }
  return counts
}

export const businessExportName = (at = new Date()) => `lumenyard-everything-${at.toISOString().slice(0, 10)}.zip`

/** The download with its README in `lang`, and an audit entry for it (who, when, the rows of each file, and whether it finished). */
export async function exportBusiness(ds: DataSource, actor: AuditActor, out: Writable, lang: ReadmeLang = 'en', progress?: ExportProgress): Promise<ExportCounts> {
  const started = Date.now()
  let counts: ExportCounts = {}
  let finished = false
  try {
    counts = await streamBusinessExport(ds, out, (file, rows) => (counts[file] = rows), lang, progress)
    finished = true
    return counts
  } finally {
    await ds.transaction((em) => audit(em, actor, 'business.export', 'business', null, { finished, ms: Date.now() - started, rows: counts }))
  }
}
