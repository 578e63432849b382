// GS1 element strings: building HRI / scanner data / bwip-js text, value rules and pairing rules,
// checked against GS1 examples and against bwip-js 4.11.4, whose barcode.ps embeds the GS1 Barcode Syntax Dictionary.
import bwipjs from 'bwip-js'
import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import {
  AI_ORDER, AI_TABLE, buildElementString, checkFieldValue, checkPairings, GS, gs1DateToIso, validateFields,
  type AiCode, type Gs1Fields,
} from '../../shared/barcode/elementString.js'
import { withCheckDigit } from '../../shared/barcode/checkDigit.js'

const GTIN = '09506000134352' // source: GS1 guidance documents' example GTIN (from memory); check digit verified in gs1CheckDigit.test.ts
const SSCC = '106141411234567897' // source: GS1 logistics label example SSCC (from memory); verified by hand in gs1CheckDigit.test.ts

/** bwip-js's own verdict on a bracketed element string; lintreqs switches on the Syntax Dictionary's "req" rules. */
function bwipVerdict(text: string, lintreqs = false): boolean {
  try {
    bwipjs.raw({ bcid: 'gs1-128', text, parse: true, ...(lintreqs && { lintreqs: true }) } as bwipjs.RawOptions)
    return true
  } catch {
    return false
  }
}

const escapeForBwip = (v: string) => v.replaceAll('^', '^094').replaceAll('(', '^040').replaceAll(')', '^041')

describe('buildElementString', () => {
  it('GTIN + lot: HRI, scanner data without a trailing separator, bwip-js text', () => {
    // source: GS1 Gen Specs §5.10 (FNC1 only after a variable-length field that is not last), AI (01) N14, (10) X..20
    const built = buildElementString({ '01': GTIN, '10': 'ABC' })
    expect(built).toEqual({
      ok: true,
      hri: `(01)${GTIN}(10)ABC`,
      raw: `01${GTIN}10ABC`,
      bwipText: `(01)${GTIN}(10)ABC`,
      order: ['01', '10'],
    })
  })

  it('the logistic-unit example from bwip-js: (00) + (02) + (37) + (10)', () => {
    // source: bwip-js 4.11.4 barcode.ps, GS1-128 composite EXAM "(00)095287654321012346|(02)09521234543213(37)24(10)1234567ABCDEFG" (read)
    const built = buildElementString({ '00': '095287654321012346', '02': '09521234543213', '37': '24', '10': '1234567ABCDEFG' })
    expect(built.ok && built.hri).toBe('(00)095287654321012346(02)09521234543213(37)24(10)1234567ABCDEFG')
    // (37) is variable length and not last, so FNC1 (GS) follows it; (00) and (02) are predefined length and need none.
    expect(built.ok && built.raw).toBe(`0009528765432101234602095212345432133724${GS}101234567ABCDEFG`)
  })

  it('puts predefined-length fields first, so dates after a lot need no separator', () => {
    // source: GS1 Gen Specs figure 5.10.1-2 (11 and 17 are predefined length) (from memory); bwip-js barcode.ps aifixed table (read)
    const built = buildElementString({ '10': 'R2405', '17': '281231', '01': GTIN })
    expect(built.ok && built.order).toEqual(['01', '17', '10'])
    expect(built.ok && built.raw).toBe(`01${GTIN}1728123110R2405`)
    const withBoth = buildElementString({ '01': GTIN, '11': '240101', '17': '281231', '10': 'R2405' })
    expect(withBoth.ok && withBoth.raw).toBe(`01${GTIN}112401011728123110R2405`)
  })

  it('separates every variable-length field but the last', () => {
    // source: GS1 Gen Specs §5.10 (from memory); AI (21) X..20, (400) X..30 per bwip-js barcode.ps gs1syntax (read)
    const built = buildElementString({ '01': GTIN, '10': 'L1', '21': 'S9', '400': 'PO-77' })
    expect(built.ok && built.raw).toBe(`01${GTIN}10L1${GS}21S9${GS}400PO-77`)
    expect(built.ok && built.raw.split(GS)).toHaveLength(3)
  })

  it('writes parentheses inside values as ^040 / ^041 for bwip-js, and bwip-js accepts that text', () => {
    // source: bwip-js gs1process, which expands ^NNN ordinals when parse is on; "(" and ")" are in GS1 character set 82
    const built = buildElementString({ '01': GTIN, '10': 'A(B)C' })
    expect(built.ok && built.hri).toBe(`(01)${GTIN}(10)A(B)C`)
    expect(built.ok && built.bwipText).toBe(`(01)${GTIN}(10)A^040B^041C`)
    expect(built.ok && bwipVerdict(built.bwipText)).toBe(true)
  })
})

