// From a classified scan (scan.ts) to the stock lookup the server answers (GET /api/stock/lookup):
// which item, lot or bin a keyboard-wedge or camera scan names.
import { problem, type Problem } from '../errors/errorCodes.js'
import type { ScanClass } from './scan.js'

export type ScanLookup =
  | { ok: true; query: { kind: 'sku' | 'gtin' | 'bin'; code: string; lotCode?: string } }
  | { ok: false; problem: Problem }

export function scanLookup(scan: ScanClass): ScanLookup {
  switch (scan.kind) {
    case 'bin':
      return { ok: true, query: { kind: 'bin', code: scan.code } }
    case 'sku':
      return { ok: true, query: { kind: 'sku', code: scan.sku } }
    case 'lot':
      return { ok: true, query: { kind: 'sku', code: scan.itemSku, lotCode: scan.lotCode } }
    case 'gtin':
      return { ok: true, query: { kind: 'gtin', code: scan.gtin } }
    case 'gs1':
      // A pallet label (SSCC) without a GTIN names no single item.
      return scan.gtin
        ? { ok: true, query: { kind: 'gtin', code: scan.gtin, ...(scan.lot ? { lotCode: scan.lot } : {}) } }
        : { ok: false, problem: problem('scan_no_gtin') }
    case 'invalid':
      return { ok: false, problem: scan.problem }
  }
}
