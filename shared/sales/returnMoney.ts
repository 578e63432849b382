// What a contractor gets back for goods returned against an order: each returned line at the price it was
// sold at, its share of the line's sales tax, less the supplier's restocking fee on the goods. Decimal text
// only (shared/money.ts). Rounding: half-up to the cent at each figure (the third decimal place 5 or more
// rounds the cent up), the rule the Streamlined Sales and Use Tax Agreement §324 sets for tax (from memory)
// and the one the rest of our money uses.
import { addMoney, MoneyDecimal, roundMoney, subtractMoney, type Money } from '../money.js'

export interface ReturnLineMoney {
  /** The order line's unit price (up to four places) and tax, and how many it sold. */
  unitPrice: string
  lineQty: number
  lineTax: Money
  /** How many come back. */
  qty: number
}

export interface ReturnFigures {
  lines: { goods: Money; tax: Money }[]
  goods: Money
  tax: Money
  restockingFee: Money
  refund: Money
}

const times = (a: string, b: string | number) => new MoneyDecimal(a).times(new MoneyDecimal(b))
/** Half-up to the cent, straight from the exact quotient (a third of a cent has no end in decimal). */
const cents = (d: InstanceType<typeof MoneyDecimal>): Money => roundMoney(d.toDecimalPlaces(6, MoneyDecimal.ROUND_HALF_UP).toFixed())

/**
 * goods = unit price × qty; tax = the line's tax × qty / qty sold (the part of the tax that came with those
 * units); fee = Σ goods × percent / 100 (on the goods, not the tax); refund = goods + tax − fee.
 */
export function returnFigures(lines: readonly ReturnLineMoney[], restockingPercent: string): ReturnFigures {
  const figured = lines.map((l) => ({
    goods: cents(times(l.unitPrice, l.qty)),
    tax: cents(times(l.lineTax, l.qty).dividedBy(l.lineQty)),
  }))
  const goods = roundMoney(addMoney('0', ...figured.map((f) => f.goods)))
  const tax = roundMoney(addMoney('0', ...figured.map((f) => f.tax)))
  const restockingFee = cents(times(goods, restockingPercent).dividedBy(100))
  return { lines: figured, goods, tax, restockingFee, refund: roundMoney(subtractMoney(addMoney(goods, tax), restockingFee)) }
}
