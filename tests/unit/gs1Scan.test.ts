// Scan parsing and classification: symbology identifiers, GS separators, hand-typed HRI, our own labels,
// and build → scan round trips for many field combinations.
import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { withCheckDigit } from '../../shared/barcode/checkDigit.js'
import { buildElementString, GS, type Gs1Fields } from '../../shared/barcode/elementString.js'
import {
  BIN_PREFIX, binLabelPayload, classifyScan, itemLabelPayload, LOT_PREFIX, lotLabelPayload, parseScan,
} from '../../shared/barcode/scan.js'

const GTIN = '09506000134352' // source: GS1 guidance documents' example GTIN (from memory); verified in gs1CheckDigit.test.ts
const GTIN13 = '9506000134352' // the same GTIN as GTIN-13 (from memory)
const SSCC = '106141411234567897' // source: GS1 logistics label example (from memory); verified by hand in gs1CheckDigit.test.ts

describe('parseScan: symbology identifiers and separators', () => {
  // source: ISO/IEC 15424 symbology identifiers ]C1 GS1-128, ]d2 GS1 DataMatrix, ]Q3 GS1 QR;
  // FNC1 transmitted as ASCII 29 (GS1 Gen Specs §5.10)
  const data = `01${GTIN}10R2405${GS}21SN-9`
  const fields = { '01': GTIN, '10': 'R2405', '21': 'SN-9' }

  it.each([']C1', ']d2', ']Q3', ']e0'])('with %s', (id) => {
    expect(parseScan(id + data)).toEqual({ kind: 'gs1', symbology: id, fields, order: ['01', '10', '21'] })
  })

  it('without an identifier, GS in the data marks GS1', () => {
    expect(parseScan(data)).toMatchObject({ kind: 'gs1', symbology: null, fields })
  })

  it('without an identifier or GS, a complete parse starting 00/01/02 is GS1', () => {
    expect(parseScan(`01${GTIN}10R2405`)).toMatchObject({ kind: 'gs1', fields: { '01': GTIN, '10': 'R2405' } })
    expect(parseScan(`00${SSCC}`)).toMatchObject({ kind: 'gs1', fields: { '00': SSCC } })
    // a bad check digit means it is not GS1 data after all
    expect(parseScan(`01${GTIN.slice(0, -1)}310R2405`)).toMatchObject({ kind: 'text' })
  })

  it('reads predefined-length fields without a separator after them', () => {
    // source: GS1 Gen Specs figure 5.10.1-2, AIs 00–04 and 11–20 predefined length (from memory); bwip-js barcode.ps aifixed (read)
    expect(parseScan(`]C1${'00'}${SSCC}02${GTIN}11240101172812003712`)).toMatchObject({
      kind: 'gs1', fields: { '00': SSCC, '02': GTIN, '11': '240101', '17': '281200', '37': '12' },
    })
  })

  it('tolerates a leading GS (FNC1 in first position), a trailing GS, and the Enter a wedge scanner sends', () => {
    expect(parseScan(`${GS}${data}${GS}\r\n`)).toMatchObject({ kind: 'gs1', fields })
    expect(parseScan(`]C1${GS}${data}\n`)).toMatchObject({ kind: 'gs1', symbology: ']C1', fields })
  })

  it('reads hand-typed HRI, with or without spaces', () => {
    expect(parseScan(`(01)${GTIN}(10)R2405`)).toMatchObject({ kind: 'gs1', fields: { '01': GTIN, '10': 'R2405' } })
    expect(parseScan(`(01) ${GTIN} (10) R2405 (17) 281231`)).toMatchObject({ kind: 'gs1', fields: { '01': GTIN, '10': 'R2405', '17': '281231' } })
    expect(parseScan(`(01)${GTIN}(10)A(B)`)).toMatchObject({ kind: 'gs1', fields: { '10': 'A(B)' } })
  })

  it('plain symbologies give text', () => {
    expect(parseScan(']C0B:A-03-2')).toEqual({ kind: 'text', symbology: ']C0', text: 'B:A-03-2' })
    expect(parseScan(`]E0${GTIN13}`)).toEqual({ kind: 'text', symbology: ']E0', text: GTIN13 })
    expect(parseScan('GB-8812')).toEqual({ kind: 'text', symbology: null, text: 'GB-8812' })
  })

  it('bad GS1 data gets a reason', () => {
    expect(parseScan('')).toEqual({ kind: 'invalid', symbology: null, reason: 'nothing was scanned', problem: { code: 'scan_empty' } })
    expect(parseScan(']C1')).toEqual({ kind: 'invalid', symbology: ']C1', reason: 'nothing after the ]C1 prefix', problem: { code: 'scan_empty' } })
    expect(parseScan(`]C101${GTIN.slice(0, -1)}3`)).toMatchObject({ kind: 'invalid', reason: expect.stringContaining('check digit should be 2, not 3') })
    expect(parseScan(`]C101${GTIN.slice(0, 9)}`)).toMatchObject({ kind: 'invalid', reason: '(01) GTIN is cut short: 14 digits needed, 9 found', problem: { code: 'scan_gs1_field_invalid', params: { ai: '01' } } })
    expect(parseScan(`]C101${GTIN}15261231`)).toMatchObject({ kind: 'invalid', reason: expect.stringContaining('unsupported GS1 AI at "1526') })
    expect(parseScan(`]C110${'A'.repeat(21)}`)).toMatchObject({ kind: 'invalid', reason: '(10) lot must be 1 to 20 characters (got 21)' })
    expect(parseScan(`]C101${GTIN}10A${GS}10B`)).toMatchObject({ kind: 'invalid', reason: '(10) lot appears twice with different values' })
    expect(parseScan(`]C101${GTIN}10A${GS}10A`)).toMatchObject({ kind: 'gs1', fields: { '10': 'A' } })
    expect(parseScan('(15)261231')).toMatchObject({ kind: 'invalid', reason: 'AI (15) is not one Lumenyard reads', problem: { code: 'scan_gs1_unreadable' } })
    expect(parseScan(`]C117261332`)).toMatchObject({ kind: 'invalid', reason: expect.stringContaining('month must be 01 to 12') })
  })
})

