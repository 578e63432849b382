// Reorder point, safety stock, lot size and the line's status, each with its working shown.
// Time unit throughout: days. Demand in stock units per day. Money enters only through costs (decimal strings);
// the results are quantities, so converting those costs to numbers here cannot put a float into any amount.
import jStat from 'jstat'
import { isMoney, type Money } from '../money.js'
import { roundUpToPack } from './packs.js'
import { DAYS_PER_YEAR } from './demand.js'
import { classifyLine, policyCeiling } from './reorderStatus.js'
import { Working, type ReorderStep } from './reorderWords.js'

export interface PolicyOverride {
  value: number
  /** Why the computed figure is set aside; shown wherever the figure is. */
  reason: string
}

export interface ReorderPolicy {
  /** Cycle service level: chance of no stock-out while a replenishment is on its way, 0.5 ≤ p < 1. */
  serviceLevel: number
  /** Mean lead time L̄ (days). */
  leadTimeDays: number
  /** σL (days); 0 when the lead time is fixed. */
  leadTimeSdDays: number
  /** Days between reviews; used by the order-up-to method (protection interval R + L). */
  reviewPeriodDays: number
  /** S: cost of placing and receiving one order. */
  costPerOrder: Money
  /** i: holding cost per year as a fraction of unit cost (0.25 = 25 %). */
  holdingRatePerYear: number
  /** 'eoq': order Q = √(2DS/H) at the reorder point; 'orderUpTo': order up to T at each review. */
  method: 'eoq' | 'orderUpTo'
  /** A line is "order soon" when its position will reach the reorder point within this many days. */
  soonDays: number
  /** Days of demand tolerated above the highest position the policy itself produces before "overstocked". */
  overstockMarginDays: number
  /** A line with stock and no use for this many days is dead stock. */
  deadStockDays: number
  overrides?: {
    safetyStock?: PolicyOverride
    reorderPoint?: PolicyOverride
    orderQuantity?: PolicyOverride
    orderUpToLevel?: PolicyOverride
  }
}

/** Starting values for a new item (common practice: 95 % service, 25 %/yr holding, 180 days for dead stock). */
export const DEFAULT_REORDER_POLICY: ReorderPolicy = {
  serviceLevel: 0.95,
  leadTimeDays: 14,
  leadTimeSdDays: 0,
  reviewPeriodDays: 7,
  costPerOrder: '25.00',
  holdingRatePerYear: 0.25,
  method: 'eoq',
  soonDays: 7,
  overstockMarginDays: 30,
  deadStockDays: 180,
}

export interface DemandInput {
  /** d̄: mean daily usage counting days without use. */
  meanDaily: number
  /** σd: standard deviation of daily usage. */
  sdDaily: number
  daysSinceLastUse: number | null
}

export interface StockPosition {
  onHand: number
  onOrder: number
  reserved: number
  /** Ordered in intent, not yet on a sent order: accepted suggestions and draft PO lines (default 0). */
  pending?: number
}

export interface VendorTerms {
  /** Units per vendor pack; orders are whole packs. */
  packSize: number
  /** Smallest order the vendor takes, in stock units. */
  minimumOrder: number
}

export interface ReorderInput {
  demand: DemandInput
  stock: StockPosition
  unitCost: Money
  policy: ReorderPolicy
  vendor?: VendorTerms
}

export type ReorderStatus = 'orderNow' | 'orderSoon' | 'overstocked' | 'deadStock' | 'ok'

export interface Explanation {
  /** The figures the working read, by name (a code such as meanDaily; screens word it). */
  inputs: Record<string, number | string | null>
  /** The working in English (logs, accepted suggestions). */
  steps: string[]
  /** The same steps keyed with their figures, for screens in the reader's language (reorderWords.ts). */
  words: ReorderStep[]
}

export interface ReorderResult {
  status: ReorderStatus
  z: number
  safetyStock: number
  /** Integer: d̄·L + SS rounded up. */
  reorderPoint: number
  eoq: number | null
  /** EOQ (or its override) as whole vendor packs, at least the minimum order; 0 without demand. */
  lotSize: number
  orderUpToLevel: number | null
  position: number
  daysOfSupply: number | null
  /** What to order now (whole packs, ≥ minimum order, never below need); 0 unless orderNow / orderSoon. */
  suggestedOrder: number
  explanation: Explanation
}

