// Typed calls for the counter: contractor accounts, jobs, takeoffs, bills of materials, quotes, sales orders,
// and the takeoff settings (material rules, role → item mapping, waste, site figures). Bodies are checked by
// the server with the schemas named beside them; the forms check with the same schemas first.
import type { ComputeAnswer } from '@shared/counter/counterBill'
import { z } from 'zod'
import {
  counterCatalogSchema, customerSummarySchema, jobSummarySchema,
  type BomRecord, type JobDetail, type RoleItemRecord, type RuleRecord, type TakeoffRecord,
} from '@shared/schemas/counter'
import type { QuoteDetail, QuoteSummary } from '@shared/schemas/quotes'
import { cardDepositStateSchema, type CardDepositStartInput, type SalesOrderDetail, type SalesOrderSummary, type SalesSettings } from '@shared/schemas/salesOrders'
import type { SalesReturnView } from '@shared/schemas/salesReturns'
import type { MaterialFamily, SiteFigures, Takeoff } from '@shared/schemas/takeoff'
import type { LengthUnit } from '@shared/units'
import { api, download } from './client'
import { toQuery, type QueryValues } from './stock'

type Id = number | string
const keyed = (key: string) => ({ headers: { 'Idempotency-Key': key } })

export const counterApi = {
  /** Everything the takeoff editor computes with; checked against its schema in development and tests. */
  catalog: () => api.get('/takeoffs/catalog', { answer: counterCatalogSchema }),

  // Contractor accounts (customerCreateSchema, customerUpdateSchema)
  customers: (q: { q?: string; active?: 'true' | 'false' | 'all' } = {}) =>
    api.get(`/customers${toQuery(q)}`, { answer: z.array(customerSummarySchema) }),
  createCustomer: (body: object) => api.post('/customers', body, { answer: customerSummarySchema }),
  updateCustomer: (id: Id, body: object) => api.patch(`/customers/${id}`, body, { answer: customerSummarySchema }),
  removeCustomer: (id: Id) => api.delete(`/customers/${id}`),

  // Jobs (jobCreateSchema, jobUpdateSchema)
  jobs: (q: QueryValues) => api.get(`/jobs${toQuery(q)}`, { answer: z.array(jobSummarySchema) }),
  job: (id: Id) => api.get<JobDetail>(`/jobs/${id}`),
  /** A job's header only (its takeoffs and bills left out of the type). */
  jobSummary: (id: Id) => api.get(`/jobs/${id}`, { answer: jobSummarySchema }),
  createJob: (body: object) => api.post('/jobs', body, { answer: jobSummarySchema }),
  updateJob: (id: Id, body: object) => api.patch(`/jobs/${id}`, body, { answer: jobSummarySchema }),

  // Takeoffs (takeoffSaveSchema) and bills of materials (bomSaveSchema)
  takeoff: (id: Id) => api.get<TakeoffRecord>(`/takeoffs/${id}`),
  createTakeoff: (jobId: Id, body: { name: string; input: Takeoff }) => api.post<TakeoffRecord>(`/jobs/${jobId}/takeoffs`, body),
  saveTakeoff: (id: Id, body: { name: string; input: Takeoff }) => api.put<TakeoffRecord>(`/takeoffs/${id}`, body),
  removeTakeoff: (id: Id) => api.delete(`/takeoffs/${id}`),
  importTakeoff: (jobId: Id, form: FormData) => api.post<TakeoffRecord>(`/jobs/${jobId}/takeoffs/import`, form),
  takeoffTemplate: (format: 'xlsx' | 'csv') => download(`/takeoffs/import-template${format === 'csv' ? '?format=csv' : ''}`),
  compute: (body: { takeoff: Takeoff; unit: LengthUnit }, signal?: AbortSignal) => api.post<ComputeAnswer>('/takeoffs/compute', body, { signal }),
  createBom: (jobId: Id, takeoffId: Id) => api.post<BomRecord>(`/jobs/${jobId}/boms`, { takeoffId }),
  bom: (id: Id) => api.get<BomRecord>(`/boms/${id}`),
  exportBom: (id: Id, tz: string) => download(`/boms/${id}/export${toQuery({ tz })}`),

  // Takeoff settings (ruleOverrideSchema, roleItemInputSchema, wasteUpdateSchema, siteFiguresUpdateSchema)
  rules: () => api.get<RuleRecord[]>('/takeoff-settings/rules'),
  saveRule: (key: string, body: object) => api.put<RuleRecord[]>(`/takeoff-settings/rules/${key}`, body),
  resetRule: (key: string) => api.delete<RuleRecord[]>(`/takeoff-settings/rules/${key}`),
  roleItems: () => api.get<RoleItemRecord[]>('/takeoff-settings/role-items'),
  createRoleItem: (body: object) => api.post<RoleItemRecord>('/takeoff-settings/role-items', body),
  updateRoleItem: (id: Id, body: object) => api.put<RoleItemRecord>(`/takeoff-settings/role-items/${id}`, body),
  removeRoleItem: (id: Id) => api.delete(`/takeoff-settings/role-items/${id}`),
  waste: () => api.get<Record<MaterialFamily, number>>('/takeoff-settings/waste'),
  saveWaste: (body: Partial<Record<MaterialFamily, number | null>>) => api.patch<Record<MaterialFamily, number>>('/takeoff-settings/waste', body),
  figures: () => api.get<SiteFigures>('/takeoff-settings/figures'),
  saveFigures: (body: Partial<Record<keyof SiteFigures, number | null>>) => api.patch<SiteFigures>('/takeoff-settings/figures', body),
}

