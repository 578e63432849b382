// Typed calls for the admin area: users and their roles, the audit trail and its export, the company profile,
// purchasing settings and the mail outbox, and selling prices (levels, rules, tax rates, account terms).
import { z } from 'zod'
import { userCreateSchema, userSummarySchema, userUpdateSchema } from '@shared/schemas/auth'
import { auditTrailPageShape } from '@shared/schemas/answers/audit'
import { okShape, poMailedShape } from '@shared/schemas/answers/changes'
import { customerTermsSummaryShape, priceLevelSummaryShape, priceRuleSummaryShape, taxRateSummaryShape } from '@shared/schemas/answers/pricing'
import { companyProfileShape, purchasingSettingsShape } from '@shared/schemas/answers/purchasing'
import { outboxSummaryShape } from '@shared/schemas/answers/purchasingViews'
import { customerTermsInputSchema, priceLevelInputSchema, priceLevelUpdateSchema, priceRuleInputSchema, taxRateInputSchema } from '@shared/schemas/pricing'
import { companyProfileSchema, purchasingSettingsSchema } from '@shared/schemas/purchasing'
import { salesSettingsShape } from '@shared/schemas/answers/salesOrders'
import { salesSettingsSchema } from '@shared/schemas/salesOrders'
import { api, download, type BodyOf } from './client'
import { toQuery, type QueryValues } from './stock'

type Id = number | string

export const adminApi = {
  // Users
  users: () => api.get('/users', { answer: z.array(userSummarySchema) }),
  createUser: (body: BodyOf<typeof userCreateSchema>) => api.post('/users', body, { answer: userSummarySchema }),
  updateUser: (id: Id, body: BodyOf<typeof userUpdateSchema>) => api.patch(`/users/${id}`, body, { answer: userSummarySchema }),
  resetPassword: (id: Id, password: string) => api.post(`/users/${id}/password`, { password }, { answer: okShape }),

  // Audit trail
  audit: (q: QueryValues) => api.get(`/audit${toQuery(q)}`, { answer: auditTrailPageShape }),
  exportAudit: (q: QueryValues) => download(`/audit/export${toQuery(q)}`),

  // Company, purchasing settings, outbox
  company: () => api.get('/purchasing/company', { answer: companyProfileShape }),
  saveCompany: (body: BodyOf<typeof companyProfileSchema>) => api.put('/purchasing/company', body, { answer: companyProfileShape }),
  purchasingSettings: () => api.get('/purchasing/settings', { answer: purchasingSettingsShape }),
  savePurchasingSettings: (body: BodyOf<typeof purchasingSettingsSchema>) =>
    api.patch('/purchasing/settings', body, { answer: purchasingSettingsShape }),
  outbox: () => api.get('/purchasing/outbox', { answer: z.array(outboxSummaryShape) }),
  outboxAttachment: (messageId: Id, attachmentId: Id) => download(`/purchasing/outbox/${messageId}/attachments/${attachmentId}`),
  sendAgain: (messageId: Id) =>
    api.post(`/purchasing/outbox/${messageId}/send-again`, {}, { answer: poMailedShape }),
}

export const salesPolicyApi = {
  /** The counter's sales policy: deposit on made-to-order lines, return window and restocking fee (read by admin and counter). */
  read: () => api.get('/sales-settings', { answer: salesSettingsShape }),
  save: (body: BodyOf<typeof salesSettingsSchema>) => api.patch('/sales-settings', body, { answer: salesSettingsShape }),
}

export const pricingApi = {
  levels: () => api.get('/pricing/levels', { answer: z.array(priceLevelSummaryShape) }),
  createLevel: (body: BodyOf<typeof priceLevelInputSchema>) => api.post('/pricing/levels', body, { answer: priceLevelSummaryShape }),
  updateLevel: (id: Id, body: BodyOf<typeof priceLevelUpdateSchema>) => api.put(`/pricing/levels/${id}`, body, { answer: priceLevelSummaryShape }),
  removeLevel: (id: Id) => api.delete(`/pricing/levels/${id}`, { answer: okShape }),
  /** 'all': rules for every account; a level's id: that level's; nothing: every rule. */
  rules: (levelId?: number | 'all') => api.get(`/pricing/rules${toQuery({ levelId })}`, { answer: z.array(priceRuleSummaryShape) }),
  createRule: (body: BodyOf<typeof priceRuleInputSchema>) => api.post('/pricing/rules', body, { answer: priceRuleSummaryShape }),
  removeRule: (id: Id) => api.delete(`/pricing/rules/${id}`, { answer: okShape }),
  taxRates: () => api.get('/pricing/tax-rates', { answer: z.array(taxRateSummaryShape) }),
  saveTaxRate: (warehouseId: Id, body: BodyOf<typeof taxRateInputSchema>) =>
    api.put(`/pricing/tax-rates/${warehouseId}`, body, { answer: z.array(taxRateSummaryShape) }),
  accounts: () => api.get('/pricing/accounts', { answer: z.array(customerTermsSummaryShape) }),
  account: (customerId: Id) => api.get(`/pricing/accounts/${customerId}`, { answer: customerTermsSummaryShape }),
  saveAccount: (customerId: Id, body: BodyOf<typeof customerTermsInputSchema>) =>
    api.put(`/pricing/accounts/${customerId}`, body, { answer: customerTermsSummaryShape }),
}
