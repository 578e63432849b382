// Transfer forms' drafts and how a scan fills them.
import type { LookupAnswer } from '@shared/schemas/stockViews'

export interface ShipLineDraft {
  itemId: number | null
  lotId: number | null
  fromBinId: number | null
  qty: number | null
}

export const blankShipLine = (): ShipLineDraft => ({ itemId: null, lotId: null, fromBinId: null, qty: null })

/**
 * A scanned bin fills the last line's "from" bin; a scanned item or lot fills the last line, or starts
 * a new line when the last one already holds another item (scan bin, scan item, type quantity, repeat).
 */
export function scanIntoShipLines(lines: ShipLineDraft[], a: LookupAnswer): void {
  let last = lines[lines.length - 1]
  if (a.item) {
    if (last.itemId !== null && (last.itemId !== a.item.id || last.lotId !== (a.lot?.id ?? null))) {
      lines.push({ ...blankShipLine(), fromBinId: last.fromBinId })
      last = lines[lines.length - 1]
    }
    last.itemId = a.item.id
    last.lotId = a.lot?.id ?? null
  }
  if (a.bin) last.fromBinId = a.bin.id
}