// Float sums such as 4.2 × 12 = 50.400000000000006 must not round up to the next unit.
const CEIL_TOLERANCE = 1e-9
function ceilQty(x: number): number {
  return Math.max(0, Math.ceil(x - CEIL_TOLERANCE))
}

function show(x: number, places = 2): string {
  return Number.isInteger(x) ? String(x) : x.toFixed(places)
}

function requireRange(name: string, value: number, min: number, max = Infinity): void {
  if (!Number.isFinite(value) || value < min || value > max) throw new RangeError(`${name} must be in [${min}, ${max}], got ${value}`)
}

const Z_BY_LEVEL = new Map<number, number>()

/** z such that Φ(z) = serviceLevel: the standard normal quantile. */
export function zForServiceLevel(serviceLevel: number): number {
  if (!(serviceLevel > 0 && serviceLevel < 1)) throw new RangeError(`service level must be between 0 and 1, got ${serviceLevel}`)
  let z = Z_BY_LEVEL.get(serviceLevel)
  if (z === undefined) {
    // A list has a handful of service levels over thousands of lines: the quantile is worked out once for each.
    if (Z_BY_LEVEL.size >= 256) Z_BY_LEVEL.clear()
    z = jStat.normal.inv(serviceLevel, 0, 1) as number
    Z_BY_LEVEL.set(serviceLevel, z)
  }
  return z
}

export interface SafetyStockInput {
  z: number
  meanDaily: number
  sdDaily: number
  leadTimeDays: number
  leadTimeSdDays: number
}

/** SS = z·√(L·σd² + d̄²·σL²); with a fixed lead time (σL = 0) this is z·σd·√L. */
export function safetyStock({ z, meanDaily, sdDaily, leadTimeDays, leadTimeSdDays }: SafetyStockInput): number {
  return z * Math.sqrt(leadTimeDays * sdDaily ** 2 + meanDaily ** 2 * leadTimeSdDays ** 2)
}

/** ROP = d̄·L + SS, not yet rounded. */
export function reorderPointRaw(meanDaily: number, leadTimeDays: number, safety: number): number {
  return meanDaily * leadTimeDays + safety
}

export interface EoqInput {
  /** D: units per year. */
  annualDemand: number
  /** S: cost per order. */
  costPerOrder: number
  /** H: holding cost per unit per year. */
  holdingCostPerUnit: number
}

/** Q* = √(2DS/H); null when H = 0 (holding is free, so no finite optimum). */
export function economicOrderQuantity({ annualDemand, costPerOrder, holdingCostPerUnit }: EoqInput): number | null {
  if (holdingCostPerUnit <= 0) return null
  return Math.sqrt((2 * annualDemand * costPerOrder) / holdingCostPerUnit)
}

/** Inventory position = on hand + on order (+ pending) − reserved: what is already coming counts once. */
export function inventoryPosition({ onHand, onOrder, reserved, pending = 0 }: StockPosition): number {
  return onHand + onOrder + pending - reserved
}

/** Raw need → whole vendor packs, at least the minimum order (itself rounded up to packs); 0 stays 0. */
export function roundOrderQuantity(need: number, vendor: VendorTerms = { packSize: 1, minimumOrder: 0 }): number {
  const units = ceilQty(need)
  if (units === 0) return 0
  return roundUpToPack(Math.max(units, vendor.minimumOrder), vendor.packSize)
}