export const salesApi = {
  // Quotes (quoteCreateSchema, quoteUpdateSchema, quoteSendSchema)
  quotes: (q: { status?: string } = {}) => api.get<QuoteSummary[]>(`/quotes${toQuery(q)}`),
  quote: (id: Id) => api.get<QuoteDetail>(`/quotes/${id}`),
  createQuote: (body: object) => api.post<QuoteDetail>('/quotes', body),
  saveQuote: (id: Id, body: object) => api.put<QuoteDetail>(`/quotes/${id}`, body),
  offerQuote: (id: Id, body: object) => api.post<QuoteDetail>(`/quotes/${id}/offer`, body),
  loseQuote: (id: Id, reason: string) => api.post<QuoteDetail>(`/quotes/${id}/lose`, { reason }),
  reviseQuote: (id: Id) => api.post<QuoteDetail>(`/quotes/${id}/revisions`),
  quotePdf: (id: Id) => download(`/quotes/${id}/pdf`),

  // Sales orders (handPaymentSchema); state changes carry the submission's Idempotency-Key
  orders: (q: { status?: string } = {}) => api.get<SalesOrderSummary[]>(`/sales-orders${toQuery(q)}`),
  order: (id: Id) => api.get<SalesOrderDetail>(`/sales-orders/${id}`),
  takeQuote: (body: { quoteId: number }, key: string) => api.post<{ id: number }>('/sales-orders', body, keyed(key)),
  recordPayment: (id: Id, body: object, key: string) => api.post(`/sales-orders/${id}/payments`, body, keyed(key)),
  cancelOrder: (id: Id, body: { reason: string }, key: string) => api.post(`/sales-orders/${id}/cancel`, body, keyed(key)),
  // Card deposits (cardDepositStartSchema): the card is entered on the provider's page, the counter follows it
  startCardDeposit: (id: Id, body: CardDepositStartInput, key: string) =>
    api.post<{ paymentId: number; amount: string; payPageUrl: string | null }>(`/sales-orders/${id}/card-deposits`, body, keyed(key)),
  cardDeposit: (id: Id, paymentId: number) => api.get(`/sales-orders/${id}/card-deposits/${paymentId}`, { answer: cardDepositStateSchema }),
  cancelCardDeposit: (id: Id, paymentId: number) => api.post(`/sales-orders/${id}/card-deposits/${paymentId}/cancel`, {}, { answer: cardDepositStateSchema }),

  // Returns against an order (salesReturnSchema) and the policy they follow (window, restocking fee)
  returns: (id: Id) => api.get<SalesReturnView[]>(`/sales-orders/${id}/returns`),
  takeReturn: (id: Id, body: object, key: string) => api.post<SalesReturnView & { accountCredit: string }>(`/sales-orders/${id}/returns`, body, keyed(key)),
  policy: () => api.get<SalesSettings>('/sales-settings'),
}
