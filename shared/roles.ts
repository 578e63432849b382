// Roles and the areas of the app each may use. The server enforces every permission
// (server/routes/routeTable.ts); the client only hides what a role can't use.
export const ROLES = ['admin', 'counter', 'warehouse', 'buyer', 'viewer'] as const
export type Role = (typeof ROLES)[number]

export const AREAS = ['stock', 'counter', 'warehouse', 'purchasing', 'admin'] as const
export type Area = (typeof AREAS)[number]

/** Which roles may open each area. */
export const AREA_ROLES: Record<Area, readonly Role[]> = {
  stock: ['admin', 'counter', 'warehouse', 'buyer', 'viewer'],
  counter: ['admin', 'counter'],
  warehouse: ['admin', 'warehouse'],
  purchasing: ['admin', 'buyer'],
  admin: ['admin'],
}

export function areasFor(roles: readonly Role[]): Area[] {
  return AREAS.filter((area) => AREA_ROLES[area].some((r) => roles.includes(r)))
}

export function hasAnyRole(userRoles: readonly Role[], allowed: readonly Role[]): boolean {
  return allowed.some((r) => userRoles.includes(r))
}

/** Common groups used by the route table, so each route reads as a sentence. */
export const ANYONE_SIGNED_IN: readonly Role[] = [...ROLES]
export const ADMIN_ONLY: readonly Role[] = ['admin']
