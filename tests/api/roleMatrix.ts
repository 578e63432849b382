// The designed access of every API route: who may call it. The role-matrix test checks that the
// server's route table matches this list exactly and that each role gets the designed answer.
// A new route adds its row here (see DEVELOPERS.md, "Adding a route").
import type { Role } from '../../shared/roles.js'

export const EVERYONE: Role[] = ['admin', 'counter', 'warehouse', 'buyer', 'viewer']

export interface MatrixRow {
  /** 'public' or the roles that may call it; every other role gets 403, signed-out 401. */
  access: 'public' | Role[]
  /** The call ends or changes the caller's session: use a fresh sign-in for it. */
  freshSession?: boolean
}

export const designedAccess: Record<string, MatrixRow> = {
  'GET /api/health': { access: 'public' },
  'POST /api/session': { access: 'public' },
  'GET /api/session': { access: 'public' },
  'DELETE /api/session': { access: EVERYONE, freshSession: true },
  'GET /api/profile': { access: EVERYONE },
  'PATCH /api/profile': { access: EVERYONE },
  'POST /api/profile/password': { access: EVERYONE, freshSession: true },
  'GET /api/users': { access: ['admin'] },
  'POST /api/users': { access: ['admin'] },
  'PATCH /api/users/:id': { access: ['admin'] },
  'POST /api/users/:id/password': { access: ['admin'] },
  // Stock operations: warehouse crew and admin move stock.
  'POST /api/stock/adjustments': { access: ['admin', 'warehouse'] },
  'POST /api/stock/bin-moves': { access: ['admin', 'warehouse'] },
  'POST /api/stock/issues': { access: ['admin', 'warehouse'] },
  'POST /api/stock/receipts': { access: ['admin', 'warehouse'] },
  'POST /api/stock/transfers': { access: ['admin', 'warehouse'] },
  'POST /api/stock/transfers/:id/receive': { access: ['admin', 'warehouse'] },
}
