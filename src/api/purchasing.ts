// Typed calls for purchasing: vendors and what they sell, purchase orders from draft to received, the
// suggestions and special orders they are made from, and the warehouse's receiving. Receipts carry the
// submission's Idempotency-Key, so a retried receipt books the stock once.
import type {
  ItemChoice, PoDetail, PoSummary, PriceListPreview, ReceiptView, ReceiveResult, ReceivingContext, SpecialOrderJob,
  SuggestionView, VendorItemView, VendorView, WarehouseChoice,
} from '@shared/schemas/purchasingViews'
import { api, download } from './client'
import { toQuery, type QueryValues } from './stock'

type Id = number | string

export const purchasingApi = {
  // Vendors and their items
  vendors: () => api.get<VendorView[]>('/vendors'),
  vendor: (id: Id) => api.get<VendorView>(`/vendors/${id}`),
  createVendor: (body: object) => api.post<VendorView>('/vendors', body),
  updateVendor: (id: Id, body: object) => api.patch<VendorView>(`/vendors/${id}`, body),
  vendorItems: (vendorId: Id) => api.get<VendorItemView[]>(`/vendors/${vendorId}/items`),
  addVendorItem: (vendorId: Id, body: object) => api.post<VendorItemView>(`/vendors/${vendorId}/items`, body),
  updateVendorItem: (vendorId: Id, id: Id, body: object) => api.patch<VendorItemView>(`/vendors/${vendorId}/items/${id}`, body),
  removeVendorItem: (vendorId: Id, id: Id) => api.delete(`/vendors/${vendorId}/items/${id}`),
  /** A vendor's price list: checked first (preview), then taken in (commit). */
  priceList: (vendorId: Id, step: 'preview' | 'commit', form: FormData) => api.post<PriceListPreview>(`/vendors/${vendorId}/price-list/${step}`, form),
  priceListTemplate: () => download('/vendors/price-list/template'),
  items: (q: string) => api.get<ItemChoice[]>(`/purchasing/items${toQuery({ q })}`),
  warehouses: () => api.get<WarehouseChoice[]>('/purchasing/warehouses'),

  // Purchase orders
  orders: (q: QueryValues) => api.get<PoSummary[]>(`/purchase-orders${toQuery(q)}`),
  order: (id: Id) => api.get<PoDetail>(`/purchase-orders/${id}`),
  receipts: (id: Id) => api.get<ReceiptView[]>(`/purchase-orders/${id}/receipts`),
  createOrder: (body: object) => api.post<PoDetail>('/purchase-orders', body),
  /** A step of the order's life (approve, cancel, close …): the order as it now is. */
  step: (id: Id, step: string, body: object = {}) => api.post<PoDetail>(`/purchase-orders/${id}/${step}`, body),
  saveLines: (id: Id, body: object) => api.patch<PoDetail>(`/purchase-orders/${id}`, body),
  removeLine: (id: Id, lineId: Id) => api.delete<PoDetail>(`/purchase-orders/${id}/lines/${lineId}`),
  send: (id: Id, body: { to: string; cc: string[]; message: string }) => api.post<{ status: string }>(`/purchase-orders/${id}/send`, body),
  orderFile: (id: Id, kind: 'export' | 'pdf') => download(`/purchase-orders/${id}/${kind}`),
  exportOrders: (ids: readonly number[]) => download(`/purchase-orders/export${toQuery({ ids: ids.map(String) })}`),

  // Suggestions and special orders
  suggestions: () => api.get<SuggestionView[]>('/purchase-orders/suggestions'),
  changeSuggestion: (id: Id, qty: number) => api.patch<SuggestionView[]>(`/purchase-orders/suggestions/${id}`, { qty }),
  dismissSuggestion: (id: Id) => api.post<SuggestionView[]>(`/purchase-orders/suggestions/${id}/dismiss`),
  ordersFromSuggestions: (suggestionIds: number[]) => api.post<PoDetail[]>('/purchase-orders/from-suggestions', { suggestionIds }),
  specialOrders: () => api.get<SpecialOrderJob[]>('/purchase-orders/special-orders'),
  ordersFromJob: (body: { jobId: number; warehouseId?: number | null; vendorId?: number | null }) => api.post<PoDetail[]>('/purchase-orders/from-job', body),

  // Receiving at the dock
  receiving: (id: Id) => api.get<ReceivingContext>(`/purchase-orders/${id}/receiving`),
  receive: (id: Id, body: object, key: string) =>
    api.post<ReceiveResult>(`/purchase-orders/${id}/receipts`, body, { headers: { 'Idempotency-Key': key } }),
}
