// Typed calls for the stock screens. Stock-changing calls carry the Idempotency-Key of the form
// submission that made them (see useIdempotentSubmit), so a double click applies once.
import { z } from 'zod'
import { moveSummaryShape, transferReceivedShape, transferShippedShape } from '@shared/schemas/answers/changes'
import {
  binContentsAnswerShape, itemOptionShape, ledgerPageShape, lookupAnswerShape, lotLevelsAnswerShape, minimumRowShape, stockLevelsAnswerShape,
  transferViewShape,
} from '@shared/schemas/answers/stockViews'
import type { AdjustmentInput, BinMoveInput, TransferReceiveInput, TransferShipInput } from '@shared/schemas/stock'
import { stockPaths, toQuery, type QueryValues } from '@shared/pageData'
import { placesSchema } from '@shared/schemas/stockViews'
import { api, download } from './client'
import { keyed } from './idempotencyKey'

// The query strings and the paths a page opens with are shared with the server's page preloads (shared/pageData.ts).
export { toQuery, type QueryValues } from '@shared/pageData'

export const stockApi = {
  levels: (q: QueryValues) => api.get(stockPaths.levels(q), { answer: stockLevelsAnswerShape }),
  binContents: (q: QueryValues) => api.get(`/stock/bin-contents${toQuery(q)}`, { answer: binContentsAnswerShape }),
  lotLevels: (itemId: number) => api.get(`/stock/lot-levels${toQuery({ itemId })}`, { answer: lotLevelsAnswerShape }),
  ledger: (q: QueryValues) => api.get(`/stock/ledger${toQuery(q)}`, { answer: ledgerPageShape }),
  ledgerExport: (q: QueryValues) => download(`/stock/ledger/export${toQuery(q)}`),
  transfers: (q: QueryValues) => api.get(`/stock/transfers${toQuery(q)}`, { answer: z.array(transferViewShape) }),
  minimums: (q: QueryValues) => api.get(`/stock/minimums${toQuery(q)}`, { answer: z.array(minimumRowShape) }),
  setMinimum: (itemId: number, warehouseId: number, minQty: number | null) =>
    api.put(`/stock/minimums/${itemId}/${warehouseId}`, { minQty }, { answer: minimumRowShape }),
  places: () => api.get(stockPaths.places, { answer: placesSchema }),
  itemOptions: (q: { q?: string; ids?: readonly string[] }) => api.get(`/stock/item-options${toQuery(q)}`, { answer: z.array(itemOptionShape) }),
  lookup: (q: QueryValues) => api.get(`/stock/lookup${toQuery(q)}`, { answer: lookupAnswerShape }),

  adjust: (body: AdjustmentInput, key: string) => api.post('/stock/adjustments', body, { ...keyed(key), answer: moveSummaryShape }),
  moveBetweenBins: (body: BinMoveInput, key: string) => api.post('/stock/bin-moves', body, { ...keyed(key), answer: moveSummaryShape }),
  shipTransfer: (body: TransferShipInput, key: string) => api.post('/stock/transfers', body, { ...keyed(key), answer: transferShippedShape }),
  receiveTransfer: (id: number, body: TransferReceiveInput, key: string) => api.post(`/stock/transfers/${id}/receive`, body, { ...keyed(key), answer: transferReceivedShape }),
}