describe('classifyScan', () => {
  it('GS1 data: gtin, lot, count, sscc', () => {
    expect(classifyScan(`]C101${GTIN}10R2405`)).toEqual({ kind: 'gs1', fields: { '01': GTIN, '10': 'R2405' }, gtin: GTIN, lot: 'R2405', warnings: [] })
    // a pallet: (02) names the item inside, (37) how many
    const pallet = classifyScan(`]C100${SSCC}02${GTIN}3740${GS}10R2405`)
    expect(pallet).toMatchObject({ kind: 'gs1', gtin: GTIN, count: 40, sscc: SSCC, lot: 'R2405', warnings: [] })
  })

  it('GS1 pairing breaches on a scanned label are warnings, not refusals', () => {
    // source: GS1 Syntax Dictionary, 01 ex 37 (bwip-js barcode.ps, read)
    const scan = classifyScan(`]C101${GTIN}3712`)
    expect(scan.kind).toBe('gs1')
    expect(scan.kind === 'gs1' && scan.warnings).toEqual([
      { code: 'scan_pair_count_with_gtin' }, { code: 'scan_pair_count_needs_contained' }, { code: 'scan_pair_count_needs_sscc' },
    ])
  })

  it('bare GTINs of every length, normalised to 14 digits', () => {
    // sources: bwip-js barcode.ps EAN-8, UPC-A, EAN-13 EXAM lines (read); GTIN-14 from GS1 guidance (from memory)
    expect(classifyScan('95200002')).toEqual({ kind: 'gtin', gtin: '00000095200002', scanned: '95200002' })
    expect(classifyScan('012345000058')).toEqual({ kind: 'gtin', gtin: '00012345000058', scanned: '012345000058' })
    expect(classifyScan(`]E0${GTIN13}`)).toEqual({ kind: 'gtin', gtin: GTIN, scanned: GTIN13 })
    expect(classifyScan(GTIN)).toEqual({ kind: 'gtin', gtin: GTIN, scanned: GTIN })
  })

  it('a GTIN-length number with a wrong check digit is refused with the reason', () => {
    expect(classifyScan('9506000134353')).toEqual({
      kind: 'invalid', reason: '9506000134353: GTIN-13 check digit should be 2, not 3',
      problem: { code: 'check_digit_wrong', params: { label: 'GTIN-13', expected: 2, actual: 3 } },
    })
    expect(classifyScan(']E0ABC')).toMatchObject({ kind: 'invalid' })
  })

  it('our bin labels, in either case', () => {
    expect(BIN_PREFIX).toBe('B:')
    expect(classifyScan('B:A-03-2')).toEqual({ kind: 'bin', code: 'A-03-2' })
    expect(classifyScan(']C0B:A-03-2\r')).toEqual({ kind: 'bin', code: 'A-03-2' })
    expect(classifyScan('b:A-03-2')).toEqual({ kind: 'bin', code: 'A-03-2' })
    expect(classifyScan('BIN/A-03-2', { binPrefix: 'BIN/' })).toEqual({ kind: 'bin', code: 'A-03-2' })
    expect(classifyScan('B:')).toMatchObject({ kind: 'invalid', reason: expect.stringContaining('bin code "" must be') })
    expect(classifyScan('B:A 03')).toMatchObject({ kind: 'invalid' })
  })

  it('our lot labels', () => {
    expect(LOT_PREFIX).toBe('L:')
    expect(classifyScan('L:GB-8812|R2405')).toEqual({ kind: 'lot', itemSku: 'GB-8812', lotCode: 'R2405' })
    expect(classifyScan('L:GB-8812R2405')).toEqual({
      kind: 'invalid', reason: 'lot label L:GB-8812R2405: no "|" between SKU and lot code', problem: { code: 'scan_lot_label_invalid', params: { text: 'L:GB-8812R2405' } },
    })
    expect(classifyScan('L:GB-8812|R 24')).toMatchObject({ kind: 'invalid', reason: expect.stringContaining('(10) lot may only hold') })
    expect(classifyScan('L:|R2405')).toMatchObject({ kind: 'invalid', reason: expect.stringContaining('SKU "" must be') })
  })

  it('SKUs, and what is none of these', () => {
    expect(classifyScan('GB-8812-DEC')).toEqual({ kind: 'sku', sku: 'GB-8812-DEC' })
    expect(classifyScan('4471')).toEqual({ kind: 'sku', sku: '4471' })
    expect(classifyScan('https://yard.example/items/42')).toMatchObject({ kind: 'invalid', reason: expect.stringContaining('is not a Lumenyard code') })
    expect(classifyScan('two words')).toMatchObject({ kind: 'invalid' })
    // the square code of item and lot labels printed before it carried the bars' data: an item page's address
    expect(classifyScan('https://yard.example/stock/items/42')).toMatchObject({ kind: 'invalid', reason: expect.stringContaining('scan the bars') })
    expect(classifyScan('  \r\n')).toEqual({ kind: 'invalid', reason: 'nothing was scanned', problem: { code: 'scan_empty' } })
  })
})

