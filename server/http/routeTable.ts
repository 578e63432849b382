// Every API route is declared here, with who may call it. A route can't exist without an access
// rule (deny by default, ASVS 8.2.1), and the role-matrix test walks this table.
import compression from 'compression'
import { Router, type Request, type Response } from 'express'
import type { Role } from '../../shared/roles.js'
import { AppError } from '../errors.js'

export type Access = 'public' | { roles: readonly Role[] }
export type Method = 'get' | 'post' | 'put' | 'patch' | 'delete'

export interface RouteSpec {
  method: Method
  path: string
  access: Access
  /** Status for a value returned by the handler (default 200). */
  status?: number
  /**
   * The answer is a few hundred bytes at most (a scanner's lookup or confirmation): it is sent without the
   * compression middleware, which would wrap the answer on every request only to find it under its 1 KB threshold.
   */
  smallAnswer?: boolean
  /** Returns the JSON body, or undefined when it wrote the response itself. */
  handler: (req: Request, res: Response) => unknown
}

export interface RegisteredRoute {
  method: Method
  path: string
  access: Access
}

const registered: RegisteredRoute[] = []
export const routeTable: readonly RegisteredRoute[] = registered

export const allow = (...roles: Role[]): Access => ({ roles })

export function requireAccess(access: Access) {
  return (req: Request, _res: Response, next: (err?: unknown) => void) => {
    if (access === 'public') return next()
    const user = req.user
    if (!user) return next(AppError.unauthenticated())
    if (!access.roles.some((r) => user.roles.includes(r))) return next(AppError.forbidden())
    next()
  }
}

/** JSON answers over 1 KB go out compressed; spreadsheets are zip files already and pass through. */
const compressAnswer = compression()

/** Builds one resource's router under /api + prefix and records its routes. */
export function defineRoutes(prefix: string, specs: RouteSpec[]): { prefix: string; router: Router } {
  const router = Router()
  for (const spec of specs) {
    const fullPath = ('/api' + prefix + (spec.path === '/' ? '' : spec.path)).replace(/\/$/, '') || '/api'
    if (!registered.some((r) => r.method === spec.method && r.path === fullPath)) {
      registered.push({ method: spec.method, path: fullPath, access: spec.access })
    }
    const handlers = spec.smallAnswer ? [requireAccess(spec.access)] : [requireAccess(spec.access), compressAnswer]
    router[spec.method](spec.path, ...handlers, async (req: Request, res: Response) => {
      const body = await spec.handler(req, res)
      if (body !== undefined && !res.headersSent) res.status(spec.status ?? 200).json(body)
    })
  }
  return { prefix, router }
}
