// The answers' schemas for the interfaces in shared/schemas/dataImports.ts, each held to its interface
// (satisfies): the client checks answers with them (src/api), and tests/api/answerSchemas.test.ts holds them to the server.
import { z } from 'zod'
import { DATA_IMPORT_KINDS } from '../dataImports.js'
import type { CurrentDataImportRun, DataImportKind, DataImportProblemPage, DataImportRecord, DataImportRow, DataImportPreview, DataImportResult, DataImportRun } from '../dataImports.js'
import { errorParamsShape, rowProblemShape } from './terms.js'

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
  problems: z.number(),
  problemColumns: z.array(z.object({ column: z.string().nullable(), count: z.number() })),
  checkRun: z.string().nullable(),
  problemRun: z.string().nullable(),
  repeatOf: dataImportRecordShape.nullable()
}) satisfies z.ZodType<DataImportPreview>

export const dataImportResultShape = dataImportPreviewShape.extend({
  record: dataImportRecordShape,
  repeated: z.boolean()
}) satisfies z.ZodType<DataImportResult>

// Only administrators read a run: a row's cost is there whenever its kind has one (opening stock), so the row is
// either a costed one, cost required, or one of a kind without costs.
const runRowShape = z.union([dataImportRowShape.extend({ unitCost: z.string().nullable() }), dataImportRowShape.omit({ unitCost: true })])
const runPreviewShape = dataImportPreviewShape.extend({ rows: z.array(runRowShape) })

const dataImportRunShape = z.object({
  id: z.string(),
  kind: dataImportKindShape,
  step: z.enum(['preview', 'commit']),
  fileName: z.string(),
  state: z.enum(['running', 'done', 'failed']),
  rowsTotal: z.number().nullable(),
  rowsRead: z.number(),
  rowsChecked: z.number(),
  rowsWritten: z.number(),
  percent: z.number(),
  startedAt: z.string(),
  // A commit's answer carries its record; a check's does not.
  answer: z.union([runPreviewShape.extend({ record: dataImportRecordShape, repeated: z.boolean() }), runPreviewShape]).nullable(),
  problem: z.object({
    status: z.number(),
    code: z.string(),
    message: z.string(),
    params: errorParamsShape.optional(),
    fields: z.record(z.string(), rowProblemShape.shape.problem).optional(),
  }).nullable(),
}) satisfies z.ZodType<DataImportRun>

export const currentDataImportRunShape = z.object({ run: dataImportRunShape.nullable() }) satisfies z.ZodType<CurrentDataImportRun>

export const dataImportProblemPageShape = z.object({
  total: z.number(),
  offset: z.number(),
  problems: z.array(z.object({ row: z.number(), label: z.string().nullable(), column: z.string().nullable(), problem: rowProblemShape.shape.problem })),
}) satisfies z.ZodType<DataImportProblemPage>
