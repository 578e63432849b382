// A count's title in the reader's language: warehouse, what it covers, and how much.
import type { CountScope, } from '@shared/counts/countTerms'
import type { CountScopeDetail } from '@shared/schemas/counts'

type Translate = (key: string, params?: Record<string, unknown>, plural?: number) => string

export function countTitle(t: Translate, c: { warehouse: { code: string }; scope: CountScope; scopeDetail: CountScopeDetail }): string {
  const d = c.scopeDetail
  const what = t(`counts.scope.${c.scope}`, { aisle: d.aisle ?? '', classes: (d.classes ?? []).join(', ') })
  const size = d.items !== undefined ? t('counts.scopeDetail.items', { n: d.items }, d.items) : d.bins !== undefined ? t('counts.scopeDetail.bins', { n: d.bins }, d.bins) : ''
  return [c.warehouse.code, what, size].filter(Boolean).join(' · ')
}
