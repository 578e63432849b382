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

/** Words a quantity cell may use for packs, in English and Spanish, singular and plural. */
const PACK_WORDS: Record<string, 'case' | 'pallet' | 'each'> = {
  case: 'case', cases: 'case', cs: 'case', caja: 'case', cajas: 'case',
  pallet: 'pallet', pallets: 'pallet', plt: 'pallet', palé: 'pallet', palés: 'pallet', pale: 'pallet', pales: 'pallet', tarima: 'pallet', tarimas: 'pallet',
  each: 'each', ea: 'each', unit: 'each', units: 'each', pc: 'each', pcs: 'each', unidad: 'each', unidades: 'each', u: 'each',
}

export type PackQuantity =
  | { ok: true; qty: number }
  | { ok: false; problem: 'whole_number' | 'not_negative' | 'unknown_pack' | 'no_case_size' | 'no_pallet_size' | 'invalid_format'; word?: string }

/**
 * A quantity as people write it in a stock sheet, in stock units: "240", "3 cases", "2 pallets 5 cases 12"
 * or "1 palé + 3 cajas". Each part is a whole number, optionally followed by a pack word; a pack needs its
 * size on the item. Fractions and negatives are refused (stock is counted in whole stock units).
 */
export function parsePackQuantity(text: string, packs: PackSizes): PackQuantity {
  const parts = text.trim().toLowerCase().replace(/\+/g, ' ').split(/\s+/).filter(Boolean)
  if (!parts.length) return { ok: false, problem: 'invalid_format' }
  let qty = 0
  for (let i = 0; i < parts.length; i++) {
    const n = parts[i]
    if (/^-/.test(n)) return { ok: false, problem: 'not_negative' }
    if (/^\d+[.,]\d+$/.test(n)) return { ok: false, problem: 'whole_number' }
    if (!/^\d+$/.test(n)) return { ok: false, problem: 'invalid_format' }
    const next = parts[i + 1]
    const word = next !== undefined && !/^[-\d]/.test(next) ? next : null
    let size = 1
    if (word !== null) {
      i++
      const kind = PACK_WORDS[word]
      if (!kind) return { ok: false, problem: 'unknown_pack', word }
      if (kind === 'case') size = packs.case && packs.case > 1 ? packs.case : 0
      if (kind === 'pallet') size = packs.pallet && packs.pallet > 1 ? packs.pallet : 0
      if (size === 0) return { ok: false, problem: kind === 'case' ? 'no_case_size' : 'no_pallet_size' }
    }
    qty += Number(n) * size
  }
  return Number.isSafeInteger(qty) ? { ok: true, qty } : { ok: false, problem: 'invalid_format' }
}
