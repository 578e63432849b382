import type { RequestHandler } from 'express'
import { AppError } from '../errors.js'

// Every state-changing request must carry this header. A cross-site form or image can't set a
// custom header, and a cross-site fetch that sets one needs a CORS preflight we never grant.
export const CSRF_HEADER = 'x-lumenyard-request'
const SAFE = new Set(['GET', 'HEAD', 'OPTIONS'])

/**
 * `signedPaths`: routes that take no session cookie and prove themselves another way (the payment
 * provider's signed webhook); the guard lets them through and the route checks the signature.
 */
export function csrfGuard(allowedOrigins: () => string[], signedPaths: readonly string[] = []): RequestHandler {
  return (req, _res, next) => {
    if (SAFE.has(req.method)) return next()
    if (signedPaths.includes(req.baseUrl + req.path)) return next()
    if (req.get(CSRF_HEADER) !== '1') {
      return next(new AppError(403, 'csrf', 'This request was refused: it did not come from the Lumenyard app.'))
    }
    const origin = req.get('origin')
    if (origin) {
      const own = `${req.protocol}://${req.get('host')}`
      if (origin !== own && !allowedOrigins().includes(origin)) {
        return next(new AppError(403, 'csrf', 'This request was refused: it came from another site.'))
      }
    }
    next()
  }
}
