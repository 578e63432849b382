// The request edge of the cost rule (services/costVisibility.ts): the signed-in caller's access, worked out once
// per API request and kept in `res.locals.costs`. Routes hand it to the services that write sheets and documents
// (`costsOf(res)`), and every JSON answer is serialised with it (`jsonWithCostAccess`).
import type { Express, NextFunction, Request, Response } from 'express'
import type { DataSource } from 'typeorm'
import { costsVisibleNow, costsVisibleTo, serialiseFor } from '../services/costVisibility.js'

/** Express middleware for /api: works out the signed-in caller's access once, for the whole request. */
export function costAccess(ds: DataSource) {
  return (req: Request, res: Response, next: NextFunction) => {
    // Most requests know at once (the role decides, or the setting was read recently): no promise to wait a turn on.
    const now = req.user ? costsVisibleNow(ds, req.user.roles) : false
    if (now !== undefined) {
      res.locals.costs = now
      return next()
    }
    costsVisibleTo(ds, req.user!.roles).then((costs) => {
      res.locals.costs = costs
      next()
    }, next)
  }
}

/** Whether this request's caller may see costs: false unless `costAccess` said so (deny by default). */
export const costsOf = (res: Response): boolean => res.locals.costs === true

/**
 * Every `res.json` of the app serialises with its own request's access, so the JSON replacer drops the costs of
 * a caller without it, whichever route, error handler or idempotent replay wrote the answer.
 */
export function jsonWithCostAccess(app: Express): void {
  const json = app.response.json
  app.response.json = function (this: Response, body: unknown) {
    return serialiseFor(costsOf(this), () => json.call(this, body))
  }
}
