// Sales tax on a counter document: one rate per warehouse location (where the goods are handed over),
// applied to the sum of the taxable extensions and rounded to the cent once per document.
//
// Rounding rule: the tax is carried to the third decimal place and rounded up to the next cent when the
// third decimal is greater than four (the rounding rule of the Streamlined Sales and Use Tax Agreement,
// section 324, which lets a seller round per invoice). For a non-negative amount that is rounding half-up
// to the cent, which is what `roundMoney` does.
import { MoneyDecimal, addMoney, roundMoney, type Money } from '../money.js'

export interface TaxExemption {
  certificate: string
  /** ISO date, the last day the certificate is valid. */
  validUntil: string
}

export interface DocumentTax {
  /** The rate applied, in percent (e.g. '8.2500'); '0' when exempt or no rate is set. */
  ratePercent: string
  taxable: Money
  /** The tax before rounding, exact. */
  exactTax: string
  tax: Money
  /** Why no tax was charged, when none was. */
  exemptCertificate?: string
  exemptUntil?: string
  noRate?: boolean
}

/** Whether an exemption certificate holds on a day (ISO dates compare as text). */
export function exemptionHolds(exemption: TaxExemption | null | undefined, onDay: string): exemption is TaxExemption {
  return !!exemption && !!exemption.certificate && exemption.validUntil >= onDay
}

/**
 * The tax of a document: Σ taxable extensions × rate, rounded half-up to the cent once.
 * `ratePercent` null means no rate is set for the location (no tax, and the document says so).
 */
export function documentTax(extensions: readonly Money[], ratePercent: string | null, exemption: TaxExemption | null, onDay: string): DocumentTax {
  const taxable = extensions.length ? addMoney(...extensions) : '0.00'
  if (exemptionHolds(exemption, onDay)) {
    return { ratePercent: '0', taxable, exactTax: '0', tax: '0.00', exemptCertificate: exemption.certificate, exemptUntil: exemption.validUntil }
  }
  if (ratePercent === null) return { ratePercent: '0', taxable, exactTax: '0', tax: '0.00', noRate: true }
  const exact = new MoneyDecimal(taxable).times(new MoneyDecimal(ratePercent)).dividedBy(100)
  return { ratePercent, taxable, exactTax: exact.toFixed(), tax: roundMoney(exact.toFixed()) }
}
