// A count line's arithmetic: the expectation reconciled for moves made while the bin was being counted,
// the variance and its value, and accuracy over many lines.
import { MoneyDecimal, type Money } from '../money.js'

export interface Reconciled {
  /** snapshot + moves since: what the ledger says was there when the counter entered the figure. */
  expected: number
  /** counted − expected: negative when units are missing. */
  variance: number
}

/**
 * The snapshot is the bin's on-hand when its visit started; moves since are the picks, receipts and moves
 * made in that bin between the snapshot and the count being entered (picking is never frozen).
 */
export function reconcileCount(input: { snapshot: number; movesSince: number; counted: number }): Reconciled {
  for (const [name, v] of Object.entries(input)) {
    if (!Number.isSafeInteger(v)) throw new RangeError(`${name} must be a whole number, got ${v}`)
  }
  if (input.counted < 0) throw new RangeError('a count is never negative')
  const expected = input.snapshot + input.movesSince
  return { expected, variance: input.counted - expected }
}

/** variance × unit cost, to cents. */
export function varianceValue(variance: number, unitCost: Money): Money {
  return new MoneyDecimal(unitCost).times(variance).toDecimalPlaces(2).toFixed(2)
}

export interface AccuracyLine {
  variance: number
  unitCost: Money | null
}

export interface AccuracyFigures {
  linesCounted: number
  linesRight: number
  /** linesRight ÷ linesCounted, 0–1; null when nothing was counted. */
  accuracy: number | null
  /** Σ |variance × cost|: how much value the records were off by. */
  valueOff: Money
  /** Σ variance × cost: gains less losses. */
  valueNet: Money
}

/** Record accuracy: a line is right when the count matched the record exactly. */
export function accuracyOf(lines: readonly AccuracyLine[]): AccuracyFigures {
  let right = 0
  let off = new MoneyDecimal(0)
  let net = new MoneyDecimal(0)
  for (const l of lines) {
    if (l.variance === 0) right++
    const value = new MoneyDecimal(varianceValue(l.variance, l.unitCost ?? '0'))
    off = off.plus(value.abs())
    net = net.plus(value)
  }
  return {
    linesCounted: lines.length,
    linesRight: right,
    accuracy: lines.length ? right / lines.length : null,
    valueOff: off.toFixed(2),
    valueNet: net.toFixed(2),
  }
}