describe('value rules', () => {
  it('check digits on (00), (01), (02)', () => {
    // source: GS1 Syntax Dictionary "csum" on 00/01/02 (bwip-js barcode.ps gs1syntax, read)
    expect(checkFieldValue('00', '106141411234567890')).toBe('(00) SSCC 106141411234567890: SSCC check digit should be 7, not 0')
    expect(checkFieldValue('01', '09506000134353')).toBe('(01) GTIN 09506000134353: GTIN-14 check digit should be 2, not 3')
    expect(checkFieldValue('02', '09506000134350')).toBe('(02) contained GTIN 09506000134350: GTIN-14 check digit should be 2, not 0')
    expect(checkFieldValue('01', GTIN)).toBeNull()
  })

  it('lengths', () => {
    // source: bwip-js barcode.ps gs1syntax: (01) N14, (10) X..20, (37) N..8, (400) X..30 (read)
    expect(checkFieldValue('01', '9506000134352')).toBe('(01) GTIN must be 14 digits (got 13)')
    expect(checkFieldValue('10', 'A'.repeat(21))).toBe('(10) lot must be 1 to 20 characters (got 21)')
    expect(checkFieldValue('10', 'A'.repeat(20))).toBeNull()
    expect(checkFieldValue('37', '123456789')).toBe('(37) count must be 1 to 8 digits (got 9)')
    expect(checkFieldValue('400', 'P'.repeat(31))).toBe('(400) customer PO number must be 1 to 30 characters (got 31)')
    expect(checkFieldValue('10', '')).toBe('(10) lot is empty')
  })

  it('character set 82 for X fields, digits for N fields', () => {
    // source: GS1 Gen Specs figure 7.11-1, set 82 (from memory); bwip-js barcode.ps cset82 table (read)
    expect(checkFieldValue('10', 'AB C')).toMatch(/^\(10\) lot may only hold/)
    expect(checkFieldValue('10', 'AB#C')).toMatch(/^\(10\) lot may only hold/)
    expect(checkFieldValue('21', 'Ä1')).toMatch(/^\(21\) serial number may only hold/)
    expect(checkFieldValue('10', `!"%&'()*+,-./:;<=>?`)).toBeNull()
    expect(checkFieldValue('10', '_azAZ09')).toBeNull()
    expect(checkFieldValue('37', '12a')).toBe('(37) count must be digits only')
  })

  it('YYMMDD dates, DD 00 for the end of the month', () => {
    // source: bwip-js barcode.ps gs1syntax: (11) and (17) use linter yymmd0 (read); GS1 Gen Specs §3.4.4 DD = 00 (from memory)
    expect(checkFieldValue('17', '281231')).toBeNull()
    expect(checkFieldValue('17', '260200')).toBeNull()
    expect(checkFieldValue('11', '240229')).toBeNull() // 2024 is a leap year
    expect(checkFieldValue('11', '250229')).toMatch(/day 29 does not exist in month 02/)
    expect(checkFieldValue('17', '260431')).toMatch(/day 31 does not exist in month 04/)
    expect(checkFieldValue('17', '261301')).toBe('(17) expiry date 261301: month must be 01 to 12, not 13')
    expect(checkFieldValue('17', '260001')).toMatch(/month must be 01 to 12, not 00/)
    expect(checkFieldValue('17', '26123')).toBe('(17) expiry date must be 6 digits (got 5)')
  })

  it('unknown keys and empty sets', () => {
    expect(validateFields({ '15': '261231' } as unknown as Gs1Fields)).toEqual([{ ai: null, message: 'AI (15) is not one Lumenyard uses' }])
    expect(validateFields({})).toEqual([{ ai: null, message: 'a GS1 barcode needs at least one field' }])
    const bad = buildElementString({ '01': '123', '10': 'A B' })
    expect(bad.ok).toBe(false)
    expect(!bad.ok && bad.errors.map((e) => e.ai)).toEqual(['01', '10'])
  })
})

