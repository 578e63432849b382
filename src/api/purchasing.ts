// Typed calls for purchasing: vendors and what they sell, purchase orders from draft to received, the
// suggestions and special orders they are made from, and the warehouse's receiving. Receipts carry the
// submission's Idempotency-Key, so a retried receipt books the stock once.
import { z } from 'zod'
import { okShape, poMailedShape } from '@shared/schemas/answers/changes'
import {
  itemChoiceShape, poDetailShape, poSummaryShape, priceListPreviewShape, receiptViewShape, receiveResultShape, receivingContextShape,
  specialOrderJobShape, suggestionViewShape, vendorItemViewShape, vendorViewShape, warehouseChoiceShape,
} from '@shared/schemas/answers/purchasingViews'
import {
  poApproveSchema, poFromJobSchema, poManualSchema, poReasonSchema, poSendSchema, poUpdateSchema, receiveSchema, vendorCreateSchema,
  vendorItemSchema, vendorItemUpdateSchema, vendorUpdateSchema,
} from '@shared/schemas/purchasing'
import { api, download, type BodyOf } from './client'
import { keyed } from './idempotencyKey'
import { toQuery, type QueryValues } from './stock'

type Id = number | string

/** A step of an order's life and what it carries: the version seen (approve), a reason (cancel, close). */
export type PoStep =
  | { step: 'approve'; body: BodyOf<typeof poApproveSchema> }
  | { step: 'cancel' | 'close'; body: BodyOf<typeof poReasonSchema> }
  | { step: 'mark-sent'; body?: undefined }

export const purchasingApi = {
  // Vendors and their items
  vendors: () => api.get('/vendors', { answer: z.array(vendorViewShape) }),
  vendor: (id: Id) => api.get(`/vendors/${id}`, { answer: vendorViewShape }),
  createVendor: (body: BodyOf<typeof vendorCreateSchema>) => api.post('/vendors', body, { answer: vendorViewShape }),
  updateVendor: (id: Id, body: BodyOf<typeof vendorUpdateSchema>) => api.patch(`/vendors/${id}`, body, { answer: vendorViewShape }),
  vendorItems: (vendorId: Id) => api.get(`/vendors/${vendorId}/items`, { answer: z.array(vendorItemViewShape) }),
  addVendorItem: (vendorId: Id, body: BodyOf<typeof vendorItemSchema>) =>
    api.post(`/vendors/${vendorId}/items`, body, { answer: vendorItemViewShape }),
  updateVendorItem: (vendorId: Id, id: Id, body: BodyOf<typeof vendorItemUpdateSchema>) =>
    api.patch(`/vendors/${vendorId}/items/${id}`, body, { answer: vendorItemViewShape }),
  removeVendorItem: (vendorId: Id, id: Id) => api.delete(`/vendors/${vendorId}/items/${id}`, { answer: okShape }),
  /** A vendor's price list: checked first (preview), then taken in (commit); both answer the rows. */
  priceList: (vendorId: Id, step: 'preview' | 'commit', form: FormData) =>
    api.post(`/vendors/${vendorId}/price-list/${step}`, form, { answer: priceListPreviewShape }),
  priceListTemplate: () => download('/vendors/price-list/template'),
  items: (q: string) => api.get(`/purchasing/items${toQuery({ q })}`, { answer: z.array(itemChoiceShape) }),
  warehouses: () => api.get('/purchasing/warehouses', { answer: z.array(warehouseChoiceShape) }),

  // Purchase orders
  orders: (q: QueryValues) => api.get(`/purchase-orders${toQuery(q)}`, { answer: z.array(poSummaryShape) }),
  order: (id: Id) => api.get(`/purchase-orders/${id}`, { answer: poDetailShape }),
  receipts: (id: Id) => api.get(`/purchase-orders/${id}/receipts`, { answer: z.array(receiptViewShape) }),
  createOrder: (body: BodyOf<typeof poManualSchema>) => api.post('/purchase-orders', body, { answer: poDetailShape }),
  /** A step of the order's life (approve, cancel, close …): the order as it now is. */
  step: (id: Id, { step, body }: PoStep) => api.post(`/purchase-orders/${id}/${step}`, body ?? {}, { answer: poDetailShape }),
  saveLines: (id: Id, body: BodyOf<typeof poUpdateSchema>) => api.patch(`/purchase-orders/${id}`, body, { answer: poDetailShape }),
  removeLine: (id: Id, lineId: Id) => api.delete(`/purchase-orders/${id}/lines/${lineId}`, { answer: poDetailShape }),
  send: (id: Id, body: BodyOf<typeof poSendSchema>) => api.post(`/purchase-orders/${id}/send`, body, { answer: poMailedShape }),
  orderFile: (id: Id, kind: 'export' | 'pdf') => download(`/purchase-orders/${id}/${kind}`),
  exportOrders: (ids: readonly number[]) => download(`/purchase-orders/export${toQuery({ ids: ids.map(String) })}`),

  // Suggestions and special orders
  suggestions: () => api.get('/purchase-orders/suggestions', { answer: z.array(suggestionViewShape) }),
  changeSuggestion: (id: Id, qty: number) => api.patch(`/purchase-orders/suggestions/${id}`, { qty }, { answer: z.array(suggestionViewShape) }),
  dismissSuggestion: (id: Id) => api.post(`/purchase-orders/suggestions/${id}/dismiss`, {}, { answer: z.array(suggestionViewShape) }),
  ordersFromSuggestions: (suggestionIds: number[]) =>
    api.post('/purchase-orders/from-suggestions', { suggestionIds }, { answer: z.array(poDetailShape) }),
  specialOrders: () => api.get('/purchase-orders/special-orders', { answer: z.array(specialOrderJobShape) }),
  ordersFromJob: (body: BodyOf<typeof poFromJobSchema>) => api.post('/purchase-orders/from-job', body, { answer: z.array(poDetailShape) }),

  // Receiving at the dock
  receiving: (id: Id) => api.get(`/purchase-orders/${id}/receiving`, { answer: receivingContextShape }),
  receive: (id: Id, body: BodyOf<typeof receiveSchema>, key: string) =>
    api.post(`/purchase-orders/${id}/receipts`, body, { ...keyed(key), answer: receiveResultShape }),
}