function validate(input: ReorderInput): void {
  const { policy, demand, stock } = input
  requireRange('service level', policy.serviceLevel, 0.5, 0.9999)
  requireRange('lead time', policy.leadTimeDays, 0)
  requireRange('lead time σ', policy.leadTimeSdDays, 0)
  requireRange('review period', policy.reviewPeriodDays, 0)
  requireRange('holding rate', policy.holdingRatePerYear, 0)
  requireRange('soon days', policy.soonDays, 0)
  requireRange('overstock margin days', policy.overstockMarginDays, 0)
  requireRange('dead stock days', policy.deadStockDays, 1)
  requireRange('mean daily demand', demand.meanDaily, 0)
  requireRange('daily demand σ', demand.sdDaily, 0)
  if (policy.method === 'orderUpTo' && policy.reviewPeriodDays <= 0) throw new RangeError('order-up-to needs a review period > 0')
  if (!isMoney(policy.costPerOrder, 4) || policy.costPerOrder.startsWith('-')) throw new RangeError('cost per order must be a non-negative amount')
  if (!isMoney(input.unitCost, 4) || input.unitCost.startsWith('-')) throw new RangeError('unit cost must be a non-negative amount')
  for (const q of [stock.onHand, stock.onOrder, stock.reserved, stock.pending ?? 0]) if (!Number.isSafeInteger(q)) throw new RangeError('stock quantities must be integers')
  if (input.vendor) {
    requireRange('pack size', input.vendor.packSize, 1)
    requireRange('minimum order', input.vendor.minimumOrder, 0)
  }
  for (const [name, o] of Object.entries(policy.overrides ?? {})) {
    if (!o) continue
    requireRange(`${name} override`, o.value, 0)
    if (o.reason.trim() === '') throw new RangeError(`${name} override needs a reason`)
  }
}

interface Targets { z: number; safetyStock: number; reorderPoint: number; orderUpToLevel: number | null }

function computeTargets({ demand, policy }: ReorderInput, steps: Working | null): Targets {
  const { meanDaily: d, sdDaily: sd } = demand
  const { leadTimeDays: L, leadTimeSdDays: sL, overrides = {} } = policy
  const z = zForServiceLevel(policy.serviceLevel)
  steps?.add('z', { serviceLevel: policy.serviceLevel, z: z.toFixed(4) })
  let ss = safetyStock({ z, meanDaily: d, sdDaily: sd, leadTimeDays: L, leadTimeSdDays: sL })
  if (sL === 0) steps?.add('safetyStock', { z: z.toFixed(4), sd: show(sd), L: show(L), ss: show(ss) })
  else steps?.add('safetyStockLeadSpread', { z: z.toFixed(4), L: show(L), sd: show(sd), d: show(d), sL: show(sL), ss: show(ss) })
  if (overrides.safetyStock) {
    ss = overrides.safetyStock.value
    steps?.add('override', { symbol: 'SS', value: show(ss), reason: overrides.safetyStock.reason })
  }
  const ropRaw = reorderPointRaw(d, L, ss)
  let reorderPoint = ceilQty(ropRaw)
  steps?.add('reorderPoint', { d: show(d), L: show(L), ss: show(ss), raw: show(ropRaw), rop: reorderPoint })
  if (overrides.reorderPoint) {
    reorderPoint = ceilQty(overrides.reorderPoint.value)
    steps?.add('override', { symbol: 'ROP', value: reorderPoint, reason: overrides.reorderPoint.reason })
  }
  let orderUpToLevel: number | null = null
  if (policy.method === 'orderUpTo') {
    const P = policy.reviewPeriodDays + L
    const ssP = z * Math.sqrt(P * sd ** 2 + d ** 2 * sL ** 2)
    const tRaw = d * P + ssP
    orderUpToLevel = ceilQty(tRaw)
    steps?.add('orderUpTo', { d: show(d), period: show(P), ssPeriod: show(ssP), raw: show(tRaw), level: orderUpToLevel })
    if (overrides.orderUpToLevel) {
      orderUpToLevel = ceilQty(overrides.orderUpToLevel.value)
      steps?.add('override', { symbol: 'T', value: orderUpToLevel, reason: overrides.orderUpToLevel.reason })
    }
  }
  return { z, safetyStock: ss, reorderPoint, orderUpToLevel }
}