describe('label payloads read back as what they label', () => {
  it('bin', () => {
    const label = binLabelPayload('A-03-2')
    expect(label).toEqual({ bwip: { bcid: 'code128', text: 'B:A-03-2' }, hri: 'B:A-03-2', data: 'B:A-03-2' })
    expect(classifyScan(label.data)).toEqual({ kind: 'bin', code: 'A-03-2' })
    expect(() => binLabelPayload('A 03')).toThrow(/bin code "A 03" must be/)
  })

  it('lot with and without GTIN', () => {
    const gs1 = lotLabelPayload({ sku: 'GB-8812', lotCode: 'R2405', gtin: GTIN13 })
    expect(gs1.bwip).toEqual({ bcid: 'gs1-128', text: `(01)${GTIN}(10)R2405`, parse: true })
    expect(classifyScan(`]C1${gs1.data}`)).toMatchObject({ kind: 'gs1', gtin: GTIN, lot: 'R2405' })
    const own = lotLabelPayload({ sku: 'GB-8812', lotCode: 'R2405', gtin: null })
    expect(own.data).toBe('L:GB-8812|R2405')
    expect(classifyScan(own.data)).toEqual({ kind: 'lot', itemSku: 'GB-8812', lotCode: 'R2405' })
    expect(() => lotLabelPayload({ sku: 'GB-8812', lotCode: 'R 1' })).toThrow(RangeError)
    expect(() => lotLabelPayload({ sku: 'GB-8812', lotCode: 'R1', gtin: '9506000134353' })).toThrow('GTIN-13 check digit should be 2, not 3')
  })

  it('item with and without GTIN', () => {
    const gs1 = itemLabelPayload({ sku: 'GB-8812', gtin: '95200002' })
    expect(gs1.hri).toBe('(01)00000095200002')
    expect(classifyScan(`]C1${gs1.data}`)).toMatchObject({ kind: 'gs1', gtin: '00000095200002' })
    const own = itemLabelPayload({ sku: 'GB-8812' })
    expect(classifyScan(own.data)).toEqual({ kind: 'sku', sku: 'GB-8812' })
    // a SKU that would scan as a GTIN cannot be printed as a SKU label
    expect(() => itemLabelPayload({ sku: '12345670' })).toThrow(/would read as a GTIN/)
  })
})

