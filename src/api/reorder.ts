// Typed calls for the buyer's reorder screens: the suggestion list and its choices, one line's working, the ABC
// classes, the policy layers, and accepting lines (under the selection's Idempotency-Key, so a retried click
// after a lost answer replays instead of accepting twice).
import { z } from 'zod'
import { okShape } from '@shared/schemas/answers/changes'
import {
  abcParetoShape, acceptResultShape, reorderChoicesShape, reorderLineDetailShape, reorderPolicyViewShape, suggestionListShape,
} from '@shared/schemas/answers/reorder'
import type { PolicyUpsertInput } from '@shared/schemas/reorder'
import { api } from './client'
import { keyed } from './idempotencyKey'
import { toQuery, type QueryValues } from './stock'

export const reorderApi = {
  suggestions: (filters: QueryValues) => api.get(`/reorder/suggestions${toQuery(filters)}`, { answer: suggestionListShape }),
  choices: () => api.get('/reorder/choices', { answer: reorderChoicesShape }),
  line: (itemId: number, warehouseId: number, windowDays?: number) =>
    api.get(`/reorder/lines/${itemId}/${warehouseId}${toQuery({ windowDays: windowDays || undefined })}`, { answer: reorderLineDetailShape }),
  abc: () => api.get('/reorder/abc', { answer: abcParetoShape }),
  policies: () => api.get('/reorder/policies', { answer: z.array(reorderPolicyViewShape) }),
  savePolicy: (body: PolicyUpsertInput) => api.post('/reorder/policies', body, { answer: reorderPolicyViewShape }),
  removePolicy: (id: number) => api.delete(`/reorder/policies/${id}`, { answer: okShape }),
  accept: (lines: { itemId: number; warehouseId: number }[], key: string) =>
    api.post('/reorder/accept', { lines }, { ...keyed(key), answer: acceptResultShape }),
}
