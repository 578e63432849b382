// The answers' schemas for the interfaces in shared/schemas/devices.ts, each held to its interface
// (satisfies): the client checks answers with them (src/api), and tests/api/answerSchemas.test.ts holds them to the server.
import { z } from 'zod'
import type { DeviceOutboxRow, DeviceOutboxSummary } from '../devices.js'

const deviceOutboxRowShape = z.object({
  deviceId: z.string(),
  person: z.string().nullable(),
  warehouseCode: z.string().nullable(),
  waiting: z.number(),
  refused: z.number(),
  oldestWaitingAt: z.string().nullable(),
  reportedAt: z.string()
}) satisfies z.ZodType<DeviceOutboxRow>

export const deviceOutboxSummaryShape = z.object({
  devices: z.array(deviceOutboxRowShape),
  waiting: z.number(),
  refused: z.number()
}) satisfies z.ZodType<DeviceOutboxSummary>
