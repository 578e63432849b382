// The request edge of the cost rule (services/costVisibility.ts): the signed-in caller's access, worked out
// once per API request and carried with the request's async context.
import type { NextFunction, Request, Response } from 'express'
import type { DataSource } from 'typeorm'
import { costsVisibleTo, withCostAccess } from '../services/costVisibility.js'

/** Express middleware for /api: works out the signed-in caller's access once, for the whole request. */
export function costScope(ds: DataSource) {
  return async (req: Request, _res: Response, next: NextFunction) => {
    const visible = req.user ? await costsVisibleTo(ds, req.user.roles) : false
    withCostAccess(visible, next)
  }
}
