// The pick list on the handheld: shown at once from the device's copy, then read from the server and
// kept on the device again, so a reload or a dead connection still has every line, bin, item and lot
// to check scans against. No connection is a state (the outbox store's `reachable`), never an error
// that replaces the screen.
import { computed, ref } from 'vue'
import type { PickConfirmAnswer, PickLineView, PickListDetail, ShortReason } from '@shared/schemas/picking'
import { isApiError } from '@/api/client'
import { pickingApi } from '@/api/picking'
import { usePickOutboxStore } from '@/stores/pickOutbox'
import { pickDevice } from './pickDevice'

export interface LoadFailure {
  status: number
  code: string
}

export function usePickListData(id: number) {
  const outbox = usePickOutboxStore()
  const list = ref<PickListDetail | null>(null)
  const lines = computed<PickLineView[]>(() => list.value?.lines ?? [])
  /** When what is shown is the device's copy: the time it was read from the server. */
  const copyFrom = ref<string | null>(null)
  const failure = ref<LoadFailure | null>(null)
  const loading = ref(true)
  // Bumped by every confirmation made or answered: a read that started before one is stale, and dropped.
  let epoch = 0

  async function fromDevice(): Promise<void> {
    const cached = await pickDevice.list(id).catch(() => undefined)
    if (cached && !list.value) {
      list.value = cached.detail
      copyFrom.value = cached.savedAt
    }
  }

  const save = () => (list.value ? pickDevice.putList(list.value).catch(() => undefined) : Promise.resolve())

  async function load(): Promise<void> {
    const started = epoch
    try {
      const fresh = await pickingApi.detail(id)
      outbox.noteReachable(true)
      failure.value = null
      if (list.value && started !== epoch) return
      list.value = fresh
      copyFrom.value = null
      await save()
    } catch (err) {
      if (isApiError(err) && err.status === 0) {
        outbox.noteReachable(false)
        await fromDevice()
      } else failure.value = isApiError(err) ? { status: err.status, code: err.code } : { status: -1, code: 'unknown' }
    } finally {
      loading.value = false
    }
  }

  /** The device's copy first (instant, and all there is offline), then the server's. */
  async function open(): Promise<void> {
    await fromDevice()
    await load()
  }

  /** The server acknowledged a confirmation: its line as the server now has it (and why it is short, if it is). */
  function apply(answer: PickConfirmAnswer, shortReason: ShortReason | null = null): void {
    epoch++
    const line = list.value?.lines.find((l) => l.id === answer.lineId)
    if (!line || !list.value) return
    Object.assign(line, { confirmedQty: answer.confirmedQty, shortQty: answer.shortQty, remaining: answer.remaining })
    if (shortReason && answer.shortQty > 0 && !line.shortReasons.includes(shortReason)) line.shortReasons.push(shortReason)
    list.value.status = answer.listStatus as PickListDetail['status']
    void save()
  }

  const touch = () => { epoch++ }

  return { list, lines, copyFrom, failure, loading, open, load, apply, touch }
}
