// Pack conversions: cases and pallets are integer multiples of the stock unit.

export interface PackSizes {
  /** Stock units per case; absent or 1 when the item has no case. */
  case?: number
  /** Stock units per pallet (not cases per pallet). */
  pallet?: number
}

export interface PackBreakdown {
  pallets: number
  cases: number
  each: number
}

function checkNonNegativeInteger(name: string, value: number): void {
  if (!Number.isSafeInteger(value) || value < 0) throw new RangeError(`${name} must be a non-negative integer, got ${value}`)
}

function checkPackSize(name: string, value: number | undefined): number {
  if (value === undefined) return 0
  if (!Number.isSafeInteger(value) || value < 1) throw new RangeError(`${name} must be a positive integer, got ${value}`)
  return value
}

/**
 * Whole pallets first, then whole cases, then loose units: 1,000 at 40/case, 960/pallet → 1 pallet, 1 case, 0 each.
 * A pack size of 1 (or none) is not a pack, so it yields 0 of that pack.
 */
export function toPacks(qty: number, packs: PackSizes): PackBreakdown {
  checkNonNegativeInteger('quantity', qty)
  const pallet = checkPackSize('pallet size', packs.pallet)
  const caseSize = checkPackSize('case size', packs.case)
  let rest = qty
  const pallets = pallet > 1 ? Math.floor(rest / pallet) : 0
  rest -= pallets * pallet
  const cases = caseSize > 1 ? Math.floor(rest / caseSize) : 0
  rest -= cases * caseSize
  return { pallets, cases, each: rest }
}

/** Stock units in a breakdown: the inverse of toPacks. */
export function fromPacks(breakdown: PackBreakdown, packs: PackSizes): number {
  const pallet = checkPackSize('pallet size', packs.pallet)
  const caseSize = checkPackSize('case size', packs.case)
  for (const [name, value] of Object.entries(breakdown)) checkNonNegativeInteger(name, value)
  if (breakdown.pallets > 0 && pallet === 0) throw new RangeError('pallets given but the item has no pallet size')
  if (breakdown.cases > 0 && caseSize === 0) throw new RangeError('cases given but the item has no case size')
  return breakdown.pallets * pallet + breakdown.cases * caseSize + breakdown.each
}

/** Smallest multiple of packSize that is ≥ qty (0 stays 0). */
export function roundUpToPack(qty: number, packSize: number): number {
  checkNonNegativeInteger('quantity', qty)
  checkPackSize('pack size', packSize)
  return Math.ceil(qty / packSize) * packSize
}

/** True when a pallet holds a whole number of cases, which label printing and picking assume. */
export function palletHoldsWholeCases(packs: PackSizes): boolean {
  const pallet = checkPackSize('pallet size', packs.pallet)
  const caseSize = checkPackSize('case size', packs.case)
  return pallet === 0 || caseSize === 0 || pallet % caseSize === 0
}
