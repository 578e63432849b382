// Every visible string goes through vue-i18n. Messages live in one file per language and area:
// src/i18n/<language>/<area>.ts, whose default export becomes the messages under `<area>.` (so
// en/stock.ts holds the keys `stock.…`). A new file is picked up by the globs below, nothing to register.
//
// The files are loaded lazily, each its own small chunk, only for the language in use (and English, the
// fallback): the sign-in page loads the BOOT_AREAS; the router guard loads every area of the user's language
// before the first signed-in page shows, in parallel with that page's code and data (src/router/index.ts).
// A key of an area not loaded yet (a language switch, a message asked for outside a page) starts loading
// its file; the text appears when it arrives.
import { createI18n, type I18nOptions } from 'vue-i18n'
import { datetimeFormats, fallbackLocale, numberFormats } from './formats'

export type Locale = 'en' | 'es'
type Messages = Record<string, unknown>
type Loader = () => Promise<{ default: Messages }>

const FALLBACK: Locale = 'en'
/** Areas the sign-in page and the shell need before anything is shown; missing files are skipped. */
export const BOOT_AREAS = ['common', 'shell', 'auth', 'errors'] as const

function byArea(modules: Record<string, Loader>): Map<string, Loader> {
  return new Map(Object.entries(modules).map(([file, load]) => [file.replace(/^.*\/([^/]+)\.ts$/, '$1'), load]))
}

const files: Record<Locale, Map<string, Loader>> = {
  en: byArea(import.meta.glob<{ default: Messages }>('./en/*.ts')),
  es: byArea(import.meta.glob<{ default: Messages }>('./es/*.ts')),
}

/** Loads (or is loading) per language and area; a settled load stays, a failed one may be tried again. */
const loads = new Map<string, Promise<void>>()

const options: I18nOptions = {
  locale: FALLBACK,
  fallbackLocale,
  messages: { en: {}, es: {} },
  numberFormats,
  datetimeFormats,
  missingWarn: false,
  fallbackWarn: false,
  missing: (locale, key) => {
    void loadMessages([key.split('.')[0]], locale as Locale)
  },
}

export const i18n = createI18n<false, typeof options>({ ...options, legacy: false })

function loadOne(locale: Locale, area: string): Promise<void> {
  const id = `${locale}/${area}`
  let pending = loads.get(id)
  if (!pending) {
    const load = files[locale]?.get(area)
    if (!load) return Promise.resolve()
    pending = load().then(
      (mod) => i18n.global.mergeLocaleMessage(locale, { [area]: mod.default }),
      (err: unknown) => {
        loads.delete(id) // a chunk that failed to arrive (offline) is asked for again next time
        throw err
      },
    )
    loads.set(id, pending)
  }
  return pending
}

/** Loads the message files of these areas ('all': every area) for a language and its fallback. */
export function loadMessages(areas: readonly string[] | 'all', locale: Locale = currentLocale()): Promise<void> {
  const chain = locale === FALLBACK ? [FALLBACK] : [locale, FALLBACK]
  const wanted = chain.flatMap((l) => (areas === 'all' ? [...files[l].keys()] : areas).map((area) => loadOne(l, area)))
  return Promise.all(wanted).then(() => undefined)
}

/** The areas loaded so far in any language: a language switch loads the same ones in the new language. */
function loadedAreas(): string[] {
  return [...new Set([...loads.keys()].map((id) => id.split('/')[1]))]
}

export function currentLocale(): Locale {
  return i18n.global.locale.value as Locale
}

const LAST_LOCALE = 'lumenyard.locale'
let wanted: Locale = FALLBACK

/**
 * The language this browser last used, else the browser's own language: the sign-in page's language, and
 * a good guess for loading messages before the session answers.
 */
export function lastLocale(): Locale {
  let stored: string | null = null
  try {
    stored = localStorage.getItem(LAST_LOCALE)
  } catch {
    // private mode: go by the browser's language
  }
  if (stored === 'es' || stored === 'en') return stored
  return typeof navigator !== 'undefined' && /^es\b/i.test(navigator.language ?? '') ? 'es' : FALLBACK
}

/** Switches the language; its messages for the areas in use load first (the old text stays meanwhile). */
export async function setLocale(locale: Locale): Promise<void> {
  wanted = locale
  await loadMessages(loadedAreas(), locale).catch(() => undefined)
  if (wanted !== locale) return // a later switch won
  i18n.global.locale.value = locale
  document.documentElement.lang = locale
  try {
    localStorage.setItem(LAST_LOCALE, locale)
  } catch {
    // private mode: the guess is only an optimisation
  }
}
