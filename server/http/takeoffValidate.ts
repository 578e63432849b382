// Parses a request that carries a takeoff: problems come back per field in the clerk's unit ("At most
// 100 ft"), and a takeoff past the limits is refused as `takeoff_too_large` before anything is laid out.
import type { z } from 'zod'
import type { LengthUnitName } from '../../shared/schemas/takeoff.js'
import { takeoffIssues, TOO_LARGE_KEYS } from '../../shared/takeoff/issues.js'
import { AppError } from '../errors.js'

export function parseTakeoffBody<S extends z.ZodType>(schema: S, body: unknown, unit: LengthUnitName): z.infer<S> {
  const result = schema.safeParse(body ?? {})
  if (result.success) return result.data
  const issues = takeoffIssues(result.error, unit)
  const fields = Object.fromEntries(issues.map((i) => [i.path, i.message]))
  const large = issues.filter((i) => TOO_LARGE_KEYS.has(i.key))
  if (large.length > 0) {
    const first = large[0]
    throw new AppError(400, 'takeoff_too_large', `This takeoff is larger than Lumenyard takes: ${first.path} — ${first.message}.`, fields)
  }
  throw new AppError(400, 'invalid_input', 'Some fields need attention.', fields)
}

/** The unit a request's own figures are in, for its messages: the takeoff's, the request's, else the user's. */
export function requestUnit(body: unknown, fallback: LengthUnitName = 'in'): LengthUnitName {
  const b = body as { unit?: unknown; input?: { unit?: unknown }; takeoff?: { unit?: unknown } } | null
  const unit = b?.takeoff?.unit ?? b?.input?.unit ?? b?.unit
  return unit === 'mm' || unit === 'in' ? unit : fallback
}
