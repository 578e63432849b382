// The counter's sales policy, kept in app_settings: the deposit asked on made-to-order lines, in percent.
import type { DataSource, EntityManager } from 'typeorm'
import { DEFAULT_DEPOSIT_PERCENT } from '../../../shared/sales/salesOrderTerms.js'
import type { SalesSettings } from '../../../shared/schemas/salesOrders.js'
import { AppSetting } from '../../entities/AppSetting.js'
import { inTransaction } from '../../db/transaction.js'
import { audit, type AuditActor } from '../auditService.js'

const DEPOSIT_KEY = 'sales.deposit_percent_made_to_order'

export async function salesSettings(db: EntityManager | DataSource): Promise<SalesSettings> {
  const row = await db.getRepository(AppSetting).findOneBy({ key: DEPOSIT_KEY })
  return { depositPercent: row?.value ?? DEFAULT_DEPOSIT_PERCENT }
}

export async function updateSalesSettings(ds: DataSource, actor: AuditActor & { userId: number }, input: SalesSettings): Promise<SalesSettings> {
  return inTransaction(ds, async (em) => {
    const before = await salesSettings(em)
    await em.query(
      'INSERT INTO app_settings (setting_key, value, updated_by) VALUES (?, ?, ?) ON DUPLICATE KEY UPDATE value = VALUES(value), updated_by = VALUES(updated_by)',
      [DEPOSIT_KEY, input.depositPercent, actor.userId],
    )
    await audit(em, actor, 'settings.update', 'app_settings', 'sales', { before, after: input })
    return salesSettings(em)
  })
}
