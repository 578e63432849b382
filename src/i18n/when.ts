// Dates and times as the user's language writes them (vue-i18n's d() with the formats of
// src/i18n/formats.ts), for code outside a component's setup: grid columns, display helpers.
// In a component, `const { d } = useI18n()` and `d(date, 'dateTime')` do the same.
import { i18n } from '@/i18n'

type When = string | number | Date | null | undefined

/** A moment with its date and time ("Dec 4, 2026, 6:30 PM" / "4 dic 2026, 6:30 p.m."); `empty` when there is none. */
export function dateTimeText(value: When, empty = '—'): string {
  return value === null || value === undefined || value === '' ? empty : i18n.global.d(new Date(value), 'dateTime')
}

/** The reader's time zone (the browser's), which the server needs to cut days and months where the reader does. */
export function readerTimeZone(): string {
  return Intl.DateTimeFormat().resolvedOptions().timeZone
}
