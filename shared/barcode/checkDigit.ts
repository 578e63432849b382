// GS1 mod-10 check digits for GTINs and SSCCs (GS1 General Specifications §7.9.1).
// The same rule serves every GS1 key length, so one function covers GTIN-8 to SSCC-18.

import { problem, type Problem } from '../errors/errorCodes.js'

/** A failed check gives the English reason (logs, label errors) and the coded problem (screens). */
export type Gs1Check = { ok: true } | { ok: false; reason: string; problem: Problem }
export type GtinNormalization = { ok: true; gtin14: string } | { ok: false; reason: string; problem: Problem }

/** Lengths a GTIN can have; an 8-digit UPC-E code is a compressed GTIN-12, not a GTIN-8. */
export const GTIN_LENGTHS: readonly number[] = [8, 12, 13, 14]
export const SSCC_LENGTH = 18

const DIGITS_ONLY = /^[0-9]+$/

/**
 * The check digit for a string of data digits (the key without its check digit).
 * Weights 3,1,3,1… run from the rightmost data digit leftwards; the check digit tops the sum up to a multiple of 10.
 */
export function gtinCheckDigit(dataDigits: string): number {
  if (!DIGITS_ONLY.test(dataDigits)) throw new RangeError(`check digit needs digits only, got "${dataDigits}"`)
  let sum = 0
  for (let i = 0; i < dataDigits.length; i++) {
    const fromRight = dataDigits.length - 1 - i
    sum += Number(dataDigits[i]) * (fromRight % 2 === 0 ? 3 : 1)
  }
  return (10 - (sum % 10)) % 10
}

/** The data digits followed by their check digit: withCheckDigit('950600013435') → '9506000134352'. */
export function withCheckDigit(dataDigits: string): string {
  return dataDigits + String(gtinCheckDigit(dataDigits))
}

/** Checks the last digit of a complete key (any length ≥ 2) against the others; the reason names the expected digit. */
function checkLastDigit(label: string, code: string): Gs1Check {
  const expected = gtinCheckDigit(code.slice(0, -1))
  const actual = Number(code[code.length - 1])
  if (expected === actual) return { ok: true }
  return { ok: false, reason: `${label} check digit should be ${expected}, not ${actual}`, problem: problem('check_digit_wrong', { label, expected, actual }) }
}

/** A GTIN-8, -12, -13 or -14 with a correct check digit. */
export function isValidGtin(code: string): Gs1Check {
  if (!DIGITS_ONLY.test(code)) return { ok: false, reason: 'GTIN must contain digits only', problem: problem('gtin_digits_only') }
  if (!GTIN_LENGTHS.includes(code.length)) {
    return { ok: false, reason: `GTIN must be 8, 12, 13 or 14 digits (got ${code.length})`, problem: problem('gtin_length', { length: code.length }) }
  }
  return checkLastDigit(`GTIN-${code.length}`, code)
}

/** An 18-digit Serial Shipping Container Code with a correct check digit. */
export function isValidSscc(code: string): Gs1Check {
  if (!DIGITS_ONLY.test(code)) return { ok: false, reason: 'SSCC must contain digits only', problem: problem('sscc_digits_only') }
  if (code.length !== SSCC_LENGTH) return { ok: false, reason: `SSCC must be 18 digits (got ${code.length})`, problem: problem('sscc_length', { length: code.length }) }
  return checkLastDigit('SSCC', code)
}

/**
 * Any valid GTIN as 14 digits with leading zeros, the form AI (01) and (02) carry
 * and the one to store and compare: 9506000134352 → 09506000134352.
 */
export function normalizeGtin(code: string): GtinNormalization {
  const check = isValidGtin(code)
  if (!check.ok) return check
  return { ok: true, gtin14: code.padStart(14, '0') }
}

/**
 * Every form a GTIN can be written in: GTIN-8, -12 and -13 are the same number right-justified in 14 digits
 * with leading zeros, so 036000291452 is also 0036000291452 and 00036000291452. Looking a stored GTIN up
 * with `gtin IN (these forms)` uses the column's index whatever length was stored.
 */
export function gtinForms(code: string): string[] {
  if (!/^\d{1,14}$/.test(code)) return [code]
  const gtin14 = code.padStart(14, '0')
  return [14, 13, 12, 8].filter((len) => /^0*$/.test(gtin14.slice(0, 14 - len))).map((len) => gtin14.slice(14 - len))
}
