// Feature: a number typed into a form (shared/numberEntry.ts): read as written, refused with a reason, never
// clamped or rounded.
import { describe, expect, it } from 'vitest'
import { decimalMarkOf, readNumber } from '../../shared/numberEntry.js'

const qty = { min: 1, max: 1_000_000 }

describe('reading a typed number', () => {
  it('reads plain, grouped and signed numbers as written', () => {
    // source: CLDR number symbols for English (decimal ".", group ",", groups of three), as ICU writes them
    expect(readNumber('12', qty)).toEqual({ ok: true, value: 12 })
    expect(readNumber(' 1,250 ', qty)).toEqual({ ok: true, value: 1250 })
    expect(readNumber('12.5', { places: 2 })).toEqual({ ok: true, value: 12.5 })
    expect(readNumber('-3', { min: -10 })).toEqual({ ok: true, value: -3 })
    // source: Intl.NumberFormat (ICU, CLDR) writes these; what the screens print must read back unchanged
    for (const value of [0, 7, 1234, 999_999, 12.25]) {
      const en = new Intl.NumberFormat('en-US').format(value)
      const es = new Intl.NumberFormat('es-ES', { useGrouping: false }).format(value)
      expect(readNumber(en, { places: 2 }, 'point')).toEqual({ ok: true, value })
      expect(readNumber(es, { places: 2 }, 'comma')).toEqual({ ok: true, value })
    }
  })

  it('refuses what the trials type into a quantity, each with its own problem', () => {
    // source: common practice (a count of stock is a whole number from 1; nothing is clamped to fit)
    expect(readNumber('0', qty)).toEqual({ ok: false, problem: { code: 'at_least', params: { min: 1 } } })
    expect(readNumber('-3', qty)).toEqual({ ok: false, problem: { code: 'at_least', params: { min: 1 } } })
    expect(readNumber('1000000000', qty)).toEqual({ ok: false, problem: { code: 'at_most', params: { max: 1_000_000 } } })
    expect(readNumber('1e9', qty)).toEqual({ ok: false, problem: { code: 'number_unreadable', params: { input: '1e9' } } })
    expect(readNumber('1,5', qty, 'point')).toEqual({ ok: false, problem: { code: 'number_unreadable', params: { input: '1,5' } } })
    expect(readNumber('1,5', qty, 'comma')).toEqual({ ok: false, problem: { code: 'whole_number' } })
    expect(readNumber('7 3/4', qty)).toEqual({ ok: false, problem: { code: 'whole_number' } })
    expect(readNumber('', qty)).toEqual({ ok: false, problem: { code: 'required' } })
    expect(readNumber('   ', qty)).toEqual({ ok: false, problem: { code: 'required' } })
    expect(readNumber('12 boxes', qty)).toEqual({ ok: false, problem: { code: 'number_unreadable', params: { input: '12 boxes' } } })
    expect(readNumber('3/0', { places: 2 })).toEqual({ ok: false, problem: { code: 'number_unreadable', params: { input: '3/0' } } })
  })

  it('reads the decimal comma in Spanish and fractions where decimals are allowed', () => {
    // source: CLDR number symbols for Spanish (decimal ","; group "."), e.g. 1.234,5
    expect(readNumber('1,5', { places: 2 }, 'comma')).toEqual({ ok: true, value: 1.5 })
    expect(readNumber('1.234,5', { places: 2 }, 'comma')).toEqual({ ok: true, value: 1234.5 })
    // source: arithmetic: 7 3/4 = 7.75, 1/8 = 0.125
    expect(readNumber('7 3/4', { places: 2 })).toEqual({ ok: true, value: 7.75 })
    expect(readNumber('1/8', { places: 3 })).toEqual({ ok: true, value: 0.125 })
    expect(readNumber('2.125', { places: 2 })).toEqual({ ok: false, problem: { code: 'decimal_places', params: { places: 2 } } })
    expect(readNumber('', { optional: true })).toEqual({ ok: true, value: undefined })
  })

  it('knows which mark each language writes', () => {
    // source: CLDR: Spanish writes 1,5; English writes 1.5 (checked against Intl's own writing)
    expect(new Intl.NumberFormat('es-ES').format(1.5)).toBe('1,5')
    expect(decimalMarkOf('es')).toBe('comma')
    expect(decimalMarkOf('en')).toBe('point')
  })
})
