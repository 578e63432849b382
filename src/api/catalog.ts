// Typed calls for the catalog: the item list and its export, one item with its stock and lots, the item
// form, and the item import's template.
import { importPreviewShape, itemDetailShape, itemPageShape, itemRecordShape, itemRecordViewShape, lotRowShape, lotRowsShape } from '@shared/schemas/answers/catalog'
import { itemPatchSchema, itemSchema, type ImportPreview } from '@shared/schemas/catalog'
import { z } from 'zod'
import { api, download, type BodyOf } from './client'
import type { SheetSteps } from './fileTransfer'
import { toQuery, type QueryValues } from './stock'

/** The item import's two steps, for the upload with progress (useSheetUpload): both answer what was (or would be) done. */
export const itemImportSteps: SheetSteps<ImportPreview, ImportPreview> = {
  path: (which) => `/items/import/${which}`,
  previewAnswer: importPreviewShape,
  commitAnswer: importPreviewShape,
}

export const catalogApi = {
  items: (q: QueryValues) => api.get(`/items${toQuery(q)}`, { answer: itemPageShape }),
  exportItems: (q: QueryValues) => download(`/items/export.xlsx${toQuery(q)}`),
  item: (id: number | string) => api.get(`/items/${id}`, { answer: itemDetailShape }),
  /** The item as the form edits it (cost only for those allowed to see it). */
  itemRecord: (id: number | string) => api.get(`/items/${id}`, { answer: z.object({ item: itemRecordViewShape }) }),
  lots: (itemId: number | string) => api.get(`/items/${itemId}/lots`, { answer: lotRowsShape }),
  create: (body: BodyOf<typeof itemSchema>) => api.post('/items', body, { answer: itemRecordShape }),
  update: (id: number | string, body: BodyOf<typeof itemPatchSchema>) => api.patch(`/items/${id}`, body, { answer: itemRecordShape }),
  deactivate: (id: number | string) => api.post(`/items/${id}/deactivate`, {}, { answer: itemRecordShape }),
  setLotTint: (itemId: number, lotId: number, tintNote: string) =>
    api.patch(`/items/${itemId}/lots/${lotId}`, { tintNote }, { answer: lotRowShape }),
  importTemplate: () => download('/items/import/template.xlsx'),
}
