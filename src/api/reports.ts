// Typed calls for the report screens.
import type { ValuationReport } from '@shared/schemas/reports'
import { api } from './client'
import { toQuery } from './stock'

export const reportsApi = {
  stockValuation: (q: { asOf: string; warehouseId: number | null; tz: string }) =>
    api.get<ValuationReport>(`/reports/stock-valuation${toQuery(q)}`),
}
