// Every visible string goes through vue-i18n. Messages live in one file per area under en/ and es/
// (picked up by the glob below: a new area adds its own file, nothing else to register).
// English is complete; Spanish covers the warehouse handheld screens and falls back to English.
import { createI18n, type I18nOptions } from 'vue-i18n'

type Messages = Record<string, unknown>

function collect(modules: Record<string, { default: Messages }>): Messages {
  const merged: Messages = {}
  for (const [file, mod] of Object.entries(modules)) {
    const key = file.replace(/^.*\/([^/]+)\.ts$/, '$1')
    merged[key] = mod.default
  }
  return merged
}

const en = collect(import.meta.glob<{ default: Messages }>('./en/*.ts', { eager: true }))
const es = collect(import.meta.glob<{ default: Messages }>('./es/*.ts', { eager: true }))

const options: I18nOptions = {
  locale: 'en',
  fallbackLocale: 'en',
  messages: { en, es } as I18nOptions['messages'],
  missingWarn: false,
  fallbackWarn: false,
}

export const i18n = createI18n<false, typeof options>({ ...options, legacy: false })

export function setLocale(locale: 'en' | 'es'): void {
  i18n.global.locale.value = locale
  document.documentElement.lang = locale
}
