// Money as decimal strings (shared/money.ts).
import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import {
  addMoney, compareMoney, formatMoney, fromCents, isMoney, MoneyFormatError, multiplyMoney, parseMoney,
  roundMoney, subtractMoney, toCents,
} from '../../shared/money.js'

// Independent reference for the properties: integer cents in BigInt, no decimal library involved.
const centsText = (c: bigint): string => {
  const neg = c < 0n
  const abs = neg ? -c : c
  return `${neg ? '-' : ''}${abs / 100n}.${(abs % 100n).toString().padStart(2, '0')}`
}
const centsArb = fc.bigInt({ min: -(10n ** 15n), max: 10n ** 15n })

describe('parseMoney', () => {
  it('normalises to two places', () => {
    expect(parseMoney('12.3')).toBe('12.30')
    expect(parseMoney(' 7 ')).toBe('7.00')
    expect(parseMoney('-0.5')).toBe('-0.50')
    expect(parseMoney('-0')).toBe('0.00')
    expect(parseMoney('1.2345', 4)).toBe('1.2345')
  })

  it('rejects floats in disguise and display formats', () => {
    for (const bad of ['1e3', '12.345', '$12', '1,200.00', '+5', '.5', '5.', 'NaN', '', 'abc']) {
      expect(() => parseMoney(bad), bad).toThrow(MoneyFormatError)
    }
    expect(isMoney('12.345')).toBe(false)
    expect(isMoney('12.345', 3)).toBe(true)
    expect(isMoney(12.34)).toBe(false)
  })
})

describe('arithmetic', () => {
  it('adds without float error', () => {
    // source: IEEE 754 binary64 (common knowledge): 0.1 + 0.2 evaluates to 0.30000000000000004 as a float
    expect(0.1 + 0.2).not.toBe(0.3)
    expect(addMoney('0.10', '0.20')).toBe('0.30')
    expect(addMoney('19.99', '0.01', '-5.00')).toBe('15.00')
    expect(addMoney()).toBe('0.00')
  })

  it('multiplies by integer quantities only', () => {
    expect(multiplyMoney('11.3333', 550)).toBe('6233.315') // hand-worked: 11.3333 × 550 = 6,233.315
    expect(multiplyMoney('0.07', 3)).toBe('0.21')
    expect(() => multiplyMoney('1.00', 1.5)).toThrow(RangeError)
  })

  it('subtracts and compares', () => {
    expect(subtractMoney('10.00', '0.01')).toBe('9.99')
    expect(compareMoney('2.50', '2.5')).toBe(0)
    expect(compareMoney('-1.00', '0.00')).toBe(-1)
    expect(compareMoney('100.00', '99.99')).toBe(1)
  })

  it('sums like integer cents (property)', () => {
    fc.assert(fc.property(fc.array(centsArb, { maxLength: 20 }), (cs) => {
      expect(addMoney(...cs.map(centsText))).toBe(centsText(cs.reduce((a, b) => a + b, 0n)))
    }))
  })

  it('multiplies like integer cents (property)', () => {
    fc.assert(fc.property(centsArb, fc.integer({ min: -100000, max: 100000 }), (c, q) => {
      expect(multiplyMoney(centsText(c), q)).toBe(centsText(c * BigInt(q)))
    }))
  })
})

describe('roundMoney', () => {
  it('rounds half-up, half away from zero', () => {
    // source: common practice (commercial rounding); 1.005 is the classic float trap: (1.005).toFixed(2) gives '1.00'
    expect((1.005).toFixed(2)).toBe('1.00')
    expect(roundMoney('1.005')).toBe('1.01')
    expect(roundMoney('1.0049')).toBe('1.00')
    expect(roundMoney('-1.005')).toBe('-1.01')
    expect(roundMoney('-0.004')).toBe('0.00')
    expect(roundMoney('12.81555', 4)).toBe('12.8156')
  })

  it('agrees with integer rounding of mills (property)', () => {
    // reference: round half away from zero on integer thousandths, by hand in BigInt
    fc.assert(fc.property(fc.bigInt({ min: -(10n ** 12n), max: 10n ** 12n }), (mills) => {
      const neg = mills < 0n
      const abs = neg ? -mills : mills
      const cents = (abs + 5n) / 10n
      const text = `${neg ? '-' : ''}${abs / 1000n}.${(abs % 1000n).toString().padStart(3, '0')}`
      expect(roundMoney(text)).toBe(centsText(neg ? -cents : cents))
    }))
  })
})

describe('cents and formatting', () => {
  it('converts to and from integer cents', () => {
    expect(toCents('12.34')).toBe(1234n)
    expect(toCents('0.005')).toBe(1n)
    expect(fromCents(1234n)).toBe('12.34')
    expect(fromCents(-5)).toBe('-0.05')
    fc.assert(fc.property(centsArb, (c) => { expect(toCents(fromCents(c))).toBe(c) }))
  })

  it('formats for display', () => {
    expect(formatMoney('1234.5')).toBe('$1,234.50')
    expect(formatMoney('-1234567.891')).toBe('-$1,234,567.89')
    expect(formatMoney('0.999')).toBe('$1.00')
    expect(formatMoney('999.99')).toBe('$999.99')
    expect(formatMoney('1234.5', { symbol: '€ ', groupSeparator: '.', decimalSeparator: ',' })).toBe('€ 1.234,50')
  })
})
