// Typed calls for pick lists. State changes carry an Idempotency-Key; scanner confirmations bring
// their own (made when the picker confirmed, kept with the queued confirmation).
import { z } from 'zod'
import { okShape, pickCompletedShape, pickListsMadeShape, pickListStepShape, pickShippedShape } from '@shared/schemas/answers/changes'
import {
  bomForPickingShape, pickConfirmAnswerShape, pickDiscardAnswerShape, pickListDetailShape, pickListSummaryShape, pickPlanShape,
  pickShortResolveAnswerShape, walkWarehouseShape,
} from '@shared/schemas/answers/picking'
import type { PickConfirmInput, PickDiscardInput, PickCreateInput, PickPlanInput, PickShortResolveInput } from '@shared/schemas/picking'
import type { DeviceOutboxReportInput } from '@shared/schemas/devices'
import { api } from './client'
import { keyed } from './idempotencyKey'

export const pickingApi = {
  list: (query: { warehouseId?: number; bomId?: number; jobId?: number; status?: string } = {}) => {
    const params = new URLSearchParams(Object.entries(query).filter(([, v]) => v !== undefined).map(([k, v]) => [k, String(v)]))
    return api.get(`/pick-lists${params.size ? `?${params}` : ''}`, { answer: z.array(pickListSummaryShape) })
  },
  detail: (id: number) => api.get(`/pick-lists/${id}`, { answer: pickListDetailShape }),
  boms: () => api.get('/pick-lists/boms', { answer: z.array(bomForPickingShape) }),
  warehouses: () => api.get('/picking/warehouses', { answer: z.array(walkWarehouseShape) }),
  plan: (body: PickPlanInput) => api.post('/pick-lists/plan', body, { answer: pickPlanShape }),
  create: (body: PickCreateInput) => api.post('/pick-lists', body, { ...keyed(), answer: pickListsMadeShape }),
  release: (id: number) => api.post(`/pick-lists/${id}/release`, {}, { ...keyed(), answer: pickListStepShape }),
  cancel: (id: number, reason: string | null) => api.post(`/pick-lists/${id}/cancel`, { reason }, { ...keyed(), answer: pickListStepShape }),
  complete: (id: number, acceptShort: boolean) =>
    api.post(`/pick-lists/${id}/complete`, { acceptShort }, { ...keyed(), answer: pickCompletedShape }),
  ship: (id: number, fromWarehouseId: number) => api.post(`/pick-lists/${id}/transfers/ship`, { fromWarehouseId }, { ...keyed(), answer: pickShippedShape }),
  confirm: (id: number, body: PickConfirmInput, key: string) => api.post(`/pick-lists/${id}/confirmations`, body, { ...keyed(key), answer: pickConfirmAnswerShape }),
  /** How many confirmations wait or were refused on this device, for the warehouse's start page. */
  reportOutbox: (deviceId: string, body: DeviceOutboxReportInput) => api.put(`/devices/${deviceId}/outbox`, body, { answer: okShape }),
  /** A line closed short: found on a recount, backordered, or substituted. */
  resolveShort: (id: number, body: PickShortResolveInput) => api.post(`/pick-lists/${id}/short-resolutions`, body, { ...keyed(), answer: pickShortResolveAnswerShape }),
  discard: (id: number, body: PickDiscardInput, key: string) => api.post(`/pick-lists/${id}/discards`, body, { ...keyed(key), answer: pickDiscardAnswerShape }),
}
