// Typed calls for the report screens.
import type { DeadStockReport, TurnsReport, UsageReport, ValuationReport, VendorReport } from '@shared/schemas/reports'
import { api } from './client'
import { downloadWithProgress } from './fileTransfer'
import { toQuery } from './stock'

export interface PeriodFilters { from: string; to: string; warehouseId: number | null; tz: string }
export interface DeadStockFilters { deadDays: number; slowDays: number; windowDays: number; warehouseId: number | null }

export const reportsApi = {
  stockValuation: (q: { asOf: string; warehouseId: number | null; tz: string }) =>
    api.get<ValuationReport>(`/reports/stock-valuation${toQuery(q)}`),
  turns: (q: PeriodFilters) => api.get<TurnsReport>(`/reports/turns${toQuery({ ...q })}`),
  usage: (q: PeriodFilters) => api.get<UsageReport>(`/reports/usage${toQuery({ ...q })}`),
  vendors: (q: PeriodFilters) => api.get<VendorReport>(`/reports/vendors${toQuery({ ...q })}`),
  deadStock: (q: DeadStockFilters) => api.get<DeadStockReport>(`/reports/dead-stock${toQuery({ ...q })}`),
  /** A report's spreadsheet in the reader's language, streamed (onBytes: bytes received so far). */
  exportFile: (report: 'turns' | 'usage' | 'vendors' | 'dead-stock', q: PeriodFilters | DeadStockFilters, lang: string, onBytes: (bytes: number) => void) =>
    downloadWithProgress(`/reports/${report}/export${toQuery({ ...q, lang })}`, onBytes),
}
