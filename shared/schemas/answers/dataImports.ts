// The answers' schemas for the interfaces in shared/schemas/dataImports.ts, each held to its interface
// (satisfies): the client checks answers with them (src/api), and tests/api/answerSchemas.test.ts holds them to the server.
import { z } from 'zod'
import { DATA_IMPORT_KINDS } from '../dataImports.js'
import type { DataImportKind, DataImportRecord, DataImportRow, DataImportPreview, DataImportResult } from '../dataImports.js'
import { rowProblemShape } from './terms.js'

const dataImportKindShape = z.enum(DATA_IMPORT_KINDS) satisfies z.ZodType<DataImportKind>

export const dataImportRecordShape = z.object({
  id: z.number(),
  kind: dataImportKindShape,
  fileName: z.string(),
  checksum: z.string(),
  rows: z.number(),
  at: z.string(),
  byName: z.string().nullable(),
  reversedAt: z.string().nullable(),
  reversedByName: z.string().nullable(),
  summary: z.record(z.string(), z.number()).nullable()
}) satisfies z.ZodType<DataImportRecord>

const dataImportRowShape = z.object({
  row: z.number(),
  label: z.string().nullable(),
  place: z.string().nullable(),
  qty: z.number().nullable(),
  unitCost: z.string().optional().nullable(),
  errors: z.array(rowProblemShape)
}) satisfies z.ZodType<DataImportRow>

export const dataImportPreviewShape = z.object({
  kind: dataImportKindShape,
  filename: z.string(),
  total: z.number(),
  ready: z.number(),
  skipped: z.number(),
  errorRows: z.number(),
  rows: z.array(dataImportRowShape),
  repeatOf: dataImportRecordShape.nullable()
}) satisfies z.ZodType<DataImportPreview>

export const dataImportResultShape = dataImportPreviewShape.extend({
  record: dataImportRecordShape,
  repeated: z.boolean()
}) satisfies z.ZodType<DataImportResult>
