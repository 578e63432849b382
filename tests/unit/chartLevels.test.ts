// The reorder chart's value axis shows its reorder point and safety stock lines even when the projected
// position never reaches them (common practice: a level drawn off the axis reads as "not there").
import { describe, expect, it } from 'vitest'
import { levelsInView } from '../../shared/inventory/stockProjection.js'

describe('chart levels in view', () => {
  it('stretches the axis up to a reorder point above every position', () => {
    // positions 20…60, reorder point 140: top 140 + 8 % of 140 = 151.2 (hand computed)
    expect(levelsInView({ min: 20, max: 60 }, [140, 35])).toEqual({ min: 0, max: 151.2 })
  })

  it('reaches below zero when the position runs negative, and keeps data already wider than the levels', () => {
    // −30…200 with levels 50 and 10: span 230, pad 18.4 → −48.4 … 218.4 (hand computed)
    const axis = levelsInView({ min: -30, max: 200 }, [50, 10])
    expect(axis.min).toBeCloseTo(-48.4, 10)
    expect(axis.max).toBeCloseTo(218.4, 10)
  })
})
