// Every router, mounted under /api. A new resource's router is added to this list.
import type { AppContext } from '../context.js'
import auth from './auth.js'
import health from './health.js'
import profile from './profile.js'
import stockOperations from './stockOperations.js'
import users from './users.js'

export const routers = [health, auth, profile, users, stockOperations]

export function buildRouters(ctx: AppContext) {
  return routers.map((make) => make(ctx))
}
