// The first-run checklist: what a new installation still lacks to go live, read from the data itself
// (a step is done when its records exist), plus the answers only the checklist asks for (units, the GS1
// company prefix) and its dismissal, kept in app_settings.
import type { DataSource, EntityManager } from 'typeorm'
import type { SetupGs1Input, SetupState, SetupUnitsInput } from '../../shared/schemas/setup.js'
import { OPEN_PO_STATUSES } from '../entities/PurchaseOrder.js'
import { audit, type AuditActor } from './auditService.js'
import { USAGE_MOVE_TYPES } from './reorder/usageQueries.js'

const KEYS = {
  dismissed: 'setup.dismissed',
  unitsConfirmed: 'setup.units_confirmed',
  weightUnit: 'company.weight_unit',
  gs1Prefix: 'company.gs1_prefix',
} as const

type Db = EntityManager | DataSource

async function settings(db: Db): Promise<Map<string, string>> {
  const rows: { setting_key: string; value: string }[] = await db.query('SELECT setting_key, value FROM app_settings WHERE setting_key IN (?)', [Object.values(KEYS)])
  return new Map(rows.map((r) => [r.setting_key, r.value]))
}

async function put(em: EntityManager, key: string, value: string, actor: AuditActor): Promise<void> {
  await em.query(
    'INSERT INTO app_settings (setting_key, value, updated_by) VALUES (?, ?, ?) ON DUPLICATE KEY UPDATE value = VALUES(value), updated_by = VALUES(updated_by)',
    [key, value, actor.userId],
  )
}

const one = async (db: Db, sql: string, params: unknown[] = []): Promise<number> => Number(((await db.query(sql, params)) as { n: string }[])[0]?.n ?? 0)

export async function setupState(db: Db, production: boolean): Promise<SetupState> {
  const s = await settings(db)
  const [profile]: { legal_name: string; bill_to_address: string | null; phone: string | null; email: string | null; document_unit: string }[] =
    await db.query('SELECT legal_name, bill_to_address, phone, email, document_unit FROM company_profile WHERE id = 1')
  const warehouses = await one(db, 'SELECT COUNT(*) AS n FROM warehouses WHERE active = 1')
  const bins = await one(db, "SELECT COUNT(*) AS n FROM bins b JOIN warehouses w ON w.id = b.warehouse_id WHERE w.active = 1 AND b.active = 1 AND b.kind = 'storage'")
  const items = await one(db, 'SELECT COUNT(*) AS n FROM items WHERE active = 1')
  const openings = await one(db, "SELECT COUNT(*) AS n FROM data_imports WHERE kind = 'opening_stock' AND reversed_at IS NULL")
  const stocked = await one(db, 'SELECT EXISTS (SELECT 1 FROM stock_balances WHERE on_hand > 0) AS n')
  const vendorItems = await one(db, 'SELECT COUNT(*) AS n FROM vendor_items')
  const accounts = await one(db, 'SELECT COUNT(*) AS n FROM customers')
  const openOrders = await one(db, 'SELECT COUNT(*) AS n FROM purchase_orders WHERE status IN (?)', [OPEN_PO_STATUSES])
  // Use is there once history came in, or once the ledger holds issues or picks of its own.
  const used = await one(db, `SELECT EXISTS (SELECT 1 FROM data_imports WHERE kind = 'usage_history' AND reversed_at IS NULL)
    OR EXISTS (SELECT 1 FROM stock_moves WHERE move_type IN (?)) AS n`, [USAGE_MOVE_TYPES])
  const dismissed = s.get(KEYS.dismissed) === 'true'
  const prefix = s.get(KEYS.gs1Prefix)
  return {
    show: production && !dismissed,
    dismissed,
    steps: [
      { key: 'company', done: !!profile?.legal_name && !!profile.bill_to_address && !!(profile.phone || profile.email) },
      { key: 'units', done: s.has(KEYS.unitsConfirmed), figures: { lengthUnit: profile?.document_unit ?? 'in', weightUnit: s.get(KEYS.weightUnit) ?? 'lb' } },
      { key: 'warehouses', done: warehouses > 0 && bins > 0, figures: { warehouses, bins } },
      { key: 'gs1', done: prefix !== undefined, figures: { prefix: prefix || null } },
      { key: 'items', done: items > 0, figures: { items } },
      { key: 'opening_stock', done: openings > 0 || stocked > 0, figures: { imports: openings } },
      { key: 'vendors', done: vendorItems > 0, figures: { vendorItems } },
      { key: 'accounts', done: accounts > 0, figures: { accounts } },
      { key: 'purchase_orders', done: openOrders > 0, figures: { orders: openOrders } },
      { key: 'usage_history', done: used > 0 },
    ],
  }
}

/** The company's length unit (its documents') and weight unit; the checklist's units step. */
export async function saveSetupUnits(ds: DataSource, actor: AuditActor, input: SetupUnitsInput, production: boolean): Promise<SetupState> {
  return ds.transaction(async (em) => {
    // The profile row may not exist yet on a new installation: create it with the unit, the name comes later.
    await em.query(
      "INSERT INTO company_profile (id, legal_name, document_unit, updated_by) VALUES (1, '', ?, ?) ON DUPLICATE KEY UPDATE document_unit = VALUES(document_unit), updated_by = VALUES(updated_by)",
      [input.lengthUnit, actor.userId],
    )
    await put(em, KEYS.weightUnit, input.weightUnit, actor)
    await put(em, KEYS.unitsConfirmed, 'true', actor)
    await audit(em, actor, 'settings.units', 'app_settings', 'company', input)
    return setupState(em, production)
  })
}

export async function saveGs1Prefix(ds: DataSource, actor: AuditActor, input: SetupGs1Input, production: boolean): Promise<SetupState> {
  return ds.transaction(async (em) => {
    await put(em, KEYS.gs1Prefix, input.prefix ?? '', actor)
    await audit(em, actor, 'settings.gs1_prefix', 'app_settings', 'company', input)
    return setupState(em, production)
  })
}

export async function dismissSetup(ds: DataSource, actor: AuditActor, production: boolean): Promise<SetupState> {
  return ds.transaction(async (em) => {
    await put(em, KEYS.dismissed, 'true', actor)
    await audit(em, actor, 'settings.setup_dismissed', 'app_settings', 'setup', null)
    return setupState(em, production)
  })
}
