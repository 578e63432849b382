// Typed calls for the buyer's reorder screens: the suggestion list and its choices, one line's working, the ABC
// classes, the policy layers, and accepting lines (under the selection's Idempotency-Key, so a retried click
// after a lost answer replays instead of accepting twice).
import type {
  AbcPareto, AcceptResult, PolicyUpsertInput, ReorderChoices, ReorderLineDetail, ReorderPolicyView, SuggestionList,
} from '@shared/schemas/reorder'
import { api } from './client'
import { toQuery, type QueryValues } from './stock'

export const reorderApi = {
  suggestions: (filters: QueryValues) => api.get<SuggestionList>(`/reorder/suggestions${toQuery(filters)}`),
  choices: () => api.get<ReorderChoices>('/reorder/choices'),
  line: (itemId: number, warehouseId: number, windowDays?: number) =>
    api.get<ReorderLineDetail>(`/reorder/lines/${itemId}/${warehouseId}${toQuery({ windowDays: windowDays || undefined })}`),
  abc: () => api.get<AbcPareto>('/reorder/abc'),
  policies: () => api.get<ReorderPolicyView[]>('/reorder/policies'),
  savePolicy: (body: PolicyUpsertInput) => api.post<ReorderPolicyView>('/reorder/policies', body),
  removePolicy: (id: number) => api.delete(`/reorder/policies/${id}`),
  accept: (lines: { itemId: number; warehouseId: number }[], key: string) =>
    api.post<AcceptResult>('/reorder/accept', { lines }, { headers: { 'Idempotency-Key': key } }),
}
