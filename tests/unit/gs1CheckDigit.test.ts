// GS1 mod-10 check digits: published examples, hand-worked sums, bad input, and bwip-js as an independent oracle.
import bwipjs from 'bwip-js'
import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import {
  gtinCheckDigit, gtinForms, isValidGtin, isValidSscc, normalizeGtin, withCheckDigit,
} from '../../shared/barcode/checkDigit.js'

/** True when bwip-js (which checks GS1 check digits itself) accepts the text for that symbology. */
function bwipAccepts(bcid: string, text: string): boolean {
  try {
    bwipjs.raw({ bcid, text })
    return true
  } catch {
    return false
  }
}

describe('published GTIN and SSCC examples', () => {
  // Each code is printed in a published source; the test checks both that it is valid and that its own last digit is recomputed.
  const examples: [code: string, source: string][] = [
    ['9520123456788', 'bwip-js 4.11.4 barcode.ps, EAN-13 encoder EXAM line (read)'],
    ['95200002', 'bwip-js 4.11.4 barcode.ps, EAN-8 encoder EXAM line (read)'],
    ['012345000058', 'bwip-js 4.11.4 barcode.ps, UPC-A encoder EXAM line (read)'],
    ['09528765432108', 'bwip-js 4.11.4 barcode.ps, ITF-14 encoder EXAM "(01) 0 952 8765 43210 8" (read)'],
    ['09521234543213', 'bwip-js 4.11.4 barcode.ps, GS1-128 encoder EXAM "(01)09521234543213(3103)000123" (read)'],
    ['24012345678905', 'bwip-js 4.11.4 barcode.ps, GS1 DataBar EXAM "(01)24012345678905" (read)'],
    ['03612345678904', 'bwip-js 4.11.4 barcode.ps, GS1 composite EXAM "(01)03612345678904|(11)990102" (read)'],
    ['09506000134352', 'GTIN-14 used throughout GS1 guidance documents (from memory)'],
    ['9506000134352', 'the same GTIN as GTIN-13, GS1 guidance documents (from memory)'],
  ]
  it.each(examples)('%s is a valid GTIN (source: %s)', (code) => {
    expect(isValidGtin(code)).toEqual({ ok: true })
    expect(gtinCheckDigit(code.slice(0, -1))).toBe(Number(code.at(-1)))
  })

  it('SSCC 095287654321012346 is valid', () => {
    // source: bwip-js 4.11.4 barcode.ps, SSCC-18 encoder EXAM "(00) 0 9528765 432101234 6" (read)
    expect(isValidSscc('095287654321012346')).toEqual({ ok: true })
  })
})

describe('hand-worked check digits (GS1 General Specifications §7.9.1: weights 3,1,3,1… from the rightmost data digit)', () => {
  it('GTIN-14 09506000134352: check digit 2', () => {
    // source: GTIN from GS1 guidance documents (from memory); sum worked by hand here.
    // data 0 9 5 0 6 0 0 0 1 3 4 3 5 (13 digits); the rightmost is position 13 and gets weight 3,
    // so odd positions weigh 3: 0+5+6+0+1+4+5 = 21 → 63; even positions weigh 1: 9+0+0+3+3 = 15.
    // 63 + 15 = 78; the next multiple of ten is 80, so the check digit is 80 − 78 = 2.
    const sum = (0 + 5 + 6 + 0 + 1 + 4 + 5) * 3 + (9 + 0 + 0 + 3 + 3)
    expect(sum).toBe(78)
    expect(Math.ceil(sum / 10) * 10 - sum).toBe(2)
    expect(gtinCheckDigit('0950600013435')).toBe(2)
    // A GTIN-13's check digit is unchanged by the leading zero of its GTIN-14 form (zeros add nothing).
    expect(gtinCheckDigit('950600013435')).toBe(2)
  })

  it('SSCC 106141411234567897: check digit 7', () => {
    // source: SSCC example from GS1 logistics label guidance (from memory); verified here by hand.
    // data 1 0 6 1 4 1 4 1 1 2 3 4 5 6 7 8 9 (17 digits); position 17 is the rightmost, so odd positions weigh 3:
    // 1+6+4+4+1+3+5+7+9 = 40 → 120; even positions weigh 1: 0+1+1+1+2+4+6+8 = 23. 120 + 23 = 143 → 150 − 143 = 7.
    const odd = [1, 6, 4, 4, 1, 3, 5, 7, 9].reduce((a, b) => a + b, 0)
    const even = [0, 1, 1, 1, 2, 4, 6, 8].reduce((a, b) => a + b, 0)
    expect(odd * 3 + even).toBe(143)
    expect(gtinCheckDigit('10614141123456789')).toBe(7)
    expect(isValidSscc('106141411234567897')).toEqual({ ok: true })
  })

  it('all-zero data gives check digit 0, not 10', () => {
    // source: GS1 Gen Specs §7.9.1 (the check digit is the amount that tops the sum up to a multiple of ten; 0 when already one)
    expect(gtinCheckDigit('0000000000000')).toBe(0)
  })
})

