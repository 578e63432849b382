// Money as decimal strings ('12.34'), computed with decimal.js so no amount ever passes through a float.
import { Decimal } from 'decimal.js'

/**
 * A private Decimal constructor: 40 significant digits so sums of large ledgers never round,
 * half-up rounding for cents. Cloned so other code's Decimal settings cannot change ours.
 */
export const MoneyDecimal = Decimal.clone({ precision: 40, rounding: Decimal.ROUND_HALF_UP })
export type MoneyDecimalValue = InstanceType<typeof MoneyDecimal>

/** A validated decimal string such as '12.34' or '-0.50'. */
export type Money = string

export class MoneyFormatError extends Error {
  constructor(readonly input: unknown, detail: string) {
    super(`Not a money amount: ${JSON.stringify(input)} (${detail})`)
    this.name = 'MoneyFormatError'
  }
}

// Plain decimal notation only: no exponent, grouping, currency sign or '+' — those belong to display, not data.
const MONEY_TEXT = /^-?(\d+)(?:\.(\d+))?$/

/** True when `text` is a plain decimal with at most `maxDecimals` places. */
export function isMoney(text: unknown, maxDecimals = 2): text is Money {
  if (typeof text !== 'string') return false
  const m = MONEY_TEXT.exec(text)
  return m !== null && (m[2]?.length ?? 0) <= maxDecimals
}

/**
 * Parses user or database text into a canonical amount with exactly `decimals` places
 * ('12.3' → '12.30'). Surrounding spaces are ignored; more places than allowed is an error, not a rounding.
 */
export function parseMoney(text: string, decimals = 2): Money {
  const trimmed = typeof text === 'string' ? text.trim() : text
  if (typeof trimmed !== 'string' || !MONEY_TEXT.test(trimmed)) {
    throw new MoneyFormatError(text, 'expected digits with an optional "." and decimals')
  }
  if (!isMoney(trimmed, decimals)) throw new MoneyFormatError(text, `at most ${decimals} decimal places`)
  const value = new MoneyDecimal(trimmed)
  return (value.isZero() ? new MoneyDecimal(0) : value).toFixed(decimals)
}

function toDecimal(amount: Money): MoneyDecimalValue {
  if (!isMoney(amount, 20)) throw new MoneyFormatError(amount, 'expected a decimal string')
  return new MoneyDecimal(amount)
}

// Results keep every place they need (exact) but never fewer than two, so '3' reads as '3.00'.
function exact(value: MoneyDecimalValue): Money {
  const clean = value.isZero() ? new MoneyDecimal(0) : value
  return clean.toFixed(Math.max(2, clean.decimalPlaces()))
}

/** Exact sum of any number of amounts. */
export function addMoney(...amounts: Money[]): Money {
  return exact(amounts.reduce((sum, a) => sum.plus(toDecimal(a)), new MoneyDecimal(0)))
}

/** Exact difference a − b. */
export function subtractMoney(a: Money, b: Money): Money {
  return exact(toDecimal(a).minus(toDecimal(b)))
}

/** Exact amount × quantity; quantities are integers in the stock unit. */
export function multiplyMoney(amount: Money, quantity: number): Money {
  if (!Number.isSafeInteger(quantity)) throw new RangeError(`quantity must be an integer, got ${quantity}`)
  return exact(toDecimal(amount).times(quantity))
}

/** Rounds half-up (half away from zero: 0.005 → 0.01, −0.005 → −0.01) to `decimals` places, default cents. */
export function roundMoney(amount: Money, decimals = 2): Money {
  const rounded = toDecimal(amount).toDecimalPlaces(decimals, MoneyDecimal.ROUND_HALF_UP)
  return (rounded.isZero() ? new MoneyDecimal(0) : rounded).toFixed(decimals)
}

/** −1, 0 or 1 as a < b, a = b, a > b. */
export function compareMoney(a: Money, b: Money): -1 | 0 | 1 {
  return toDecimal(a).comparedTo(toDecimal(b)) as -1 | 0 | 1
}

/** Whole cents as a bigint (rounded half-up first), for integer-cent storage. */
export function toCents(amount: Money): bigint {
  return BigInt(toDecimal(roundMoney(amount)).times(100).toFixed(0))
}

/** Amount text from whole cents. */
export function fromCents(cents: bigint | number): Money {
  if (typeof cents === 'number' && !Number.isSafeInteger(cents)) throw new RangeError(`cents must be an integer, got ${cents}`)
  return new MoneyDecimal(cents.toString()).dividedBy(100).toFixed(2)
}

export interface MoneyFormat {
  symbol?: string
  groupSeparator?: string
  decimalSeparator?: string
  decimals?: number
}

/** Display text: rounded half-up, grouped in thousands, e.g. '-$1,234.50'. Done by hand so no float is involved. */
export function formatMoney(amount: Money, format: MoneyFormat = {}): string {
  const { symbol = '$', groupSeparator = ',', decimalSeparator = '.', decimals = 2 } = format
  const fixed = roundMoney(amount, decimals)
  const negative = fixed.startsWith('-')
  const [whole, fraction] = (negative ? fixed.slice(1) : fixed).split('.')
  const grouped = whole.replace(/\B(?=(\d{3})+(?!\d))/g, groupSeparator)
  return `${negative ? '-' : ''}${symbol}${grouped}${fraction === undefined ? '' : decimalSeparator + fraction}`
}
