// Handheld outbox reports: a device says how many confirmations wait or were refused on it; the
// warehouse's start page reads the devices that still hold some.
import { z } from 'zod'
import { DEVICE_ID_PATTERN, deviceOutboxReportSchema } from '../../shared/schemas/devices.js'
import type { AppContext } from '../context.js'
import { actorOf } from '../context.js'
import { AppError } from '../errors.js'
import { allow, defineRoutes } from '../http/routeTable.js'
import { readSource } from '../http/readSource.js'
import { parseBody, parseQuery } from '../http/validate.js'
import { deviceOutboxSummary, reportDeviceOutbox } from '../services/counts/deviceOutbox.js'

const crew = allow('admin', 'warehouse')
const summaryQuery = z.object({ warehouseId: z.coerce.number().int().positive().optional() })

function deviceId(value: unknown): string {
  const text = String(value ?? '')
  if (!DEVICE_ID_PATTERN.test(text)) throw new AppError(400, 'device_id_invalid', 'A device id is 8–64 letters, digits or dashes.')
  return text
}

export default (ctx: AppContext) =>
  defineRoutes('/devices', [
    {
      method: 'get',
      path: '/outbox',
      access: crew,
      handler: (req) => deviceOutboxSummary(readSource(ctx), parseQuery(summaryQuery, req.query).warehouseId),
    },
    {
      method: 'put',
      path: '/:deviceId/outbox',
      access: crew,
      handler: (req) => reportDeviceOutbox(ctx.ds, actorOf(req).userId, deviceId(req.params.deviceId), parseBody(deviceOutboxReportSchema, req.body)),
    },
  ])
