import { computed, ref, shallowRef, type Ref } from 'vue'
import { ElMessage, ElMessageBox } from 'element-plus'
import { isApiError } from '@/api/client'
import { i18n } from '@/i18n'

interface ApiActionOptions {
  /** Loads the record again as it is now (what a refused stale save offers); without it, the page reloads. */
  reload?: () => unknown
}

/**
 * A save refused because someone saved the record meanwhile: the person's edits stay on screen, the refusal says
 * so in their language, and reloading (which drops their edits) happens only after they choose it. Keeping the
 * edits is the answer the focus starts on, so an Enter pressed once more (a save sent with Enter, then Enter again)
 * or Escape keeps them; discarding them takes its own button.
 */
async function offerReload(message: string, reload: (() => unknown) | undefined): Promise<void> {
  const t = i18n.global.t
  const discard = await ElMessageBox.confirm(`${message} ${t('common.changedMeanwhileReload')}`, t('common.changedMeanwhileTitle'), {
    type: 'warning',
    confirmButtonText: t('common.changedMeanwhileKeep'),
    cancelButtonText: t('common.changedMeanwhileDiscard'),
    distinguishCancelAndClose: true,
    customClass: 'changed-meanwhile',
  }).then(() => false, (action: unknown) => action === 'cancel')
  if (!discard) return
  if (reload) await reload()
  else window.location.reload()
}

/**
 * Runs one API action with a busy flag. Field errors land in fieldErrors (shown beside inputs),
 * anything else in a message. A save refused as made on an older version (changed_meanwhile) keeps what is on
 * screen and offers to reload, through `options.reload`. Returns the result, or undefined when it failed.
 */
export function useApiAction(options: ApiActionOptions = {}) {
  const busy = ref(false)
  const fieldErrors = ref<Record<string, string>>({})
  const errorMessage = ref('')
  /** The failed answer's HTTP status (0: the server was not reached); null when the failure was not an answer. */
  const errorStatus = ref<number | null>(null)
  /** The last failure's code (e.g. changed_meanwhile), for screens that answer a particular refusal. */
  const errorCode = ref('')
  /** The failure when no field carries it: what a form dialog shows in its own alert region. */
  const formError = computed(() => (Object.keys(fieldErrors.value).length ? '' : errorMessage.value))

  async function run<T>(action: () => Promise<T>): Promise<T | undefined> {
    busy.value = true
    fieldErrors.value = {}
    errorMessage.value = ''
    errorStatus.value = null
    errorCode.value = ''
    try {
      return await action()
    } catch (err) {
      if (isApiError(err)) {
        fieldErrors.value = err.fields
        errorMessage.value = err.message
        errorStatus.value = err.status
        errorCode.value = err.code
        if (err.code === 'changed_meanwhile') void offerReload(err.message, options.reload)
        else if (err.status !== 401) ElMessage.error(err.message)
      } else {
        errorMessage.value = i18n.global.t('common.errorTitle')
        ElMessage.error(errorMessage.value)
        console.error(err)
      }
      return undefined
    } finally {
      busy.value = false
    }
  }

  return { busy, fieldErrors, errorMessage, formError, errorStatus, errorCode, run }
}

/**
 * Loads page data with loading and error state, for empty/error screens. Only the latest load's answer
 * is kept: when loads overlap (a filter changed, another record chosen), an older answer arriving last
 * never replaces a newer one.
 *
 * `shallow`: the answer is kept as it came, not made deeply reactive (only a new answer updates the page). For
 * rows handed to a grid, which keeps its own copy and reads every field of every row: thousands of rows made
 * reactive cost a proxy per row and a tracked read per field before the first rows show.
 */
export function useLoader<T>(load: () => Promise<T>, opts: { shallow?: boolean } = {}) {
  const data = (opts.shallow ? shallowRef<T | null>(null) : ref<T | null>(null)) as Ref<T | null>
  const loading = ref(false)
  const error = ref('')
  let latest = 0
  async function reload(): Promise<void> {
    const mine = ++latest
    loading.value = true
    error.value = ''
    try {
      const answer = await load()
      if (mine === latest) data.value = answer as never
    } catch (err) {
      if (mine === latest) error.value = isApiError(err) ? err.message : String(err)
    } finally {
      if (mine === latest) loading.value = false
    }
  }
  return { data, loading, error, reload }
}
