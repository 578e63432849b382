// Typed calls for fulfilling sales orders: sending an order to the warehouse, taking a backordered rest off,
// and handover tickets (made, signed, voided). Every change carries the caller's Idempotency-Key.
import { z } from 'zod'
import { readyMailShape, restCancelledShape, sentToPickShape, ticketMadeShape, ticketSignedShape, ticketVoidedShape } from '@shared/schemas/answers/changes'
import { orderFulfilmentShape, ticketDetailShape, ticketSummaryShape } from '@shared/schemas/answers/handover'
import type { TicketCreateInput, TicketSignInput } from '@shared/schemas/handover'
import { api } from './client'
import { toQuery } from './stock'
import { keyed } from './idempotencyKey'

export const fulfilmentApi = {
  order: (orderId: number) => api.get(`/sales-orders/${orderId}/fulfilment`, { answer: orderFulfilmentShape }),
  sendToPick: (orderId: number, key: string) => api.post(`/sales-orders/${orderId}/pick-lists`, {}, { ...keyed(key), answer: sentToPickShape }),
  cancelRest: (orderId: number, lineId: number, key: string) => api.post(`/sales-orders/${orderId}/lines/${lineId}/cancel-rest`, {}, { ...keyed(key), answer: restCancelledShape }),
  /** The ready e-mail once more after a failure (the server sends it once). */
  sendReadyAgain: (orderId: number) => api.post(`/sales-orders/${orderId}/ready-mail`, {}, { answer: readyMailShape }),
  createTicket: (orderId: number, body: TicketCreateInput, key: string) => api.post(`/sales-orders/${orderId}/tickets`, body, { ...keyed(key), answer: ticketMadeShape }),
  tickets: (q: { status: 'open' | 'signed' | 'voided' | 'all'; q?: string; limit?: number; beforeId?: number }) => api.get(`/handover-tickets${toQuery(q)}`, { answer: z.array(ticketSummaryShape) }),
  ticket: (id: number) => api.get(`/handover-tickets/${id}`, { answer: ticketDetailShape }),
  sign: (id: number, body: TicketSignInput, key: string) => api.post(`/handover-tickets/${id}/sign`, body, { ...keyed(key), answer: ticketSignedShape }),
  voidTicket: (id: number, key: string) => api.post(`/handover-tickets/${id}/void`, {}, { ...keyed(key), answer: ticketVoidedShape }),
  /** Same-origin addresses the browser opens itself (the session cookie goes along). */
  pdfUrl: (id: number) => `/api/handover-tickets/${id}/pdf`,
  signatureUrl: (id: number) => `/api/handover-tickets/${id}/signature`,
}
