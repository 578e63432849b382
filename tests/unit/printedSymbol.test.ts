// How barcodes are laid on paper (shared/barcode/symbolLayout.ts): module widths a handheld reads,
// quiet zones inside the drawing, and a drawing that a general-purpose decoder (ZXing) reads back.
import bwipjs from 'bwip-js'
import { PNG } from 'pngjs'
import { describe, expect, it } from 'vitest'
import { binLabelPayload, classifyScan, itemLabelPayload, lotLabelPayload, type LabelPayload } from '../../shared/barcode/scan.js'
import { chooseModuleMm, layOut, type PrintedSymbol, type SymbolModules } from '../../shared/barcode/symbolLayout.js'
import { decodePng } from '../support/decodePng.js'

const linear = (p: LabelPayload): SymbolModules => ({ kind: 'linear', widths: (bwipjs.raw(p.bwip as never)[0] as { sbs: number[] }).sbs })
const qr = (text: string): SymbolModules => {
  const m = bwipjs.raw({ bcid: 'qrcode', text } as never)[0] as { pixs: number[]; pixx: number }
  return { kind: 'qr', size: m.pixx, dark: m.pixs }
}

/** The drawing's dark rectangles ("M x y h w v h h-w z") painted at `px` pixels per module, quiet zones included. */
function paint(s: PrintedSymbol, px = 3): { png: Buffer; dark: boolean[][] } {
  const w = s.across * px
  const h = Math.ceil(s.tall * px)
  const dark = Array.from({ length: h }, () => new Array<boolean>(w).fill(false))
  for (const m of s.path.matchAll(/M([\d.]+) ([\d.]+)h([\d.]+)v([\d.]+)/g)) {
    const [x, y, rw, rh] = m.slice(1).map(Number)
    for (let yy = Math.round(y * px); yy < Math.round((y + rh) * px); yy++) for (let xx = x * px; xx < (x + rw) * px; xx++) dark[yy][xx] = true
  }
  const png = new PNG({ width: w, height: h })
  dark.forEach((row, y) => row.forEach((d, x) => png.data.set(d ? [0, 0, 0, 255] : [255, 255, 255, 255], (y * w + x) * 4)))
  return { png: PNG.sync.write(png), dark }
}

const GTIN13 = '9506000134352' // source: GS1 guidance documents' example GTIN (from memory); verified in gs1CheckDigit.test.ts

describe('module width', () => {
  it('never goes below 0.25 mm, in whole 300 dpi dots, and is larger where there is room', () => {
    // source: GS1 General Specifications §5.12.3 symbol specification tables (smallest X 0.250 mm, from memory); 1 in = 25.4 mm
    expect(chooseModuleMm(143, 60)).toBeCloseTo(4 * 25.4 / 300, 6) // 143 × 0.3387 = 48.4 mm fits 60
    expect(chooseModuleMm(143, 40)).toBeCloseTo(3 * 25.4 / 300, 6) // 0.254 mm: 36.3 mm
    expect(chooseModuleMm(143, 36)).toBeNull() // 143 × 0.254 = 36.3 mm does not fit 36 mm: refused, not shrunk
    expect(chooseModuleMm(33, 40, 10)).toBeCloseTo(10 * 25.4 / 300, 6)
  })
})

describe('quiet zones and size', () => {
  it('keeps 10 empty modules each side of Code 128 and GS1-128, inside the drawing', () => {
    // source: ISO/IEC 15417 (Code 128) and GS1 General Specifications §5.4 (GS1-128): quiet zone 10X each side (from memory)
    for (const p of [binLabelPayload('A-03-2'), itemLabelPayload({ sku: 'GB-8812', gtin: GTIN13 })]) {
      const s = layOut(linear(p), { maxWidthMm: 80, barHeightMm: 9 })!
      const { dark } = paint(s, 1)
      const first = dark[0].indexOf(true)
      const last = dark[0].lastIndexOf(true)
      expect(first).toBe(10)
      expect(s.across - 1 - last).toBe(10)
      expect(s.widthMm).toBeCloseTo(s.across * s.moduleMm, 1)
      expect(s.heightMm).toBeCloseTo(9, 1)
    }
  })

  it('keeps 4 empty modules all round a QR Code', () => {
    // source: ISO/IEC 18004 (QR Code): quiet zone 4X on all four sides (from memory)
    const s = layOut(qr('B:A-03-2'), { maxWidthMm: 20, maxDots: 5 })!
    const { dark } = paint(s, 1)
    expect(dark.slice(0, 4).flat().some(Boolean)).toBe(false)
    expect(dark.slice(-4).flat().some(Boolean)).toBe(false)
    expect(dark.map((row) => row.indexOf(true)).filter((i) => i >= 0).reduce((a, b) => Math.min(a, b))).toBe(4)
    expect(s.across).toBe(21 + 8) // version 1: 21 modules (ISO/IEC 18004, from memory)
  })
})

describe('what is drawn decodes (ZXing @zxing/library) to what the scan parser accepts', () => {
  const cases: [string, LabelPayload, (c: ReturnType<typeof classifyScan>) => void][] = [
    ['bin', binLabelPayload('A-03-2'), (c) => expect(c).toEqual({ kind: 'bin', code: 'A-03-2' })],
    ['item with GTIN', itemLabelPayload({ sku: 'GB-8812', gtin: GTIN13 }), (c) => expect(c).toMatchObject({ kind: 'gs1', gtin: `0${GTIN13}` })],
    ['item without GTIN', itemLabelPayload({ sku: 'GB-8812-DEC' }), (c) => expect(c).toEqual({ kind: 'sku', sku: 'GB-8812-DEC' })],
    ['lot with GTIN', lotLabelPayload({ sku: 'GB-8812', lotCode: 'R2405', gtin: GTIN13 }), (c) => expect(c).toMatchObject({ kind: 'gs1', gtin: `0${GTIN13}`, lot: 'R2405' })],
    ['lot without GTIN', lotLabelPayload({ sku: 'GB-8812-DEC', lotCode: 'R2405' }), (c) => expect(c).toEqual({ kind: 'lot', itemSku: 'GB-8812-DEC', lotCode: 'R2405' })],
  ]
  for (const [name, payload, check] of cases) {
    it(`${name}: the bars and the QR Code beside them`, () => {
      const bars = decodePng(paint(layOut(linear(payload), { maxWidthMm: 100, barHeightMm: 10 })!).png, 'code128')
      check(classifyScan(bars))
      const square = decodePng(paint(layOut(qr(payload.data), { maxWidthMm: 40, maxDots: 6 })!, 4).png, 'qrcode')
      expect(square).toBe(payload.data) // the QR Code holds exactly what the bars send
      check(classifyScan(square))
    })
  }
})
