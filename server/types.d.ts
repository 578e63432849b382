import 'express-session'
import type { Logger } from 'pino'
import type { SessionUser } from '../shared/schemas/auth.js'

declare global {
  namespace Express {
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type
    interface User extends SessionUser {}
  }
}

declare module 'http' {
  interface IncomingMessage {
    /** The API request's number in this process (http/requestLog.ts). */
    id?: number
    /** The request's logger (http/requestLog.ts), made when first used. */
    log: Logger
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
