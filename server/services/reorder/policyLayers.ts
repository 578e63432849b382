// The effective reorder policy of a line: built-in defaults, then the global layer, the item's family, its ABC
// class and finally the item in that warehouse; each layer's non-null fields win. ABC after family because the
// class measures this item's value, which is the finer distinction. Lead time comes from the vendor, not a layer.
import type { EntityManager } from 'typeorm'
import { HEIZER_RENDER_CUTOFFS, type AbcClass, type AbcCutoffs } from '../../../shared/inventory/abc.js'
import { DEFAULT_REORDER_POLICY, type ReorderPolicy } from '../../../shared/inventory/reorder.js'
import {
  USAGE_WINDOW_DEFAULT_DAYS, type LeadTimeFigures, type PolicyScopeName, type PolicySource,
} from '../../../shared/schemas/reorder.js'
import { ReorderPolicyRow } from '../../entities/ReorderPolicy.js'

export interface PolicyLayers {
  global: ReorderPolicyRow | null
  family: Map<string, ReorderPolicyRow>
  abc: Map<string, ReorderPolicyRow>
  line: Map<string, ReorderPolicyRow>
}

export interface EffectivePolicy {
  policy: ReorderPolicy
  sources: Partial<Record<keyof ReorderPolicy, PolicySource>>
  overrideReason: string | null
}

type LayerField = 'serviceLevel' | 'reviewPeriodDays' | 'costPerOrder' | 'holdingRatePerYear' | 'method'
  | 'soonDays' | 'overstockMarginDays' | 'deadStockDays'

const LAYER_FIELDS: Array<[LayerField, (r: ReorderPolicyRow) => ReorderPolicy[LayerField] | null]> = [
  ['serviceLevel', (r) => (r.serviceLevel === null ? null : Number(r.serviceLevel))],
  ['reviewPeriodDays', (r) => r.reviewPeriodDays],
  ['costPerOrder', (r) => r.costPerOrder],
  ['holdingRatePerYear', (r) => (r.holdingRate === null ? null : Number(r.holdingRate))],
  ['method', (r) => r.method],
  ['soonDays', (r) => r.soonDays],
  ['overstockMarginDays', (r) => r.overstockMarginDays],
  ['deadStockDays', (r) => r.deadStockDays],
]

export async function loadPolicyLayers(em: EntityManager): Promise<PolicyLayers> {
  const rows = await em.find(ReorderPolicyRow)
  const layers: PolicyLayers = { global: null, family: new Map(), abc: new Map(), line: new Map() }
  for (const r of rows) {
    if (r.scope === 'global') layers.global = r
    else layers[r.scope === 'item_warehouse' ? 'line' : r.scope].set(r.scopeKey, r)
  }
  return layers
}

export interface GlobalSettings {
  windowDays: number
  cutoffs: AbcCutoffs
  /** The longest dead-stock limit any layer sets: how far back the last use must be looked for. */
  lookbackDays: number
}

export function globalSettings(layers: PolicyLayers, requestedWindow?: number): GlobalSettings {
  const g = layers.global
  const windowDays = requestedWindow ?? g?.usageWindowDays ?? USAGE_WINDOW_DEFAULT_DAYS
  const cutoffs = {
    a: g?.abcCutoffA != null ? Number(g.abcCutoffA) : HEIZER_RENDER_CUTOFFS.a,
    b: g?.abcCutoffB != null ? Number(g.abcCutoffB) : HEIZER_RENDER_CUTOFFS.b,
  }
  const all = [g, ...layers.family.values(), ...layers.abc.values(), ...layers.line.values()]
  const deadDays = all.map((r) => r?.deadStockDays ?? 0)
  return { windowDays, cutoffs, lookbackDays: Math.max(windowDays, DEFAULT_REORDER_POLICY.deadStockDays, ...deadDays) }
}

function applyLayer(target: EffectivePolicy, row: ReorderPolicyRow | null | undefined, source: PolicyScopeName): void {
  if (!row) return
  for (const [field, read] of LAYER_FIELDS) {
    const value = read(row)
    if (value === null) continue
    ;(target.policy as unknown as Record<string, unknown>)[field] = value
    target.sources[field] = source
  }
}

/** Merges the layers for one line; `baseCache` shares the family × class part between lines. */
export function effectivePolicy(
  layers: PolicyLayers,
  line: { family: string; abcClass: AbcClass; key: string },
  leadTime: LeadTimeFigures,
  baseCache: Map<string, EffectivePolicy> = new Map(),
): EffectivePolicy {
  const cacheKey = `${line.family}|${line.abcClass}`
  let base = baseCache.get(cacheKey)
  if (!base) {
    base = { policy: { ...DEFAULT_REORDER_POLICY }, sources: {}, overrideReason: null }
    for (const field of LAYER_FIELDS.map(([f]) => f)) base.sources[field] = 'default'
    applyLayer(base, layers.global, 'global')
    applyLayer(base, layers.family.get(line.family), 'family')
    applyLayer(base, layers.abc.get(line.abcClass), 'abc')
    baseCache.set(cacheKey, base)
  }
  const own = layers.line.get(line.key)
  const policy = { ...base.policy, leadTimeDays: leadTime.meanDays, leadTimeSdDays: leadTime.sdDays }
  // Most lines have no layer of their own: they share the family × class sources (read only).
  if (!own) return { policy, sources: base.sources, overrideReason: null }
  const merged: EffectivePolicy = { policy, sources: { ...base.sources }, overrideReason: null }
  applyLayer(merged, own, 'item_warehouse')
  const reason = own.overrideReason ?? ''
  const overrides: ReorderPolicy['overrides'] = {}
  if (own.overrideReorderPoint !== null) overrides.reorderPoint = { value: own.overrideReorderPoint, reason }
  if (own.overrideOrderQty !== null) overrides.orderQuantity = { value: own.overrideOrderQty, reason }
  if (overrides.reorderPoint || overrides.orderQuantity) {
    merged.policy.overrides = overrides
    merged.sources.overrides = 'item_warehouse'
    merged.overrideReason = reason
  }
  return merged
}