describe('round trips: buildElementString → scanner data → parseScan', () => {
  // source: GS1 character set 82 (GS1 Gen Specs figure 7.11-1, from memory; bwip-js barcode.ps cset82, read)
  const CSET82 = `!"%&'()*+,-./0123456789:;<=>?ABCDEFGHIJKLMNOPQRSTUVWXYZ_abcdefghijklmnopqrstuvwxyz`
  const digits = (min: number, max = min) => fc.string({ unit: fc.constantFrom(...'0123456789'), minLength: min, maxLength: max })
  const text = (max: number) => fc.string({ unit: fc.constantFrom(...CSET82), minLength: 1, maxLength: max })
  const gtin = digits(13).map(withCheckDigit)
  const sscc = digits(17).map(withCheckDigit)
  const date = fc.tuple(fc.integer({ min: 0, max: 99 }), fc.integer({ min: 1, max: 12 }), fc.integer({ min: 0, max: 28 }))
    .map((parts) => parts.map((n) => String(n).padStart(2, '0')).join(''))
  // The three shapes GS1 allows among our AIs: a trade item, a logistic unit with contents, an SSCC alone.
  const tradeItem = fc.record({ '01': gtin, '10': text(20), '11': date, '17': date, '21': text(20), '400': text(30) }, { requiredKeys: ['01'] })
  const logisticUnit = fc.record({ '00': sscc, '02': gtin, '37': digits(1, 8), '10': text(20), '11': date, '17': date, '400': text(30) }, { requiredKeys: ['00', '02', '37'] })
  const ssccOnly = fc.record({ '00': sscc, '400': text(30) }, { requiredKeys: ['00'] })
  const anyFields: fc.Arbitrary<Gs1Fields> = fc.oneof(tradeItem, logisticUnit, ssccOnly)

  it('scanner data, with and without ]C1, with a leading GS', () => {
    fc.assert(fc.property(anyFields, (fields) => {
      const built = buildElementString(fields)
      if (!built.ok) throw new Error(built.errors.map((e) => e.message).join('; '))
      for (const scanned of [built.raw, `]C1${built.raw}`, `]d2${built.raw}`, `${GS}${built.raw}\r\n`]) {
        const parsed = parseScan(scanned)
        expect(parsed.kind === 'gs1' && parsed.fields).toEqual(fields)
      }
      expect(classifyScan(`]C1${built.raw}`)).toMatchObject({ kind: 'gs1', fields, warnings: [] })
    }), { numRuns: 500 })
  })

  it('HRI typed back in', () => {
    const unambiguous = anyFields.filter((f) => Object.values(f).every((v) => typeof v === 'string' && !/\(\d{2,4}\)/.test(v)))
    fc.assert(fc.property(unambiguous, (fields) => {
      const built = buildElementString(fields)
      expect(built.ok).toBe(true)
      const parsed = built.ok ? parseScan(built.hri) : null
      expect(parsed?.kind === 'gs1' && parsed.fields).toEqual(fields)
    }), { numRuns: 300 })
  })

  it('our own lot and bin labels', () => {
    const sku = fc.stringMatching(/^[A-Za-z0-9][A-Za-z0-9._/-]{0,39}$/).filter((s) => !/^(\d{8}|\d{12,14})$/.test(s))
    const bin = fc.stringMatching(/^[A-Za-z0-9][A-Za-z0-9._/-]{0,31}$/)
    fc.assert(fc.property(sku, text(20), bin, (s, lot, b) => {
      expect(classifyScan(lotLabelPayload({ sku: s, lotCode: lot }).data)).toEqual({ kind: 'lot', itemSku: s, lotCode: lot })
      expect(classifyScan(binLabelPayload(b).data)).toEqual({ kind: 'bin', code: b })
      expect(classifyScan(itemLabelPayload({ sku: s }).data)).toEqual({ kind: 'sku', sku: s })
    }), { numRuns: 300 })
  })
})
