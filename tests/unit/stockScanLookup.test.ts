// From a scan to what the stock forms look up (shared/barcode/scanLookup.ts), through the shared scan
// classifier, for the labels a warehouse meets; and the adjustment form's change against the server's
// sign rules (shared/inventory/adjustmentDelta.ts with shared/schemas/stock.ts adjustmentSchema).
import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { ADJUSTMENT_REASONS } from '../../shared/catalog.js'
import { GS } from '../../shared/barcode/elementString.js'
import { classifyScan } from '../../shared/barcode/scan.js'
import { scanLookup } from '../../shared/barcode/scanLookup.js'
import { adjustmentDelta } from '../../shared/inventory/adjustmentDelta.js'
import { adjustmentSchema } from '../../shared/schemas/stock.js'

const GTIN = '09506000134352' // source: GS1 guidance documents' example GTIN (from memory); its check digit is verified in gs1CheckDigit.test.ts
const SSCC = '106141411234567897' // source: GS1 logistics label example (from memory); verified by hand in gs1CheckDigit.test.ts
const lookup = (raw: string) => scanLookup(classifyScan(raw))

describe('scanLookup', () => {
  it('reads GS1-128 GTIN + lot, with FNC1 (ASCII 29) after the variable-length lot', () => {
    // source: GS1 General Specifications — AI (01) N14 predefined length, AI (10) X..20 variable, ended by FNC1
    // unless last; ]C1 identifies GS1-128 (ISO/IEC 15424). (both from the published standards).
    expect(lookup(`]C101${GTIN}10R2405`)).toEqual({ ok: true, query: { kind: 'gtin', code: GTIN, lotCode: 'R2405' } })
    expect(lookup(`]C110R2405${GS}01${GTIN}`)).toEqual({ ok: true, query: { kind: 'gtin', code: GTIN, lotCode: 'R2405' } })
  })

  it('reads an EAN-13 as the GTIN-14 with a leading zero', () => {
    // source: GS1 General Specifications — a GTIN-13 in a 14-digit field is right-justified with a leading zero (from memory)
    expect(lookup(`]E0${GTIN.slice(1)}`)).toEqual({ ok: true, query: { kind: 'gtin', code: GTIN } })
  })

  it('refuses a pallet label (SSCC only): it names no single item', () => {
    expect(lookup(`]C100${SSCC}`)).toEqual({ ok: false, problem: { code: 'scan_no_gtin' } })
  })

  it('reads our own bin and lot labels, the prefix in either case (Caps Lock on a keyboard wedge)', () => {
    expect(lookup('B:A-03-2')).toEqual({ ok: true, query: { kind: 'bin', code: 'A-03-2' } })
    expect(lookup('b:A-03-2')).toEqual({ ok: true, query: { kind: 'bin', code: 'A-03-2' } })
    expect(lookup('L:GB-8812|R2405')).toEqual({ ok: true, query: { kind: 'sku', code: 'GB-8812', lotCode: 'R2405' } })
    expect(lookup('GB-8812\r\n')).toEqual({ ok: true, query: { kind: 'sku', code: 'GB-8812' } })
  })

  it('gives a coded problem (worded by the screen) for what it cannot read', () => {
    const bad = lookup(GTIN.slice(0, -1) + '3') // wrong check digit
    expect(bad).toMatchObject({ ok: false, problem: { code: 'check_digit_wrong', params: { label: 'GTIN-14' } } })
    expect(lookup('two words!')).toEqual({ ok: false, problem: { code: 'scan_not_ours', params: { text: 'two words!' } } })
    expect(lookup('B:A 03')).toEqual({ ok: false, problem: { code: 'scan_bin_label_invalid', params: { text: 'B:A 03' } } })
  })
})

describe('adjustmentDelta agrees with the server’s sign rules', () => {
  const parse = (reason: string, delta: number | null) => adjustmentSchema.safeParse({ itemId: 1, binId: 1, delta, reason })

  it('removes for damaged and written off, adds for found, and counts to what was counted', () => {
    expect(adjustmentDelta('damaged', 3, 24)).toBe(-3)
    expect(adjustmentDelta('written_off', 2, 24)).toBe(-2)
    expect(adjustmentDelta('found', 5, 24)).toBe(5)
    expect(adjustmentDelta('counted', 20, 24)).toBe(-4)
    expect(adjustmentDelta('counted', 30, 24)).toBe(6)
    expect(adjustmentDelta(null, 3, 24)).toBeNull()
  })

  it('every positive entry gives a change the schema accepts, unless the count matches (property)', () => {
    fc.assert(fc.property(fc.constantFrom(...ADJUSTMENT_REASONS), fc.integer({ min: 1, max: 100_000 }), fc.integer({ min: 0, max: 100_000 }), (reason, entered, onHand) => {
      const delta = adjustmentDelta(reason, entered, onHand)!
      expect(parse(reason, delta).success).toBe(delta !== 0)
    }))
  })

  it('a negative entry for a removing or adding reason is refused on the change field', () => {
    for (const reason of ['damaged', 'found'] as const) {
      const result = parse(reason, adjustmentDelta(reason, -2, 10))
      expect(result.success).toBe(false)
      expect(result.error!.issues[0].path).toEqual(['delta'])
    }
  })
})
