// Inventory turnover and days of supply, as the accounting texts define them: turnover = cost of goods
// sold ÷ average inventory, average inventory = (beginning + ending) ÷ 2, days in inventory = days in
// the period ÷ turnover (Weygandt, Kimmel & Kieso, Accounting Principles, inventories chapter).
import { MoneyDecimal, type Money } from '../money.js'

export interface TurnsInput {
  /** Cost of what left the shelves in the period (issues and picks at their moving-average cost). */
  costOfGoods: Money
  beginValue: Money
  endValue: Money
  days: number
}

export interface TurnsFigures {
  averageValue: Money
  /** Times the average stock was used in the period; null when there was no stock to turn. */
  turns: number | null
  /** turns scaled to a 365-day year. */
  annualTurns: number | null
  /** Days the average stock lasts at the period's rate of use; null when nothing was used. */
  daysOfSupply: number | null
}

export function turnsOf(input: TurnsInput): TurnsFigures {
  if (!(Number.isInteger(input.days) && input.days > 0)) throw new RangeError('the period needs at least one day')
  const average = new MoneyDecimal(input.beginValue).plus(input.endValue).dividedBy(2)
  const cogs = new MoneyDecimal(input.costOfGoods)
  const turns = average.isZero() ? null : cogs.dividedBy(average).toNumber()
  return {
    averageValue: average.toDecimalPlaces(2).toFixed(2),
    turns,
    annualTurns: turns === null ? null : (turns * 365) / input.days,
    daysOfSupply: turns === null || turns === 0 ? null : input.days / turns,
  }
}
