import type passport from 'passport'
import type { Logger } from 'pino'
import type { DataSource } from 'typeorm'
import type { Request } from 'express'
import type { AppConfig } from './config.js'
import type { SignInThrottle } from './services/signInThrottle.js'
import type { AuditActor } from './services/auditService.js'
import type { PayProvider } from './services/payments/payProvider.js'
import type { ProviderEventHandler } from './services/payments/paymentEvents.js'
import type { Role } from '../shared/roles.js'
import { AppError } from './errors.js'

/** What every router gets: built once in app.ts. */
export interface AppContext {
  config: AppConfig
  ds: DataSource
  /**
   * For reports and dashboards only: a read-only replica when LUMENYARD_DB_READ_HOST/PORT is set, else the
   * primary (the same object as ds). A replica lags: never read from it what decides a write.
   */
  readDs: DataSource
  passport: passport.PassportStatic
  throttle: SignInThrottle
  logger: Logger
  /** The card-payment provider's SDK, configured (config.pay). */
  pay: PayProvider
  /** What each kind of provider event changes, by event type (the webhook records every event once). */
  payEventHandlers: Partial<Record<string, ProviderEventHandler>>
}

/** Who is signed in, as the session read them for this request: the audit trail's who, their name and roles. */
export type SignedInActor = AuditActor & { userId: number; name: string; roles: readonly Role[] }

export function actorOf(req: Request): SignedInActor {
  if (!req.user) throw AppError.unauthenticated()
  return { userId: req.user.id, ip: req.ip ?? null, name: req.user.displayName, roles: req.user.roles }
}
