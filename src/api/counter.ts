// Typed calls for the counter: contractor accounts, jobs, takeoffs, bills of materials, quotes, sales orders,
// and the takeoff settings (material rules, role → item mapping, waste, site figures). Bodies are typed from the
// schemas the server parses them with; the forms check with the same schemas first.
import { z } from 'zod'
import {
  cardDepositStartedShape, createdShape, okShape, orderCancelledShape, paymentRecordedShape,
} from '@shared/schemas/answers/changes'
import { bomRecordShape, computeAnswerShape, jobDetailShape, ruleRecordShape, takeoffRecordShape } from '@shared/schemas/answers/counter'
import { quoteDetailShape, quoteSummaryShape } from '@shared/schemas/answers/quotes'
import { cardDepositStateShape, salesOrderDetailShape, salesOrderSummaryShape } from '@shared/schemas/answers/salesOrders'
import { returnTakenShape, salesReturnViewShape } from '@shared/schemas/answers/salesReturns'
import { salesReturnSchema } from '@shared/schemas/salesReturns'
import {
  computeRequestSchema, counterCatalogSchema, customerCreateSchema, customerSummarySchema, customerUpdateSchema, jobCreateSchema,
  jobSummarySchema, jobUpdateSchema, roleItemInputSchema, roleItemRecordSchema, ruleOverrideSchema, siteFiguresUpdateSchema, takeoffSaveSchema, takeoffUpdateSchema,
  wasteUpdateSchema,
} from '@shared/schemas/counter'
import { quoteCreateSchema, quoteSendSchema, quoteUpdateSchema } from '@shared/schemas/quotes'
import { handPaymentSchema, salesOrderCancelSchema, salesOrderFromQuoteSchema, type CardDepositStartInput } from '@shared/schemas/salesOrders'
import { materialFamilySchema, siteFiguresSchema } from '@shared/schemas/takeoff'
import { api, download, type BodyOf } from './client'
import { keyed } from './idempotencyKey'
import { toQuery, type QueryValues } from './stock'

type Id = number | string
const wasteShape = z.record(materialFamilySchema, z.number())

export const counterApi = {
  /** Everything the takeoff editor computes with. */
  catalog: () => api.get('/takeoffs/catalog', { answer: counterCatalogSchema }),

  // Contractor accounts
  customers: (q: { q?: string; active?: 'true' | 'false' | 'all' } = {}) =>
    api.get(`/customers${toQuery(q)}`, { answer: z.array(customerSummarySchema) }),
  createCustomer: (body: BodyOf<typeof customerCreateSchema>) => api.post('/customers', body, { answer: customerSummarySchema }),
  updateCustomer: (id: Id, body: BodyOf<typeof customerUpdateSchema>) => api.patch(`/customers/${id}`, body, { answer: customerSummarySchema }),
  removeCustomer: (id: Id) => api.delete(`/customers/${id}`, { answer: okShape }),

  // Jobs
  jobs: (q: QueryValues) => api.get(`/jobs${toQuery(q)}`, { answer: z.array(jobSummarySchema) }),
  job: (id: Id) => api.get(`/jobs/${id}`, { answer: jobDetailShape }),
  /** A job's header only (its takeoffs and bills left out of the type). */
  jobSummary: (id: Id) => api.get(`/jobs/${id}`, { answer: jobSummarySchema }),
  createJob: (body: BodyOf<typeof jobCreateSchema>) => api.post('/jobs', body, { answer: jobSummarySchema }),
  updateJob: (id: Id, body: BodyOf<typeof jobUpdateSchema>) => api.patch(`/jobs/${id}`, body, { answer: jobSummarySchema }),

  // Takeoffs and bills of materials
  takeoff: (id: Id) => api.get(`/takeoffs/${id}`, { answer: takeoffRecordShape }),
  createTakeoff: (jobId: Id, body: BodyOf<typeof takeoffSaveSchema>) => api.post(`/jobs/${jobId}/takeoffs`, body, { answer: takeoffRecordShape }),
  saveTakeoff: (id: Id, body: BodyOf<typeof takeoffUpdateSchema>) => api.put(`/takeoffs/${id}`, body, { answer: takeoffRecordShape }),
  removeTakeoff: (id: Id) => api.delete(`/takeoffs/${id}`, { answer: okShape }),
  importTakeoff: (jobId: Id, form: FormData) => api.post(`/jobs/${jobId}/takeoffs/import`, form, { answer: takeoffRecordShape }),
  takeoffTemplate: (format: 'xlsx' | 'csv') => download(`/takeoffs/import-template${format === 'csv' ? '?format=csv' : ''}`),
  compute: (body: BodyOf<typeof computeRequestSchema>, signal?: AbortSignal) =>
    api.post('/takeoffs/compute', body, { signal, answer: computeAnswerShape }),
  createBom: (jobId: Id, takeoffId: Id) => api.post(`/jobs/${jobId}/boms`, { takeoffId }, { answer: bomRecordShape }),
  bom: (id: Id) => api.get(`/boms/${id}`, { answer: bomRecordShape }),
  exportBom: (id: Id, tz: string) => download(`/boms/${id}/export${toQuery({ tz })}`),

  // Takeoff settings
  rules: () => api.get('/takeoff-settings/rules', { answer: z.array(ruleRecordShape) }),
  saveRule: (key: string, body: BodyOf<typeof ruleOverrideSchema>) =>
    api.put(`/takeoff-settings/rules/${key}`, body, { answer: z.array(ruleRecordShape) }),
  resetRule: (key: string) => api.delete(`/takeoff-settings/rules/${key}`, { answer: z.array(ruleRecordShape) }),
  roleItems: () => api.get('/takeoff-settings/role-items', { answer: z.array(roleItemRecordSchema) }),
  createRoleItem: (body: BodyOf<typeof roleItemInputSchema>) => api.post('/takeoff-settings/role-items', body, { answer: roleItemRecordSchema }),
  updateRoleItem: (id: Id, body: BodyOf<typeof roleItemInputSchema>) =>
    api.put(`/takeoff-settings/role-items/${id}`, body, { answer: roleItemRecordSchema }),
  removeRoleItem: (id: Id) => api.delete(`/takeoff-settings/role-items/${id}`, { answer: okShape }),
  waste: () => api.get('/takeoff-settings/waste', { answer: wasteShape }),
  saveWaste: (body: BodyOf<typeof wasteUpdateSchema>) => api.patch('/takeoff-settings/waste', body, { answer: wasteShape }),
  figures: () => api.get('/takeoff-settings/figures', { answer: siteFiguresSchema }),
  saveFigures: (body: BodyOf<typeof siteFiguresUpdateSchema>) => api.patch('/takeoff-settings/figures', body, { answer: siteFiguresSchema }),
}

