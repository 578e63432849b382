import type { ZodError } from 'zod'
import { problem, type ErrorCode, type ErrorParams, type ParamArgs, type Problem } from '../shared/errors/errorCodes.js'
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

  /** 400: the request cannot be done as sent. */
  static badRequest<C extends ErrorCode>(code: C, message: string, ...[extra]: ExtraArgs<C>): AppError {
    return AppError.of(400, code, message, ...([extra] as ExtraArgs<C>))
  }
  /** 404: the record named is not there. */
  static notFound<C extends ErrorCode>(code: C, message: string, ...[extra]: ExtraArgs<C>): AppError {
    return AppError.of(404, code, message, ...([extra] as ExtraArgs<C>))
  }
  /** 409: the record's current state refuses it. */
  static conflict<C extends ErrorCode>(code: C, message: string, ...[extra]: ExtraArgs<C>): AppError {
    return AppError.of(409, code, message, ...([extra] as ExtraArgs<C>))
  }
  /** 422: well-formed, but the work cannot be done with it. */
  static unprocessable<C extends ErrorCode>(code: C, message: string, ...[extra]: ExtraArgs<C>): AppError {
    return AppError.of(422, code, message, ...([extra] as ExtraArgs<C>))
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
