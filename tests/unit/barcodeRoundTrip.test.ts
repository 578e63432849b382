// Labels rendered by bwip-js and read back by ZXing, the general-purpose decoder: what we print is what a scanner gets.
import bwipjs from 'bwip-js'
import fc from 'fast-check'
import { PNG } from 'pngjs'
import { describe, expect, it } from 'vitest'
import { withCheckDigit } from '../../shared/barcode/checkDigit.js'
import { buildElementString, GS, type Gs1Fields } from '../../shared/barcode/elementString.js'
import {
  binLabelPayload, classifyScan, itemLabelPayload, lotLabelPayload, parseScan, type LabelPayload,
} from '../../shared/barcode/scan.js'
import { decodePng } from '../support/decodePng.js'

const GTIN13 = '9506000134352' // source: GS1 guidance documents' example GTIN (from memory); verified in gs1CheckDigit.test.ts
const GTIN = '09506000134352'
const SSCC = '106141411234567897' // source: GS1 logistics label example (from memory); verified by hand in gs1CheckDigit.test.ts

async function render(bwip: LabelPayload['bwip'] | { bcid: 'qrcode' | 'ean13'; text: string }): Promise<Buffer> {
  // height (in mm) and the text line are for linear symbols; a QR code keeps its square shape.
  return bwipjs.toBuffer(bwip.bcid === 'qrcode' ? { ...bwip, scale: 3 } : { ...bwip, scale: 2, height: 12, includetext: true })
}

/** Fields ZXing read from a GS1-128 label, via our own scan parser. */
function fieldsOf(decoded: string): Gs1Fields | null {
  const parsed = parseScan(decoded)
  return parsed.kind === 'gs1' ? parsed.fields : null
}

describe('labels decode to their payloads (bwip-js 4.11.4 → ZXing @zxing/library 0.23.0)', () => {
  it('bin label, Code 128', async () => {
    const label = binLabelPayload('A-03-2')
    const decoded = decodePng(await render(label.bwip), 'code128')
    expect(decoded).toBe('B:A-03-2')
    expect(classifyScan(decoded)).toEqual({ kind: 'bin', code: 'A-03-2' })
  })

  it('item label with a GTIN, GS1-128 (01)', async () => {
    const label = itemLabelPayload({ sku: 'GB-8812', gtin: GTIN13 })
    const decoded = decodePng(await render(label.bwip), 'code128')
    // source: ZXing Code128Reader with ASSUME_GS1 reports a leading FNC1 as "]C1" (ISO/IEC 15424 identifier for GS1-128)
    expect(decoded).toBe(`]C1${label.data}`)
    expect(fieldsOf(decoded)).toEqual({ '01': GTIN })
    expect(classifyScan(decoded)).toMatchObject({ kind: 'gs1', gtin: GTIN })
  })

  it('the same GTIN as an EAN-13 symbol on the pack', async () => {
    const decoded = decodePng(await render({ bcid: 'ean13', text: GTIN13 }), 'ean13')
    expect(decoded).toBe(GTIN13)
    expect(classifyScan(decoded)).toEqual({ kind: 'gtin', gtin: GTIN, scanned: GTIN13 })
  })

  it('item label without a GTIN, Code 128 of the SKU', async () => {
    const label = itemLabelPayload({ sku: 'GB-8812-DEC' })
    expect(classifyScan(decodePng(await render(label.bwip), 'code128'))).toEqual({ kind: 'sku', sku: 'GB-8812-DEC' })
  })

  it('lot label with a GTIN, GS1-128 (01)+(10), parentheses in the lot code included', async () => {
    for (const lotCode of ['R2405', 'R24(B)']) {
      const label = lotLabelPayload({ sku: 'GB-8812', lotCode, gtin: GTIN13 })
      const decoded = decodePng(await render(label.bwip), 'code128')
      expect(decoded).toBe(`]C1${label.data}`)
      expect(fieldsOf(decoded)).toEqual({ '01': GTIN, '10': lotCode })
    }
  })

  it('lot label without a GTIN, Code 128 of our own format', async () => {
    const label = lotLabelPayload({ sku: 'GB-8812', lotCode: 'R2405' })
    const decoded = decodePng(await render(label.bwip), 'code128')
    expect(classifyScan(decoded)).toEqual({ kind: 'lot', itemSku: 'GB-8812', lotCode: 'R2405' })
  })

  it('pallet count label, GS1-128 (00)+(02)+(37)+(10), FNC1 only after the count', async () => {
    // source: GS1 Syntax Dictionary via bwip-js barcode.ps: (37) requires (00) and (02) (read); layout as bwip-js's EXAM
    // "(00)095287654321012346|(02)09521234543213(37)24(10)1234567ABCDEFG"
    const built = buildElementString({ '00': SSCC, '02': GTIN, '37': '40', '10': 'R2405' })
    if (!built.ok) throw new Error(built.errors.map((e) => e.message).join('; '))
    const decoded = decodePng(await render({ bcid: 'gs1-128', text: built.bwipText, parse: true }), 'code128')
    expect(decoded).toBe(`]C100${SSCC}02${GTIN}3740${GS}10R2405`)
    expect(fieldsOf(decoded)).toEqual({ '00': SSCC, '02': GTIN, '37': '40', '10': 'R2405' })
    expect(classifyScan(decoded)).toMatchObject({ kind: 'gs1', gtin: GTIN, count: 40, sscc: SSCC, lot: 'R2405', warnings: [] })
  })

  it('QR code with a link', async () => {
    const url = 'https://yard.example/items/42'
    expect(decodePng(await render({ bcid: 'qrcode', text: url }), 'qrcode')).toBe(url)
  })

  it('a wrong payload is not read back as the right one (the check can fail)', async () => {
    const decoded = decodePng(await render(binLabelPayload('A-03-2').bwip), 'code128')
    expect(decoded).not.toBe('B:A-03-3')
    // a blank (fully transparent, so white once composited) image holds no barcode
    const blank = PNG.sync.write(new PNG({ width: 80, height: 40 }))
    expect(() => decodePng(blank, 'code128')).toThrow()
  })
})

describe('random element strings survive printing and scanning', () => {
  const digits = (n: number) => fc.string({ unit: fc.constantFrom(...'0123456789'), minLength: n, maxLength: n })
  const lot = fc.string({ unit: fc.constantFrom(...'ABCDEFGHJKLMNPRSTUVWXYZ0123456789-./()'), minLength: 1, maxLength: 12 })
  const fields = fc.record({ '01': digits(13).map(withCheckDigit), '10': lot, '21': lot, '11': fc.constant('240101'), '17': fc.constant('281231') }, { requiredKeys: ['01'] })

  it('decoded text equals "]C1" + our scanner data, and parses back to the fields', async () => {
    // source: ZXing decodes independently of bwip-js; matching ]C1 + raw shows our GS placement equals the printed FNC1s
    await fc.assert(fc.asyncProperty(fields, async (f) => {
      const built = buildElementString(f)
      if (!built.ok) throw new Error(built.errors.map((e) => e.message).join('; '))
      const decoded = decodePng(await render({ bcid: 'gs1-128', text: built.bwipText, parse: true }), 'code128')
      expect(decoded).toBe(`]C1${built.raw}`)
      expect(fieldsOf(decoded)).toEqual(f)
    }), { numRuns: 50 })
  })
})
