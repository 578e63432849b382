// Card providers count money in the currency's smallest unit as a whole number (cents for USD). Lumenyard
// keeps decimal text; these convert exactly, never through a float.
import { MoneyDecimal, type Money } from '../money.js'

/** Decimal places of a currency's minor unit (ISO 4217); two unless listed. */
const MINOR_DIGITS: Record<string, number> = { jpy: 0, krw: 0, clp: 0, bhd: 3, kwd: 3, jod: 3, omr: 3, tnd: 3 }

export function minorDigits(currency: string): number {
  return MINOR_DIGITS[currency.toLowerCase()] ?? 2
}

/** '123.45' USD → 12345. Refuses an amount with more places than the currency has. */
export function toMinorUnits(amount: Money, currency: string): number {
  const digits = minorDigits(currency)
  const scaled = new MoneyDecimal(amount).times(new MoneyDecimal(10).pow(digits))
  if (!scaled.isInteger()) throw new RangeError(`${amount} has more than ${digits} decimal places for ${currency}`)
  if (scaled.abs().greaterThan(Number.MAX_SAFE_INTEGER)) throw new RangeError(`${amount} is too large`)
  return scaled.toNumber()
}

/** 12345 USD → '123.45'. */
export function fromMinorUnits(minor: number, currency: string): Money {
  if (!Number.isSafeInteger(minor)) throw new RangeError(`${minor} is not a whole number of minor units`)
  const digits = minorDigits(currency)
  return new MoneyDecimal(minor).dividedBy(new MoneyDecimal(10).pow(digits)).toFixed(Math.max(digits, 2))
}
