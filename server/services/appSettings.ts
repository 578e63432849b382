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
  })
}
