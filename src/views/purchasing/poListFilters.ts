// The purchase-order list's filters by day, as the start page's figures open it (late, due this week,
// expected today, sent this month): read from the address, and worded for the note above the list.
type Translate = (key: string, values?: Record<string, unknown>) => string

const DAY = /^\d{4}-\d{2}-\d{2}$/

/** A day from the address, or '' when absent or not a day. */
export const poDayParam = (v: unknown): string => (typeof v === 'string' && DAY.test(v) ? v : '')

export function expectedFilterText(t: Translate, from: string, to: string): string {
  if (from && to) return t('today.filter.expected', { from, to })
  return from ? t('today.filter.expectedFrom', { from }) : t('today.filter.expectedBy', { to })
}

export interface PoDayFilters { expectedFrom: string; expectedTo: string; sentFrom: string; sentTo: string }

export function poDayFiltersFrom(query: Record<string, unknown>): PoDayFilters {
  return { expectedFrom: poDayParam(query.expectedFrom), expectedTo: poDayParam(query.expectedTo), sentFrom: poDayParam(query.sentFrom), sentTo: poDayParam(query.sentTo) }
}

/** The note's words for the filters set, '' when none is. */
export function poDayFilterText(t: Translate, f: PoDayFilters): string {
  const parts: string[] = []
  if (f.expectedFrom || f.expectedTo) parts.push(expectedFilterText(t, f.expectedFrom, f.expectedTo))
  if (f.sentFrom || f.sentTo) parts.push(t('today.filter.sent', { from: f.sentFrom || '…', to: f.sentTo || '…' }))
  return parts.join(' · ')
}
