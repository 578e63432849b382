// The counter's sales policy, kept in app_settings: the deposit asked on made-to-order lines (percent), and
// the returns policy: how many days after booking unopened goods may come back, and the restocking fee.
import { In, type DataSource, type EntityManager } from 'typeorm'
import { DEFAULT_DEPOSIT_PERCENT } from '../../../shared/sales/salesOrderTerms.js'
import type { SalesSettings } from '../../../shared/schemas/salesOrders.js'
import { DEFAULT_RESTOCKING_PERCENT, DEFAULT_RETURN_WINDOW_DAYS } from '../../../shared/schemas/salesReturns.js'
import { AppSetting } from '../../entities/AppSetting.js'
import { inTransaction } from '../../db/transaction.js'
import { audit, type AuditActor } from '../auditService.js'

const KEYS = {
  depositPercent: 'sales.deposit_percent_made_to_order',
  returnWindowDays: 'sales.return_window_days',
  restockingPercent: 'sales.restocking_percent',
} as const satisfies Record<keyof SalesSettings, string>

export async function salesSettings(db: EntityManager | DataSource): Promise<SalesSettings> {
  const rows = await db.getRepository(AppSetting).findBy({ key: In(Object.values(KEYS)) })
  const value = (key: string) => rows.find((r) => r.key === key)?.value
  return {
    depositPercent: value(KEYS.depositPercent) ?? DEFAULT_DEPOSIT_PERCENT,
    returnWindowDays: Number(value(KEYS.returnWindowDays) ?? DEFAULT_RETURN_WINDOW_DAYS),
    restockingPercent: value(KEYS.restockingPercent) ?? DEFAULT_RESTOCKING_PERCENT,
  }
}

export async function updateSalesSettings(ds: DataSource, actor: AuditActor & { userId: number }, input: Partial<SalesSettings>): Promise<SalesSettings> {
  return inTransaction(ds, async (em) => {
    const before = await salesSettings(em)
    for (const [name, key] of Object.entries(KEYS) as [keyof SalesSettings, string][]) {
      if (input[name] === undefined) continue
      await em.query(
        'INSERT INTO app_settings (setting_key, value, updated_by) VALUES (?, ?, ?) ON DUPLICATE KEY UPDATE value = VALUES(value), updated_by = VALUES(updated_by)',
        [key, String(input[name]), actor.userId],
      )
    }
    await audit(em, actor, 'settings.update', 'app_settings', 'sales', { before, after: input })
    return salesSettings(em)
  })
}
