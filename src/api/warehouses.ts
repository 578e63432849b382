// Typed calls for the warehouses screen: warehouses, their bins, and bins made from a range. Answers are
// checked against shared/schemas/warehouses.ts in development and tests.
import { deletedShape } from '@shared/schemas/answers/changes'
import { z } from 'zod'
import {
  binRangeResultSchema, binRowSchema, warehouseDetailSchema, warehouseRowSchema,
  type BinInput, type BinPatch, type BinRangeInput, type WarehouseInput, type WarehousePatch,
} from '@shared/schemas/warehouses'
import { api } from './client'

type Body<T> = { [K in keyof T]?: unknown }

export const warehousesApi = {
  list: () => api.get('/warehouses', { answer: z.array(warehouseRowSchema) }),
  detail: (id: number) => api.get(`/warehouses/${id}`, { answer: warehouseDetailSchema }),
  create: (body: Body<WarehouseInput>) => api.post('/warehouses', body, { answer: warehouseRowSchema }),
  update: (id: number, body: Body<WarehousePatch>) => api.patch(`/warehouses/${id}`, body, { answer: warehouseRowSchema }),
  addBin: (warehouseId: number, body: Body<BinInput>) => api.post(`/warehouses/${warehouseId}/bins`, body, { answer: binRowSchema }),
  updateBin: (warehouseId: number, binId: number, body: Body<BinPatch>) => api.patch(`/warehouses/${warehouseId}/bins/${binId}`, body, { answer: binRowSchema }),
  removeBin: (warehouseId: number, binId: number) => api.delete(`/warehouses/${warehouseId}/bins/${binId}`, { answer: deletedShape }),
  addBinRange: (warehouseId: number, body: Body<BinRangeInput>) =>
    api.post(`/warehouses/${warehouseId}/bins/range`, body, { answer: binRangeResultSchema }),
}