describe('pairing rules', () => {
  // source for every rule: GS1 Barcode Syntax Dictionary "ex"/"req" attributes as embedded in bwip-js 4.11.4 barcode.ps (read):
  // 01 ex 37; 02 ex 01 req 37; 37 req 00 and (02 or 8026); 10/11/17 req 01 or 02 (or 03/8006/8026); 21 req 01 (or 03/8006).
  const messages = (fields: Gs1Fields) => checkPairings(fields).map((i) => i.message)

  it('(37) never with (01)', () => {
    expect(messages({ '01': GTIN, '37': '12' })).toEqual([
      '(01) GTIN and (37) count cannot be in one barcode: a count belongs with (02) on a logistic unit, not with a trade item\'s (01)',
      '(37) count needs (02) contained GTIN: which item is counted',
      '(37) count needs (00) SSCC: GS1 allows a count only on a logistic unit with its own SSCC',
    ])
  })

  it('(01) and (02) not together', () => {
    expect(messages({ '00': SSCC, '01': GTIN, '02': GTIN, '37': '5' })[0]).toMatch(/^\(01\) GTIN and \(02\) contained GTIN cannot be in one barcode/)
  })

  it('(02) requires (37); (37) requires (02) and (00)', () => {
    expect(messages({ '00': SSCC, '02': GTIN })).toEqual(['(02) contained GTIN needs (37) count: how many of the contained item the unit holds'])
    expect(messages({ '00': SSCC, '37': '12' })).toEqual(['(37) count needs (02) contained GTIN: which item is counted'])
    expect(messages({ '02': GTIN, '37': '12' })).toEqual(['(37) count needs (00) SSCC: GS1 allows a count only on a logistic unit with its own SSCC'])
    expect(messages({ '00': SSCC, '02': GTIN, '37': '12', '10': 'R1' })).toEqual([])
  })

  it('(10) requires (01) or (02); (21) requires (01); dates require an item', () => {
    expect(messages({ '10': 'R1' })).toEqual(['(10) lot needs (01) GTIN or (02) contained GTIN: a lot means nothing without the item'])
    expect(messages({ '00': SSCC, '10': 'R1' })).toHaveLength(1)
    expect(messages({ '00': SSCC, '02': GTIN, '37': '1', '21': 'S1' })).toEqual(['(21) serial number needs (01) GTIN: a serial number identifies one instance of a trade item'])
    expect(messages({ '17': '281231' })).toHaveLength(1)
    expect(messages({ '01': GTIN, '10': 'R1', '21': 'S1', '11': '240101', '17': '281231' })).toEqual([])
    expect(messages({ '00': SSCC, '400': 'PO-1' })).toEqual([])
  })

  it('buildElementString refuses a breach and says why', () => {
    const built = buildElementString({ '01': GTIN, '37': '12' })
    expect(built.ok).toBe(false)
    expect(!built.ok && built.errors[0]).toEqual({ ai: '37', message: expect.stringContaining('cannot be in one barcode'), problem: { code: 'scan_pair_count_with_gtin' } })
  })

  it('agrees with bwip-js on every combination of our AIs', () => {
    // source: bwip-js 4.11.4 gs1process with lintreqs (GS1 Syntax Dictionary ex/req), read
    const sample: Record<AiCode, string> = { '00': SSCC, '01': GTIN, '02': GTIN, '10': 'R1', '11': '240101', '17': '281231', '21': 'S1', '37': '12', '400': 'PO1' }
    let checked = 0
    for (let mask = 1; mask < 1 << AI_ORDER.length; mask++) {
      const fields: Gs1Fields = {}
      AI_ORDER.forEach((ai, i) => { if (mask & (1 << i)) fields[ai] = sample[ai] })
      const text = AI_ORDER.filter((ai) => fields[ai]).map((ai) => `(${ai})${fields[ai]}`).join('')
      expect([text, checkPairings(fields).length === 0]).toEqual([text, bwipVerdict(text, true)])
      checked++
    }
    expect(checked).toBe(511)
  })
})

