// What a pick line weighs and how it should be handled: the sheet and the handheld show these
// cautions, and defer to the yard's own lifting practice and local rules.
import { Decimal } from 'decimal.js'
import { toPacks, type PackBreakdown } from '../inventory/packs.js'

/**
 * One person's lift limit: the load constant of the NIOSH Revised Lifting Equation, 23 kg (51 lb),
 * the most an ideal lift allows. Heavier single lifts call for two people or a lifting aid.
 */
export const ONE_PERSON_LIFT_KG = 23

export type HandlingCaution = 'team_lift' | 'use_cart' | 'pallet_equipment' | 'glass_edges'

export interface HandlingInput {
  qty: number
  /** Per stock unit, a decimal string as MariaDB returns it. */
  weightKg: string
  caseQty: number | null
  palletQty: number | null
  family: string
}

export interface Handling {
  packs: PackBreakdown
  /** Whole line, kg, 1 decimal. */
  totalKg: string
  /** The heaviest single thing lifted by hand (a case when the line holds cases, else one unit), kg, 1 decimal. */
  heaviestLiftKg: string
  cautions: HandlingCaution[]
}

const packSizes = (i: HandlingInput) => ({ case: i.caseQty ?? undefined, pallet: i.palletQty ?? undefined })

export function lineHandling(input: HandlingInput): Handling {
  const packs = toPacks(input.qty, packSizes(input))
  const unit = new Decimal(input.weightKg || '0')
  const total = unit.times(input.qty)
  const handledCase = packs.cases > 0 || (packs.pallets > 0 && (input.caseQty ?? 0) > 1)
  const heaviest = handledCase ? unit.times(input.caseQty ?? 1) : input.qty > 0 ? unit : new Decimal(0)
  const cautions: HandlingCaution[] = []
  if (packs.pallets > 0) cautions.push('pallet_equipment')
  if (heaviest.greaterThan(ONE_PERSON_LIFT_KG)) cautions.push('team_lift')
  // Many trips of lighter units: a cart or dolly instead of carrying.
  else if (total.greaterThan(ONE_PERSON_LIFT_KG) && packs.pallets === 0) cautions.push('use_cart')
  if (input.family === 'glass_block' && input.qty > 0) cautions.push('glass_edges')
  return { packs, totalKg: total.toFixed(1), heaviestLiftKg: heaviest.toFixed(1), cautions }
}
