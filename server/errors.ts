import type { ZodError } from 'zod'
import { ERROR_CODES, isErrorCode, problem, type ErrorCode, type ErrorParams, type ParamArgs, type Problem } from '../shared/errors/errorCodes.js'
import { zodFieldProblems } from '../shared/errors/zodProblems.js'

export { problem }

/** Per field, the problem shown beside it: `{ toBinId: problem('same_bin') }`. */
export type FieldProblems = Record<string, Problem>

type Extra<C extends ErrorCode> = ParamArgs<C>[0] extends infer P
  ? undefined extends P
    ? { params?: P; fields?: FieldProblems }
    : { params: P; fields?: FieldProblems }
  : never
/** The optional last argument: the code's values (required when its message names some) and field problems. */
type ExtraArgs<C extends ErrorCode> = undefined extends ParamArgs<C>[0] ? [extra?: Extra<C>] : [extra: Extra<C>]

/**
 * The one error class. Its status, code, params and field problems reach the client, which words
 * them in the user's language (src/i18n/<lang>/errors.ts); the English message is for the log and
 * for people reading the API by hand. Codes are registered in shared/errors/errorCodes.ts.
 *
 *   throw AppError.notFound('bin_not_found', `Bin ${code} was not found.`, { params: { code } })
 */
export class AppError extends Error {
  readonly params: ErrorParams
  readonly fields?: FieldProblems

  constructor(
    readonly status: number,
    readonly code: ErrorCode,
    message: string,
    extra: { params?: ErrorParams; fields?: FieldProblems } = {},
  ) {
    super(message)
    this.params = extra.params ?? {}
    if (extra.fields && Object.keys(extra.fields).length) this.fields = extra.fields
  }

  static of<C extends ErrorCode>(status: number, code: C, message: string, ...[extra]: ExtraArgs<C>): AppError {
    return new AppError(status, code, message, extra as { params?: ErrorParams; fields?: FieldProblems })
  }

  /** 400. Also the earlier form `badRequest(message, fields?)` (deprecated: name the situation with a code). */
  static badRequest<C extends ErrorCode>(code: C, message: string, ...extra: ExtraArgs<C>): AppError
  /** @deprecated give a code: badRequest(code, message, { params, fields }) */
  static badRequest(message: string, fields?: Record<string, string>): AppError
  static badRequest(a: string, b?: unknown, c?: unknown): AppError {
    return legacyOr(400, 'bad_request', a, b, c)
  }
  /** 404. */
  static notFound<C extends ErrorCode>(code: C, message: string, ...extra: ExtraArgs<C>): AppError
  /** @deprecated give a code: notFound(code, message, { params }) */
  static notFound(what?: string): AppError
  static notFound(a = 'That record', b?: unknown, c?: unknown): AppError {
    return isErrorCode(a) && typeof b === 'string' ? legacyOr(404, a, a, b, c) : legacy(404, 'not_found', `${a} was not found.`)
  }
  /** 409. */
  static conflict<C extends ErrorCode>(code: C, message: string, ...extra: ExtraArgs<C>): AppError
  /** @deprecated give a code first: conflict(code, message, { params }) */
  static conflict(message: string, code?: ErrorCode): AppError
  static conflict(a: string, b?: unknown, c?: unknown): AppError {
    if (isErrorCode(a) && typeof b === 'string') return legacyOr(409, a, a, b, c)
    return legacy(409, isErrorCode(b) ? b : 'conflict', a)
  }
  /** 422. */
  static unprocessable<C extends ErrorCode>(code: C, message: string, ...extra: ExtraArgs<C>): AppError
  /** @deprecated give a code first: unprocessable(code, message, { params }) */
  static unprocessable(message: string, code?: ErrorCode): AppError
  static unprocessable(a: string, b?: unknown, c?: unknown): AppError {
    if (isErrorCode(a) && typeof b === 'string') return legacyOr(422, a, a, b, c)
    return legacy(422, isErrorCode(b) ? b : 'unprocessable', a)
  }
  static unauthenticated(code: 'unauthenticated' | 'session_ended' = 'unauthenticated', message = 'Please sign in.') {
    return new AppError(401, code, message)
  }
  static forbidden(message = 'Your role does not allow this.') {
    return new AppError(403, 'forbidden', message)
  }
  /** 429. */
  static tooMany<C extends ErrorCode>(code: C, message: string, ...[extra]: ExtraArgs<C>): AppError {
    return AppError.of(429, code, message, ...([extra] as ExtraArgs<C>))
  }
  /** Bad input: 400 with one coded problem per field (shared/errors/zodProblems.ts). */
  static fromZod(error: ZodError, code: 'invalid_input' | 'invalid_filters' = 'invalid_input', message = 'Some fields need attention.') {
    return new AppError(400, code, message, { fields: zodFieldProblems(error) })
  }
}

// The earlier, uncoded form: the English message travels as `text` for codes whose message is just
// that (English users still read it; others get a general sentence). Goes once every area has codes.
function legacy(status: number, code: ErrorCode, message: string, fields?: Record<string, string>): AppError {
  const params: ErrorParams = (ERROR_CODES[code] as readonly string[]).includes('text') ? { text: message } : {}
  return new AppError(status, code, message, { params, fields: fields && textFields(fields) })
}

/** @deprecated English field text as problems; give each field a code instead. */
export function textFields(fields: Record<string, string>): FieldProblems {
  return Object.fromEntries(Object.entries(fields).map(([k, text]) => [k, { code: 'field_invalid', params: { text } }]))
}

// The coded form (code, message, extra) or the earlier one (message, fields as English text), told
// apart by whether the first argument is a registered code.
function legacyOr(status: number, fallback: ErrorCode, a: string, b: unknown, c: unknown): AppError {
  if (isErrorCode(a) && typeof b === 'string') return new AppError(status, a, b, (c ?? {}) as { params?: ErrorParams; fields?: FieldProblems })
  return legacy(status, fallback, a, b as Record<string, string> | undefined)
}
