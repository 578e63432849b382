// The answers' schemas for the interfaces in shared/takeoff/cautions.ts, each held to its interface
// (satisfies): the client checks answers with them (src/api), and tests/api/answerSchemas.test.ts holds them to the server.
import { z } from 'zod'
import type { CautionLevel, Caution } from '../../takeoff/cautions.js'

const cautionLevelShape = z.union([z.literal('stop'), z.literal('warn'), z.literal('info')]) satisfies z.ZodType<CautionLevel>

export const cautionShape = z.object({
  level: cautionLevelShape,
  code: z.string().optional(),
  message: z.string(),
  wall: z.string().optional(),
  key: z.string().optional(),
  params: z.record(z.string(), z.union([z.string(), z.number()])).optional()
}) satisfies z.ZodType<Caution>
