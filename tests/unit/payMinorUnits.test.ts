// Amounts handed to the card provider are whole numbers of the currency's minor unit; Lumenyard keeps
// decimal text. The digits per currency are ISO 4217's.
import { describe, expect, it } from 'vitest'
import { fromMinorUnits, minorDigits, toMinorUnits } from '../../shared/payments/minorUnits.js'

describe('minor units', () => {
  it('uses the minor-unit digits of ISO 4217', () => {
    // source: ISO 4217 currency code list, column "minor unit": USD 2, EUR 2, JPY 0, KWD 3
    expect(minorDigits('usd')).toBe(2)
    expect(minorDigits('EUR')).toBe(2)
    expect(minorDigits('jpy')).toBe(0)
    expect(minorDigits('kwd')).toBe(3)
  })

  it('converts decimal text to cents and back exactly', () => {
    // source: ISO 4217 (USD has 2 minor digits): $123.45 = 12345 cents, $0.10 = 10 cents
    expect(toMinorUnits('123.45', 'usd')).toBe(12345)
    expect(toMinorUnits('0.1', 'usd')).toBe(10)
    // 0.1 + 0.2 in binary floating point is 0.30000000000000004 (IEEE 754, from memory): the decimal path stays exact
    expect(toMinorUnits('0.30', 'usd')).toBe(30)
    expect(toMinorUnits('1.005', 'kwd')).toBe(1005) // source: ISO 4217, KWD 3 minor digits
    expect(fromMinorUnits(12345, 'usd')).toBe('123.45')
    expect(fromMinorUnits(7, 'usd')).toBe('0.07')
    expect(fromMinorUnits(500, 'jpy')).toBe('500.00') // source: ISO 4217, JPY 0 minor digits
  })

  it('refuses a fraction of a cent and a non-integer count', () => {
    expect(() => toMinorUnits('10.005', 'usd')).toThrow(RangeError)
    expect(() => toMinorUnits('1.5', 'jpy')).toThrow(RangeError)
    expect(() => fromMinorUnits(1.5, 'usd')).toThrow(RangeError)
  })
})
