// An order's money: the deposit asked on its made-to-order lines, and the document's tax shared out over
// its lines so the lines add up to the tax the quote showed. Decimal text only (shared/money.ts).
import { addMoney, compareMoney, MoneyDecimal, roundMoney, subtractMoney, type Money } from '../money.js'

/**
 * The deposit: Σ extensions of the made-to-order lines × percent / 100, rounded half-up to the cent once
 * (the rounding the rest of our money uses; half-up to the cent is common practice for invoices).
 */
export function depositRequired(madeToOrderExtensions: readonly Money[], percent: string): Money {
  if (!madeToOrderExtensions.length) return '0.00'
  const base = addMoney(...madeToOrderExtensions)
  return roundMoney(new MoneyDecimal(base).times(new MoneyDecimal(percent)).dividedBy(100).toFixed())
}

/**
 * Each line's part of the document's tax: its extension × the rate, rounded half-up to the cent, and the
 * last line with an extension takes what is left, so the parts always add up to the document's tax.
 */
export function lineTaxShares(extensions: readonly Money[], ratePercent: string, documentTax: Money): Money[] {
  const shares: Money[] = extensions.map(() => '0.00')
  let last = -1
  extensions.forEach((e, i) => { if (compareMoney(e, '0') > 0) last = i })
  if (last < 0 || compareMoney(documentTax, '0') === 0) return shares
  let given = '0.00'
  for (let i = 0; i < last; i++) {
    shares[i] = roundMoney(new MoneyDecimal(extensions[i]).times(new MoneyDecimal(ratePercent)).dividedBy(100).toFixed())
    given = addMoney(given, shares[i])
  }
  shares[last] = roundMoney(subtractMoney(documentTax, given))
  return shares
}

/** What the contractor still owes on the order. */
export function balanceDue(total: Money, paid: Money): Money {
  return roundMoney(subtractMoney(total, paid))
}