describe('value rules agree with bwip-js', () => {
  // The context fields make each string valid apart from the value under test.
  const contexts: [AiCode, string][] = [['10', `(01)${GTIN}`], ['21', `(01)${GTIN}`], ['400', ''], ['11', `(01)${GTIN}`], ['17', `(01)${GTIN}`], ['37', `(00)${SSCC}(02)${GTIN}`]]
  const ascii = fc.string({ unit: fc.integer({ min: 32, max: 126 }).map((c) => String.fromCharCode(c)), maxLength: 32 })
  const digitish = fc.string({ unit: fc.constantFrom(...'0123456789'), minLength: 0, maxLength: 10 })

  it.each(contexts)('AI (%s)', (ai, context) => {
    // source: bwip-js 4.11.4 gs1process: cset82, length limits and yymmd0 date linter (read)
    const values = AI_TABLE[ai].charset === 'X' ? ascii : fc.oneof(digitish, ascii)
    fc.assert(fc.property(values, (value) => {
      const text = `${context}(${ai})${escapeForBwip(value)}`
      expect([value, checkFieldValue(ai, value) === null]).toEqual([value, bwipVerdict(text)])
    }), { numRuns: 300 })
  })

  it('every date of every month agrees', () => {
    // source: bwip-js 4.11.4 lintyymmd0 (read), all months, days 00–32, a leap and a common year
    for (const yy of ['24', '25']) {
      for (let mm = 0; mm <= 13; mm++) {
        for (let dd = 0; dd <= 32; dd++) {
          const v = `${yy}${String(mm).padStart(2, '0')}${String(dd).padStart(2, '0')}`
          expect([v, checkFieldValue('17', v) === null]).toEqual([v, bwipVerdict(`(01)${GTIN}(17)${v}`)])
        }
      }
    }
  })

  it('random valid GTINs and SSCCs are accepted by both', () => {
    const digits = (n: number) => fc.string({ unit: fc.constantFrom(...'0123456789'), minLength: n, maxLength: n })
    fc.assert(fc.property(digits(13), digits(17), (g, s) => {
      const fields = { '00': withCheckDigit(s), '02': withCheckDigit(g), '37': '1' }
      const built = buildElementString(fields)
      expect(built.ok).toBe(true)
      expect(built.ok && bwipVerdict(built.bwipText, true)).toBe(true)
    }), { numRuns: 100 })
  })
})

describe('gs1DateToIso', () => {
  // source: GS1 Gen Specs §7.12 century window (from memory); the same thresholds (≥ 51 → previous century, ≤ −50 → next)
  // appear in bwip-js 4.11.4 lintyymmd0 (read)
  it('reads dates in the sliding century window', () => {
    expect(gs1DateToIso('281231', 2026)).toBe('2028-12-31')
    expect(gs1DateToIso('760101', 2026)).toBe('2076-01-01') // 50 ahead: this century
    expect(gs1DateToIso('770101', 2026)).toBe('1977-01-01') // 51 ahead: previous century
    expect(gs1DateToIso('200101', 2070)).toBe('2120-01-01') // 50 behind: next century
  })

  it('DD 00 is the last day of the month, leap years included', () => {
    expect(gs1DateToIso('240200', 2026)).toBe('2024-02-29')
    expect(gs1DateToIso('250200', 2026)).toBe('2025-02-28')
    expect(gs1DateToIso('260400', 2026)).toBe('2026-04-30')
  })

  it('refuses impossible dates', () => {
    expect(() => gs1DateToIso('261301', 2026)).toThrow(RangeError)
    expect(() => gs1DateToIso('2612', 2026)).toThrow(RangeError)
    // 00 read in 2060 is 2100, which is not a leap year (Gregorian rule)
    expect(() => gs1DateToIso('000229', 2060)).toThrow(RangeError)
    expect(gs1DateToIso('000229', 2026)).toBe('2000-02-29')
  })
})
