// Failed sign-ins are throttled per account and per address (ASVS 6.3.1). Counters live in
// memory: one server process per deployment; a restart clears them, which the lock time bounds anyway.
import { RateLimiterMemory } from 'rate-limiter-flexible'
import { AppError } from '../errors.js'

export interface ThrottleLimits {
  failsPerAccount: number
  failsPerIp: number
  lockMinutes: number
}

export class SignInThrottle {
  private readonly perAccount: RateLimiterMemory
  private readonly perIp: RateLimiterMemory

  constructor(private readonly limits: ThrottleLimits) {
    const duration = limits.lockMinutes * 60
    this.perAccount = new RateLimiterMemory({ points: limits.failsPerAccount, duration })
    this.perIp = new RateLimiterMemory({ points: limits.failsPerIp, duration })
  }

  /** Refuses before the password is even checked when either counter is spent. */
  async check(username: string, ip: string): Promise<void> {
    const [account, address] = await Promise.all([
      this.perAccount.get(username.toLowerCase()),
      this.perIp.get(ip),
    ])
    const minutes = (ms: number) => Math.max(1, Math.ceil(ms / 60_000))
    if (account && account.consumedPoints >= this.limits.failsPerAccount) {
      const wait = minutes(account.msBeforeNext)
      throw AppError.tooMany('too_many_signins_account', `Too many failed sign-ins for this account. Try again in ${wait} minutes, or ask an admin to reset the password.`, { params: { minutes: wait } })
    }
    if (address && address.consumedPoints >= this.limits.failsPerIp) {
      const wait = minutes(address.msBeforeNext)
      throw AppError.tooMany('too_many_signins_device', `Too many failed sign-ins from this device. Try again in ${wait} minutes.`, { params: { minutes: wait } })
    }
  }

  async fail(username: string, ip: string): Promise<void> {
    await Promise.all([
      this.perAccount.penalty(username.toLowerCase(), 1),
      this.perIp.penalty(ip, 1),
    ])
  }

  async succeed(username: string): Promise<void> {
    await this.perAccount.delete(username.toLowerCase())
  }
}
