// Reorder policy layers: list, save (one row per target, replaced whole: an absent field inherits) and remove.
// Every change is audited with who made it; overrides carry their reason (schema and a CHECK constraint).
import type { DataSource } from 'typeorm'
import { HEIZER_RENDER_CUTOFFS } from '../../../shared/inventory/abc.js'
import type { PolicyUpsertInput, ReorderPolicyView } from '../../../shared/schemas/reorder.js'
import { ReorderPolicyRow } from '../../entities/ReorderPolicy.js'
import { inTransaction, isDuplicateKey } from '../../db/transaction.js'
import { AppError, type FieldProblems, problem } from '../../errors.js'
import { audit, type AuditActor } from '../auditService.js'

const SETTINGS = [
  'serviceLevel', 'reviewPeriodDays', 'costPerOrder', 'holdingRatePerYear', 'method', 'soonDays', 'overstockMarginDays',
  'deadStockDays', 'usageWindowDays', 'abcCutoffA', 'abcCutoffB', 'overrideReorderPoint', 'overrideOrderQty',
] as const

const num = (v: string | null) => (v === null ? null : Number(v))
const text = (v: number | null | undefined) => (v == null ? null : String(v))

interface ViewRow { id: number; item_sku: string | null; warehouse_code: string | null; updated_by_name: string | null }

export async function listPolicies(ds: DataSource): Promise<ReorderPolicyView[]> {
  const [rows, names]: [ReorderPolicyRow[], ViewRow[]] = await Promise.all([
    ds.getRepository(ReorderPolicyRow).find({ order: { scope: 'ASC', scopeKey: 'ASC' } }),
    ds.query(`SELECT p.id, i.sku AS item_sku, w.code AS warehouse_code, u.display_name AS updated_by_name
                FROM reorder_policies p LEFT JOIN items i ON i.id = p.item_id
                LEFT JOIN warehouses w ON w.id = p.warehouse_id LEFT JOIN users u ON u.id = p.updated_by`),
  ])
  const extra = new Map(names.map((n) => [n.id, n]))
  return rows.map((r) => toView(r, extra.get(r.id)))
}

function toView(r: ReorderPolicyRow, extra?: ViewRow): ReorderPolicyView {
  return {
    id: r.id, scope: r.scope, family: r.family as ReorderPolicyView['family'], abcClass: r.abcClass,
    itemId: r.itemId, itemSku: extra?.item_sku ?? null, warehouseId: r.warehouseId, warehouseCode: extra?.warehouse_code ?? null,
    serviceLevel: num(r.serviceLevel), reviewPeriodDays: r.reviewPeriodDays, costPerOrder: r.costPerOrder,
    holdingRatePerYear: num(r.holdingRate), method: r.method, soonDays: r.soonDays, overstockMarginDays: r.overstockMarginDays,
    deadStockDays: r.deadStockDays, usageWindowDays: r.usageWindowDays, abcCutoffA: num(r.abcCutoffA), abcCutoffB: num(r.abcCutoffB),
    overrideReorderPoint: r.overrideReorderPoint, overrideOrderQty: r.overrideOrderQty, overrideReason: r.overrideReason,
    note: r.note, updatedBy: extra?.updated_by_name ?? null, updatedAt: r.updatedAt.toISOString(),
  }
}

function scopeKey(input: PolicyUpsertInput): string {
  if (input.scope === 'family') return input.family!
  if (input.scope === 'abc') return input.abcClass!
  if (input.scope === 'item_warehouse') return `${input.itemId}:${input.warehouseId}`
  return ''
}

async function checkTarget(ds: DataSource, input: PolicyUpsertInput): Promise<void> {
  if (SETTINGS.every((f) => input[f] == null)) throw AppError.badRequest('policy_value_needed', 'Set at least one value.', { fields: { _: problem('policy_value_needed') } })
  const a = input.abcCutoffA ?? HEIZER_RENDER_CUTOFFS.a
  const b = input.abcCutoffB ?? HEIZER_RENDER_CUTOFFS.b
  if (input.scope === 'global' && a > b) throw AppError.badRequest('abc_cutoffs_order', 'The ABC cut-offs are out of order.', { fields: { abcCutoffB: problem('abc_cutoffs_order') } })
  if (input.scope !== 'item_warehouse') return
  const [found] = await ds.query(
    `SELECT (SELECT COUNT(*) FROM items WHERE id = ?) AS items, (SELECT COUNT(*) FROM warehouses WHERE id = ?) AS warehouses`,
    [input.itemId, input.warehouseId],
  )
  const fields: FieldProblems = {}
  if (Number(found.items) === 0) fields.itemId = problem('item_not_found')
  if (Number(found.warehouses) === 0) fields.warehouseId = problem('warehouse_not_found')
  if (Object.keys(fields).length) throw AppError.badRequest('policy_target_missing', 'Choose an item and a warehouse that exist.', { fields })
}

function fill(row: ReorderPolicyRow, input: PolicyUpsertInput, actor: AuditActor): void {
  Object.assign(row, {
    scope: input.scope, scopeKey: scopeKey(input), family: input.family ?? null, abcClass: input.abcClass ?? null,
    itemId: input.itemId ?? null, warehouseId: input.warehouseId ?? null,
    serviceLevel: text(input.serviceLevel), reviewPeriodDays: input.reviewPeriodDays ?? null, costPerOrder: input.costPerOrder ?? null,
    holdingRate: text(input.holdingRatePerYear), method: input.method ?? null, soonDays: input.soonDays ?? null,
    overstockMarginDays: input.overstockMarginDays ?? null, deadStockDays: input.deadStockDays ?? null,
    usageWindowDays: input.usageWindowDays ?? null, abcCutoffA: text(input.abcCutoffA), abcCutoffB: text(input.abcCutoffB),
    overrideReorderPoint: input.overrideReorderPoint ?? null, overrideOrderQty: input.overrideOrderQty ?? null,
    overrideReason: input.overrideReorderPoint != null || input.overrideOrderQty != null ? input.overrideReason ?? null : null,
    note: input.note || null, updatedBy: actor.userId,
  })
}

export async function savePolicy(ds: DataSource, actor: AuditActor, input: PolicyUpsertInput): Promise<ReorderPolicyView> {
  await checkTarget(ds, input)
  try {
    const id = await inTransaction(ds, async (em) => {
      const repo = em.getRepository(ReorderPolicyRow)
      const existing = await repo.findOne({ where: { scope: input.scope, scopeKey: scopeKey(input) }, lock: { mode: 'pessimistic_write' } })
      const row = existing ?? repo.create()
      fill(row, input, actor)
      await repo.save(row)
      await audit(em, actor, existing ? 'reorder.policy.update' : 'reorder.policy.create', 'reorder_policy', row.id, input)
      return row.id
    })
    return (await listPolicies(ds)).find((p) => p.id === id)!
  } catch (err) {
    if (isDuplicateKey(err)) throw AppError.conflict('policy_saved_meanwhile', 'Someone saved a policy for the same target just now; reload and try again.')
    throw err
  }
}

export async function deletePolicy(ds: DataSource, actor: AuditActor, id: number): Promise<{ ok: true }> {
  await inTransaction(ds, async (em) => {
    const row = await em.findOne(ReorderPolicyRow, { where: { id }, lock: { mode: 'pessimistic_write' } })
    if (!row) throw AppError.notFound('policy_not_found', 'That policy was not found.')
    await em.delete(ReorderPolicyRow, { id })
    await audit(em, actor, 'reorder.policy.delete', 'reorder_policy', id, { scope: row.scope, scopeKey: row.scopeKey })
  })
  return { ok: true }
}
