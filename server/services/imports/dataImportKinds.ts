// The kinds of import of a business's own data, and the blank template of each (its columns, and a
// guide sheet saying what each column takes).
import type { DataImportKind } from '../../../shared/schemas/dataImports.js'
import { readmeWord, type ReadmeLang } from '../exports/readmeWords.js'
import { buildXlsx, sheet } from '../exports/xlsxWriter.js'
import type { DataImportDefinition } from './dataImports.js'
import { importGuideSheet } from './importGuide.js'
import { OPENING_STOCK_GUIDE, openingStockImport } from './openingStockImport.js'
import { USAGE_HISTORY_GUIDE, usageHistoryImport } from './usageHistoryImport.js'
import { ACCOUNTS_GUIDE, accountsImport } from './accountsImport.js'
import { PURCHASE_ORDERS_GUIDE, purchaseOrdersImport } from './purchaseOrdersImport.js'
import { VENDOR_ITEMS_GUIDE, vendorItemsImport } from './vendorItemsImport.js'
import { BINS_GUIDE, WAREHOUSES_GUIDE, binsImport, warehousesImport } from './warehousesImport.js'
import { PRICE_LEVELS_GUIDE, PRICE_RULES_GUIDE, priceLevelsImport, priceRulesImport } from './pricingImport.js'
import { VENDORS_GUIDE, vendorsImport } from './vendorsImport.js'
import { AVERAGES_GUIDE, averagesImport } from './averagesImport.js'
import { SALES_TAX_GUIDE, salesTaxImport } from './salesTaxImport.js'
import { LEAD_TIMES_GUIDE, REORDER_SETTINGS_GUIDE, leadTimesImport, reorderSettingsImport } from './reorderSettingsImport.js'

export const DATA_IMPORTS: Record<DataImportKind, DataImportDefinition<unknown>> = {
  opening_stock: openingStockImport as DataImportDefinition<unknown>,
  usage_history: usageHistoryImport as DataImportDefinition<unknown>,
  accounts: accountsImport as DataImportDefinition<unknown>,
  vendor_items: vendorItemsImport as DataImportDefinition<unknown>,
  purchase_orders: purchaseOrdersImport as DataImportDefinition<unknown>,
  warehouses: warehousesImport as DataImportDefinition<unknown>,
  bins: binsImport as DataImportDefinition<unknown>,
  price_levels: priceLevelsImport as DataImportDefinition<unknown>,
  price_rules: priceRulesImport as DataImportDefinition<unknown>,
  vendors: vendorsImport as DataImportDefinition<unknown>,
  reorder_settings: reorderSettingsImport as DataImportDefinition<unknown>,
  lead_times: leadTimesImport as DataImportDefinition<unknown>,
  averages: averagesImport as DataImportDefinition<unknown>,
  sales_tax: salesTaxImport as DataImportDefinition<unknown>,
}

/** Each kind's template tab and what its guide sheet says each column takes (in English; Spanish through readmeWords). */
export const DATA_IMPORT_GUIDES: Record<DataImportKind, { tab: string; guide: Record<string, string> }> = {
  opening_stock: { tab: 'Opening stock', guide: OPENING_STOCK_GUIDE },
  usage_history: { tab: 'Usage history', guide: USAGE_HISTORY_GUIDE },
  accounts: { tab: 'Accounts', guide: ACCOUNTS_GUIDE },
  vendor_items: { tab: 'Vendor items', guide: VENDOR_ITEMS_GUIDE },
  purchase_orders: { tab: 'Open purchase orders', guide: PURCHASE_ORDERS_GUIDE },
  warehouses: { tab: 'Warehouses', guide: WAREHOUSES_GUIDE },
  bins: { tab: 'Bins', guide: BINS_GUIDE },
  price_levels: { tab: 'Price levels', guide: PRICE_LEVELS_GUIDE },
  price_rules: { tab: 'Price rules', guide: PRICE_RULES_GUIDE },
  vendors: { tab: 'Vendors', guide: VENDORS_GUIDE },
  reorder_settings: { tab: 'Reorder settings', guide: REORDER_SETTINGS_GUIDE },
  lead_times: { tab: 'Lead times', guide: LEAD_TIMES_GUIDE },
  averages: { tab: 'Averages', guide: AVERAGES_GUIDE },
  sales_tax: { tab: 'Sales tax', guide: SALES_TAX_GUIDE },
}

export async function dataImportTemplate(kind: DataImportKind, lang: ReadmeLang = 'en'): Promise<Buffer> {
  const { spec } = DATA_IMPORTS[kind]
  const { tab, guide } = DATA_IMPORT_GUIDES[kind]
  return buildXlsx(
    sheet<never>({ name: tab, columns: spec.columns.map((c) => ({ header: c.header, kind: 'text', value: () => null })), rows: [] }),
    importGuideSheet(spec.columns, (c) => guide[c.key] ?? '', readmeWord(lang, 'templateRows', { max: spec.maxRows.toLocaleString(lang === 'es' ? 'es-ES' : 'en-US') }), lang),
  )
}
