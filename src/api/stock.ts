// Typed calls for the stock screens. Stock-changing calls carry the Idempotency-Key of the form
// submission that made them (see useIdempotentSubmit), so a double click applies once.
import type { AdjustmentInput, BinMoveInput, TransferReceiveInput, TransferShipInput } from '@shared/schemas/stock'
import type {
  BinContentsAnswer, ItemOption, LedgerPage, LookupAnswer, LotLevelsAnswer, MinimumRow, StockLevelsAnswer, TransferView,
} from '@shared/schemas/stockViews'
import { placesSchema } from '@shared/schemas/stockViews'
import { api, download } from './client'

export type QueryValues = Record<string, string | number | boolean | readonly string[] | null | undefined>

/** A query string from filters, leaving out empty ones; lists become comma-separated. */
export function toQuery(values: QueryValues): string {
  const params = new URLSearchParams()
  for (const [k, v] of Object.entries(values)) {
    if (v === undefined || v === null || v === '' || (Array.isArray(v) && !v.length)) continue
    params.set(k, Array.isArray(v) ? v.join(',') : String(v))
  }
  const text = params.toString()
  return text ? `?${text}` : ''
}

export interface MoveSummary {
  batchId: string
  moves: { id: string; moveType: string; itemId: number; binId: number; lotId: number | null; qty: number }[]
}

const keyed = (key: string) => ({ headers: { 'Idempotency-Key': key } })

export const stockPaths = {
  levels: (q: QueryValues) => `/stock/levels${toQuery(q)}`,
  places: '/stock/places',
}

export const stockApi = {
  levels: (q: QueryValues) => api.get<StockLevelsAnswer>(stockPaths.levels(q)),
  binContents: (q: QueryValues) => api.get<BinContentsAnswer>(`/stock/bin-contents${toQuery(q)}`),
  lotLevels: (itemId: number) => api.get<LotLevelsAnswer>(`/stock/lot-levels${toQuery({ itemId })}`),
  ledger: (q: QueryValues) => api.get<LedgerPage>(`/stock/ledger${toQuery(q)}`),
  ledgerExport: (q: QueryValues) => download(`/stock/ledger/export${toQuery(q)}`),
  transfers: (q: QueryValues) => api.get<TransferView[]>(`/stock/transfers${toQuery(q)}`),
  minimums: (q: QueryValues) => api.get<MinimumRow[]>(`/stock/minimums${toQuery(q)}`),
  setMinimum: (itemId: number, warehouseId: number, minQty: number | null) =>
    api.put<MinimumRow>(`/stock/minimums/${itemId}/${warehouseId}`, { minQty }),
  places: () => api.get(stockPaths.places, { answer: placesSchema }),
  itemOptions: (q: { q?: string; ids?: readonly string[] }) => api.get<ItemOption[]>(`/stock/item-options${toQuery(q)}`),
  lookup: (q: QueryValues) => api.get<LookupAnswer>(`/stock/lookup${toQuery(q)}`),

  adjust: (body: AdjustmentInput, key: string) => api.post<MoveSummary>('/stock/adjustments', body, keyed(key)),
  moveBetweenBins: (body: BinMoveInput, key: string) => api.post<MoveSummary>('/stock/bin-moves', body, keyed(key)),
  shipTransfer: (body: TransferShipInput, key: string) => api.post<{ transfer: { id: number } }>('/stock/transfers', body, keyed(key)),
  receiveTransfer: (id: number, body: TransferReceiveInput, key: string) => api.post<{ id: number; status: string }>(`/stock/transfers/${id}/receive`, body, keyed(key)),
}
