// Typed calls for fulfilling sales orders: sending an order to the warehouse, taking a backordered rest off,
// and handover tickets (made, signed, voided). Every change carries the caller's Idempotency-Key.
import type { OrderFulfilment, TicketCreateInput, TicketDetail, TicketSignInput, TicketSummary } from '@shared/schemas/handover'
import { api } from './client'

const keyed = (key: string) => ({ headers: { 'Idempotency-Key': key } })

export const fulfilmentApi = {
  order: (orderId: number) => api.get<OrderFulfilment>(`/sales-orders/${orderId}/fulfilment`),
  sendToPick: (orderId: number, key: string) => api.post<{ pickListId: number; lines: number; qty: number }>(`/sales-orders/${orderId}/pick-lists`, {}, keyed(key)),
  cancelRest: (orderId: number, lineId: number, key: string) => api.post<{ cancelled: number }>(`/sales-orders/${orderId}/lines/${lineId}/cancel-rest`, {}, keyed(key)),
  /** The ready e-mail once more after a failure (the server sends it once). */
  sendReadyAgain: (orderId: number) => api.post<{ sent: boolean; mailedAt: string | null }>(`/sales-orders/${orderId}/ready-mail`, {}),
  createTicket: (orderId: number, body: TicketCreateInput, key: string) => api.post<{ id: number; number: string }>(`/sales-orders/${orderId}/tickets`, body, keyed(key)),
  tickets: (status: 'open' | 'signed' | 'voided' | 'all' = 'open') => api.get<TicketSummary[]>(`/handover-tickets?status=${status}`),
  ticket: (id: number) => api.get<TicketDetail>(`/handover-tickets/${id}`),
  sign: (id: number, body: TicketSignInput, key: string) => api.post<{ issued: number; replayed: boolean; orderStatus: string }>(`/handover-tickets/${id}/sign`, body, keyed(key)),
  voidTicket: (id: number, key: string) => api.post(`/handover-tickets/${id}/void`, {}, keyed(key)),
  /** Same-origin addresses the browser opens itself (the session cookie goes along). */
  pdfUrl: (id: number) => `/api/handover-tickets/${id}/pdf`,
  signatureUrl: (id: number) => `/api/handover-tickets/${id}/signature`,
}
