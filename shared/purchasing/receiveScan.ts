// What one scan at the receiving dock means for the PO on screen: units of a line (with lot and
// count from GS1-128), a bin to put them in, or why it fits nothing on the order.
import { problem, type Problem } from '../errors/errorCodes.js'
import { normalizeGtin } from '../barcode/checkDigit.js'
import { classifyScan, type ScanClass } from '../barcode/scan.js'

export interface ScanLine {
  poLineId: number
  sku: string
  gtin: string | null
  vendorSku: string | null
  /** Units still expected; a scan goes to the first matching line with units open. */
  open: number
}

export type ReceivingScan =
  | { kind: 'line'; poLineId: number; qty: number; lotCode: string | null; sscc: string | null; warnings: Problem[] }
  | { kind: 'bin'; code: string }
  /** `message` in English for logs; `problem` for the screen. */
  | { kind: 'error'; message: string; problem: Problem }

const gtin14 = (g: string | null) => {
  if (!g) return null
  const n = normalizeGtin(g)
  return n.ok ? n.gtin14 : null
}

function pick(candidates: ScanLine[]): ScanLine | undefined {
  return candidates.find((l) => l.open > 0) ?? candidates[0]
}

function lineFor(scan: ScanClass, lines: readonly ScanLine[]): ScanLine | undefined {
  const same = (a: string | null, b: string) => !!a && a.toUpperCase() === b.toUpperCase()
  switch (scan.kind) {
    case 'gs1':
      return scan.gtin ? pick(lines.filter((l) => gtin14(l.gtin) === scan.gtin)) : undefined
    case 'gtin':
      return pick(lines.filter((l) => gtin14(l.gtin) === scan.gtin))
    case 'lot':
      return pick(lines.filter((l) => same(l.sku, scan.itemSku)))
    case 'sku':
      return pick(lines.filter((l) => same(l.sku, scan.sku) || same(l.vendorSku, scan.sku)))
    default:
      return undefined
  }
}

/** The code the scan read, as printed on the label. */
function codeOf(scan: ScanClass): string {
  if (scan.kind === 'gs1' || scan.kind === 'gtin') return scan.gtin ?? ''
  if (scan.kind === 'lot') return `${scan.itemSku} ${scan.lotCode}`
  return scan.kind === 'sku' ? scan.sku : ''
}

function describe(scan: ScanClass): string {
  if (scan.kind === 'gs1') return scan.gtin ? `GTIN ${scan.gtin}` : 'this GS1 label'
  if (scan.kind === 'gtin') return `GTIN ${scan.gtin}`
  if (scan.kind === 'lot') return `${scan.itemSku} lot ${scan.lotCode}`
  if (scan.kind === 'sku') return scan.sku
  return 'this code'
}

/** Reads a scan (or typed code) against the order's lines. */
export function readReceivingScan(raw: string, lines: readonly ScanLine[]): ReceivingScan {
  const scan = classifyScan(raw)
  if (scan.kind === 'invalid') return { kind: 'error', message: scan.reason, problem: scan.problem }
  if (scan.kind === 'bin') return { kind: 'bin', code: scan.code }
  if (scan.kind === 'gs1' && !scan.gtin) {
    return scan.sscc
      ? { kind: 'error', message: `SSCC ${scan.sscc} alone does not say what is on the pallet: scan its content label ((02) with (37))`, problem: problem('scan_sscc_only', { sscc: scan.sscc }) }
      : { kind: 'error', message: 'This GS1 label carries no GTIN.', problem: problem('scan_no_gtin') }
  }
  const line = lineFor(scan, lines)
  if (!line) return { kind: 'error', message: `${describe(scan)} is not on this purchase order.`, problem: problem('scan_not_on_order', { code: codeOf(scan) }) }
  const gs1 = scan.kind === 'gs1' ? scan : null
  const lotCode = gs1?.lot ?? (scan.kind === 'lot' ? scan.lotCode : null)
  const count = gs1?.count ?? 1
  if (!Number.isSafeInteger(count) || count < 1) return { kind: 'error', message: `A count of ${gs1?.fields['37']} units cannot be received.`, problem: problem('scan_count_invalid', { count: gs1?.fields['37'] ?? '' }) }
  return { kind: 'line', poLineId: line.poLineId, qty: count, lotCode, sscc: gs1?.sscc ?? null, warnings: gs1?.warnings ?? [] }
}
