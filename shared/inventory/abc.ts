// ABC classes by annual usage value (annual quantity × unit cost), for count frequency and buying attention.
// Default cut-offs follow Heizer & Render's rule of thumb (Operations Management, inventory chapter):
// A items ≈ 15–20 % of items carrying ≈ 70–80 % of value, B up to ≈ 95 %, C the rest.
import { MoneyDecimal, isMoney, roundMoney, type Money } from '../money.js'

export type AbcClass = 'A' | 'B' | 'C'

export interface AbcCutoffs {
  /** Cumulative share of value (0–1) up to which items are A. */
  a: number
  /** Cumulative share of value up to which items are B; the rest are C. */
  b: number
}

/** Heizer & Render's rule of thumb. */
export const HEIZER_RENDER_CUTOFFS: AbcCutoffs = { a: 0.8, b: 0.95 }

export interface AbcItemInput {
  id: string
  /** Annual usage value as a decimal string. */
  annualValue: Money
}

export interface AbcItem {
  id: string
  annualValue: Money
  rank: number
  share: number
  cumulativeShare: number
  abcClass: AbcClass
}

export interface AbcClassSummary {
  count: number
  value: Money
  shareOfItems: number
  shareOfValue: number
}

export interface AbcResult {
  items: AbcItem[]
  total: Money
  summary: Record<AbcClass, AbcClassSummary>
}

/**
 * Rules, in order:
 * - sort by value, highest first; equal values by id, so the order is repeatable;
 * - an item's class comes from the cumulative share up to and including it: ≤ a → A, ≤ b → B, else C;
 * - the top item is always A (an item holding more than the A cut-off alone is the clearest A there is);
 * - tied values share the class of the first item of the tie, so the id order can never split a tie;
 * - zero-value items are always C; if every item is zero, all are C.
 */
export function classifyAbc(inputs: readonly AbcItemInput[], cutoffs: AbcCutoffs = HEIZER_RENDER_CUTOFFS): AbcResult {
  if (!(cutoffs.a > 0 && cutoffs.a <= cutoffs.b && cutoffs.b <= 1)) throw new RangeError('cut-offs need 0 < a ≤ b ≤ 1')
  for (const i of inputs) {
    if (!isMoney(i.annualValue, 20) || i.annualValue.startsWith('-')) throw new RangeError(`item ${i.id}: annual value must be a non-negative amount`)
  }
  const sorted = inputs
    .map((i) => ({ ...i, value: new MoneyDecimal(i.annualValue) }))
    .sort((x, y) => y.value.comparedTo(x.value) || (x.id < y.id ? -1 : x.id > y.id ? 1 : 0))
  const total = sorted.reduce((sum, i) => sum.plus(i.value), new MoneyDecimal(0))
  let running = new MoneyDecimal(0)
  let previous: { value: InstanceType<typeof MoneyDecimal>; abcClass: AbcClass } | null = null
  const items = sorted.map((i, index): AbcItem => {
    running = running.plus(i.value)
    const cumulative = total.isZero() ? new MoneyDecimal(0) : running.dividedBy(total)
    let abcClass: AbcClass
    if (i.value.isZero()) abcClass = 'C'
    else if (previous && previous.value.equals(i.value)) abcClass = previous.abcClass
    else if (index === 0 || cumulative.lessThanOrEqualTo(cutoffs.a)) abcClass = 'A'
    else abcClass = cumulative.lessThanOrEqualTo(cutoffs.b) ? 'B' : 'C'
    previous = { value: i.value, abcClass }
    return {
      id: i.id, annualValue: i.annualValue, rank: index + 1, abcClass,
      share: total.isZero() ? 0 : i.value.dividedBy(total).toNumber(),
      cumulativeShare: cumulative.toNumber(),
    }
  })
  return { items, total: total.toFixed(Math.max(2, total.decimalPlaces())), summary: summarize(items, total) }
}

function summarize(items: readonly AbcItem[], total: InstanceType<typeof MoneyDecimal>): Record<AbcClass, AbcClassSummary> {
  const summary = {} as Record<AbcClass, AbcClassSummary>
  for (const abcClass of ['A', 'B', 'C'] as const) {
    const members = items.filter((i) => i.abcClass === abcClass)
    const value = members.reduce((sum, i) => sum.plus(i.annualValue), new MoneyDecimal(0))
    summary[abcClass] = {
      count: members.length,
      value: value.toFixed(Math.max(2, value.decimalPlaces())),
      shareOfItems: items.length === 0 ? 0 : members.length / items.length,
      shareOfValue: total.isZero() ? 0 : value.dividedBy(total).toNumber(),
    }
  }
  return summary
}

export interface ParetoSeries {
  labels: string[]
  /** Each item's value as a number, for drawing only. */
  values: number[]
  /** Cumulative share in percent, 0–100. */
  cumulativePercent: number[]
  classes: AbcClass[]
}

/** Bars (value, highest first) and the cumulative-percent line of a Pareto chart. */
export function paretoSeries(result: AbcResult): ParetoSeries {
  return {
    labels: result.items.map((i) => i.id),
    values: result.items.map((i) => Number(i.annualValue)),
    cumulativePercent: result.items.map((i) => i.cumulativeShare * 100),
    classes: result.items.map((i) => i.abcClass),
  }
}

/** Annual usage value = annual quantity × unit cost, to cents (annual quantity may be a mean × 365, so fractional). */
export function annualUsageValue(annualQuantity: number, unitCost: Money): Money {
  if (!Number.isFinite(annualQuantity) || annualQuantity < 0) throw new RangeError('annual quantity must be ≥ 0')
  if (!isMoney(unitCost, 20)) throw new RangeError('unit cost must be an amount')
  return usageValueInCents(annualQuantity, unitCost) ?? roundMoney(new MoneyDecimal(unitCost).times(annualQuantity).toFixed())
}

const PLAIN_DECIMAL = /^(\d+)(?:\.(\d+))?$/

/**
 * The same amount in integer arithmetic (a list values thousands of lines): the exact product of the quantity as
 * written (String(q), as decimal.js reads a number) and the cost, rounded half-up to cents. Null wherever the
 * decimal path could round inside the product (over 40 digits) or refuse it (over 20 places), or for a negative
 * cost; the caller then takes that path.
 */
function usageValueInCents(annualQuantity: number, unitCost: Money): Money | null {
  const q = PLAIN_DECIMAL.exec(String(annualQuantity))
  const c = PLAIN_DECIMAL.exec(unitCost)
  if (!q || !c) return null
  const qPlaces = (q[2] ?? '').replace(/0+$/, '')
  const cPlaces = (c[2] ?? '').replace(/0+$/, '')
  const places = qPlaces.length + cPlaces.length
  const product = BigInt(q[1] + qPlaces) * BigInt(c[1] + cPlaces)
  if (places > 20 || product.toString().length > 40) return null
  let cents: bigint
  if (places <= 2) cents = product * 10n ** BigInt(2 - places)
  else {
    const unit = 10n ** BigInt(places - 2)
    cents = product / unit + (2n * (product % unit) >= unit ? 1n : 0n)
  }
  const digits = cents.toString().padStart(3, '0')
  return `${digits.slice(0, -2)}.${digits.slice(-2)}`
}
