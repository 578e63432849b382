// How numbers and dates are written per language, through vue-i18n's d() and n(). Messages are kept
// per language ('en', 'es'); the formats are those of the United States for both (the crew works in
// a US yard: 1,234.5 and month names in Spanish), reached through the fallback chain below, because
// vue-i18n hands Intl the locale under which it found the format.
import type { IntlDateTimeFormats, IntlNumberFormats } from 'vue-i18n'

export const fallbackLocale = { en: ['en-US'], es: ['es-US', 'en'], default: ['en'] }

const numbers = {
  integer: { maximumFractionDigits: 0 },
  /** Areas, angles and weights shown to a tenth (12.5 ft², 97.5°). */
  tenths: { maximumFractionDigits: 1 },
  /** Small measures and rates shown to a hundredth (3.72 m², a mean of 4.17 a day). */
  hundredths: { maximumFractionDigits: 2 },
  decimal: { maximumFractionDigits: 3 },
  /** The figures behind a computation (a mean daily use of 0.4167). */
  precise: { maximumFractionDigits: 4 },
  percent: { style: 'percent', maximumFractionDigits: 1 },
  /** A tax rate to the precision a taxing authority sets it (6.5 %, 7.1875 %): given as a fraction, 0.065. */
  ratePercent: { style: 'percent', maximumFractionDigits: 4 },
} as const

export const numberFormats: IntlNumberFormats = { 'en-US': numbers, 'es-US': numbers }

const dates = {
  date: { year: 'numeric', month: 'short', day: 'numeric' },
  dateTime: { year: 'numeric', month: 'short', day: 'numeric', hour: 'numeric', minute: '2-digit' },
  time: { hour: 'numeric', minute: '2-digit' },
} as const

export const datetimeFormats: IntlDateTimeFormats = { 'en-US': dates, 'es-US': dates }
