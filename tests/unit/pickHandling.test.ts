// Handling cautions on pick lines (shared/picking/handling.ts).
// source: NIOSH Revised Lifting Equation (Waters, Putz-Anderson, Garg, Fine, 1993), load constant 23 kg / 51 lb:
// the most one person should lift under ideal conditions (from memory). Weights below are invented demo values.
import { describe, expect, it } from 'vitest'
import { lineHandling, ONE_PERSON_LIFT_KG } from '../../shared/picking/handling.js'

const block = { weightKg: '2.950', caseQty: 8, palletQty: 320, family: 'glass_block' }

describe('lineHandling', () => {
  it('uses the 23 kg one-person limit', () => {
    expect(ONE_PERSON_LIFT_KG).toBe(23)
  })

  it('flags a two-person lift when one case is over the limit: 8 × 2.95 kg = 23.6 kg', () => {
    const h = lineHandling({ ...block, qty: 16 })
    expect(h).toMatchObject({ totalKg: '47.2', heaviestLiftKg: '23.6', packs: { pallets: 0, cases: 2, each: 0 } })
    expect(h.cautions).toEqual(['team_lift', 'glass_edges'])
  })

  it('asks for a cart when single units are light but the line is heavy: 10 × 2.95 kg loose', () => {
    const h = lineHandling({ ...block, caseQty: null, palletQty: null, qty: 10 })
    expect(h).toMatchObject({ totalKg: '29.5', heaviestLiftKg: '3.0' })
    expect(h.cautions).toEqual(['use_cart', 'glass_edges'])
  })

  it('is not over the limit at exactly 23 kg, and light lines get no lifting caution', () => {
    expect(lineHandling({ weightKg: '2.875', caseQty: 8, palletQty: null, family: 'glass_block', qty: 8 }).cautions).toEqual(['glass_edges'])
    expect(lineHandling({ weightKg: '0.010', caseQty: 100, palletQty: null, family: 'spacer', qty: 120 }).cautions).toEqual([])
  })

  it('sends whole pallets to equipment: 330 = 1 pallet + 1 case + 2 loose', () => {
    const h = lineHandling({ ...block, qty: 330 })
    expect(h.packs).toEqual({ pallets: 1, cases: 1, each: 2 })
    expect(h.cautions).toEqual(['pallet_equipment', 'team_lift', 'glass_edges'])
    expect(h.totalKg).toBe('973.5')
  })

  it('says nothing for an empty line', () => {
    expect(lineHandling({ ...block, qty: 0 })).toMatchObject({ totalKg: '0.0', heaviestLiftKg: '0.0', cautions: [] })
  })
})
