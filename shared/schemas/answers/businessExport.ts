// The answers' schemas for shared/schemas/businessExport.ts, each held to its interface (satisfies).
import { z } from 'zod'
import { EXPORT_JOB_STATES, type CurrentExportJob, type ExportJob } from '../businessExport.js'

export const exportJobShape = z.object({
  id: z.string(),
  state: z.enum(EXPORT_JOB_STATES),
  percent: z.number(),
  rowsDone: z.number(),
  rowsTotal: z.number().nullable(),
  filename: z.string(),
  bytes: z.number().nullable(),
  startedAt: z.string(),
  finishedAt: z.string().nullable(),
}) satisfies z.ZodType<ExportJob>

export const currentExportJobShape = z.object({ job: exportJobShape.nullable() }) satisfies z.ZodType<CurrentExportJob>
