// What the handheld says when the server refuses a confirmation or a request fails, in the picker's
// language: a message per code, never the server's English or a raw code.
import { useI18n } from 'vue-i18n'
import type { OutboxItem } from './pickDevice'

export function usePickOutcomeText() {
  const { t, te } = useI18n()

  function errorText(status: number, code: string): string {
    if (te(`picking.outcome.${code}`)) return t(`picking.outcome.${code}`)
    if (status === 403) return t('picking.outcome.forbidden')
    if (status === 404) return t('picking.outcome.not_found')
    if (status >= 500) return t('picking.outcome.server')
    return t('picking.outcome.other')
  }

  const refusalText = (item: OutboxItem) => (item.refusal ? errorText(item.refusal.status, item.refusal.code) : '')

  return { errorText, refusalText }
}
