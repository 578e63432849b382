// Element Plus's own words in each of our languages (its locale files ship with the library).
import en from 'element-plus/es/locale/lang/en'
import es from 'element-plus/es/locale/lang/es'
import type { Locale } from './index'

const LOCALES = { en, es } as const

export const componentLocale = (locale: Locale) => LOCALES[locale]
