import { computed, ref, shallowRef, type Ref } from 'vue'
import type { ZodType } from 'zod'
import { useI18n } from 'vue-i18n'
import { ElMessage } from 'element-plus'
import { isApiError } from '@/api/client'
import { uploadWithProgress, type SheetSteps, type UploadHandle } from '@/api/fileTransfer'

/** A refusal worded for the page: its message, then a line for each row it names (`row` is the word for a row). */
export function rowsWorded(message: string, fields: Record<string, string>, row: string): string {
  return [message, ...Object.entries(fields).map(([at, text]) => `${row} ${at}: ${text}`)].join('\n')
}

/**
 * A spreadsheet sent to the server twice, first to be checked and then to be written: the chosen file, the
 * upload's progress (sending, then working on the server), cancelling, and the failure worded per row.
 * `steps` gives the route and the answer's schema for each step (from the area's API module); `words` is the
 * message area with `cancelled` and `row`.
 */
export function useSheetUpload<P, C>(steps: SheetSteps<P, C>, words: string) {
  const { t } = useI18n()
  const file = shallowRef<File | null>(null)
  const preview = ref<P | null>(null) as Ref<P | null>
  const phase = ref<'idle' | 'sending' | 'working'>('idle')
  const step = ref<'preview' | 'commit'>('preview')
  const progress = ref(0)
  const failure = ref('')
  let handle: UploadHandle<P | C> | null = null
  const busy = computed(() => phase.value !== 'idle')
  /** Shows a step's failure, worded per row when the server named rows. */
  const showFailure = (err: unknown) => {
    failure.value = isApiError(err) ? rowsWorded(err.message, err.fields, t(`${words}.row`)) : String(err)
  }

  /** Forgets the file, its check and any failure (a new file chosen, or a new kind of import). */
  function reset(next: File | null = null) {
    file.value = next
    preview.value = null
    failure.value = ''
  }

  function choose(e: Event) {
    reset((e.target as HTMLInputElement).files?.[0] ?? null)
  }

  async function send<T extends P | C>(which: 'preview' | 'commit', answer: ZodType<T>): Promise<T | null> {
    if (!file.value || busy.value) return null
    const form = new FormData()
    form.append('file', file.value)
    step.value = which
    phase.value = 'sending'
    progress.value = 0
    failure.value = ''
    const upload = uploadWithProgress(steps.path(which), form, answer, (f) => {
      progress.value = Math.round(f * 100)
      if (f >= 1) phase.value = 'working'
    })
    handle = upload
    try {
      return await upload.done
    } catch (err) {
      if (isApiError(err) && err.code === 'aborted') ElMessage.info(t(`${words}.cancelled`))
      else showFailure(err)
      return null
    } finally {
      phase.value = 'idle'
      handle = null
    }
  }

  async function check() {
    preview.value = await send('preview', steps.previewAnswer)
  }

  /** Writes the checked file; null when it failed or was cancelled (the failure is shown). */
  const commit = () => send('commit', steps.commitAnswer)

  const cancel = () => handle?.abort()

  return { file, preview, phase, step, progress, failure, busy, reset, choose, check, commit, cancel, showFailure }
}
