// Typed calls for the cycle count screens. Calls that change a count carry the Idempotency-Key of the
// submission that made them, so a scanner's double Enter or a retried request applies once.
import { z } from 'zod'
import {
  binFinishedShape, binStartedShape, countCancelledShape, countEnteredShape, countReviewedShape, createdShape,
} from '@shared/schemas/answers/changes'
import {
  countAccuracyRowShape, countDetailShape, countDuePlanShape, countHistoryRowShape, countSettingsShape, countSummaryShape, handheldCountShape,
} from '@shared/schemas/answers/counts'
import type {
  CountEntryInput, CountOpenInput, CountReviewInput, CountSettingsInput, CountStartBinInput,
} from '@shared/schemas/counts'
import { api } from './client'
import { keyed } from './idempotencyKey'
import { toQuery, type QueryValues } from './stock'

export const countsApi = {
  list: (q: QueryValues) => api.get(`/counts${toQuery(q)}`, { answer: z.array(countSummaryShape) }),
  open: (body: CountOpenInput) => api.post('/counts', body, { answer: createdShape }),
  due: (warehouseId: number) => api.get(`/counts/due${toQuery({ warehouseId })}`, { answer: countDuePlanShape }),
  settings: () => api.get('/counts/settings', { answer: countSettingsShape }),
  saveSettings: (body: CountSettingsInput) => api.put('/counts/settings', body, { answer: countSettingsShape }),
  history: (q: QueryValues) => api.get(`/counts/history${toQuery(q)}`, { answer: z.array(countHistoryRowShape) }),
  accuracy: (q: QueryValues) => api.get(`/counts/accuracy${toQuery(q)}`, { answer: z.array(countAccuracyRowShape) }),
  detail: (id: number) => api.get(`/counts/${id}`, { answer: countDetailShape }),
  handheld: (id: number) => api.get(`/counts/${id}/handheld`, { answer: handheldCountShape }),
  startBin: (id: number, body: CountStartBinInput, key: string) => api.post(`/counts/${id}/bins/start`, body, { ...keyed(key), answer: binStartedShape }),
  enter: (id: number, body: CountEntryInput, key: string) => api.post(`/counts/${id}/entries`, body, { ...keyed(key), answer: countEnteredShape }),
  finishBin: (id: number, binId: number, key: string) =>
    api.post(`/counts/${id}/bins/${binId}/finish`, {}, { ...keyed(key), answer: binFinishedShape }),
  review: (id: number, body: CountReviewInput, key: string) =>
    api.post(`/counts/${id}/review`, body, { ...keyed(key), answer: countReviewedShape }),
  cancel: (id: number, reason: string, key: string) => api.post(`/counts/${id}/cancel`, { reason }, { ...keyed(key), answer: countCancelledShape }),
}
