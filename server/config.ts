// The one place that reads the environment. Fails fast, naming the variable and what it expects.
import { z } from 'zod'

const bool = z
  .enum(['true', 'false', '1', '0', 'yes', 'no'])
  .transform((v) => v === 'true' || v === '1' || v === 'yes')

const port = z.coerce.number().int().min(1).max(65535)

const schema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  LUMENYARD_HOST: z.string().min(1).default('127.0.0.1'),
  LUMENYARD_PORT: port.default(5480),
  LUMENYARD_PUBLIC_URL: z.url().optional(),
  LUMENYARD_LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),

  LUMENYARD_DB_HOST: z.string().min(1).default('127.0.0.1'),
  LUMENYARD_DB_PORT: port.default(3406),
  LUMENYARD_DB_USER: z.string().min(1).default('lumenyard_app'),
  LUMENYARD_DB_PASSWORD: z.string().min(1, 'LUMENYARD_DB_PASSWORD is required (npm start sets it for the embedded database)'),
  LUMENYARD_DB_NAME: z.string().regex(/^[A-Za-z0-9_]+$/, 'letters, digits and _ only').default('lumenyard'),
  LUMENYARD_DB_POOL: z.coerce.number().int().min(2).max(500).default(40),
  LUMENYARD_DB_READ_HOST: z.string().min(1).optional(),
  LUMENYARD_DB_READ_PORT: port.optional(),
  LUMENYARD_DB_READ_USER: z.string().min(1).optional(),
  LUMENYARD_DB_READ_PASSWORD: z.string().min(1).optional(),

  LUMENYARD_SESSION_SECRET: z.string().min(32, 'must be at least 32 characters'),
  LUMENYARD_SESSION_IDLE_MINUTES: z.coerce.number().int().min(1).max(24 * 60).default(30),
  LUMENYARD_SESSION_MAX_HOURS: z.coerce.number().int().min(1).max(24 * 7).default(12),
  LUMENYARD_SECURE_COOKIES: bool.optional(),
  LUMENYARD_TRUST_PROXY: bool.default(false),

  LUMENYARD_SIGNIN_FAILS_PER_ACCOUNT: z.coerce.number().int().min(1).default(5),
  LUMENYARD_SIGNIN_FAILS_PER_IP: z.coerce.number().int().min(1).default(50),
  LUMENYARD_SIGNIN_LOCK_MINUTES: z.coerce.number().int().min(1).default(15),

  LUMENYARD_SMTP_HOST: z.string().min(1).default('127.0.0.1'),
  LUMENYARD_SMTP_PORT: port.default(2525),
  LUMENYARD_SMTP_SECURE: bool.default(false),
  LUMENYARD_SMTP_USER: z.string().optional(),
  LUMENYARD_SMTP_PASSWORD: z.string().optional(),
  LUMENYARD_MAIL_FROM: z.string().default('Lumenyard <purchasing@lumenyard.invalid>'),

  LUMENYARD_UPLOAD_MAX_MB: z.coerce.number().min(0.1).max(50).default(5),

  // Card payments go through the payment provider's SDK. Outside production it talks to the local fake
  // (server/fakes/payFake.ts) on 127.0.0.1:LUMENYARD_PAY_PORT; LUMENYARD_PAY_HOST points it elsewhere.
  LUMENYARD_PAY_HOST: z.string().min(1).optional(),
  LUMENYARD_PAY_PORT: port.default(4242),
  LUMENYARD_PAY_PROTOCOL: z.enum(['http', 'https']).optional(),
  LUMENYARD_PAY_SECRET_KEY: z.string().min(8, 'must be at least 8 characters').optional(),
  LUMENYARD_PAY_WEBHOOK_SECRET: z.string().min(8, 'must be at least 8 characters').optional(),
  LUMENYARD_PAY_CURRENCY: z.string().regex(/^[a-z]{3}$/, 'three lower-case letters (ISO 4217), e.g. usd').default('usd'),
})

/**
 * Keys that only the local payment fake accepts: fixed so `npm start` and the tests need no setup.
 * Never valid with the real provider, and refused in production (the keys must come from the environment).
 */
export const LOCAL_PAY_SECRET_KEY = 'sk_test_lumenyard_local_fake_only'
export const LOCAL_PAY_WEBHOOK_SECRET = 'whsec_lumenyard_local_fake_only'

export interface AppConfig {
  env: 'development' | 'production' | 'test'
  host: string
  port: number
  publicUrl?: string
  logLevel: string
  db: { host: string; port: number; user: string; password: string; database: string; pool: number }
  /** A read-only replica for reports and dashboards; absent: they read the primary. */
  readDb?: { host: string; port: number; user: string; password: string; database: string; pool: number }
  session: {
    secret: string
    idleMinutes: number
    maxHours: number
    secureCookies: boolean
    trustProxy: boolean
  }
  signin: { failsPerAccount: number; failsPerIp: number; lockMinutes: number }
  smtp: { host: string; port: number; secure: boolean; user?: string; password?: string; from: string }
  uploadMaxBytes: number
  pay: {
    /** Where the SDK sends its requests; absent: the provider's own API (production). */
    api?: { host: string; port: number; protocol: 'http' | 'https' }
    /** The port the local fake listens on. */
    fakePort: number
    /** `npm start` starts the local fake: outside production when LUMENYARD_PAY_HOST is not set. */
    localFake: boolean
    /** Card payments can be taken: always outside production (the fake), in production when both keys are set. */
    enabled: boolean
    secretKey: string
    webhookSecret: string
    /** ISO 4217 code in the provider's lower-case form. */
    currency: string
  }
}

