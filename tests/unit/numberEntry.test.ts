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

  it('reads what the screens write back as written, and asks about Spanish text that reads two ways', () => {
    // source: CLDR number symbols through Intl.NumberFormat#formatToParts (ICU): es-US, the Spanish screens' locale,
    // and en-US write a decimal point and comma groups; Spanish as written in Spain (es) a decimal comma and point groups
    const symbols = (locale: string) => {
      const parts = new Intl.NumberFormat(locale).formatToParts(12345.5)
      return { decimal: parts.find((p) => p.type === 'decimal')?.value, group: parts.find((p) => p.type === 'group')?.value }
    }
    expect(symbols('es-US')).toEqual({ decimal: '.', group: ',' })
    expect(symbols('en-US')).toEqual({ decimal: '.', group: ',' })
    expect(symbols('es')).toEqual({ decimal: ',', group: '.' })
    // What a Spanish screen writes (grouped in a table, ungrouped in the field) reads back unchanged in Spanish.
    for (const value of [1.5, 12.25, 0.125, 1234.5, 1_234_567, 2.125]) {
      for (const useGrouping of [true, false]) {
        const written = new Intl.NumberFormat('es-US', { useGrouping, maximumFractionDigits: 4 }).format(value)
        expect(readNumber(written, { places: 4 }, 'comma'), written).toEqual({ ok: true, value })
      }
    }
    // 1,500 is 1500 in es-US writing and one and a half with the decimal comma of es: asked, with both readings.
    const twoWays = (input: string, thousands: string, decimal: string) => ({ ok: false, problem: { code: 'number_two_ways', params: { input, thousands, decimal } } })
    expect(readNumber('1,500', { places: 2 }, 'comma')).toEqual(twoWays('1,500', '1500', '1.5'))
    expect(readNumber('1,500', qty, 'comma')).toEqual(twoWays('1,500', '1500', '1.5'))
    expect(readNumber('12,000', qty, 'comma')).toEqual(twoWays('12,000', '12000', '12'))
    expect(readNumber('-2,750', { min: -10_000, places: 2 }, 'comma')).toEqual(twoWays('-2,750', '-2750', '-2.75'))
    // 1.500 is one and a half as the screens write it, 1500 with the point groups of es: asked where the field takes
    // fewer than three decimals (the field itself never writes it there); read as written where it takes three.
    expect(readNumber('1.500', qty, 'comma')).toEqual(twoWays('1.500', '1500', '1.5'))
    expect(readNumber('1.500', { places: 2 }, 'comma')).toEqual(twoWays('1.500', '1500', '1.5'))
    expect(readNumber('1.500', { places: 3 }, 'comma')).toEqual({ ok: true, value: 1.5 })
    // Text that reads one way only is read in Spanish too: the decimal comma where no group fits, mixed marks.
    expect(readNumber('1,5', { places: 2 }, 'comma')).toEqual({ ok: true, value: 1.5 })
    expect(readNumber('0,125', { places: 3 }, 'comma')).toEqual({ ok: true, value: 0.125 })
    expect(readNumber('1,500.25', { places: 2 }, 'comma')).toEqual({ ok: true, value: 1500.25 })
    expect(readNumber('1.500,25', { places: 2 }, 'comma')).toEqual({ ok: true, value: 1500.25 })
    expect(readNumber('1,500,000', { min: 1 }, 'comma')).toEqual({ ok: true, value: 1_500_000 })
    // source: CLDR en: a comma only between groups of three, a point before decimals; English reads each one way
    expect(readNumber('1,500', qty, 'point')).toEqual({ ok: true, value: 1500 })
    expect(readNumber('1.500', { places: 3 }, 'point')).toEqual({ ok: true, value: 1.5 })
    expect(readNumber('0,500', qty, 'point')).toEqual({ ok: false, problem: { code: 'number_unreadable', params: { input: '0,500' } } })
  })

  it('knows which mark each language writes', () => {
    // source: CLDR: Spanish writes 1,5; English writes 1.5 (checked against Intl's own writing)
    expect(new Intl.NumberFormat('es-ES').format(1.5)).toBe('1,5')
    expect(decimalMarkOf('es')).toBe('comma')
    expect(decimalMarkOf('en')).toBe('point')
  })
})