describe('withCheckDigit and normalizeGtin', () => {
  it('appends the check digit', () => {
    // source: GTIN 9506000134352, GS1 guidance documents (from memory)
    expect(withCheckDigit('950600013435')).toBe('9506000134352')
    // source: bwip-js barcode.ps SSCC-18 EXAM (read)
    expect(withCheckDigit('09528765432101234')).toBe('095287654321012346')
  })

  it('pads every GTIN length to 14 digits', () => {
    // sources: bwip-js barcode.ps EAN-8, UPC-A and EAN-13 EXAM lines (read)
    expect(normalizeGtin('95200002')).toEqual({ ok: true, gtin14: '00000095200002' })
    expect(normalizeGtin('012345000058')).toEqual({ ok: true, gtin14: '00012345000058' })
    expect(normalizeGtin('9506000134352')).toEqual({ ok: true, gtin14: '09506000134352' })
    expect(normalizeGtin('09506000134352')).toEqual({ ok: true, gtin14: '09506000134352' })
  })

  it('lists every stored form a scanned GTIN may match (GTIN-8/12/13 right-justified in 14 digits with zeros)', () => {
    // source: GS1 General Specifications, GTIN data structures: shorter GTINs are right-justified in a 14-digit field (from memory);
    // the codes are the bwip-js barcode.ps EAN-8, UPC-A and EAN-13 EXAM lines (read)
    expect(gtinForms('95200002')).toEqual(['00000095200002', '0000095200002', '000095200002', '95200002'])
    expect(gtinForms('00000095200002')).toEqual(['00000095200002', '0000095200002', '000095200002', '95200002'])
    expect(gtinForms('012345000058')).toEqual(['00012345000058', '0012345000058', '012345000058'])
    expect(gtinForms('9506000134352')).toEqual(['09506000134352', '9506000134352'])
    expect(gtinForms('24012345678905')).toEqual(['24012345678905'])
    // not digits: looked up as typed, so it finds nothing rather than everything
    expect(gtinForms('95-200002')).toEqual(['95-200002'])
  })

  it('refuses to normalise an invalid GTIN and says why', () => {
    expect(normalizeGtin('9506000134353')).toMatchObject({ ok: false, reason: 'GTIN-13 check digit should be 2, not 3' })
  })
})

