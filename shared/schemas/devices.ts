// What a handheld tells the server about its outbox, and what the warehouse's start page reads back.
import { z } from 'zod'
import { issueCode } from '../errors/zodProblems.js'

/** A device's own random id, kept in its browser storage. */
export const DEVICE_ID_PATTERN = /^[A-Za-z0-9-]{8,64}$/

export const deviceOutboxReportSchema = z.object({
  waiting: z.number().int().min(0).max(100_000),
  refused: z.number().int().min(0).max(100_000),
  oldestWaitingAt: z.iso.datetime({ offset: true, error: issueCode('invalid_date') }).nullable().optional(),
  warehouseId: z.number().int().positive().nullable().optional(),
})
export type DeviceOutboxReportInput = z.infer<typeof deviceOutboxReportSchema>

export interface DeviceOutboxRow {
  deviceId: string
  person: string | null
  warehouseCode: string | null
  waiting: number
  refused: number
  oldestWaitingAt: string | null
  reportedAt: string
}

export interface DeviceOutboxSummary {
  /** Devices whose last report still had confirmations waiting or refused. */
  devices: DeviceOutboxRow[]
  waiting: number
  refused: number
}
