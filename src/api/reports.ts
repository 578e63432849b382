// Typed calls for the report screens.
import { deadStockReportShape, turnsReportShape, usageReportShape, valuationReportShape, vendorReportShape } from '@shared/schemas/answers/reports'
import { api } from './client'
import { downloadWithProgress } from './fileTransfer'
import { toQuery } from './stock'

export interface PeriodFilters { from: string; to: string; warehouseId: number | null; tz: string }
export interface DeadStockFilters { deadDays: number; slowDays: number; windowDays: number; warehouseId: number | null }

export const reportsApi = {
  stockValuation: (q: { asOf: string; warehouseId: number | null; tz: string }) =>
    api.get(`/reports/stock-valuation${toQuery(q)}`, { answer: valuationReportShape }),
  turns: (q: PeriodFilters) => api.get(`/reports/turns${toQuery({ ...q })}`, { answer: turnsReportShape }),
  usage: (q: PeriodFilters) => api.get(`/reports/usage${toQuery({ ...q })}`, { answer: usageReportShape }),
  vendors: (q: PeriodFilters) => api.get(`/reports/vendors${toQuery({ ...q })}`, { answer: vendorReportShape }),
  deadStock: (q: DeadStockFilters) => api.get(`/reports/dead-stock${toQuery({ ...q })}`, { answer: deadStockReportShape }),
  /** A report's spreadsheet in the reader's language, streamed (onBytes: bytes received so far). */
  exportFile: (report: 'turns' | 'usage' | 'vendors' | 'dead-stock', q: PeriodFilters | DeadStockFilters, lang: string, onBytes: (bytes: number) => void) =>
    downloadWithProgress(`/reports/${report}/export${toQuery({ ...q, lang })}`, onBytes),
}
