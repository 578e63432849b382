// What a contractor pays for an item, and why: the list price, the account's price level (a percentage
// off list), a price rule for the item (a set price or a percentage off list, from a quantity on: a
// quantity break), a pack price for items sold by the case, or a clerk's override with its reason.
// Money stays decimal text (shared/money.ts); nothing here passes through a float.
import { MoneyDecimal, roundMoney, type Money } from '../money.js'

export type PriceSource = 'list' | 'level' | 'break' | 'override'
export type PriceBasis = 'unit' | 'pack'

/** A price rule for one item: for every account (levelId null) or one price level, from `minQty` stock units on. */
export interface PriceRule {
  id?: number
  levelId: number | null
  minQty: number
  /** 'unit': the price of one stock unit; 'pack': the price of one case (items sold by the case only). */
  basis: PriceBasis
  /** A set price (per unit or per case), or null when the rule gives a percentage off list. */
  price: Money | null
  percentOff: string | null
}

export interface PricedItem {
  listPrice: Money
  /** Stock units per case (1 when none). */
  packSize: number
  /** Sold by the whole case only: the quantity is rounded up to cases. */
  sellByPack: boolean
}

export interface PriceLevelTerms {
  id: number
  code: string
  /** Off list for every item without a rule of its own; null: list price. */
  percentOff: string | null
}

export interface PriceOverride {
  unitPrice: Money
  reason: string
  by: string
}

/** Where the price came from, with the figures the explanation needs. */
export interface PriceExplanation {
  source: PriceSource
  listPrice: Money
  levelCode?: string
  percentOff?: string
  minQty?: number
  ruleId?: number
  basis?: PriceBasis
  /** A rule for every account (not the account's level). */
  allAccounts?: boolean
  overrideReason?: string
  overrideBy?: string
}

export interface ResolvedPrice {
  /** The quantity sold, in stock units: rounded up to whole cases for items sold by the case. */
  qty: number
  /** Whole cases when the item sells by the case, else null. */
  packs: number | null
  packSize: number
  /** The price of one stock unit, to the cent unless a case price divides unevenly (then up to 4 places, for display). */
  unitPrice: Money
  /** The price of one case (items sold by the case), else null. */
  packPrice: Money | null
  /** qty × unit price, or cases × case price: exact, in cents. */
  extension: Money
  explanation: PriceExplanation
}

const HUNDRED = new MoneyDecimal(100)

/**
 * A percentage off a price, rounded half-up to the cent (the price a clerk would write on a ticket).
 * 24.99 at 15 % off: 24.99 × 0.85 = 21.2415 → 21.24.
 */
export function percentOffPrice(price: Money, percentOff: string): Money {
  const factor = HUNDRED.minus(new MoneyDecimal(percentOff)).dividedBy(HUNDRED)
  return roundMoney(new MoneyDecimal(price).times(factor).toFixed())
}

interface Candidate {
  /** Price per stock unit, exact (for comparison). */
  perUnit: InstanceType<typeof MoneyDecimal>
  unitPrice: Money
  packPrice: Money | null
  explanation: PriceExplanation
  /** Higher wins a tie: an item's own rule before a level's percentage before the list. */
  specificity: number
}

function ruleCandidate(rule: PriceRule, item: PricedItem, level: PriceLevelTerms | null): Candidate {
  const allAccounts = rule.levelId === null
  const explanation: PriceExplanation = {
    source: rule.minQty > 1 ? 'break' : 'level',
    listPrice: item.listPrice,
    minQty: rule.minQty,
    basis: rule.basis,
    ...(rule.id !== undefined ? { ruleId: rule.id } : {}),
    ...(allAccounts ? { allAccounts: true } : level ? { levelCode: level.code } : {}),
    ...(rule.percentOff !== null ? { percentOff: rule.percentOff } : {}),
  }
  // An all-accounts rule from 1 unit on is still a rule of the item: read as a level price for everyone.
  const specificity = allAccounts ? 2 : 3
  if (rule.basis === 'pack') {
    const listPack = new MoneyDecimal(item.listPrice).times(item.packSize).toFixed(2)
    const packPrice = rule.price ?? percentOffPrice(listPack, rule.percentOff ?? '0')
    const perUnit = new MoneyDecimal(packPrice).dividedBy(item.packSize)
    return { perUnit, unitPrice: unitText(perUnit), packPrice, explanation, specificity }
  }
  const unitPrice = rule.price ?? percentOffPrice(item.listPrice, rule.percentOff ?? '0')
  return { perUnit: new MoneyDecimal(unitPrice), unitPrice, packPrice: null, explanation, specificity }
}

