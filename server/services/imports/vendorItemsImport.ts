// Vendors with what they sell us: one row per vendor and item (vendor SKU, pack size, minimum order, cost,
// lead time). A vendor code not yet in Lumenyard is added with the row's name; an item a vendor already
// sells us is refused (change it on the vendor's page), so the import can be reversed whole.
import type { ImportSpec } from './importTypes.js'

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
