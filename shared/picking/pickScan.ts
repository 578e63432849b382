// Checks a picker's scans against the pick line in front of them: bin, then item (and lot), then
// quantity. The handheld runs these for instant feedback (also while offline); the server runs the
// same checks on every confirmation, so a wrong bin, item or lot never reaches the stock ledger. The handheld
// hands over each scan already read (its scan box reads it once); the server passes the text it stored.
import { normalizeGtin } from '../barcode/checkDigit.js'
import { asRead, type ScanClass, type ScanInput } from '../barcode/scan.js'

/** What the line asks for. */
export interface PickTarget {
  binCode: string
  sku: string
  gtin: string | null
  /** The lot to take; null when the item is not lot-tracked on this line. */
  lotCode: string | null
}

export type PickScanProblem = 'unreadable' | 'wrong_bin' | 'wrong_item' | 'wrong_lot' | 'not_a_bin' | 'not_an_item'

export type BinCheck = { ok: true } | { ok: false; problem: PickScanProblem; scanned: string }

export type ItemCheck =
  | {
      ok: true
      /** The scan also proved the lot (GS1 (10) or our lot label). */
      lotConfirmed: boolean
      /** A count the scan carried (GS1 (37)), to prefill the quantity. */
      count?: number
    }
  | { ok: false; problem: PickScanProblem; scanned: string }

export type LotCheck = { ok: true } | { ok: false; problem: PickScanProblem; scanned: string }

// A keyboard wedge under Caps Lock flips letters, so codes compare without case.
const same = (a: string, b: string) => a.trim().toUpperCase() === b.trim().toUpperCase()

function gtinMatches(scanned: string, target: PickTarget): boolean {
  if (!target.gtin) return false
  const want = normalizeGtin(target.gtin)
  const got = normalizeGtin(scanned)
  return want.ok && got.ok && want.gtin14 === got.gtin14
}

function describe(scan: ScanClass, raw: string): string {
  switch (scan.kind) {
    case 'bin': return scan.code
    case 'lot': return `${scan.itemSku} / ${scan.lotCode}`
    case 'sku': return scan.sku
    case 'gtin': return scan.gtin
    case 'gs1': return [scan.gtin, scan.lot].filter(Boolean).join(' / ') || raw.trim()
    default: return raw.trim()
  }
}

/** The bin label (B:code); a bin code typed by hand reads as a SKU-shaped text and counts too. */
export function checkBinScan(input: ScanInput, target: PickTarget): BinCheck {
  const { raw, scan } = asRead(input)
  const scanned = describe(scan, raw)
  if (scan.kind === 'invalid') return { ok: false, problem: 'unreadable', scanned }
  const code = scan.kind === 'bin' ? scan.code : scan.kind === 'sku' ? scan.sku : null
  if (code === null) return { ok: false, problem: 'not_a_bin', scanned }
  return same(code, target.binCode) ? { ok: true } : { ok: false, problem: 'wrong_bin', scanned }
}

function checkGs1Item(scan: Extract<ScanClass, { kind: 'gs1' }>, target: PickTarget, raw: string): ItemCheck {
  const scanned = describe(scan, raw)
  if (!scan.gtin) return { ok: false, problem: 'not_an_item', scanned }
  if (!gtinMatches(scan.gtin, target)) return { ok: false, problem: 'wrong_item', scanned }
  if (scan.lot !== undefined && target.lotCode !== null && !same(scan.lot, target.lotCode)) {
    return { ok: false, problem: 'wrong_lot', scanned }
  }
  const lotConfirmed = target.lotCode === null || scan.lot !== undefined
  return { ok: true, lotConfirmed, ...(scan.count !== undefined && { count: scan.count }) }
}

/** The item: GS1 data with (01)/(02), a bare GTIN, our lot label (L:SKU|lot) or the SKU. */
export function checkItemScan(input: ScanInput, target: PickTarget): ItemCheck {
  const { raw, scan } = asRead(input)
  const scanned = describe(scan, raw)
  switch (scan.kind) {
    case 'invalid': return { ok: false, problem: 'unreadable', scanned }
    case 'bin': return { ok: false, problem: 'not_an_item', scanned }
    case 'gs1': return checkGs1Item(scan, target, raw)
    case 'gtin': return gtinMatches(scan.gtin, target) ? { ok: true, lotConfirmed: target.lotCode === null } : { ok: false, problem: 'wrong_item', scanned }
    case 'sku': return same(scan.sku, target.sku) ? { ok: true, lotConfirmed: target.lotCode === null } : { ok: false, problem: 'wrong_item', scanned }
    case 'lot':
      if (!same(scan.itemSku, target.sku)) return { ok: false, problem: 'wrong_item', scanned }
      if (target.lotCode !== null && !same(scan.lotCode, target.lotCode)) return { ok: false, problem: 'wrong_lot', scanned }
      return { ok: true, lotConfirmed: true }
  }
}

/** The lot, when the item scan did not carry it: our lot label, GS1 data with (10), or the lot code typed. */
export function checkLotScan(input: ScanInput, target: PickTarget): LotCheck {
  if (target.lotCode === null) return { ok: true }
  const read = asRead(input)
  const { raw, scan } = read
  const scanned = describe(scan, raw)
  if (scan.kind === 'lot' || scan.kind === 'gs1') {
    const item = checkItemScan(read, target)
    if (!item.ok) return item
    return item.lotConfirmed ? { ok: true } : { ok: false, problem: 'wrong_lot', scanned }
  }
  // A lot code typed by hand reads as a SKU-shaped text (or digits); lot codes are GS1 (10) text.
  const typed = raw.trim()
  if (typed.length === 0) return { ok: false, problem: 'unreadable', scanned }
  return same(typed, target.lotCode) ? { ok: true } : { ok: false, problem: 'wrong_lot', scanned }
}

export interface ConfirmationScans {
  binScan: string
  itemScan?: string | null
  lotScan?: string | null
}

/** All checks of one confirmation, in the order the picker made them; the first problem wins. */
export function checkConfirmationScans(scans: ConfirmationScans, target: PickTarget, qty: number): { ok: true } | { ok: false; problem: PickScanProblem; scanned: string } {
  const bin = checkBinScan(scans.binScan, target)
  if (!bin.ok) return bin
  // Nothing taken (a line closed short): the bin scan proves the picker stood there.
  if (qty === 0 && !scans.itemScan) return { ok: true }
  if (!scans.itemScan) return { ok: false, problem: 'unreadable', scanned: '' }
  const item = checkItemScan(scans.itemScan, target)
  if (!item.ok) return item
  if (item.lotConfirmed) return { ok: true }
  // A lot line confirmed without any lot scan is as wrong as the wrong lot.
  if (!scans.lotScan?.trim()) return { ok: false, problem: 'wrong_lot', scanned: '' }
  return checkLotScan(scans.lotScan, target)
}