export const salesApi = {
  // Quotes
  quotes: (q: { status?: string; q?: string; limit?: number; beforeId?: number } = {}) => api.get(`/quotes${toQuery(q)}`, { answer: z.array(quoteSummaryShape) }),
  quote: (id: Id) => api.get(`/quotes/${id}`, { answer: quoteDetailShape }),
  createQuote: (body: BodyOf<typeof quoteCreateSchema>) => api.post('/quotes', body, { answer: quoteDetailShape }),
  saveQuote: (id: Id, body: BodyOf<typeof quoteUpdateSchema>) => api.put(`/quotes/${id}`, body, { answer: quoteDetailShape }),
  offerQuote: (id: Id, body: BodyOf<typeof quoteSendSchema>) => api.post(`/quotes/${id}/offer`, body, { answer: quoteDetailShape }),
  loseQuote: (id: Id, reason: string) => api.post(`/quotes/${id}/lose`, { reason }, { answer: quoteDetailShape }),
  reviseQuote: (id: Id) => api.post(`/quotes/${id}/revisions`, {}, { answer: quoteDetailShape }),
  quotePdf: (id: Id) => download(`/quotes/${id}/pdf`),

  // Sales orders; state changes carry the submission's Idempotency-Key
  orders: (q: { status?: string; q?: string; limit?: number; beforeId?: number } = {}) => api.get(`/sales-orders${toQuery(q)}`, { answer: z.array(salesOrderSummaryShape) }),
  order: (id: Id) => api.get(`/sales-orders/${id}`, { answer: salesOrderDetailShape }),
  takeQuote: (body: BodyOf<typeof salesOrderFromQuoteSchema>, key: string) => api.post('/sales-orders', body, { ...keyed(key), answer: createdShape }),
  recordPayment: (id: Id, body: BodyOf<typeof handPaymentSchema>, key: string) =>
    api.post(`/sales-orders/${id}/payments`, body, { ...keyed(key), answer: paymentRecordedShape }),
  cancelOrder: (id: Id, body: BodyOf<typeof salesOrderCancelSchema>, key: string) =>
    api.post(`/sales-orders/${id}/cancel`, body, { ...keyed(key), answer: orderCancelledShape }),
  // Card deposits: the card is entered on the provider's page, the counter follows it
  startCardDeposit: (id: Id, body: CardDepositStartInput, key: string) =>
    api.post(`/sales-orders/${id}/card-deposits`, body, { ...keyed(key), answer: cardDepositStartedShape }),
  cardDeposit: (id: Id, paymentId: number) => api.get(`/sales-orders/${id}/card-deposits/${paymentId}`, { answer: cardDepositStateShape }),
  // Returns against an order (the policy they follow, window and restocking fee, is salesPolicyApi.read in ./admin)
  returns: (id: Id) => api.get(`/sales-orders/${id}/returns`, { answer: z.array(salesReturnViewShape) }),
  takeReturn: (id: Id, body: BodyOf<typeof salesReturnSchema>, key: string) =>
    api.post(`/sales-orders/${id}/returns`, body, { ...keyed(key), answer: returnTakenShape }),
  cancelCardDeposit: (id: Id, paymentId: number) => api.post(`/sales-orders/${id}/card-deposits/${paymentId}/cancel`, {}, { answer: cardDepositStateShape }),
}
