import type { z } from 'zod'
import type { ERROR_CODES, ErrorCode } from '../../shared/errors/errorCodes.js'
import { AppError } from '../errors.js'

/** Parses with the shared schema; bad input becomes a 400 with a message per field. */
export function parseBody<S extends z.ZodType>(schema: S, body: unknown): z.infer<S> {
  const result = schema.safeParse(body ?? {})
  if (!result.success) throw AppError.fromZod(result.error)
  return result.data
}

export function parseQuery<S extends z.ZodType>(schema: S, query: unknown): z.infer<S> {
  const result = schema.safeParse(query ?? {})
  if (!result.success) throw AppError.fromZod(result.error, 'invalid_filters', 'Some filters are not valid.')
  return result.data
}

/** The codes that say a record named by id is not there (`job_not_found`, …): no values needed. */
export type NotFoundCode = {
  [C in ErrorCode]: C extends `${string}_not_found` ? ((typeof ERROR_CODES)[C] extends readonly [] ? C : never) : never
}[ErrorCode]

/** Route ids are positive integers; anything else is a 404 with the record's own code, not a 500. */
export function idParam(value: string | string[] | undefined, notFound: NotFoundCode = 'record_not_found'): number {
  const text = Array.isArray(value) ? value[0] : value
  const n = Number(text)
  if (!text || !Number.isSafeInteger(n) || n <= 0) throw new AppError(404, notFound, `No record for id "${text ?? ''}" (${notFound}).`)
  return n
}
