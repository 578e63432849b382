// Words a quoted price's source in the reader's language: list, the account's level, a quantity break,
// or a clerk's own price with who set it and why.
import type { PriceExplanation } from '@shared/pricing/sellingPrice'

type Translate = (key: string, values?: Record<string, unknown>) => string
type FormatNumber = (value: number, format: string) => string

/** `n` writes the percentage as a number of the reader's language (10 % rather than the stored 10.00). */
export function priceSourceText(e: PriceExplanation, t: Translate, n: FormatNumber): string {
  switch (e.source) {
    case 'level':
      return e.percentOff ? t('sales.source.levelPercent', { level: e.levelCode ?? '', percent: n(Number(e.percentOff), 'precise') }) : t('sales.source.level', { level: e.levelCode ?? '' })
    case 'break':
      return `${t('sales.source.break', { qty: e.minQty ?? 1 })}${e.allAccounts ? ` · ${t('sales.source.allAccounts')}` : e.levelCode ? ` · ${t('sales.source.level', { level: e.levelCode })}` : ''}`
    case 'override':
      return t('sales.source.override', { by: e.overrideBy ?? '', reason: e.overrideReason ?? '' })
    default:
      return t('sales.source.list')
  }
}
