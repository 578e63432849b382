import type { z } from 'zod'
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

/** Route ids are positive integers; anything else is a 404, not a 500. */
export function idParam(value: string | string[] | undefined, what = 'That record'): number {
  const text = Array.isArray(value) ? value[0] : value
  const n = Number(text)
  if (!text || !Number.isSafeInteger(n) || n <= 0) throw AppError.notFound(what)
  return n
}
