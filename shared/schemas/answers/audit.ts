// The answers' schemas for the interfaces in shared/schemas/audit.ts, each held to its interface
// (satisfies): the client checks answers with them (src/api), and tests/api/answerSchemas.test.ts holds them to the server.
import { z } from 'zod'
import type { AuditSubject, AuditMove, AuditTrailEntry, AuditTrailPage } from '../audit.js'
import { auditKindShape, moveTypeShape, stockUnitShape } from './terms.js'

const auditSubjectShape = z.object({
  type: z.string(),
  ref: z.string().nullable()
}) satisfies z.ZodType<AuditSubject>

const auditMoveShape = z.object({
  moveType: moveTypeShape,
  sku: z.string(),
  itemName: z.string(),
  qty: z.number(),
  stockUnit: stockUnitShape,
  warehouseCode: z.string(),
  binCode: z.string(),
  lotCode: z.string().nullable(),
  reason: z.string().nullable(),
  document: auditSubjectShape.nullable()
}) satisfies z.ZodType<AuditMove>

const auditTrailEntryShape = z.object({
  key: z.string(),
  at: z.string(),
  kind: auditKindShape,
  action: z.string(),
  userId: z.number().nullable(),
  userName: z.string().nullable(),
  ip: z.string().nullable(),
  subject: auditSubjectShape.nullable(),
  facts: z.object({
    rolesFrom: z.array(z.string()).optional(),
    rolesTo: z.array(z.string()).optional(),
    username: z.string().optional(),
    reason: z.string().optional()
  }),
  move: auditMoveShape.nullable()
}) satisfies z.ZodType<AuditTrailEntry>

export const auditTrailPageShape = z.object({
  entries: z.array(auditTrailEntryShape),
  next: z.string().nullable()
}) satisfies z.ZodType<AuditTrailPage>
