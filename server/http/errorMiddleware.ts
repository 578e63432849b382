import type { ErrorRequestHandler, RequestHandler } from 'express'
import { isDatabaseUnavailable } from '../db/outage.js'
import { isOutOfRange } from '../db/transaction.js'
import { AppError } from '../errors.js'

/** Unknown /api paths answer JSON 404, never the SPA page. */
export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(new AppError(404, 'route_not_found', `No API route ${req.method} ${req.path}.`))
}

/**
 * Every error becomes { error: { code, message, params?, fields? } } (shared/schemas/apiError.ts):
 * the client words the code in the user's language; stacks go to the log only.
 */
export const errorMiddleware: ErrorRequestHandler = (err, req, res, _next) => {
  let appError: AppError
  if (err instanceof AppError) {
    appError = err
  } else if (err?.type === 'entity.too.large') {
    appError = new AppError(413, 'too_large', 'The request is too large.')
  } else if (err?.type === 'entity.parse.failed') {
    appError = new AppError(400, 'bad_json', 'The request body is not valid JSON.')
  } else if (err?.code === 'LIMIT_FILE_SIZE') {
    appError = new AppError(413, 'file_too_large', 'The file is larger than the upload limit.')
  } else if (isOutOfRange(err)) {
    // Validation should have caught it first; a total that still overflows its column changed nothing (rolled back).
    req.log?.warn({ err }, 'value out of column range')
    appError = AppError.conflict('value_out_of_range', 'A quantity or amount would grow larger than Lumenyard can record. Nothing was changed; split it into smaller ones.')
  } else if (typeof err?.code === 'string' && err.code.startsWith('LIMIT_')) {
    appError = new AppError(400, 'bad_upload', `The upload was refused: ${err.message}.`)
  } else if (isDatabaseUnavailable(err)) {
    // An outage, not a bug: the client shows its banner and reads again by itself; writes were not saved
    // (or, when only the answer was lost, a retry with the same Idempotency-Key returns it).
    req.log?.warn({ err: { code: err?.code ?? err?.driverError?.code, message: err?.message } }, 'database unavailable')
    appError = new AppError(503, 'db_unavailable', 'The database is not answering. Nothing was saved; try again in a moment.')
    if (!res.headersSent) res.set('Retry-After', '5')
  } else {
    req.log?.error({ err }, 'unhandled error')
    appError = new AppError(500, 'internal', 'Something went wrong on the server. The error was logged.')
  }
  if (appError.status >= 500 && err instanceof AppError) req.log?.error({ err }, 'server error')
  if (res.headersSent) return
  res.status(appError.status).json({
    error: {
      code: appError.code,
      message: appError.message,
      ...(Object.keys(appError.params).length ? { params: appError.params } : {}),
      ...(appError.fields ? { fields: appError.fields } : {}),
    },
  })
}
