// Every visible string goes through vue-i18n. Messages live in one file per language and area:
// src/i18n/<language>/<area>.ts, whose default export becomes the messages under `<area>.` (so
// en/stock.ts holds the keys `stock.…`). A new file is picked up by the globs in bundles/, nothing to register.
//
// The files are loaded lazily, only for the language in use (and English, the fallback), in two chunks per
// language (bundles/): the BOOT_AREAS the sign-in page and the shell need, and every other area. The router
// guard loads both before the first signed-in page shows, in parallel with that page's code and data
// (src/router/index.ts). A cold load used to ask for each area's file on its own (some twenty requests
// queued ahead of the page's data on the browser's six connections). A key of an area not loaded yet (a
// language switch, a message asked for outside a page) starts loading its chunk; the text appears when it
// arrives.
import { createI18n, type I18nOptions } from 'vue-i18n'
import { BOOT_AREAS } from './bootAreas'
import { datetimeFormats, fallbackLocale, numberFormats } from './formats'
import type { Messages } from './messageFiles'

export { BOOT_AREAS }
export type Locale = 'en' | 'es'
type Bundle = 'boot' | 'rest'
type BundleLoader = () => Promise<{ default: Record<string, Messages> }>

const FALLBACK: Locale = 'en'

const bundles: Record<Locale, Record<Bundle, BundleLoader>> = {
  en: { boot: () => import('./bundles/enBoot'), rest: () => import('./bundles/enRest') },
  es: { boot: () => import('./bundles/esBoot'), rest: () => import('./bundles/esRest') },
}

const bundleOf = (area: string): Bundle => ((BOOT_AREAS as readonly string[]).includes(area) ? 'boot' : 'rest')

/** Loads (or is loading) per language and bundle; a settled load stays, a failed one may be tried again. */
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

function loadOne(locale: Locale, bundle: Bundle): Promise<void> {
  const id = `${locale}/${bundle}`
  let pending = loads.get(id)
  if (!pending) {
    const load = bundles[locale]?.[bundle]
    if (!load) return Promise.resolve()
    pending = load().then(
      (mod) => i18n.global.mergeLocaleMessage(locale, mod.default),
      (err: unknown) => {
        loads.delete(id) // a chunk that failed to arrive (offline) is asked for again next time
        throw err
      },
    )
    loads.set(id, pending)
  }
  return pending
}

/** Loads the messages of these areas ('all': every area) for a language and its fallback. */
export function loadMessages(areas: readonly string[] | 'all', locale: Locale = currentLocale()): Promise<void> {
  return loadBundles(areas === 'all' ? ['boot', 'rest'] : [...new Set(areas.map(bundleOf))], locale)
}

function loadBundles(wanted: readonly Bundle[], locale: Locale): Promise<void> {
  const chain = locale === FALLBACK ? [FALLBACK] : [locale, FALLBACK]
  return Promise.all(chain.flatMap((l) => wanted.map((b) => loadOne(l, b)))).then(() => undefined)
}

/** The bundles loaded so far in any language: a language switch loads the same ones in the new language. */
function loadedBundles(): Bundle[] {
  return [...new Set([...loads.keys()].map((id) => id.split('/')[1] as Bundle))]
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
  await loadBundles(loadedBundles(), locale).catch(() => undefined)
  if (wanted !== locale) return // a later switch won
  i18n.global.locale.value = locale
  document.documentElement.lang = locale
  rememberLocale(locale)
}

/**
 * Kept for the sign-in page's next visit once the page is idle: the browser opens its storage on the first use,
 * and that read blocks the page (some 50–80 ms on a busy machine before a cold page's first rows).
 */
function rememberLocale(locale: Locale): void {
  const write = () => {
    try {
      localStorage.setItem(LAST_LOCALE, locale)
    } catch {
      // private mode: the guess is only an optimisation
    }
  }
  if (typeof requestIdleCallback === 'function') requestIdleCallback(write, { timeout: 2000 })
  else setTimeout(write, 500)
}
