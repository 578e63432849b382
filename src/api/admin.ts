// Typed calls for the admin area: users and their roles, the audit trail and its export, the company profile,
// purchasing settings and the mail outbox, and selling prices (levels, rules, tax rates, account terms).
import type { AuditTrailPage } from '@shared/schemas/audit'
import { z } from 'zod'
import { userSummarySchema } from '@shared/schemas/auth'
import type { CustomerTermsSummary, PriceLevelSummary, PriceRuleSummary, TaxRateSummary } from '@shared/schemas/pricing'
import type { CompanyProfile, PurchasingSettings } from '@shared/schemas/purchasing'
import type { SalesSettings } from '@shared/schemas/salesOrders'
import type { OutboxSummary } from '@shared/schemas/purchasingViews'
import { api, download } from './client'
import { toQuery, type QueryValues } from './stock'

type Id = number | string

export const adminApi = {
  // Users (userCreateSchema, userUpdateSchema, passwordResetSchema)
  users: () => api.get('/users', { answer: z.array(userSummarySchema) }),
  createUser: (body: object) => api.post('/users', body, { answer: userSummarySchema }),
  updateUser: (id: Id, body: { active?: boolean; roles?: string[]; displayName?: string; email?: string }) =>
    api.patch(`/users/${id}`, body, { answer: userSummarySchema }),
  resetPassword: (id: Id, password: string) => api.post(`/users/${id}/password`, { password }),

  // Audit trail
  audit: (q: QueryValues) => api.get<AuditTrailPage>(`/audit${toQuery(q)}`),
  exportAudit: (q: QueryValues) => download(`/audit/export${toQuery(q)}`),

  // Company, purchasing settings, outbox
  company: () => api.get<CompanyProfile>('/purchasing/company'),
  saveCompany: (body: object) => api.put<CompanyProfile>('/purchasing/company', body),
  purchasingSettings: () => api.get<PurchasingSettings>('/purchasing/settings'),
  savePurchasingSettings: (body: Partial<PurchasingSettings>) => api.patch<PurchasingSettings>('/purchasing/settings', body),
  outbox: () => api.get<OutboxSummary[]>('/purchasing/outbox'),
  outboxAttachment: (messageId: Id, attachmentId: Id) => download(`/purchasing/outbox/${messageId}/attachments/${attachmentId}`),
  sendAgain: (messageId: Id) => api.post(`/purchasing/outbox/${messageId}/send-again`),
}

export const salesPolicyApi = {
  /** The counter's sales policy: deposit on made-to-order lines, return window and restocking fee (read by admin and counter). */
  read: () => api.get<SalesSettings>('/sales-settings'),
  save: (body: Partial<Record<keyof SalesSettings, string | number>>) => api.patch<SalesSettings>('/sales-settings', body),
}

export const pricingApi = {
  levels: () => api.get<PriceLevelSummary[]>('/pricing/levels'),
  createLevel: (body: object) => api.post<PriceLevelSummary>('/pricing/levels', body),
  updateLevel: (id: Id, body: object) => api.put<PriceLevelSummary>(`/pricing/levels/${id}`, body),
  removeLevel: (id: Id) => api.delete(`/pricing/levels/${id}`),
  /** 'all': rules for every account; a level's id: that level's; nothing: every rule. */
  rules: (levelId?: number | 'all') => api.get<PriceRuleSummary[]>(`/pricing/rules${toQuery({ levelId })}`),
  createRule: (body: object) => api.post<PriceRuleSummary>('/pricing/rules', body),
  removeRule: (id: Id) => api.delete(`/pricing/rules/${id}`),
  taxRates: () => api.get<TaxRateSummary[]>('/pricing/tax-rates'),
  saveTaxRate: (warehouseId: Id, body: object) => api.put(`/pricing/tax-rates/${warehouseId}`, body),
  accounts: () => api.get<CustomerTermsSummary[]>('/pricing/accounts'),
  account: (customerId: Id) => api.get<CustomerTermsSummary>(`/pricing/accounts/${customerId}`),
  saveAccount: (customerId: Id, body: object) => api.put(`/pricing/accounts/${customerId}`, body),
}
