// Typed calls for the catalog: the item list and its export, one item with its stock and lots, the item
// form, and the item import's template.
import { itemPageSchema, lotRowsSchema, type ItemDetail, type ItemRecord, type ItemRecordView } from '@shared/schemas/catalog'
import { api, download } from './client'
import { toQuery, type QueryValues } from './stock'

export const catalogPaths = {
  /** The item import's two steps, for the upload with progress (useSheetUpload). */
  importStep: (which: 'preview' | 'commit') => `/items/import/${which}`,
}

export const catalogApi = {
  items: (q: QueryValues) => api.get(`/items${toQuery(q)}`, { answer: itemPageSchema }),
  exportItems: (q: QueryValues) => download(`/items/export.xlsx${toQuery(q)}`),
  item: (id: number | string) => api.get<ItemDetail>(`/items/${id}`),
  /** The item as the form edits it (cost only for those allowed to see it). */
  itemRecord: (id: number | string) => api.get<{ item: ItemRecordView }>(`/items/${id}`),
  lots: (itemId: number | string) => api.get(`/items/${itemId}/lots`, { answer: lotRowsSchema }),
  create: (body: object) => api.post<ItemRecord>('/items', body),
  update: (id: number | string, body: object) => api.patch<ItemRecord>(`/items/${id}`, body),
  deactivate: (id: number | string) => api.post(`/items/${id}/deactivate`),
  setLotTint: (itemId: number, lotId: number, tintNote: string) => api.patch(`/items/${itemId}/lots/${lotId}`, { tintNote }),
  importTemplate: () => download('/items/import/template.xlsx'),
}
