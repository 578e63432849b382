// AG Grid for the stock screens: only the modules they use, our palette, a system-safe font (the
// grid's default font would be fetched from the web), and the column definitions.
import {
  CellStyleModule, ClientSideRowModelApiModule, ClientSideRowModelModule, ColumnApiModule, ModuleRegistry, NumberEditorModule, NumberFilterModule, QuickFilterModule,
  RowStyleModule, TextFilterModule, type ColDef,
} from 'ag-grid-community'
import { gridTheme } from '@/components/grid/gridTheme'
import type { LedgerRow, StockLevelRow } from '@shared/schemas/stockViews'
import { dateTimeText } from '@/i18n/when'

ModuleRegistry.registerModules([
  ClientSideRowModelModule, ClientSideRowModelApiModule, TextFilterModule, NumberFilterModule, QuickFilterModule, ColumnApiModule, CellStyleModule, RowStyleModule,
  NumberEditorModule,
])

export const stockTheme = gridTheme.withParams({ rowHeight: 44, headerHeight: 44 })

type Translate = (key: string, values?: Record<string, unknown>) => string

// Quantities: no per-column filter (the server filters and the quick search cover them), headers wrap.
const qty = (field: keyof StockLevelRow, t: Translate, extra: ColDef<StockLevelRow> = {}): ColDef<StockLevelRow> => ({
  field, headerName: t(`stock.col.${field}`), width: 92, type: 'rightAligned', filter: false, wrapHeaderText: true, autoHeaderHeight: true, ...extra,
})

export function levelColumns(t: Translate, canSetMinimum: boolean): ColDef<StockLevelRow>[] {
  return [
    { field: 'sku', headerName: t('stock.col.sku'), width: 150, pinned: 'left', filter: 'agTextColumnFilter', cellClass: 'sku-cell' },
    { field: 'name', headerName: t('stock.col.name'), flex: 1, minWidth: 150, filter: 'agTextColumnFilter' },
    { field: 'warehouseCode', headerName: t('stock.col.warehouse'), width: 130, filter: 'agTextColumnFilter', wrapHeaderText: true, autoHeaderHeight: true },
    qty('onHand', t),
    qty('reserved', t),
    qty('available', t, { cellClass: 'available-cell' }),
    qty('inTransit', t, { valueFormatter: (p) => (p.value ? String(p.value) : '') }),
    qty('minQty', t, {
      width: 100,
      editable: canSetMinimum,
      cellEditor: 'agNumberCellEditor',
      cellEditorParams: { min: 0, max: 1_000_000, precision: 0 },
      cellClass: canSetMinimum ? 'editable-cell' : undefined,
      valueFormatter: (p) => (p.value === null || p.value === undefined ? '—' : String(p.value)),
    }),
    {
      // cellDataType off: a boolean column would render as a checkbox and skip the formatter.
      field: 'low', headerName: t('stock.col.low'), width: 80, filter: false, cellDataType: false,
      valueFormatter: (p) => (p.value ? t('stock.overview.lowTag') : ''),
      cellClass: (p) => (p.value ? 'low-cell' : ''),
    },
  ]
}

/** Sorting happens on the server: the grid shows the arrow, the comparator keeps the page as it came. */
const serverSorted = { comparator: () => 0, sortable: true } as const

export const LEDGER_SORT_BY_FIELD: Partial<Record<keyof LedgerRow, string>> = {
  at: 'at', sku: 'sku', warehouseCode: 'warehouse', binCode: 'bin', lotCode: 'lot', moveType: 'moveType', qty: 'qty', userName: 'user', docType: 'doc',
}

/**
 * The document a move belongs to as people name it: its number (PO, pick list), the job's name, else its
 * kind and id ("Cycle count 12"); a kind this screen does not know reads "Document 12", never a table name.
 */
export function documentName(label: (key: string, fallback: string) => string, row: Pick<LedgerRow, 'docType' | 'docId' | 'docRef'> | undefined): string {
  if (!row?.docType) return ''
  const kind = label(`stock.docKinds.${row.docType}`, label('stock.docKinds.other', 'Document'))
  if (row.docRef) return row.docType === 'job' ? `${kind} ${row.docRef}` : row.docRef
  return `${kind} ${row.docId ?? ''}`.trim()
}

/** `label(key, fallback)`: the message for key, or the fallback when there is none (reasons are free text on issues). */
export function ledgerColumns(label: (key: string, fallback: string) => string): ColDef<LedgerRow>[] {
  const t = (key: string) => label(key, key)
  const sortable = (field: keyof LedgerRow) => (LEDGER_SORT_BY_FIELD[field] ? serverSorted : { sortable: false })
  const col = (field: keyof LedgerRow, width: number, extra: ColDef<LedgerRow> = {}): ColDef<LedgerRow> => ({
    field, headerName: t(`stock.col.${field}`), width, ...sortable(field), ...extra,
  })
  return [
    col('at', 165, { valueFormatter: (p) => dateTimeText(p.value, ''), sort: 'desc' }),
    col('moveType', 130, { valueFormatter: (p) => label(`stock.moveTypes.${p.value}`, String(p.value ?? '')) }),
    col('sku', 150, { cellClass: 'sku-cell' }),
    col('itemName', 200, { flex: 1, minWidth: 160 }),
    col('warehouseCode', 100),
    col('binCode', 110),
    col('lotCode', 100),
    col('qty', 90, { type: 'rightAligned', cellClass: (p) => ((p.value ?? 0) < 0 ? 'qty-out' : 'qty-in'), valueFormatter: (p) => (p.value > 0 ? `+${p.value}` : String(p.value)) }),
    col('reason', 110, { valueFormatter: (p) => (p.value ? label(`stock.reasons.${p.value}`, String(p.value)) : '') }),
    col('docType', 150, { valueGetter: (p) => documentName(label, p.data) }),
    col('note', 180),
    col('userName', 140),
  ]
}
