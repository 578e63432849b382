import type { ZodError } from 'zod'

/** The one error class. Its status, code and message reach the client; nothing else does. */
export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields?: Record<string, string>,
  ) {
    super(message)
  }

  static badRequest(message: string, fields?: Record<string, string>) {
    return new AppError(400, 'bad_request', message, fields)
  }
  static unauthenticated(message = 'Please sign in.') {
    return new AppError(401, 'unauthenticated', message)
  }
  static forbidden(message = 'Your role does not allow this.') {
    return new AppError(403, 'forbidden', message)
  }
  static notFound(what = 'That record') {
    return new AppError(404, 'not_found', `${what} was not found.`)
  }
  static conflict(message: string, code = 'conflict') {
    return new AppError(409, code, message)
  }
  static unprocessable(message: string, code = 'unprocessable') {
    return new AppError(422, code, message)
  }
  static tooMany(message: string) {
    return new AppError(429, 'too_many_attempts', message)
  }
  static fromZod(error: ZodError, message = 'Some fields need attention.') {
    const fields: Record<string, string> = {}
    for (const issue of error.issues) {
      const key = issue.path.join('.') || '_'
      if (!fields[key]) fields[key] = issue.message
    }
    return new AppError(400, 'invalid_input', message, fields)
  }
}
