// The blind count on the handheld: scan a bin (its snapshot is taken on the server), then for each thing
// in it scan the item (and its lot), enter how many, and finish the bin. The phone never learns what the
// records say. Each submission carries its own Idempotency-Key, so a double Enter applies once.
import { computed, ref } from 'vue'
import { ElMessageBox } from 'element-plus'
import type { ReadScan } from '@shared/barcode/scan'
import { scanLookup } from '@shared/barcode/scanLookup'
import type { HandheldCount } from '@shared/schemas/counts'
import type { ItemOption } from '@shared/schemas/stockViews'
import { isApiError } from '@/api/client'
import { countsApi } from '@/api/counts'
import { stockApi } from '@/api/stock'
import { newIdempotencyKey } from '@/api/idempotencyKey'
import type { useScanFeedback } from '@/composables/picking/useScanFeedback'

export type CountStep = 'bin' | 'item' | 'lot' | 'qty'
type Translate = (key: string, params?: Record<string, unknown>) => string
type Has = (key: string) => boolean

export interface PendingEntry {
  item: ItemOption
  lotCode: string | null
}

/** One key per body: the same submission sent again (double Enter, a retry) carries the same key. */
function keyedSender() {
  let last: { body: string; key: string } | null = null
  return {
    key(body: unknown): string {
      const text = JSON.stringify(body)
      if (!last || last.body !== text) last = { body: text, key: newIdempotencyKey() }
      return last.key
    },
    done() { last = null },
  }
}

