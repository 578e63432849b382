// Typed calls for pick lists. State changes carry an Idempotency-Key; scanner confirmations bring
// their own (made when the picker confirmed, kept with the queued confirmation).
import type {
  BomForPicking, PickConfirmAnswer, PickConfirmInput, PickDiscardAnswer, PickDiscardInput, PickCreateInput, PickListDetail, PickListSummary, PickPlan, PickPlanInput,
  PickShortResolveAnswer, PickShortResolveInput, WalkWarehouse,
} from '@shared/schemas/picking'
import type { DeviceOutboxReportInput } from '@shared/schemas/devices'
import { api } from './client'

/** A key unique enough for Idempotency-Key; randomUUID needs a secure context, so a fallback for plain-HTTP handhelds. */
export function newIdempotencyKey(): string {
  if (typeof crypto.randomUUID === 'function') return crypto.randomUUID()
  const bytes = crypto.getRandomValues(new Uint8Array(16))
  return [...bytes].map((b) => b.toString(16).padStart(2, '0')).join('')
}

const keyed = (key = newIdempotencyKey()) => ({ headers: { 'Idempotency-Key': key } })

export const pickingApi = {
  list: (query: { warehouseId?: number; bomId?: number; jobId?: number; status?: string } = {}) => {
    const params = new URLSearchParams(Object.entries(query).filter(([, v]) => v !== undefined).map(([k, v]) => [k, String(v)]))
    return api.get<PickListSummary[]>(`/pick-lists${params.size ? `?${params}` : ''}`)
  },
  detail: (id: number) => api.get<PickListDetail>(`/pick-lists/${id}`),
  boms: () => api.get<BomForPicking[]>('/pick-lists/boms'),
  warehouses: () => api.get<WalkWarehouse[]>('/picking/warehouses'),
  plan: (body: PickPlanInput) => api.post<PickPlan>('/pick-lists/plan', body),
  create: (body: PickCreateInput) => api.post<{ ids: number[]; lists: PickListSummary[] }>('/pick-lists', body, keyed()),
  release: (id: number) => api.post(`/pick-lists/${id}/release`, {}, keyed()),
  cancel: (id: number, reason: string | null) => api.post(`/pick-lists/${id}/cancel`, { reason }, keyed()),
  complete: (id: number, acceptShort: boolean) =>
    api.post<{ issued: number; closedShort: number }>(`/pick-lists/${id}/complete`, { acceptShort }, keyed()),
  ship: (id: number, fromWarehouseId: number) => api.post<{ transferId: number; qty: number }>(`/pick-lists/${id}/transfers/ship`, { fromWarehouseId }, keyed()),
  confirm: (id: number, body: PickConfirmInput, key: string) => api.post<PickConfirmAnswer>(`/pick-lists/${id}/confirmations`, body, keyed(key)),
  /** How many confirmations wait or were refused on this device, for the warehouse's start page. */
  reportOutbox: (deviceId: string, body: DeviceOutboxReportInput) => api.put<{ ok: true }>(`/devices/${deviceId}/outbox`, body),
  /** A line closed short: found on a recount, backordered, or substituted. */
  resolveShort: (id: number, body: PickShortResolveInput) => api.post<PickShortResolveAnswer>(`/pick-lists/${id}/short-resolutions`, body, keyed()),
  discard: (id: number, body: PickDiscardInput, key: string) => api.post<PickDiscardAnswer>(`/pick-lists/${id}/discards`, body, keyed(key)),
}
