// Handhelds report how many pick confirmations wait in their outbox (not yet sent) or were refused, so
// the warehouse's start page can show work that exists only on a device. One row per device, replaced by
// each report; devices whose outbox is empty drop out of the summary.
import type { DataSource } from 'typeorm'
import type { DeviceOutboxReportInput, DeviceOutboxRow, DeviceOutboxSummary } from '../../../shared/schemas/devices.js'
import { AppError, problem } from '../../errors.js'

export async function reportDeviceOutbox(ds: DataSource, userId: number, deviceId: string, input: DeviceOutboxReportInput): Promise<{ ok: true }> {
  await ds.query(
    `INSERT INTO device_outbox_reports (device_id, user_id, warehouse_id, waiting, refused, oldest_waiting_at, reported_at)
     VALUES (?, ?, ?, ?, ?, ?, CURRENT_TIMESTAMP(3))
     ON DUPLICATE KEY UPDATE user_id = VALUES(user_id), warehouse_id = VALUES(warehouse_id), waiting = VALUES(waiting),
       refused = VALUES(refused), oldest_waiting_at = VALUES(oldest_waiting_at), reported_at = VALUES(reported_at)`,
    [deviceId, userId, input.warehouseId ?? null, input.waiting, input.refused, input.oldestWaitingAt ? new Date(input.oldestWaitingAt) : null],
  ).catch((err: { errno?: number; driverError?: { errno?: number } }) => {
    if ((err?.errno ?? err?.driverError?.errno) === 1452) throw AppError.badRequest('warehouse_not_found', 'That warehouse does not exist.', { fields: { warehouseId: problem('warehouse_not_found') } })
    throw err
  })
  return { ok: true }
}

interface Row {
  device_id: string
  display_name: string | null
  warehouse_code: string | null
  waiting: number
  refused: number
  oldest_waiting_at: Date | null
  reported_at: Date
}

export async function deviceOutboxSummary(ds: DataSource, warehouseId?: number): Promise<DeviceOutboxSummary> {
  const rows: Row[] = await ds.query(
    `SELECT r.device_id, u.display_name, w.code AS warehouse_code, r.waiting, r.refused, r.oldest_waiting_at, r.reported_at
       FROM device_outbox_reports r
       LEFT JOIN users u ON u.id = r.user_id
       LEFT JOIN warehouses w ON w.id = r.warehouse_id
      WHERE (r.waiting > 0 OR r.refused > 0) AND (? IS NULL OR r.warehouse_id = ?)
      ORDER BY r.reported_at DESC LIMIT 200`,
    [warehouseId ?? null, warehouseId ?? null],
  )
  const devices: DeviceOutboxRow[] = rows.map((r) => ({
    deviceId: r.device_id, person: r.display_name, warehouseCode: r.warehouse_code, waiting: Number(r.waiting), refused: Number(r.refused),
    oldestWaitingAt: r.oldest_waiting_at ? new Date(r.oldest_waiting_at).toISOString() : null, reportedAt: new Date(r.reported_at).toISOString(),
  }))
  return { devices, waiting: devices.reduce((a, d) => a + d.waiting, 0), refused: devices.reduce((a, d) => a + d.refused, 0) }
}
