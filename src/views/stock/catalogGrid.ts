// The catalog grid's AG Grid set-up: only the modules it uses, our own palette and font (the grid's
// default font would be fetched from the web), and the column definitions.
import {
  CellStyleModule, ClientSideRowModelModule, ColumnApiModule, ModuleRegistry, NumberFilterModule, QuickFilterModule,
  RowStyleModule, TextFilterModule, type ColDef,
} from 'ag-grid-community'
import { gridTheme } from '@/components/grid/gridTheme'
import type { ItemRow } from '@shared/schemas/catalog'
import { formatMoney } from '@shared/money'

ModuleRegistry.registerModules([
  ClientSideRowModelModule, TextFilterModule, NumberFilterModule, QuickFilterModule, ColumnApiModule, CellStyleModule, RowStyleModule,
])

export const catalogTheme = gridTheme

type Translate = (key: string) => string

export interface ColumnChoice {
  field: string
  label: string
  visible: boolean
}

/** Columns hidden until chosen: the list stays readable on a laptop. */
export const HIDDEN_AT_FIRST = new Set(['gtin', 'palletQty', 'cost', 'thicknessClass', 'stockUnit'])

const label = (t: Translate, group: string) => (v: string | null | undefined) => (v ? t(`catalog.${group}.${v}`) : '')

export function catalogColumns(t: Translate): ColDef<ItemRow>[] {
  const text = (field: keyof ItemRow, width: number, extra: ColDef<ItemRow> = {}): ColDef<ItemRow> => ({
    field, headerName: t(`catalog.col.${field}`), width, filter: 'agTextColumnFilter', hide: HIDDEN_AT_FIRST.has(field), ...extra,
  })
  const number = (field: keyof ItemRow, width: number, extra: ColDef<ItemRow> = {}): ColDef<ItemRow> => ({
    field, headerName: t(`catalog.col.${field}`), width, filter: 'agNumberColumnFilter', type: 'rightAligned', hide: HIDDEN_AT_FIRST.has(field), ...extra,
  })
  const money = (field: 'cost' | 'listPrice'): ColDef<ItemRow> => number(field, 110, {
    valueGetter: (p) => (p.data && p.data[field] != null ? Number(p.data[field]) : null),
    valueFormatter: (p) => (p.data && p.data[field] != null ? formatMoney(p.data[field]) : ''),
  })
  return [
    text('sku', 190, { pinned: 'left', cellClass: 'sku-cell' }),
    text('name', 340, { flex: 1, minWidth: 220 }),
    text('family', 130, { valueFormatter: (p) => label(t, 'families')(p.value) }),
    text('nominalSize', 100),
    text('pattern', 105, { valueFormatter: (p) => label(t, 'patterns')(p.value) }),
    text('shape', 130, { valueFormatter: (p) => label(t, 'shapes')(p.value) }),
    text('thicknessClass', 110, { valueFormatter: (p) => label(t, 'thickness')(p.value) }),
    text('stockUnit', 90, { valueFormatter: (p) => label(t, 'units')(p.value) }),
    text('gtin', 150),
    number('caseQty', 80),
    number('palletQty', 90),
    money('cost'),
    money('listPrice'),
    number('onHand', 100),
    number('available', 105),
  ]
}
