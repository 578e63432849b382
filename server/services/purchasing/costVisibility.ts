// Who sees purchase costs: buyers and admins always; warehouse crew only when the admin setting
// allows it. Everyone else (and warehouse by default) gets responses with the cost fields removed.
import type { DataSource, EntityManager } from 'typeorm'
import type { Role } from '../../../shared/roles.js'
import { purchasingSettings } from '../appSettings.js'

export interface Viewer {
  userId: number
  roles: readonly Role[]
}

export async function canSeeCosts(em: EntityManager | DataSource, viewer: Viewer): Promise<boolean> {
  if (viewer.roles.includes('admin') || viewer.roles.includes('buyer')) return true
  if (!viewer.roles.includes('warehouse')) return false
  return (await purchasingSettings(em)).warehouseSeesCosts
}

/** Drops the named fields; used on every PO response so hidden costs never leave the server. */
export function withoutCosts<T extends object>(value: T, visible: boolean, fields: readonly (keyof T)[]): T {
  if (visible) return value
  const copy = { ...value }
  for (const f of fields) delete copy[f]
  return copy
}
