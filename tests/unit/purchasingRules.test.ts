// Pure purchasing rules: PO statuses, pack rounding and money, over-receipt tolerance, the shower base
// spec line and what a dock scan means for the order on screen.
import { describe, expect, it } from 'vitest'
import { buildElementString, GS } from '../../shared/barcode/elementString.js'
import { lotLabelPayload } from '../../shared/barcode/scan.js'
import { canDo, refusal, statusAfterReceipt } from '../../shared/purchasing/poStatus.js'
import { formatPoNumber, lineTotal, orderTotal, packsFor } from '../../shared/purchasing/poMoney.js'
import { checkLineReceipt, overReceiptAllowance } from '../../shared/purchasing/receiptRules.js'
import { readReceivingScan, type ScanLine } from '../../shared/purchasing/receiveScan.js'
import { specText } from '../../shared/purchasing/specText.js'

describe('PO statuses', () => {
  it('allows each action only from its statuses', () => {
    expect(canDo('approve', 'draft')).toBe(true)
    expect(canDo('approve', 'approved')).toBe(false)
    expect(canDo('receive', 'approved')).toBe(false)
    expect(canDo('receive', 'partly_received')).toBe(true)
    expect(canDo('cancel', 'partly_received')).toBe(false)
    expect(canDo('close', 'received')).toBe(true)
    expect(refusal('edit', 'sent')).toBe('A sent purchase order cannot be changed; only draft ones can.')
    expect(refusal('edit', 'draft')).toBeNull()
    // English grammar (any style guide, common practice): "an" before a vowel sound, a list's last item after "or"
    expect(refusal('receive', 'approved')).toBe('An approved purchase order cannot be received; only sent or partly received ones can.')
    expect(refusal('close', 'draft')).toBe('A draft purchase order cannot be closed; only sent, partly received or received ones can.')
  })

  it('is received only when every line has all it ordered', () => {
    expect(statusAfterReceipt([{ qtyOrdered: 10, qtyReceived: 10 }, { qtyOrdered: 5, qtyReceived: 6 }])).toBe('received')
    expect(statusAfterReceipt([{ qtyOrdered: 10, qtyReceived: 10 }, { qtyOrdered: 5, qtyReceived: 4 }])).toBe('partly_received')
  })
})

describe('packs and money', () => {
  it('orders whole packs, at least the minimum', () => {
    // hand computed: 50 wanted, min 48, packs of 24 → ceil(50/24) = 3; 10 wanted, min 48 → 2 packs
    expect(packsFor(50, 24, 48)).toBe(3)
    expect(packsFor(10, 24, 48)).toBe(2)
    expect(packsFor(48, 24, 48)).toBe(2)
    expect(() => packsFor(0, 24)).toThrow(RangeError)
  })

  it('rounds each line half-up to cents and adds the rounded lines', () => {
    // 0.005 rounds up (half-up, common practice for invoices): 3 × 0.0015 = 0.0045 → 0.00; 1 × 0.005 → 0.01
    expect(lineTotal('0.0015', 3)).toBe('0.00')
    expect(lineTotal('0.0050', 1)).toBe('0.01')
    // three lines of 0.3333 × 1 = 0.33 each → 0.99, not 1.00 (the total is the sum of what is printed)
    expect(orderTotal([{ unitCost: '0.3333', qtyOrdered: 1 }, { unitCost: '0.3333', qtyOrdered: 1 }, { unitCost: '0.3333', qtyOrdered: 1 }])).toBe('0.99')
    expect(orderTotal([])).toBe('0.00')
  })

  it('numbers orders PO-year-five digits', () => {
    expect(formatPoNumber(2026, 42)).toBe('PO-2026-00042')
    expect(formatPoNumber(2026, 123456)).toBe('PO-2026-123456')
    expect(() => formatPoNumber(2026, 0)).toThrow(RangeError)
  })
})

describe('over-receipt', () => {
  it('allows 10 % over (rounded up, at least one unit) and only with a reason', () => {
    expect(overReceiptAllowance(60)).toBe(6)
    expect(overReceiptAllowance(72)).toBe(8) // 7.2 → 8
    expect(overReceiptAllowance(3)).toBe(1)
    const base = { qtyOrdered: 60, qtyReceived: 50, damagedQty: 0 }
    expect(checkLineReceipt({ ...base, qty: 10, hasReason: false })).toEqual({ ok: true, variance: null })
    expect(checkLineReceipt({ ...base, qty: 4, hasReason: false })).toEqual({ ok: true, variance: 'short' })
    expect(checkLineReceipt({ ...base, qty: 16, hasReason: false })).toMatchObject({ ok: false, field: 'reason' })
    expect(checkLineReceipt({ ...base, qty: 16, hasReason: true })).toEqual({ ok: true, variance: 'over' })
    expect(checkLineReceipt({ ...base, qty: 17, hasReason: true })).toMatchObject({ ok: false, field: 'qty' })
    expect(checkLineReceipt({ ...base, qty: 5, damagedQty: 5, hasReason: true })).toEqual({ ok: true, variance: 'damaged' })
  })
})

