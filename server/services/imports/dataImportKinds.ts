// The kinds of import of a business's own data, and the blank template of each (its columns, and a
// guide sheet saying what each column takes).
import type { DataImportKind } from '../../../shared/schemas/dataImports.js'
import { buildXlsx, sheet } from '../exports/xlsxWriter.js'
import type { DataImportDefinition } from './dataImports.js'
import { importGuideSheet } from './importGuide.js'
import { OPENING_STOCK_GUIDE, openingStockImport } from './openingStockImport.js'
import { USAGE_HISTORY_GUIDE, usageHistoryImport } from './usageHistoryImport.js'
import { ACCOUNTS_GUIDE, accountsImport } from './accountsImport.js'
import { PURCHASE_ORDERS_GUIDE, purchaseOrdersImport } from './purchaseOrdersImport.js'
import { VENDOR_ITEMS_GUIDE, vendorItemsImport } from './vendorItemsImport.js'

export const DATA_IMPORTS: Record<DataImportKind, DataImportDefinition<unknown>> = {
  opening_stock: openingStockImport as DataImportDefinition<unknown>,
  usage_history: usageHistoryImport as DataImportDefinition<unknown>,
  accounts: accountsImport as DataImportDefinition<unknown>,
  vendor_items: vendorItemsImport as DataImportDefinition<unknown>,
  purchase_orders: purchaseOrdersImport as DataImportDefinition<unknown>,
}

const GUIDES: Record<DataImportKind, { tab: string; guide: Record<string, string> }> = {
  opening_stock: { tab: 'Opening stock', guide: OPENING_STOCK_GUIDE },
  usage_history: { tab: 'Usage history', guide: USAGE_HISTORY_GUIDE },
  accounts: { tab: 'Accounts', guide: ACCOUNTS_GUIDE },
  vendor_items: { tab: 'Vendor items', guide: VENDOR_ITEMS_GUIDE },
  purchase_orders: { tab: 'Open purchase orders', guide: PURCHASE_ORDERS_GUIDE },
}

export async function dataImportTemplate(kind: DataImportKind): Promise<Buffer> {
  const { spec } = DATA_IMPORTS[kind]
  const { tab, guide } = GUIDES[kind]
  return buildXlsx(
    sheet<never>({ name: tab, columns: spec.columns.map((c) => ({ header: c.header, kind: 'text', value: () => null })), rows: [] }),
    importGuideSheet(spec.columns, (c) => guide[c.key] ?? '',
      `At most ${spec.maxRows.toLocaleString('en-US')} rows per file. The same file imported twice changes nothing the second time.`),
  )
}
