// One short line per API request (its id, method and address; the status; the time taken), written when the
// answer has gone. Only these fields: no headers (cookies), no bodies (passwords). A request's own logger
// (`req.log`, for the error handler) is made only when something is logged for it, not for every request.
import type { Express, NextFunction, Request, Response } from 'express'
import type { Logger } from 'pino'

const own = new WeakMap<Request, Logger>()

/** Installs `req.log` on the app's requests and answers the middleware that writes each API request's line. */
export function requestLog(app: Express, logger: Logger) {
  let lastId = 0
  Object.defineProperty(app.request, 'log', {
    configurable: true,
    get(this: Request): Logger {
      let log = own.get(this)
      if (!log) own.set(this, (log = logger.child({ req: { id: this.id, method: this.method, url: this.originalUrl } })))
      return log
    },
  })
  return (req: Request, res: Response, next: NextFunction) => {
    if (!req.url.startsWith('/api')) return next()
    req.id = ++lastId
    const started = performance.now()
    res.once('finish', () => {
      const line = { req: { id: req.id, method: req.method, url: req.originalUrl }, res: { status: res.statusCode }, responseTime: Math.round(performance.now() - started) }
      if (res.statusCode >= 500) logger.error(line, 'request errored')
      else logger.info(line, 'request completed')
    })
    next()
  }
}
