// The reorder grid's AG Grid set-up: only the modules it uses, our palette and local font, and the columns.
import {
  CellStyleModule, ClientSideRowModelModule, ModuleRegistry, RowSelectionModule, RowStyleModule, TooltipModule,
  type ColDef, type RowSelectionOptions,
} from 'ag-grid-community'
import { gridTheme } from '@/components/grid/gridTheme'
import { formatMoney } from '@shared/money'
import type { ReorderLine } from '@shared/schemas/reorder'
import { i18n } from '@/i18n'

ModuleRegistry.registerModules([ClientSideRowModelModule, RowSelectionModule, CellStyleModule, RowStyleModule, TooltipModule])

export const reorderTheme = gridTheme

export const reorderSelection: RowSelectionOptions<ReorderLine> = {
  mode: 'multiRow',
  checkboxes: true,
  headerCheckbox: true,
  selectAll: 'filtered',
  enableClickSelection: false,
  isRowSelectable: (node) => !!node.data && node.data.blockedBy === null,
}

type Translate = (key: string, named?: Record<string, unknown>) => string

const num = (digits = 0) => (p: { value: number | null | undefined }) =>
  p.value === null || p.value === undefined ? '—' : i18n.global.n(p.value, { key: 'decimal', maximumFractionDigits: digits })

export function reorderColumns(t: Translate): ColDef<ReorderLine>[] {
  const col = (field: keyof ReorderLine, header: string, width: number, extra: ColDef<ReorderLine> = {}): ColDef<ReorderLine> =>
    ({ field, headerName: t(`reorder.col.${header}`), width, ...extra })
  const qty = (field: keyof ReorderLine, header: string, width = 100, digits = 0) =>
    col(field, header, width, { type: 'rightAligned', valueFormatter: num(digits) })
  return [
    col('sku', 'sku', 150, { pinned: 'left', cellClass: 'sku-cell' }),
    col('name', 'name', 220, { flex: 1, minWidth: 160 }),
    col('warehouseCode', 'warehouse', 100),
    col('status', 'status', 120, { valueFormatter: (p) => (p.value ? t(`reorder.statuses.${p.value}`) : ''), cellClass: (p) => `status-${p.value}` }),
    qty('position', 'position'),
    qty('reorderPoint', 'reorderPoint', 110),
    qty('safetyStock', 'safetyStock', 105, 1),
    qty('suggestedOrder', 'suggested', 105),
    qty('pendingQty', 'pending', 95),
    col('abcClass', 'abc', 70),
    col('vendorCode', 'vendor', 110, { valueFormatter: (p) => p.value ?? t('reorder.blocked.noVendor') }),
    qty('meanDaily', 'meanDaily', 95, 2),
    qty('daysOfSupply', 'daysOfSupply', 110, 1),
    qty('leadTimeDays', 'leadTime', 105, 1),
    col('lastUsedDate', 'lastUsed', 110, { valueFormatter: (p) => p.value ?? '—' }),
    qty('trendRatio', 'trend', 80, 2),
    col('annualValue', 'annualValue', 130, {
      type: 'rightAligned', valueGetter: (p) => (p.data ? Number(p.data.annualValue) : null),
      valueFormatter: (p) => (p.data ? formatMoney(p.data.annualValue) : ''),
    }),
  ]
}
