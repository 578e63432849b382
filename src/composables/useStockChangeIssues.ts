// A refused stock change (shared/inventory/stockChangePreview.ts) worded beside the form's fields,
// in the person's language and with the item's unit.
import { useI18n } from 'vue-i18n'
import type { ChangeIssue } from '@shared/inventory/stockChangePreview'
import { useStockQty } from './useStockQty'

export function useStockChangeIssues() {
  const { t } = useI18n()
  const { qtyText } = useStockQty()

  /** Field → message; `rename` maps a request field to the form's (delta → qty), `special` words a code its own way. */
  function fieldMessages(issues: ChangeIssue[], unit: string, rename: Record<string, string> = {}, special?: (i: ChangeIssue) => string | null): Record<string, string> {
    const out: Record<string, string> = {}
    for (const issue of issues) {
      const params = Object.fromEntries(Object.entries(issue.params ?? {}).map(([k, v]) => [k, qtyText(v, unit)]))
      out[rename[issue.field] ?? issue.field] ??= special?.(issue) ?? t(`stock.check.${issue.code}`, params)
    }
    return out
  }

  return { fieldMessages }
}