export class ConfigError extends Error {}

export function loadConfig(env: NodeJS.ProcessEnv = process.env): AppConfig {
  const parsed = schema.safeParse(env)
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`)
    throw new ConfigError(`Lumenyard cannot start: bad configuration\n${lines.join('\n')}`)
  }
  const e = parsed.data
  const production = e.NODE_ENV === 'production'
  // In production card payments are on only when both provider keys come from the environment; a supplier
  // that takes no cards runs without them (the card routes answer `card_payments_off`). One key alone, or the
  // local fake's keys, is a mistake worth stopping for.
  const payKeys = [e.LUMENYARD_PAY_SECRET_KEY, e.LUMENYARD_PAY_WEBHOOK_SECRET]
  if (production) {
    const lines: string[] = []
    if (payKeys.filter(Boolean).length === 1) {
      const missing = e.LUMENYARD_PAY_SECRET_KEY ? 'LUMENYARD_PAY_WEBHOOK_SECRET' : 'LUMENYARD_PAY_SECRET_KEY'
      lines.push(`  ${missing}: required with the other card-payment key (the payment provider's ${missing.endsWith('WEBHOOK_SECRET') ? 'webhook signing secret' : 'secret API key'})`)
    }
    if (payKeys.some((v) => v === LOCAL_PAY_SECRET_KEY || v === LOCAL_PAY_WEBHOOK_SECRET)) lines.push('  LUMENYARD_PAY_*: the local fake\'s keys cannot be used in production')
    if (lines.length) throw new ConfigError(`Lumenyard cannot start: bad configuration\n${lines.join('\n')}`)
  }
  const payHost = e.LUMENYARD_PAY_HOST ?? (production ? undefined : '127.0.0.1')
  return {
    env: e.NODE_ENV,
    host: e.LUMENYARD_HOST,
    port: e.LUMENYARD_PORT,
    publicUrl: e.LUMENYARD_PUBLIC_URL,
    logLevel: e.LUMENYARD_LOG_LEVEL,
    db: {
      host: e.LUMENYARD_DB_HOST,
      port: e.LUMENYARD_DB_PORT,
      user: e.LUMENYARD_DB_USER,
      password: e.LUMENYARD_DB_PASSWORD,
      database: e.LUMENYARD_DB_NAME,
      pool: e.LUMENYARD_DB_POOL,
    },
    readDb: e.LUMENYARD_DB_READ_HOST || e.LUMENYARD_DB_READ_PORT
      ? {
          host: e.LUMENYARD_DB_READ_HOST ?? e.LUMENYARD_DB_HOST,
          port: e.LUMENYARD_DB_READ_PORT ?? e.LUMENYARD_DB_PORT,
          user: e.LUMENYARD_DB_READ_USER ?? e.LUMENYARD_DB_USER,
          password: e.LUMENYARD_DB_READ_PASSWORD ?? e.LUMENYARD_DB_PASSWORD,
          database: e.LUMENYARD_DB_NAME,
          pool: e.LUMENYARD_DB_POOL,
        }
      : undefined,
    session: {
      secret: e.LUMENYARD_SESSION_SECRET,
      idleMinutes: e.LUMENYARD_SESSION_IDLE_MINUTES,
      maxHours: e.LUMENYARD_SESSION_MAX_HOURS,
      // Secure by default in production (ASVS V3.3.1); plain http in development needs it off.
      secureCookies: e.LUMENYARD_SECURE_COOKIES ?? e.NODE_ENV === 'production',
      trustProxy: e.LUMENYARD_TRUST_PROXY,
    },
    signin: {
      failsPerAccount: e.LUMENYARD_SIGNIN_FAILS_PER_ACCOUNT,
      failsPerIp: e.LUMENYARD_SIGNIN_FAILS_PER_IP,
      lockMinutes: e.LUMENYARD_SIGNIN_LOCK_MINUTES,
    },
    smtp: {
      host: e.LUMENYARD_SMTP_HOST,
      port: e.LUMENYARD_SMTP_PORT,
      secure: e.LUMENYARD_SMTP_SECURE,
      user: e.LUMENYARD_SMTP_USER,
      password: e.LUMENYARD_SMTP_PASSWORD,
      from: e.LUMENYARD_MAIL_FROM,
    },
    uploadMaxBytes: Math.round(e.LUMENYARD_UPLOAD_MAX_MB * 1024 * 1024),
    pay: {
      api: payHost
        ? { host: payHost, port: e.LUMENYARD_PAY_PORT, protocol: e.LUMENYARD_PAY_PROTOCOL ?? (payHost === '127.0.0.1' || payHost === 'localhost' ? 'http' : 'https') }
        : undefined,
      fakePort: e.LUMENYARD_PAY_PORT,
      localFake: !production && !e.LUMENYARD_PAY_HOST,
      enabled: !production || payKeys.every(Boolean),
      secretKey: e.LUMENYARD_PAY_SECRET_KEY ?? LOCAL_PAY_SECRET_KEY,
      webhookSecret: e.LUMENYARD_PAY_WEBHOOK_SECRET ?? LOCAL_PAY_WEBHOOK_SECRET,
      currency: e.LUMENYARD_PAY_CURRENCY,
    },
  }
}
