// Admin settings kept in app_settings as key → text. Each setting is declared here with its default,
// so a missing row reads as the default and an unknown key can't be written.
import type { DataSource, EntityManager } from 'typeorm'
import type { PurchasingSettings, PurchasingSettingsInput } from '../../shared/schemas/purchasing.js'
import { AppSetting } from '../entities/AppSetting.js'
import { audit, type AuditActor } from './auditService.js'

const DEFAULTS: PurchasingSettings = { warehouseSeesCosts: false, autoCloseOnReceipt: true }
const KEYS: Record<keyof PurchasingSettings, string> = {
  warehouseSeesCosts: 'purchasing.warehouse_sees_costs',
  autoCloseOnReceipt: 'purchasing.auto_close_on_receipt',
}

export async function purchasingSettings(em: EntityManager | DataSource): Promise<PurchasingSettings> {
  const rows = await em.getRepository(AppSetting).find()
  const byKey = new Map(rows.map((r) => [r.key, r.value]))
  const read = (name: keyof PurchasingSettings) => {
    const v = byKey.get(KEYS[name])
    return v === undefined ? DEFAULTS[name] : v === 'true'
  }
  return { warehouseSeesCosts: read('warehouseSeesCosts'), autoCloseOnReceipt: read('autoCloseOnReceipt') }
}

/**
 * The same settings as last read, for at most SETTINGS_CACHE_MS: every signed-in warehouse request asks
 * whether the crew sees costs (costVisibility.ts), and that read was one statement in ten of a stock issue.
 * A change through updatePurchasingSettings takes effect at once in this process (the cache is dropped on
 * commit); another process running against the same database sees it within SETTINGS_CACHE_MS.
 */
export const SETTINGS_CACHE_MS = 30_000
const cached = new WeakMap<DataSource, { at: number; value: Promise<PurchasingSettings>; settled?: PurchasingSettings }>()

export function recentPurchasingSettings(db: EntityManager | DataSource): Promise<PurchasingSettings> {
  const ds = 'connection' in db ? db.connection : db
  const hit = cached.get(ds)
  if (hit && Date.now() - hit.at < SETTINGS_CACHE_MS) return hit.value
  const value = purchasingSettings(ds)
  const entry: { at: number; value: Promise<PurchasingSettings>; settled?: PurchasingSettings } = { at: Date.now(), value }
  cached.set(ds, entry)
  value.then((v) => (entry.settled = v), () => cached.delete(ds)) // a failed read is not kept
  return value
}

/** The same settings when a fresh read of them has already arrived, without waiting a turn; else undefined. */
export function settledPurchasingSettings(ds: DataSource): PurchasingSettings | undefined {
  const hit = cached.get(ds)
  return hit && Date.now() - hit.at < SETTINGS_CACHE_MS ? hit.settled : undefined
}

export async function updatePurchasingSettings(ds: DataSource, actor: AuditActor, input: PurchasingSettingsInput): Promise<PurchasingSettings> {
  return ds.transaction(async (em) => {
    for (const name of Object.keys(KEYS) as (keyof PurchasingSettings)[]) {
      const value = input[name]
      if (value === undefined) continue
      await em.query(
        'INSERT INTO app_settings (setting_key, value, updated_by) VALUES (?, ?, ?) ON DUPLICATE KEY UPDATE value = VALUES(value), updated_by = VALUES(updated_by)',
        [KEYS[name], String(value), actor.userId],
      )
    }
    await audit(em, actor, 'settings.update', 'app_settings', 'purchasing', input)
    return purchasingSettings(em)
  }).finally(() => cached.delete(ds))
}
