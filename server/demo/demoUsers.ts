import type { EntityManager } from 'typeorm'
import type { Role } from '../../shared/roles.js'
import { User } from '../entities/User.js'
import { hashPassword } from '../services/userService.js'

// Demo sign-ins for the invented supplier "Brightcourse Glass Supply". Demo scenario only:
// never created with NODE_ENV=production.
export const DEMO_PASSWORD = 'brightcourse-demo'

export const DEMO_USERS: { username: string; displayName: string; roles: Role[]; locale: 'en' | 'es' }[] = [
  { username: 'admin', displayName: 'Marisol Vega', roles: ['admin'], locale: 'en' },
  { username: 'counter', displayName: 'Dev Okafor', roles: ['counter'], locale: 'en' },
  { username: 'warehouse', displayName: 'Tomás Reyes', roles: ['warehouse'], locale: 'es' },
  { username: 'buyer', displayName: 'Priya Lindqvist', roles: ['buyer'], locale: 'en' },
  { username: 'viewer', displayName: 'Sam Whitcombe', roles: ['viewer'], locale: 'en' },
]

export async function loadDemoUsers(em: EntityManager): Promise<void> {
  const hash = await hashPassword(DEMO_PASSWORD)
  for (const u of DEMO_USERS) {
    const exists = await em.findOneBy(User, { username: u.username })
    if (exists) continue
    await em.insert(User, { ...u, email: `${u.username}@brightcourse.example`, passwordHash: hash, active: true })
  }
}