describe('shower base spec text', () => {
  it('reads the nested takeoff spec and the flat explanation inputs alike, in inches to the sixteenth', () => {
    // NIST SP 811 (1 in = 25.4 mm exactly): 1219 mm = 47.99 in → 48; 914 mm = 35.98 in → 36; 600 mm = 23.622 in
    // → 378/16 = 23 5/8; 610 mm = 24.016 in → 24; 457 mm = 17.992 in → 18 (hand computed, nearest 1/16)
    const nested = { widthMm: 1219, depthMm: 914, curb: { radiusMm: 600, arcDeg: 90 }, drain: { fromLeftMm: 610, fromBackMm: 457 }, entry: 'left', curbless: false }
    expect(specText(nested)).toBe('48 in × 36 in (width × depth); curved curb, radius 23 5/8 in, 90°; drain 24 in from left, 18 in from back; entry left')
    // 1524 mm = 60 in; 813 mm = 32.008 in → 32; 762 mm = 30 in; 406 mm = 15.984 in → 16 (hand computed)
    const flat = { widthMm: 1524, depthMm: 813, curb: 'straight', drainFromLeftMm: 762, drainFromBackMm: 406, entry: 'center' }
    expect(specText(flat)).toBe('60 in × 32 in (width × depth); curb straight; drain 30 in from left, 16 in from back; entry center')
    expect(specText({ widthMm: 900, depthMm: 900, curbless: true, drain: { fromLeftMm: 450, fromBackMm: 450 }, entry: 'right' })).toContain('curbless')
    expect(specText(null)).toBeNull()
  })

  it('writes a size typed in inches without float noise, in either unit, and never shortens it', () => {
    // 42 in and 48 in typed at the counter are stored as 42 × 25.4 and 48 × 25.4 mm; 48 × 25.4 is
    // 1219.1999999999998 in binary floating point (IEEE 754 double), which must never reach a vendor.
    const spec = { widthMm: 42 * 25.4, depthMm: 48 * 25.4, curb: { radiusMm: 48 * 25.4, arcDeg: 90 }, drain: { fromLeftMm: 21 * 25.4, fromBackMm: 24 * 25.4 }, entry: 'right', note: 'x'.repeat(300) }
    const inches = specText(spec, 'in')!
    expect(inches.startsWith('42 in × 48 in (width × depth); curved curb, radius 48 in, 90°; drain 21 in from left, 24 in from back; entry right')).toBe(true)
    // 1066.8 mm and 1219.2 mm: 42 × 25.4 and 48 × 25.4 to a tenth (hand computed)
    const mm = specText(spec, 'mm')!
    expect(mm.startsWith('1066.8 × 1219.2 mm (width × depth); curved curb, radius 1219.2 mm, 90°; drain 533.4 mm from left, 609.6 mm from back')).toBe(true)
    for (const text of [inches, mm]) {
      expect(text).not.toMatch(/\d\.\d{3,}/)
      expect(text.endsWith(`note: ${'x'.repeat(300)}`)).toBe(true)
    }
  })
})

describe('receiving scans', () => {
  const GTIN = '09506000134352' // source: GS1 guidance documents' example GTIN (from memory); checked in gs1CheckDigit.test.ts
  const SSCC = '106141411234567897' // source: GS1 logistics label example (from memory); checked in gs1CheckDigit.test.ts
  const lines: ScanLine[] = [
    { poLineId: 1, sku: 'GB-8812', gtin: '9506000134352', vendorSku: 'LK-8812', open: 0 },
    { poLineId: 2, sku: 'GB-8812', gtin: '9506000134352', vendorSku: 'LK-8812', open: 24 },
    { poLineId: 3, sku: 'SL-CLR', gtin: null, vendorSku: 'NB-77', open: 12 },
  ]

  it('reads (01) GTIN with (10) lot as one unit of that lot, on the first line still open', () => {
    // GS1-128 element string with FNC1 as GS (GS1 General Specifications §5.10)
    expect(readReceivingScan(`]C101${GTIN}10R2611${GS}`, lines)).toEqual({ kind: 'line', poLineId: 2, qty: 1, lotCode: 'R2611', sscc: null, warnings: [] })
    expect(readReceivingScan(`(01)${GTIN}(10)R2611`, lines)).toMatchObject({ kind: 'line', poLineId: 2, lotCode: 'R2611' })
  })

  it('reads a pallet label (00) SSCC with (02) content GTIN and (37) count as that many units', () => {
    const built = buildElementString({ '00': SSCC, '02': GTIN, '37': '48', '10': 'R2612' })
    expect(built.ok).toBe(true)
    if (!built.ok) return
    expect(readReceivingScan(`]C1${built.raw}`, lines)).toEqual({ kind: 'line', poLineId: 2, qty: 48, lotCode: 'R2612', sscc: SSCC, warnings: [] })
    expect(readReceivingScan(`(00)${SSCC}`, lines)).toMatchObject({ kind: 'error', message: expect.stringContaining('(02) with (37)') })
  })

  it('passes on the GS1 pairing warning for (37) with (01)', () => {
    // source: GS1 Barcode Syntax Dictionary: (37) goes with (02), not (01)
    const scan = readReceivingScan(`(01)${GTIN}(37)6`, lines)
    expect(scan).toMatchObject({ kind: 'line', qty: 6 })
    expect(scan.kind === 'line' && scan.warnings.length).toBeGreaterThan(0)
  })

  it('reads our own lot and bin labels, a SKU or a vendor SKU typed by hand', () => {
    expect(readReceivingScan(lotLabelPayload({ sku: 'SL-CLR', lotCode: 'B77' }).data, lines)).toMatchObject({ kind: 'line', poLineId: 3, lotCode: 'B77', qty: 1 })
    expect(readReceivingScan('B:A-01-1', lines)).toEqual({ kind: 'bin', code: 'A-01-1' })
    expect(readReceivingScan('nb-77', lines)).toMatchObject({ kind: 'line', poLineId: 3 })
    expect(readReceivingScan('SL-CLR', lines)).toMatchObject({ kind: 'line', poLineId: 3, lotCode: null })
  })

  it('says why a code fits nothing on the order', () => {
    expect(readReceivingScan('GB-9999', lines)).toEqual({ kind: 'error', message: 'GB-9999 is not on this purchase order.', problem: { code: 'scan_not_on_order', params: { code: 'GB-9999' } } })
    expect(readReceivingScan('', lines).kind).toBe('error')
  })
})
