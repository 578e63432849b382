// One confirmation on the handheld: bin → item (and lot) → quantity, each scan checked at once
// against the line with the same shared rules the server applies. A wrong scan is refused with a
// clear message and a buzz, and nothing changes; a right one moves to the next step. One intent makes
// one confirmation: while one is being kept, a second Enter, tap or scanner echo does nothing.
import { computed, reactive, ref, type Ref } from 'vue'
import type { ReadScan } from '@shared/barcode/scan'
import { checkBinScan, checkItemScan, checkLotScan, type PickScanProblem, type PickTarget } from '@shared/picking/pickScan'
import type { PickConfirmInput, PickLineView, ShortReason } from '@shared/schemas/picking'
import type { useScanFeedback } from './useScanFeedback'

export type PickStep = 'bin' | 'item' | 'lot' | 'qty'
type Translate = (key: string, params?: Record<string, unknown>) => string

export interface PickFlowDeps {
  lines: Ref<PickLineView[]>
  /** What the outbox still holds for a line: units, and whether it closes the line short. */
  pending(lineId: number): { qty: number; closed: boolean }
  feedback: ReturnType<typeof useScanFeedback>
  t: Translate
  /** A quantity of the line with its unit ("17 ft"). */
  units(line: PickLineView, qty: number): string
  submit(body: PickConfirmInput, line: PickLineView): Promise<void>
}

export function usePickFlow(d: PickFlowDeps) {
  const currentId = ref<number | null>(null)
  const step = ref<PickStep>('bin')
  const scans = reactive({ bin: '', item: '', lot: '' })
  const qty = ref(0)
  /** A confirmation is being kept on the device right now. */
  const busy = ref(false)
  const current = computed(() => d.lines.value.find((l) => l.id === currentId.value) ?? null)

  /** Still to take on a line, counting what waits in the outbox. */
  function left(line: PickLineView): number {
    const p = d.pending(line.id)
    return p.closed ? 0 : Math.max(0, line.remaining - p.qty)
  }

  const target = (line: PickLineView): PickTarget => ({ binCode: line.binCode, sku: line.sku, gtin: line.gtin, lotCode: line.lotCode })

  function reset() {
    step.value = 'bin'
    scans.bin = scans.item = scans.lot = ''
    qty.value = current.value ? left(current.value) : 0
  }

  function select(lineId: number) {
    currentId.value = lineId
    reset()
  }

  /** The next line in walking order with something left, starting after the current one. */
  function selectNextOpen(): boolean {
    const lines = d.lines.value
    const from = lines.findIndex((l) => l.id === currentId.value) // -1: start at the first line
    for (let i = 1; i <= lines.length; i++) {
      const line = lines[(from + i) % lines.length]
      if (left(line) > 0) { select(line.id); return true }
    }
    currentId.value = null
    return false
  }

  function refuse(problem: PickScanProblem | 'over_pick' | 'bad_qty' | 'need_bin' | 'need_item', scanned: string, line: PickLineView) {
    d.feedback.error(d.t(`picking.handheld.problem.${problem}`, { scanned, bin: line.binCode, sku: line.sku, lot: line.lotCode ?? '', left: d.units(line, left(line)) }))
  }

  function scanItem(read: ReadScan, line: PickLineView) {
    const check = checkItemScan(read, target(line))
    if (!check.ok) return refuse(check.problem, check.scanned, line)
    scans.item = read.raw
    if (check.count !== undefined) qty.value = check.count
    step.value = check.lotConfirmed ? 'qty' : 'lot'
    d.feedback.ok(d.t(check.lotConfirmed ? 'picking.handheld.itemLotOk' : 'picking.handheld.itemOk', { sku: line.sku, lot: line.lotCode ?? '' }))
  }

  /** A scan as the scan box read it: its text goes into the confirmation, its meaning is checked here. */
  function scan(read: ReadScan) {
    const line = current.value
    const raw = read.raw
    if (!line || !raw.trim() || busy.value) return
    if (step.value === 'bin') {
      const check = checkBinScan(read, target(line))
      if (!check.ok) return refuse(check.problem, check.scanned, line)
      scans.bin = raw
      step.value = 'item'
      d.feedback.ok(d.t('picking.handheld.binOk', { bin: line.binCode }))
    } else if (step.value === 'item') scanItem(read, line)
    else if (step.value === 'lot') {
      const check = checkLotScan(read, target(line))
      if (!check.ok) return refuse(check.problem, check.scanned, line)
      scans.lot = raw
      step.value = 'qty'
      d.feedback.ok(d.t('picking.handheld.lotOk', { lot: line.lotCode ?? '' }))
    } else if (/^\d{1,6}$/.test(raw.trim())) {
      qty.value = Number(raw.trim())
      void confirm()
    } else scanItem(read, line)
  }

  function body(line: PickLineView, units: number, shortReason: ShortReason | null): PickConfirmInput {
    return {
      lineId: line.id, binScan: scans.bin, itemScan: scans.item || null, lotScan: scans.lot || null, qty: units,
      shortReason, scannedAt: new Date().toISOString(),
    }
  }

  async function send(units: number, shortReason: ShortReason | null) {
    const line = current.value
    if (!line || busy.value) return
    // A short pick of nothing needs only the bin; taking units needs the item (and lot) scanned too.
    if (step.value === 'bin') return refuse('need_bin', '', line)
    if (units > 0 && step.value !== 'qty') return refuse('need_item', '', line)
    if (!Number.isSafeInteger(units) || units < 0 || (units === 0 && !shortReason)) return refuse('bad_qty', String(units), line)
    if (units > left(line)) return refuse('over_pick', String(units), line)
    busy.value = true
    try {
      await d.submit(body(line, units, shortReason), line)
    } catch (err) {
      console.error(err)
      return d.feedback.error(d.t('picking.handheld.notKept'))
    } finally {
      busy.value = false
    }
    const said = d.t(shortReason ? 'picking.handheld.shortSaved' : 'picking.handheld.confirmed', { qty: d.units(line, units), sku: line.sku })
    d.feedback.ok(shortReason === 'not_found' ? `${said} ${d.t('picking.handheld.countAsked', { bin: line.binCode })}` : said)
    if (left(line) > 0 && !shortReason) reset()
    else selectNextOpen()
  }

  const confirm = () => send(qty.value, null)
  const short = (found: number, reason: ShortReason) => send(found, reason)

  return { current, currentId, step, scans, qty, busy, left, select, selectNextOpen, scan, confirm, short }
}
