// Typed calls for going live: the setup checklist (units, GS1 prefix, logo), the data imports with their
// history and reversal, and the whole-business export. Uploads and the export report their progress.
import type { DataImportKind, DataImportRecord } from '@shared/schemas/dataImports'
import { setupStateSchema } from '@shared/schemas/setup'
import { api, download } from './client'
import { downloadWithProgress, uploadWithProgress } from './fileTransfer'

export const goliveApi = {
  setup: () => api.get('/setup', { answer: setupStateSchema }),
  saveUnits: (body: { lengthUnit: 'in' | 'mm'; weightUnit: 'lb' | 'kg' }) => api.put('/setup/units', body, { answer: setupStateSchema }),
  saveGs1Prefix: (prefix: string | null) => api.put('/setup/gs1-prefix', { prefix }, { answer: setupStateSchema }),
  uploadLogo: (form: FormData) => uploadWithProgress<unknown>('/setup/logo', form, () => {}).done,
  /** The logo for printed pages; null when none was uploaded. */
  printedLogo: () => download('/setup/printed-logo').catch(() => null),
  dismissSetup: () => api.post('/setup/dismiss'),

  imports: () => api.get<DataImportRecord[]>('/imports'),
  reverseImport: (id: number) => api.post(`/imports/${id}/reverse`),
  importTemplate: (kind: DataImportKind) => download(`/imports/${kind}/template.xlsx`),
  businessExport: (onBytes: (bytes: number) => void) => downloadWithProgress('/business-export', onBytes),
}

export const golivePaths = {
  /** A data import's two steps, for the upload with progress (useSheetUpload). */
  importStep: (kind: DataImportKind, which: 'preview' | 'commit') => `/imports/${kind}/${which}`,
}