describe('invalid input gets a reason', () => {
  it('a 12-digit string is judged as a GTIN-12', () => {
    // by hand: data 9 5 0 6 0 0 0 1 3 4 3; odd positions ×3: (9+0+0+0+3+3)×3 = 45; even: 5+6+0+1+4 = 16; 61 → 70 − 61 = 9
    expect(isValidGtin('950600013435')).toMatchObject({ ok: false, reason: 'GTIN-12 check digit should be 9, not 5' })
    expect(isValidGtin('950600013435')).toMatchObject({ problem: { code: 'check_digit_wrong', params: { label: 'GTIN-12', expected: 9, actual: 5 } } })
  })

  it('wrong lengths', () => {
    expect(isValidGtin('95060001343')).toMatchObject({ ok: false, reason: 'GTIN must be 8, 12, 13 or 14 digits (got 11)', problem: { code: 'gtin_length', params: { length: 11 } } })
    expect(isValidGtin('109506000134352')).toMatchObject({ ok: false, reason: 'GTIN must be 8, 12, 13 or 14 digits (got 15)' })
    expect(isValidSscc('10614141123456789')).toMatchObject({ ok: false, reason: 'SSCC must be 18 digits (got 17)' })
  })

  it('non-digits and empty strings', () => {
    expect(isValidGtin('95060001343X2')).toMatchObject({ ok: false, reason: 'GTIN must contain digits only' })
    expect(isValidGtin('')).toMatchObject({ ok: false, reason: 'GTIN must contain digits only' })
    expect(isValidGtin(' 9506000134352')).toMatchObject({ ok: false, reason: 'GTIN must contain digits only' })
    expect(isValidSscc('10614141123456789O')).toMatchObject({ ok: false, reason: 'SSCC must contain digits only' })
    expect(() => gtinCheckDigit('12a4')).toThrow(RangeError)
    expect(() => gtinCheckDigit('')).toThrow(RangeError)
  })

  it('wrong check digits name the expected digit', () => {
    // source: bwip-js barcode.ps EAN-13 and SSCC-18 EXAM lines (read), last digit altered
    expect(isValidGtin('9520123456787')).toMatchObject({ ok: false, reason: 'GTIN-13 check digit should be 8, not 7' })
    expect(isValidSscc('095287654321012340')).toMatchObject({ ok: false, reason: 'SSCC check digit should be 6, not 0' })
  })
})

describe('agreement with bwip-js, which validates GS1 check digits itself', () => {
  const digits = (n: number) => fc.string({ unit: fc.constantFrom(...'0123456789'), minLength: n, maxLength: n })
  const lastDigit = fc.integer({ min: 0, max: 9 })

  it('GTIN-14 in AI (01): valid here exactly when bwip-js accepts it', () => {
    // source: bwip-js 4.11.4 gs1process lintcsum (GS1 Syntax Dictionary "csum" linter)
    fc.assert(fc.property(digits(13), lastDigit, (data, d) => {
      const code = data + d
      expect(isValidGtin(code).ok).toBe(bwipAccepts('gs1-128', `(01)${code}`))
    }), { numRuns: 300 })
  })

  it('EAN-13, EAN-8 and UPC-A: valid here exactly when bwip-js accepts the check digit', () => {
    // source: bwip-js 4.11.4 ean13 / ean8 / upca encoders (badCheckDigit errors)
    fc.assert(fc.property(digits(12), digits(7), digits(11), lastDigit, (d13, d8, d12, d) => {
      expect(isValidGtin(d13 + d).ok).toBe(bwipAccepts('ean13', d13 + d))
      expect(isValidGtin(d8 + d).ok).toBe(bwipAccepts('ean8', d8 + d))
      expect(isValidGtin(d12 + d).ok).toBe(bwipAccepts('upca', d12 + d))
    }), { numRuns: 200 })
  })

  it('SSCC in AI (00): valid here exactly when bwip-js accepts it', () => {
    // source: bwip-js 4.11.4 gs1process lintcsum
    fc.assert(fc.property(digits(17), lastDigit, (data, d) => {
      expect(isValidSscc(data + d).ok).toBe(bwipAccepts('gs1-128', `(00)${data}${d}`))
    }), { numRuns: 300 })
  })

  it('any single changed digit is caught', () => {
    // source: weights 1 and 3 are both coprime to 10, so changing one digit always changes the sum mod 10 (arithmetic)
    fc.assert(fc.property(digits(13), fc.integer({ min: 0, max: 13 }), fc.integer({ min: 1, max: 9 }), (data, pos, delta) => {
      const code = withCheckDigit(data)
      const changed = code.slice(0, pos) + String((Number(code[pos]) + delta) % 10) + code.slice(pos + 1)
      expect(isValidGtin(changed).ok).toBe(false)
    }))
  })
})
