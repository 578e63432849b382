// What an adjustment or a bin move will do, checked before it is confirmed
// (shared/inventory/stockChangePreview.ts over shared/inventory/balanceAfter.ts, the rule the stock
// engine applies). source: APICS Dictionary, "available inventory": on hand minus allocations (units
// held for orders) — from memory; on hand never below zero — common practice. Figures worked by hand.
import { describe, expect, it } from 'vitest'
import { balanceAfter } from '../../shared/inventory/balanceAfter.js'
import { previewAdjustment, previewBinMove } from '../../shared/inventory/stockChangePreview.js'

const bin = { onHand: 85, reserved: 20 }
const adjust = (delta: unknown, reason = 'damaged') => previewAdjustment({ itemId: 3, binId: 7, lotId: null, delta, reason, note: null }, bin)
const move = (qty: unknown, toBinId = 8) => previewBinMove({ itemId: 3, lotId: null, fromBinId: 7, toBinId, qty, note: null }, bin, { onHand: 4, reserved: 0 })

describe('the balance rule', () => {
  it('takes units out down to what is held for pick lists, not below', () => {
    expect(balanceAfter(bin, -65)).toEqual({ ok: true, onHand: 20, reserved: 20 }) // 85 − 65 = 20 = held
    expect(balanceAfter(bin, -66)).toMatchObject({ ok: false, problem: 'not_enough_available', available: 65, wanted: 66 })
    expect(balanceAfter(bin, -86)).toMatchObject({ ok: false, problem: 'not_enough_on_hand', onHand: 85, wanted: 86 })
  })
  it('lets a pick consume its own reservation', () => {
    expect(balanceAfter(bin, -20, 20)).toEqual({ ok: true, onHand: 65, reserved: 0 })
  })
})

describe('an adjustment', () => {
  it('refuses taking out more than the bin holds, before any confirmation (85 on hand, 99 999 damaged)', () => {
    expect(adjust(-99_999)).toEqual({ ok: false, issues: [{ field: 'delta', code: 'not_enough_on_hand', params: { onHand: 85, reserved: 20, available: 65, wanted: 99_999 } }] })
  })
  it('refuses touching the units held for pick lists', () => {
    expect(adjust(-70)).toMatchObject({ ok: false, issues: [{ field: 'delta', code: 'not_enough_available', params: { available: 65, wanted: 70 } }] })
  })
  it('gives the before and after it will ask the server for', () => {
    expect(adjust(-3)).toMatchObject({ ok: true, input: { delta: -3, reason: 'damaged' }, bin: { before: 85, after: 82 } })
    expect(adjust(12, 'found')).toMatchObject({ ok: true, bin: { before: 85, after: 97 } })
  })
  it('words what the schema refuses as codes, one per field', () => {
    expect(adjust(2.5)).toEqual({ ok: false, issues: [{ field: 'delta', code: 'whole_units' }] })
    expect(adjust(4)).toEqual({ ok: false, issues: [{ field: 'delta', code: 'removal_takes' }] })
    expect(adjust(-4, 'found')).toEqual({ ok: false, issues: [{ field: 'delta', code: 'found_adds' }] })
    expect(adjust(0, 'counted')).toEqual({ ok: false, issues: [{ field: 'delta', code: 'no_change' }] })
    expect(previewAdjustment({ delta: null }, bin)).toEqual({
      ok: false, issues: [{ field: 'itemId', code: 'choose' }, { field: 'binId', code: 'choose' }, { field: 'delta', code: 'qty_needed' }, { field: 'reason', code: 'choose_reason' }],
    })
  })
})

describe('a move between bins', () => {
  it('moves only the free units of the bin it leaves', () => {
    expect(move(65)).toMatchObject({ ok: true, from: { before: 85, after: 20 }, to: { before: 4, after: 69 } })
    expect(move(66)).toMatchObject({ ok: false, issues: [{ field: 'qty', code: 'not_enough_available' }] })
  })
  it('refuses no quantity, a fraction and the same bin', () => {
    expect(move(0)).toEqual({ ok: false, issues: [{ field: 'qty', code: 'more_than_zero' }] })
    expect(move(1.5)).toEqual({ ok: false, issues: [{ field: 'qty', code: 'whole_units' }] })
    expect(move(null)).toEqual({ ok: false, issues: [{ field: 'qty', code: 'qty_needed' }] })
    expect(move(5, 7)).toEqual({ ok: false, issues: [{ field: 'toBinId', code: 'same_bin' }] })
  })
})
