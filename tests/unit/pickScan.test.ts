// Scan checks of a pick confirmation (shared/picking/pickScan.ts): bin, item, lot, in the order the picker scans.
import { describe, expect, it } from 'vitest'
import { readScan, type ReadScan } from '../../shared/barcode/scan.js'
import { checkBinScan, checkConfirmationScans, checkItemScan, checkLotScan, type PickTarget } from '../../shared/picking/pickScan.js'

const GTIN = '09506000134352' // source: GS1 guidance documents' example GTIN (from memory); check digit verified in gs1CheckDigit.test.ts
const GS = '\u001d' // source: GS1 General Specifications, FNC1 sent by scanners as ASCII 29
const block: PickTarget = { binCode: 'A-03-2', sku: 'GB8-CLR', gtin: GTIN, lotCode: 'R2405' }
const spacer: PickTarget = { binCode: 'B-01-1', sku: 'SP-14', gtin: null, lotCode: null }

describe('bin scans', () => {
  it('accepts our bin label and the code typed by hand, in either case (Caps Lock on a wedge)', () => {
    expect(checkBinScan('B:A-03-2', block)).toEqual({ ok: true })
    expect(checkBinScan('b:a-03-2\r\n', block)).toEqual({ ok: true })
    expect(checkBinScan('A-03-2', block)).toEqual({ ok: true })
  })

  it('refuses another bin and things that are no bin at all', () => {
    expect(checkBinScan('B:A-03-1', block)).toEqual({ ok: false, problem: 'wrong_bin', scanned: 'A-03-1' })
    expect(checkBinScan(GTIN, block)).toMatchObject({ ok: false, problem: 'not_a_bin' })
    expect(checkBinScan('B:', block)).toMatchObject({ ok: false, problem: 'unreadable' })
  })
})

describe('item scans', () => {
  it('reads GS1 (02) + (37) count + (10) lot from typed HRI and from raw data with FNC1', () => {
    // source: GS1 Barcode Syntax Dictionary: (37) count goes with (02), (10) lot is variable length
    expect(checkItemScan(`(02)${GTIN}(37)8(10)R2405`, block)).toEqual({ ok: true, lotConfirmed: true, count: 8 })
    expect(checkItemScan(`]C102${GTIN}378${GS}10R2405`, block)).toEqual({ ok: true, lotConfirmed: true, count: 8 })
  })

  it('takes the GTIN alone, or as GTIN-13 on an EAN-13 symbol, and then still needs the lot', () => {
    // source: GS1 General Specifications, a GTIN-13 is a GTIN-14 with a leading zero (from memory)
    expect(checkItemScan(GTIN, block)).toEqual({ ok: true, lotConfirmed: false })
    expect(checkItemScan(`]E0${GTIN.slice(1)}`, block)).toEqual({ ok: true, lotConfirmed: false })
  })

  it('refuses another item, another lot, and a bin label', () => {
    expect(checkItemScan('SP-14', block)).toEqual({ ok: false, problem: 'wrong_item', scanned: 'SP-14' })
    expect(checkItemScan(`(01)${GTIN}(10)R2311`, block)).toMatchObject({ ok: false, problem: 'wrong_lot' })
    expect(checkItemScan('L:GB8-CLR|R2311', block)).toMatchObject({ ok: false, problem: 'wrong_lot' })
    expect(checkItemScan('L:GB8-BLU|R2405', block)).toMatchObject({ ok: false, problem: 'wrong_item' })
    expect(checkItemScan('B:A-03-2', block)).toMatchObject({ ok: false, problem: 'not_an_item' })
    expect(checkItemScan('GB8-CLR', spacer)).toMatchObject({ ok: false, problem: 'wrong_item' })
  })

  it('takes a SKU for items without GTIN or lot, and our lot label as item and lot at once', () => {
    expect(checkItemScan('sp-14', spacer)).toEqual({ ok: true, lotConfirmed: true })
    expect(checkItemScan('L:GB8-CLR|R2405', block)).toEqual({ ok: true, lotConfirmed: true })
  })
})

describe('lot scans and whole confirmations', () => {
  it('checks the lot label, GS1 (10), or the lot code typed', () => {
    expect(checkLotScan('L:GB8-CLR|R2405', block)).toEqual({ ok: true })
    expect(checkLotScan(`(01)${GTIN}(10)R2405`, block)).toEqual({ ok: true })
    expect(checkLotScan('r2405', block)).toEqual({ ok: true })
    expect(checkLotScan('R2311', block)).toMatchObject({ ok: false, problem: 'wrong_lot' })
    expect(checkLotScan('anything', spacer)).toEqual({ ok: true })
  })

  it('runs bin → item → lot and stops at the first problem', () => {
    expect(checkConfirmationScans({ binScan: 'B:A-03-2', itemScan: GTIN, lotScan: 'R2405' }, block, 5)).toEqual({ ok: true })
    expect(checkConfirmationScans({ binScan: 'B:A-01-1', itemScan: 'SP-14' }, block, 5)).toMatchObject({ problem: 'wrong_bin' })
    expect(checkConfirmationScans({ binScan: 'B:A-03-2', itemScan: GTIN }, block, 5)).toMatchObject({ problem: 'wrong_lot' })
    expect(checkConfirmationScans({ binScan: 'B:A-03-2', itemScan: null }, block, 5)).toMatchObject({ problem: 'unreadable' })
    // closing a line short with nothing taken needs the bin only
    expect(checkConfirmationScans({ binScan: 'B:A-03-2' }, block, 0)).toEqual({ ok: true })
  })
})

describe('a scan read once at the edge', () => {
  // common practice: the handheld's scan box reads each scan once (readScan) and the checks take that reading,
  // so they judge the meaning they were handed and never read the text again; the server hands them the text.
  it('gives the same verdicts for the text and for the scan read from it', () => {
    const texts = ['B:A-03-2', 'A-03-1', `(02)${GTIN}(37)8(10)R2405`, `(01)${GTIN}`, 'L:GB8-CLR|R2405', 'L:GB8-CLR|R2406', 'GB8-CLR', 'B:', 'R2405']
    for (const text of texts) {
      expect(checkBinScan(readScan(text), block), text).toEqual(checkBinScan(text, block))
      expect(checkItemScan(readScan(text), block), text).toEqual(checkItemScan(text, block))
      expect(checkLotScan(readScan(text), block), text).toEqual(checkLotScan(text, block))
    }
  })

  it('judges the reading it is handed, not the text beside it', () => {
    // The text says bin A-03-1; the reading handed over says A-03-2: a check that read the text again would refuse it.
    const handed: ReadScan = { raw: 'B:A-03-1', scan: { kind: 'bin', code: 'A-03-2' } }
    expect(checkBinScan(handed, block)).toEqual({ ok: true })
    const lot: ReadScan = { raw: 'L:GB8-CLR|R2406', scan: { kind: 'lot', itemSku: 'GB8-CLR', lotCode: 'R2405' } }
    expect(checkItemScan(lot, block)).toEqual({ ok: true, lotConfirmed: true })
    expect(checkLotScan(lot, block)).toEqual({ ok: true })
  })
})
