// Typed calls for the cycle count screens. Calls that change a count carry the Idempotency-Key of the
// submission that made them, so a scanner's double Enter or a retried request applies once.
import type {
  CountAccuracyRow, CountDetail, CountDuePlan, CountEntryInput, CountHistoryRow, CountOpenInput, CountReviewInput, CountSettings,
  CountSettingsInput, CountStartBinInput, CountSummary, HandheldCount,
} from '@shared/schemas/counts'
import { api } from './client'
import { toQuery, type QueryValues } from './stock'

const keyed = (key: string) => ({ headers: { 'Idempotency-Key': key } })

export const countsApi = {
  list: (q: QueryValues) => api.get<CountSummary[]>(`/counts${toQuery(q)}`),
  open: (body: CountOpenInput) => api.post<{ id: number }>('/counts', body),
  due: (warehouseId: number) => api.get<CountDuePlan>(`/counts/due${toQuery({ warehouseId })}`),
  settings: () => api.get<CountSettings>('/counts/settings'),
  saveSettings: (body: CountSettingsInput) => api.put<CountSettings>('/counts/settings', body),
  history: (q: QueryValues) => api.get<CountHistoryRow[]>(`/counts/history${toQuery(q)}`),
  accuracy: (q: QueryValues) => api.get<CountAccuracyRow[]>(`/counts/accuracy${toQuery(q)}`),
  detail: (id: number) => api.get<CountDetail>(`/counts/${id}`),
  handheld: (id: number) => api.get<HandheldCount>(`/counts/${id}/handheld`),
  startBin: (id: number, body: CountStartBinInput, key: string) => api.post<{ binId: number }>(`/counts/${id}/bins/start`, body, keyed(key)),
  enter: (id: number, body: CountEntryInput, key: string) => api.post<{ lineId: number }>(`/counts/${id}/entries`, body, keyed(key)),
  finishBin: (id: number, binId: number, key: string) =>
    api.post<{ closed: boolean; lines: number; differences: number }>(`/counts/${id}/bins/${binId}/finish`, {}, keyed(key)),
  review: (id: number, body: CountReviewInput, key: string) =>
    api.post<{ approved: number; recounts: number; closed: boolean }>(`/counts/${id}/review`, body, keyed(key)),
  cancel: (id: number, reason: string, key: string) => api.post<{ cancelled: true }>(`/counts/${id}/cancel`, { reason }, keyed(key)),
}
