import { ref } from 'vue'
import { ElMessage } from 'element-plus'
import { isApiError } from '@/api/client'
import { i18n } from '@/i18n'

/**
 * Runs one API action with a busy flag. Field errors land in fieldErrors (shown beside inputs),
 * anything else in a message. Returns the result, or undefined when it failed.
 */
export function useApiAction() {
  const busy = ref(false)
  const fieldErrors = ref<Record<string, string>>({})
  const errorMessage = ref('')
  /** The failed answer's HTTP status (0: the server was not reached); null when the failure was not an answer. */
  const errorStatus = ref<number | null>(null)

  async function run<T>(action: () => Promise<T>): Promise<T | undefined> {
    busy.value = true
    fieldErrors.value = {}
    errorMessage.value = ''
    errorStatus.value = null
    try {
      return await action()
    } catch (err) {
      if (isApiError(err)) {
        fieldErrors.value = err.fields
        errorMessage.value = err.message
        errorStatus.value = err.status
        if (err.status !== 401) ElMessage.error(err.message)
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

  return { busy, fieldErrors, errorMessage, errorStatus, run }
}

/** Loads page data with loading and error state, for empty/error screens. */
export function useLoader<T>(load: () => Promise<T>) {
  const data = ref<T | null>(null)
  const loading = ref(false)
  const error = ref('')
  async function reload(): Promise<void> {
    loading.value = true
    error.value = ''
    try {
      data.value = (await load()) as never
    } catch (err) {
      error.value = isApiError(err) ? err.message : String(err)
    } finally {
      loading.value = false
    }
  }
  return { data, loading, error, reload }
}
