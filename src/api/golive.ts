// Typed calls for going live: the setup checklist (units, GS1 prefix, logo), the data imports with their
// history and reversal, and the whole-business export. Uploads and the export report their progress.
import { z } from 'zod'
import { okShape } from '@shared/schemas/answers/changes'
import { currentDataImportRunShape, dataImportPreviewShape, dataImportProblemPageShape, dataImportRecordShape, dataImportResultShape } from '@shared/schemas/answers/dataImports'
import type { DataImportKind, DataImportPreview, DataImportResult } from '@shared/schemas/dataImports'
import { setupStateSchema } from '@shared/schemas/setup'
import { currentExportJobShape, exportJobShape } from '@shared/schemas/answers/businessExport'
import { api, download } from './client'
import { downloadWithProgress, uploadWithProgress, type SheetSteps } from './fileTransfer'

export const goliveApi = {
  setup: () => api.get('/setup', { answer: setupStateSchema }),
  saveUnits: (body: { lengthUnit: 'in' | 'mm'; weightUnit: 'lb' | 'kg' }) => api.put('/setup/units', body, { answer: setupStateSchema }),
  saveGs1Prefix: (prefix: string | null) => api.put('/setup/gs1-prefix', { prefix }, { answer: setupStateSchema }),
  uploadLogo: (form: FormData) => uploadWithProgress('/setup/logo', form, okShape, () => {}).done,
  /** The logo for printed pages; null when none was uploaded. */
  printedLogo: () => download('/setup/printed-logo').catch(() => null),
  dismissSetup: () => api.post('/setup/dismiss', {}, { answer: setupStateSchema }),

  imports: () => api.get('/imports', { answer: z.array(dataImportRecordShape) }),
  reverseImport: (id: number) => api.post(`/imports/${id}/reverse`, {}, { answer: dataImportRecordShape }),
  importTemplate: (kind: DataImportKind) => download(`/imports/${kind}/template.xlsx`),
  /** The signed-in person's latest check or commit: how far it has got, its answer once done. */
  currentImportRun: () => api.get('/imports/runs/current', { answer: currentDataImportRunShape }),
  /** A page of a check's problems from `offset`; of one column when `column` is given (null: the row as a whole). */
  importProblems: (runId: string, offset: number, column?: string | null) => {
    const q = new URLSearchParams({ offset: String(offset) })
    if (column !== undefined) q.set('column', column ?? '')
    return api.get(`/imports/runs/${encodeURIComponent(runId)}/problems?${q}`, { answer: dataImportProblemPageShape })
  },
  /** Commits the file a finished check kept on the server (nothing is sent again); a second press follows the first. */
  commitChecked: (runId: string) => api.post(`/imports/runs/${encodeURIComponent(runId)}/commit`, {}, { answer: dataImportResultShape }),
  /** Starts everything out on the server, or answers the export already running. */
  startExport: () => api.post('/business-export/jobs', {}, { answer: exportJobShape }),
  currentExport: () => api.get('/business-export/jobs/current', { answer: currentExportJobShape }),
  exportFile: (id: string, onBytes: (bytes: number) => void) => downloadWithProgress(`/business-export/jobs/${encodeURIComponent(id)}/file`, onBytes),
}

/** A data import's two steps for the upload with progress (useSheetUpload); `kind` is read at each step. */
export function dataImportSteps(kind: () => DataImportKind): SheetSteps<DataImportPreview, DataImportResult> {
  return { path: (which) => `/imports/${kind()}/${which}`, previewAnswer: dataImportPreviewShape, commitAnswer: dataImportResultShape }
}
