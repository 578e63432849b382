// Vendors with their contact, payment terms, currency and usual lead time, in the columns of the everything-out
// file vendors.xlsx. New vendors only (one already here is changed on its page); bring vendors in before their
// items so the items import finds them with their full details.
import { vendorCreateSchema, type VendorCreateInput } from '../../../shared/schemas/purchasing.js'
import type { ImportSpec } from './importTypes.js'
import { cellText, distinctOf, filledCells, heldValues } from './importFacts.js'
import { insertRows, recordsImport } from './recordsImport.js'

export const VENDORS_SPEC: ImportSpec = {
  columns: [
    { key: 'code', header: 'Vendor code', aliases: ['Vendor', 'Code'], required: true, kind: 'text' },
    { key: 'name', header: 'Name', aliases: ['Vendor name'], required: true, kind: 'text' },
    { key: 'contactName', header: 'Contact', aliases: ['Contact name'], kind: 'text' },
    { key: 'email', header: 'E-mail', aliases: ['Email'], kind: 'text' },
    { key: 'phone', header: 'Phone', kind: 'text' },
    { key: 'address', header: 'Address', kind: 'text' },
    { key: 'terms', header: 'Terms', aliases: ['Payment terms'], kind: 'text' },
    { key: 'currency', header: 'Currency', kind: 'text' },
    { key: 'leadTimeDays', header: 'Lead time days', aliases: ['Lead time'], kind: 'integer' },
    { key: 'active', header: 'Active', kind: 'boolean' },
  ],
  maxRows: 5_000,
  maxColumns: 20,
}

export const VENDORS_GUIDE: Record<string, string> = {
  code: 'Your code for the vendor (letters, digits, . _ -; up to 20). A code already in Lumenyard is refused.',
  name: 'The vendor\'s name as it goes on purchase orders.',
  contactName: 'Who takes your orders.',
  email: 'Where purchase orders are sent.',
  terms: 'Payment terms as you agreed them, e.g. 30 days net (up to 40 characters).',
  currency: 'The ISO 4217 code of the currency you pay in, e.g. USD (blank: USD).',
  leadTimeDays: 'Usual days from order to arrival, 0 to 365 (blank: 14). An item\'s own lead time goes in the vendor items file.',
  active: 'no for a vendor you no longer buy from (blank: yes).',
}

export const vendorsImport = recordsImport<VendorCreateInput, object>({
  kind: 'vendors',
  spec: VENDORS_SPEC,
  async facts(em, part, importId) {
    return { held: await heldValues(em, 'vendors', 'code', distinctOf(part, 'code'), importId) }
  },
  read(values, _facts, reader) {
    const parsed = vendorCreateSchema.safeParse(filledCells(values))
    if (!parsed.success) {
      reader.issues(parsed.error.issues)
      return null
    }
    return parsed.data
  },
  identity: (v) => v.code,
  identityColumn: 'code',
  preview: (v, values) => ({ label: v?.code ?? (cellText(values.code) || null), place: v?.name ?? null }),
  async insert(em, importId, rows) {
    await insertRows(em, 'vendors', ['code', 'name', 'contact_name', 'email', 'phone', 'address', 'terms', 'currency', 'lead_time_days', 'active'], importId, rows,
      (v) => [v.code, v.name, v.contactName ?? null, v.email ?? null, v.phone ?? null, v.address ?? null, v.terms ?? null, v.currency, v.leadTimeDays, v.active ? 1 : 0])
    return { vendors: rows.length }
  },
  async inUse(em, importId) {
    const [used]: { code: string }[] = await em.query(
      `SELECT v.code FROM vendors v WHERE v.import_id = ? AND (EXISTS (SELECT 1 FROM purchase_orders o WHERE o.vendor_id = v.id)
         OR EXISTS (SELECT 1 FROM vendor_items vi WHERE vi.vendor_id = v.id) OR EXISTS (SELECT 1 FROM lots l WHERE l.vendor_id = v.id)
         OR EXISTS (SELECT 1 FROM lead_time_history h WHERE h.vendor_id = v.id)) LIMIT 1`, [importId])
    return used?.code ?? null
  },
  remove: (em, importId) => em.query('DELETE FROM vendors WHERE import_id = ?', [importId]),
})
