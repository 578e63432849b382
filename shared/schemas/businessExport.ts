// Everything out as a job: how far the export has got (rows counted first, then written), and its file once ready.

export const EXPORT_JOB_STATES = ['running', 'ready', 'failed'] as const

export interface ExportJob {
  id: string
  state: (typeof EXPORT_JOB_STATES)[number]
  /** Whole percent of the rows written; 100 only once the zip is complete. */
  percent: number
  rowsDone: number
  /** The rows the export will write, once counted. */
  rowsTotal: number | null
  filename: string
  /** The zip's size once ready. */
  bytes: number | null
  startedAt: string
  finishedAt: string | null
}

export interface CurrentExportJob {
  job: ExportJob | null
}
