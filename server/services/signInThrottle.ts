// Failed sign-ins are throttled per account and per address (ASVS 5.0 V6.3.1). The counters live in
// MariaDB (table signin_throttle, rate-limiter-flexible's MySQL store), so every app process behind a
// proxy counts the same attempts. Each attempt reserves a point *before* the password is checked, in
// one atomic upsert: 30 simultaneous wrong passwords for one account let exactly `failsPerAccount`
// reach the password check; the rest are refused at once. A right password gives its points back.
import mysql from 'mysql2'
import { RateLimiterMySQL, RateLimiterRes } from 'rate-limiter-flexible'
import type { AppConfig } from '../config.js'
import { AppError } from '../errors.js'

export interface ThrottleLimits {
  failsPerAccount: number
  failsPerIp: number
  lockMinutes: number
}

const TABLE = 'signin_throttle'

export class SignInThrottle {
  private readonly pool: mysql.Pool
  private readonly perAccount: RateLimiterMySQL
  private readonly perIp: RateLimiterMySQL

  constructor(private readonly limits: ThrottleLimits, db: AppConfig['db']) {
    this.pool = mysql.createPool({ host: db.host, port: db.port, user: db.user, password: db.password, database: db.database, connectionLimit: 4 })
    const common = { storeClient: this.pool, storeType: 'pool', dbName: db.database, tableName: TABLE, tableCreated: true, duration: limits.lockMinutes * 60 }
    this.perAccount = new RateLimiterMySQL({ ...common, keyPrefix: 'account', points: limits.failsPerAccount })
    this.perIp = new RateLimiterMySQL({ ...common, keyPrefix: 'ip', points: limits.failsPerIp })
  }

  /**
   * Reserves one attempt on both counters before the password is checked; refuses (429) when either
   * is spent. Call `succeeded` after a right password; a wrong one keeps its reservation.
   */
  async reserve(username: string, ip: string): Promise<void> {
    const minutes = (ms: number) => Math.max(1, Math.ceil(ms / 60_000))
    const account = await this.consume(this.perAccount, username.toLowerCase())
    if (account) {
      const wait = minutes(account.msBeforeNext)
      throw AppError.tooMany('too_many_signins_account', `Too many failed sign-ins for this account. Try again in ${wait} minutes, or ask an admin to reset the password.`, { params: { minutes: wait } })
    }
    const address = await this.consume(this.perIp, ip)
    if (address) {
      const wait = minutes(address.msBeforeNext)
      throw AppError.tooMany('too_many_signins_device', `Too many failed sign-ins from this device. Try again in ${wait} minutes.`, { params: { minutes: wait } })
    }
  }

  /** A right password: the account's failures are forgotten and the address gets its point back. */
  async succeeded(username: string, ip: string): Promise<void> {
    await this.perAccount.delete(username.toLowerCase())
    await this.perIp.reward(ip, 1)
  }

  close(): Promise<void> {
    return new Promise((resolve) => this.pool.end(() => resolve()))
  }

  /** The refusal when the counter is spent; null when the point was reserved. Database errors propagate. */
  private async consume(limiter: RateLimiterMySQL, key: string): Promise<RateLimiterRes | null> {
    try {
      await limiter.consume(key, 1)
      return null
    } catch (err) {
      if (err instanceof RateLimiterRes) return err
      throw err
    }
  }
}