export function useCountFlow(countId: number, deps: { feedback: ReturnType<typeof useScanFeedback>; t: Translate; te: Has }) {
  const { feedback: fb, t, te } = deps
  const count = ref<HandheldCount | null>(null)
  const loadError = ref('')
  const pending = ref<PendingEntry | null>(null)
  const qty = ref<number | null>(null)
  const busy = ref(false)
  const keys = keyedSender()

  const current = computed(() => count.value?.current ?? null)
  const step = computed<CountStep>(() => {
    if (!current.value) return 'bin'
    if (!pending.value) return 'item'
    return lotNeeded.value ? 'lot' : 'qty'
  })
  const lotNeeded = ref(false)
  const binsLeft = computed(() => (count.value?.bins ?? []).filter((b) => b.status !== 'done').length)

  async function load() {
    try {
      count.value = await countsApi.handheld(countId)
      loadError.value = ''
    } catch (err) {
      loadError.value = isApiError(err) ? err.message : t('counts.handheld.loadFailed')
    }
  }

  /** A refusal in the counter's language when its code has words, else the server's message. */
  function problem(err: unknown) {
    if (!isApiError(err)) return fb.error(String(err))
    fb.error(te(`errors.${err.code}`) ? t(`errors.${err.code}`) : err.message)
  }

  async function send<T>(body: unknown, call: (key: string) => Promise<T>): Promise<T | undefined> {
    busy.value = true
    try {
      const answer = await call(keys.key(body))
      keys.done()
      return answer
    } catch (err) {
      if (isApiError(err) && err.code === 'count_bin_taken') throw err
      problem(err)
      return undefined
    } finally {
      busy.value = false
    }
  }

  async function startBin(raw: string) {
    const body = { binScan: raw, takeOver: false }
    try {
      if (await send(body, (key) => countsApi.startBin(countId, body, key))) {
        await load()
        if (current.value) fb.ok(t('counts.handheld.binStarted', { bin: current.value.binCode }))
      }
    } catch (err) {
      // Someone else is on this bin: carry on their visit only if the counter says they stopped.
      const ok = await ElMessageBox.confirm((err as Error).message, t('counts.handheld.takeOverTitle'), {
        type: 'warning', confirmButtonText: t('counts.handheld.takeOver'), cancelButtonText: t('counts.handheld.cancel'),
      }).catch(() => false)
      if (!ok) return
      const over = { binScan: raw, takeOver: true }
      if (await send(over, (key) => countsApi.startBin(countId, over, key)).catch(problem)) await load()
    }
  }

  function chooseItem(item: ItemOption, lotCode: string | null) {
    const asked = current.value?.asked ?? []
    if (asked.length && count.value?.itemsOnly && !asked.some((a) => a.itemId === item.id)) {
      fb.error(t('counts.handheld.notAsked', { sku: item.sku }))
      return
    }
    pending.value = { item, lotCode }
    lotNeeded.value = lotCode === null && item.matchLot
    const entered = current.value?.entered.find((e) => e.itemId === item.id && e.lotCode === lotCode)
    qty.value = entered ? entered.qty : null
    fb.info(lotNeeded.value ? t('counts.handheld.scanLotNow', { sku: item.sku }) : t('counts.handheld.howMany', { sku: item.sku }))
  }

  async function readItem({ raw, scan }: ReadScan) {
    if (scan.kind === 'bin') {
      fb.error(t('counts.handheld.finishFirst', { bin: current.value?.binCode ?? '' }))
      return
    }
    const lookup = scanLookup(scan)
    if (!lookup.ok || lookup.query.kind === 'bin') {
      fb.error(t('counts.handheld.notAnItem', { scanned: raw.trim() }))
      return
    }
    try {
      const answer = await stockApi.lookup({ kind: lookup.query.kind, code: lookup.query.code })
      if (!answer.item) throw new Error(t('counts.handheld.notAnItem', { scanned: raw.trim() }))
      chooseItem(answer.item, lookup.query.lotCode ?? null)
    } catch (err) {
      fb.error(isApiError(err) && err.status === 404 ? t('counts.handheld.unknownItem', { scanned: raw.trim() }) : (err as Error).message)
    }
  }

  function readLot({ raw, scan }: ReadScan) {
    const item = pending.value!.item
    let lot: string | null = null
    if (scan.kind === 'lot' && scan.itemSku.toUpperCase() === item.sku.toUpperCase()) lot = scan.lotCode
    else if (scan.kind === 'gs1' && scan.lot) lot = scan.lot
    else if (scan.kind === 'sku') lot = scan.sku // a lot code typed by hand
    if (!lot) {
      fb.error(t('counts.handheld.notALot', { sku: item.sku, scanned: raw.trim() }))
      return
    }
    chooseItem(item, lot)
  }

  /** Every scan goes through here, as the scan box read it; what it means depends on the step. */
  async function scan(read: ReadScan) {
    if (busy.value) return
    if (step.value === 'bin') return startBin(read.raw)
    if (step.value === 'lot') return readLot(read)
    return readItem(read)
  }

  function noLot() {
    if (pending.value) chooseItem(pending.value.item, null)
    lotNeeded.value = false
  }

  function editEntered(e: { itemId: number; sku: string; itemName: string; lotCode: string | null }) {
    chooseItem({ id: e.itemId, sku: e.sku, name: e.itemName, stockUnit: 'each', gtin: null, matchLot: false }, e.lotCode)
  }

  function dropPending() {
    pending.value = null
    lotNeeded.value = false
    qty.value = null
  }

  async function saveQty() {
    const bin = current.value
    const p = pending.value
    const n = qty.value
    if (!bin || !p) return
    if (n === null || !Number.isInteger(n) || n < 0 || n > 1_000_000) {
      fb.error(t('counts.handheld.badQty'))
      return
    }
    const body = { binId: bin.binId, itemId: p.item.id, lotCode: p.lotCode, qty: n }
    if (await send(body, (key) => countsApi.enter(countId, body, key))) {
      fb.ok(t('counts.handheld.saved', { sku: p.item.sku, lot: p.lotCode ?? '—', qty: n }))
      dropPending()
      await load()
    }
  }

  async function finishBin() {
    const bin = current.value
    if (!bin) return
    const ok = await ElMessageBox.confirm(t('counts.handheld.finishConfirm', { bin: bin.binCode }), t('counts.handheld.finishTitle'), {
      type: 'warning', confirmButtonText: t('counts.handheld.finish'), cancelButtonText: t('counts.handheld.cancel'),
    }).catch(() => false)
    if (!ok) return
    const answer = await send({ finish: bin.binId }, (key) => countsApi.finishBin(countId, bin.binId, key))
    if (answer) {
      dropPending()
      fb.ok(answer.closed ? t('counts.handheld.countClosed') : t('counts.handheld.binDone', { bin: bin.binCode }))
      await load()
    }
  }

  return { count, loadError, current, step, pending, qty, busy, binsLeft, load, scan, noLot, saveQty, finishBin, editEntered, dropPending }
}
