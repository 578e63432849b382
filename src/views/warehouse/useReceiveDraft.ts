// The receipt being put together at the dock: rows per PO line, bin and lot, filled by scans or by
// hand, posted once with an Idempotency-Key that stays the same until the post succeeds, so a retry
// after a lost answer never receives twice.
import { newIdempotencyKey } from '@/api/idempotencyKey'
import { computed, ref } from 'vue'
import { problem, type Problem } from '@shared/errors/errorCodes'
import { readReceivingScan, type ScanLine } from '@shared/purchasing/receiveScan'
import type { ReceiveResult, ReceivingContext } from '@shared/schemas/purchasingViews'
import { purchasingApi } from '@/api/purchasing'

export interface DraftRow {
  key: number
  poLineId: number
  binId: number | null
  lotCode: string
  qty: number
  damagedQty: number
  reason: string
}

export function useReceiveDraft(context: () => ReceivingContext | null) {
  const rows = ref<DraftRow[]>([])
  const binId = ref<number | null>(null)
  let idempotencyKey = newIdempotencyKey()
  let seq = 0

  const lineOf = (id: number) => context()?.po.lines.find((l) => l.id === id)
  const draftQty = (poLineId: number) => rows.value.filter((r) => r.poLineId === poLineId).reduce((s, r) => s + r.qty, 0)
  const scanLines = computed<ScanLine[]>(() =>
    (context()?.po.lines ?? []).map((l) => ({ poLineId: l.id, sku: l.sku, gtin: l.gtin, vendorSku: l.vendorSku, open: l.qtyOrdered - l.qtyReceived - draftQty(l.id) })),
  )

  function add(poLineId: number, qty: number, lotCode: string | null): void {
    const lot = lotCode ?? ''
    const row = rows.value.find((r) => r.poLineId === poLineId && r.binId === binId.value && r.lotCode === lot)
    if (row) row.qty += qty
    else rows.value.push({ key: ++seq, poLineId, binId: binId.value, lotCode: lot, qty, damagedQty: 0, reason: '' })
  }

  /** Applies one scan: adds units to a row, or switches the bin; says what happened for the screen. */
  function scan(raw: string): { kind: 'line'; sku: string; qty: number; lot: string | null; warnings: Problem[] } | { kind: 'bin'; code: string } | { kind: 'error'; problem: Problem } {
    const result = readReceivingScan(raw, scanLines.value)
    if (result.kind === 'error') return { kind: 'error', problem: result.problem }
    if (result.kind === 'bin') {
      const bin = context()?.bins.find((b) => b.code.toUpperCase() === result.code.toUpperCase())
      if (!bin) return { kind: 'error', problem: problem('bin_code_not_found', { bin: result.code }) }
      binId.value = bin.id
      return { kind: 'bin', code: bin.code }
    }
    add(result.poLineId, result.qty, result.lotCode)
    return { kind: 'line', sku: lineOf(result.poLineId)?.sku ?? '', qty: result.qty, lot: result.lotCode, warnings: result.warnings }
  }

  function addByHand(poLineId: number): void {
    rows.value.push({ key: ++seq, poLineId, binId: binId.value, lotCode: '', qty: 1, damagedQty: 0, reason: '' })
  }

  async function post(note: string | null): Promise<ReceiveResult> {
    const body = {
      note,
      lines: rows.value.map((r) => ({ poLineId: r.poLineId, binId: r.binId, lotCode: r.lotCode || null, qty: r.qty, damagedQty: r.damagedQty, reason: r.reason || null })),
    }
    const result = await purchasingApi.receive(context()!.po.id, body, idempotencyKey)
    idempotencyKey = newIdempotencyKey()
    rows.value = []
    return result
  }

  return { rows, binId, scan, addByHand, post, lineOf }
}
