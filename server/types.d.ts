import 'express-session'
import type { SessionUser } from '../shared/schemas/auth.js'

declare global {
  namespace Express {
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type
    interface User extends SessionUser {}
  }
}

declare module 'express-session' {
  interface SessionData {
    signedInAt?: number
    /** When the idle timeout was last pushed forward (ms): changed at most once a minute (db/sessionStore.ts). */
    renewedAt?: number
    /** Written by passport: the signed-in user's id and session epoch. */
    passport?: { user?: { id: number; epoch: number } }
  }
}