function computeLotSize({ demand, policy, unitCost, vendor }: ReorderInput, steps: Working | null): { eoq: number | null; lotSize: number } {
  const D = demand.meanDaily * DAYS_PER_YEAR
  const S = Number(policy.costPerOrder)
  const H = policy.holdingRatePerYear * Number(unitCost)
  const eoq = economicOrderQuantity({ annualDemand: D, costPerOrder: S, holdingCostPerUnit: H })
  steps?.add('annual', { year: DAYS_PER_YEAR, D: show(D), rate: policy.holdingRatePerYear, cost: unitCost, H: show(H, 4) })
  if (eoq === null) steps?.add('eoqNone')
  else steps?.add('eoq', { D: show(D), S: policy.costPerOrder, H: show(H, 4), eoq: show(eoq) })
  const override = policy.overrides?.orderQuantity
  const base = override ? override.value : (eoq ?? 0)
  if (override) steps?.add('override', { symbol: 'Q', value: show(base), reason: override.reason })
  const lotSize = D === 0 && !override ? 0 : roundOrderQuantity(Math.max(base, 1), vendor)
  if (vendor) steps?.add('lotSize', { base: show(base), pack: vendor.packSize, minimum: vendor.minimumOrder, lot: lotSize })
  return { eoq, lotSize }
}

export interface ReorderOptions {
  /** false: the working is written out only when `explanation` is first read (a list of thousands needs none). */
  explain?: boolean
}

/** The full reorder suggestion for one item in one warehouse. */
export function reorderSuggestion(input: ReorderInput, options: ReorderOptions = {}): ReorderResult {
  validate(input)
  const { demand, stock, policy, vendor } = input
  const steps: Working | null = options.explain === false ? null : new Working()
  const position = inventoryPosition(stock)
  if (stock.pending) steps?.add('positionPending', { onHand: stock.onHand, onOrder: stock.onOrder, pending: stock.pending, reserved: stock.reserved, position })
  else steps?.add('position', { onHand: stock.onHand, onOrder: stock.onOrder, reserved: stock.reserved, position })
  const targets = computeTargets(input, steps)
  const { eoq, lotSize } = computeLotSize(input, steps)
  const ceiling = policyCeiling({ ...targets, lotSize, method: policy.method, packSize: vendor?.packSize ?? 1, minimumOrder: vendor?.minimumOrder ?? 0 })
  const status = classifyLine({ position, stock, demand, policy, reorderPoint: targets.reorderPoint, ceiling }, steps ?? undefined)
  let suggestedOrder = 0
  if (status === 'orderNow' || status === 'orderSoon') {
    const need = status === 'orderNow' ? targets.reorderPoint + 1 - position : 0
    const raw = policy.method === 'orderUpTo' ? (targets.orderUpToLevel ?? 0) - position : Math.max(lotSize, need)
    suggestedOrder = roundOrderQuantity(Math.max(raw, need), vendor)
    if (policy.method === 'orderUpTo') steps?.add('orderToLevel', { level: targets.orderUpToLevel ?? 0, position, raw: show(raw), qty: suggestedOrder })
    else steps?.add('orderLot', { lot: lotSize, need, qty: suggestedOrder })
  }
  const figures = {
    status, ...targets, eoq, lotSize, position, suggestedOrder,
    daysOfSupply: demand.meanDaily > 0 ? position / demand.meanDaily : null,
  }
  if (steps) return { ...figures, explanation: { inputs: explanationInputs(input), steps: steps.steps, words: steps.words } }
  let written: Explanation | undefined
  return Object.defineProperty(figures, 'explanation', {
    enumerable: true,
    get: () => (written ??= reorderSuggestion(input).explanation),
  }) as ReorderResult
}

function explanationInputs({ demand, stock, policy, vendor, unitCost }: ReorderInput): Explanation['inputs'] {
  // Named by code: screens word each name in the reader's language (reorder.inputs.<name>).
  return {
    meanDaily: demand.meanDaily, sdDaily: demand.sdDaily, leadTimeDays: policy.leadTimeDays,
    leadTimeSdDays: policy.leadTimeSdDays, reviewPeriodDays: policy.reviewPeriodDays, serviceLevel: policy.serviceLevel,
    costPerOrder: policy.costPerOrder, holdingRatePerYear: policy.holdingRatePerYear, unitCost,
    onHand: stock.onHand, onOrder: stock.onOrder, pending: stock.pending ?? 0, reserved: stock.reserved,
    daysSinceLastUse: demand.daysSinceLastUse,
    packSize: vendor?.packSize ?? null, minimumOrder: vendor?.minimumOrder ?? null,
  }
}
