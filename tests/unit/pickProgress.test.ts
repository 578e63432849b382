// Pick list progress (shared/picking/pickProgress.ts). Counting pick lines and units per unit of
// measure, a short line counting as short rather than done: common practice in warehouse picking
// (a line fill rate counts lines shipped complete; units are only summed within one unit of measure).
// Expected figures worked by hand below.
import { describe, expect, it } from 'vitest'
import { lineProgress, pickProgress } from '../../shared/picking/pickProgress.js'

const block = { qty: 16, confirmedQty: 16, shortQty: 0, stockUnit: 'each' }
const strip = { qty: 24, confirmedQty: 7, shortQty: 17, stockUnit: 'foot' } // 7 ft found, 17 ft short
const sealant = { qty: 3, confirmedQty: 1, shortQty: 0, stockUnit: 'tube' }
const spacer = { qty: 100, confirmedQty: 0, shortQty: 0, stockUnit: 'each' }

describe('one line', () => {
  it('is short, not done, when it closed with units missing', () => {
    expect(lineProgress(strip)).toBe('short')
    expect(lineProgress({ ...strip, confirmedQty: 0, shortQty: 24 })).toBe('short')
  })
  it('stays short until every missing unit is settled, then reads resolved (never done)', () => {
    // hand-worked: 17 ft short; 10 ft backordered leaves 7 ft open; 17 settled leaves none
    expect(lineProgress({ ...strip, shortResolvedQty: 10 })).toBe('short')
    expect(lineProgress({ ...strip, shortResolvedQty: 17 })).toBe('resolved')
  })
  it('is open again when a recount puts the short units back on the line', () => {
    // hand-worked: 7 ft confirmed, the 17 ft found on a recount: 17 ft left to pick
    expect(lineProgress({ ...strip, shortQty: 0 })).toBe('partial')
  })
  it('is done only when every unit is confirmed', () => {
    expect(lineProgress(block)).toBe('done')
    expect(lineProgress(sealant)).toBe('partial')
    expect(lineProgress(spacer)).toBe('open')
  })
})

describe('a whole list', () => {
  it('counts lines done, short and left, and units per stock unit', () => {
    const p = pickProgress([block, strip, sealant, spacer])
    // hand-worked: 1 done (block), 1 short (strip), 2 left (sealant partly, spacer not at all)
    expect(p.lines).toEqual({ total: 4, done: 1, short: 1, resolved: 0, left: 2 })
    // hand-worked: each = 16 + 100 = 116, confirmed 16, left 100; foot 24, 7 confirmed, 17 short; tube 3, 1 confirmed, 2 left
    expect(p.units).toEqual([
      { unit: 'each', qty: 116, confirmed: 16, short: 0, resolved: 0, left: 100 },
      { unit: 'foot', qty: 24, confirmed: 7, short: 17, resolved: 0, left: 0 },
      { unit: 'tube', qty: 3, confirmed: 1, short: 0, resolved: 0, left: 2 },
    ])
  })
  it('counts settled short units apart from open ones, per unit', () => {
    const p = pickProgress([block, { ...strip, shortResolvedQty: 10 }, { ...strip, shortResolvedQty: 17 }])
    // hand-worked: block done; first strip 7 ft still open short; second fully settled
    expect(p.lines).toEqual({ total: 3, done: 1, short: 1, resolved: 1, left: 0 })
    expect(p.units[1]).toEqual({ unit: 'foot', qty: 48, confirmed: 14, short: 7, resolved: 27, left: 0 })
  })
  it('does not call a list with a short line finished', () => {
    const p = pickProgress([block, strip])
    expect(p.lines.done).toBeLessThan(p.lines.total)
    expect(p.lines.left).toBe(0)
  })
})