/** A unit price to the cent when it is whole cents, else to 4 places (a case price shared out). */
function unitText(value: InstanceType<typeof MoneyDecimal>): Money {
  const places = Math.min(4, Math.max(2, value.decimalPlaces()))
  return value.toDecimalPlaces(places, MoneyDecimal.ROUND_HALF_UP).toFixed(places)
}

/** The quantity sold: whole cases for an item sold by the case. */
export function sellingQty(qty: number, item: PricedItem): { qty: number; packs: number | null } {
  if (!Number.isSafeInteger(qty) || qty <= 0) throw new RangeError(`quantity must be a positive integer, got ${qty}`)
  if (!item.sellByPack || item.packSize <= 1) return { qty, packs: null }
  const packs = Math.ceil(qty / item.packSize)
  return { qty: packs * item.packSize, packs }
}

/**
 * Resolves the price of `qty` stock units of an item for an account. The lowest price the account is
 * entitled to wins: the list price, its level's percentage off list, the best quantity break reached of a
 * rule for its level, or of a rule for every account. On a tie the more specific source is named. A clerk's
 * override replaces all of them (its reason and author travel with it).
 * `rules` are the item's rules: those of other levels are ignored here.
 */
export function resolvePrice(input: {
  item: PricedItem
  qty: number
  level: PriceLevelTerms | null
  rules: readonly PriceRule[]
  override?: PriceOverride | null
}): ResolvedPrice {
  const { item, level, override } = input
  const sold = sellingQty(input.qty, item)
  const candidates: Candidate[] = [
    { perUnit: new MoneyDecimal(item.listPrice), unitPrice: roundMoney(item.listPrice), packPrice: null, specificity: 0, explanation: { source: 'list', listPrice: item.listPrice } },
  ]
  if (level?.percentOff) {
    const unitPrice = percentOffPrice(item.listPrice, level.percentOff)
    candidates.push({
      perUnit: new MoneyDecimal(unitPrice),
      unitPrice,
      packPrice: null,
      specificity: 1,
      explanation: { source: 'level', listPrice: item.listPrice, levelCode: level.code, percentOff: level.percentOff },
    })
  }
  // Per owner (the level, or every account) the rule of the highest quantity reached applies.
  for (const owner of [level?.id ?? undefined, null]) {
    if (owner === undefined) continue
    const reached = input.rules
      .filter((r) => r.levelId === owner && r.minQty <= sold.qty && (r.basis === 'unit' || (item.sellByPack && item.packSize > 1)))
      .sort((a, b) => b.minQty - a.minQty)
    if (reached.length) candidates.push(ruleCandidate(reached[0], item, level))
  }
  const best = candidates.reduce((a, b) => {
    const cmp = b.perUnit.comparedTo(a.perUnit)
    return cmp < 0 || (cmp === 0 && b.specificity > a.specificity) ? b : a
  })

  if (override) {
    const unitPrice = roundMoney(override.unitPrice)
    const packPrice = sold.packs !== null ? new MoneyDecimal(unitPrice).times(item.packSize).toFixed(2) : null
    return {
      ...sold,
      packSize: item.packSize,
      unitPrice,
      packPrice,
      extension: new MoneyDecimal(unitPrice).times(sold.qty).toFixed(2),
      explanation: { source: 'override', listPrice: item.listPrice, overrideReason: override.reason, overrideBy: override.by },
    }
  }
  const packPrice = sold.packs !== null ? (best.packPrice ?? new MoneyDecimal(best.unitPrice).times(item.packSize).toFixed(2)) : null
  const extension = packPrice !== null && sold.packs !== null
    ? new MoneyDecimal(packPrice).times(sold.packs).toFixed(2)
    : new MoneyDecimal(best.unitPrice).times(sold.qty).toFixed(2)
  return { ...sold, packSize: item.packSize, unitPrice: best.unitPrice, packPrice, extension, explanation: best.explanation }
}
