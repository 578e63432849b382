// What a screen shows, read as an English or a Spanish reader would: every visible text run, placeholder,
// title and label, matched against the app's own messages (src/i18n/en and es). A run that reads as an English
// message whose Spanish differs, a raw message key, or a library's default English counts against the screen.
// Shared by the browser tests of the Spanish screens.
import { readdirSync } from 'node:fs'
import path from 'node:path'
import type { Page } from 'playwright-core'

type Tree = { [key: string]: string | Tree }
const I18N = path.resolve(import.meta.dirname, '..', '..', 'src', 'i18n')
async function load(lang: string): Promise<Record<string, Tree>> {
  const areas = readdirSync(path.join(I18N, lang)).filter((f) => f.endsWith('.ts')).map((f) => f.slice(0, -3))
  const mods = await Promise.all(areas.map((a) => import(path.join(I18N, lang, `${a}.ts`)) as Promise<{ default: Tree }>))
  return Object.fromEntries(areas.map((a, i) => [a, mods[i].default]))
}
const en = await load('en')
const es = await load('es')

function leaves(value: unknown, prefix: string, out: Map<string, string>): Map<string, string> {
  if (typeof value === 'string') out.set(prefix, value)
  else if (value && typeof value === 'object') for (const [k, v] of Object.entries(value)) leaves(v, prefix ? `${prefix}.${k}` : k, out)
  return out
}
const escape = (s: string) => s.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')

/**
 * One form of a message as a whole-text test. The regular expression is the definition; the rest only skips
 * running it where it cannot match (thousands of forms against every text run on a screen took seconds a
 * screen): a form without values matches only its own text, and one with values only a text that holds its
 * longest fixed part.
 */
interface Form { re: RegExp; exact: string | null; holds: string }
const matches = (f: Form, run: string) => (f.exact !== null ? run === f.exact : run.includes(f.holds) && f.re.test(run))

/** A message's plural forms as whole-text patterns: named values match any text, {'x'} literals are x. */
// A form with values needs 8 letters of its own ("{n} tubes" would match an item's name).
function patterns(text: string): Form[] {
  const letters = (form: string) => form.replace(/\{[^}]*\}/g, '').replace(/[^\p{L}]/gu, '').length
  return text.split('|').map((form) => form.trim()).filter((form) => letters(form) >= (/\{\w+\}/.test(form) ? 8 : 4))
    .map((form) => {
      // Each part as the text it stands for, or null for a named value.
      const parts = form.split(/(\{[^}]*\})/).map((part) => {
        if (/^\{'.*'\}$/.test(part)) return part.slice(2, -2)
        if (/^\{\w+\}$/.test(part)) return null
        return part.replace(/\s+/g, ' ')
      })
      const fixed = parts.filter((p) => p !== null)
      return {
        re: new RegExp('^' + parts.map((p) => (p === null ? '.+?' : escape(p))).join('') + '$', 'u'),
        exact: fixed.length === parts.length ? fixed.join('') : null,
        holds: fixed.reduce((a, b) => (b.length > a.length ? b : a), ''),
      }
    })
}

const enLeaves = leaves(en, '', new Map())
const esLeaves = leaves(es, '', new Map())
const spanish = [...esLeaves.values()].flatMap(patterns)
// English messages that read differently in Spanish, and that no Spanish message also reads as.
const english = [...enLeaves].filter(([key, text]) => esLeaves.get(key) !== text)
  .flatMap(([key, text]) => patterns(text).map((form) => ({ key, form })))
// The libraries' own default English (from memory): the grid's empty and loading overlays, Element Plus's empty table.
const libraryEnglish = [/^No Rows To Show$/, /^Loading\.\.\.$/, /^No Data$/, /^Page Size:$/, /^Select$/]
const AREAS = Object.keys(en).join('|')
const rawKey = new RegExp(`^(${AREAS})(\\.[A-Za-z0-9_]+)+$`)

/** How a text run reads: the same text reads the same on every screen, so each is worked out once per file. */
const readings = new Map<string, { isSpanish: boolean; englishKey: string | undefined; library: boolean }>()
function readRun(run: string) {
  let r = readings.get(run)
  if (!r) {
    r = {
      isSpanish: spanish.some((f) => matches(f, run)),
      englishKey: english.find(({ form }) => matches(form, run))?.key,
      library: libraryEnglish.some((re) => re.test(run)),
    }
    readings.set(run, r)
  }
  return r
}

export interface ScreenText { english: string[]; keys: string[]; spanish: number; matched: number }

/** Every visible text run (an element's own text) and every placeholder, title and label on the page. */
export async function screenText(page: Page): Promise<ScreenText> {
  const runs: string[] = await page.evaluate(() => {
    const out: string[] = []
    for (const el of Array.from(document.body.querySelectorAll('*'))) {
      if (!(el as HTMLElement).checkVisibility?.()) continue
      if (el.closest('[col-id="note"]')) continue // what people typed, in their own words
      if (el.closest('[translate="no"]')) continue // marked as not for translating (HTML Living Standard, the translate attribute): a mail as it was sent
      let own = ''
      for (const n of Array.from(el.childNodes)) if (n.nodeType === Node.TEXT_NODE) own += n.textContent
      own = own.replace(/\s+/g, ' ').trim()
      // one word in code type is an identifier (a rule's id), the same in every language; the working is checked
      if (own && !(el.closest('code') && !own.includes(' '))) out.push(own)
      for (const a of ['placeholder', 'title', 'aria-label']) {
        const v = el.getAttribute(a)?.replace(/\s+/g, ' ').trim()
        if (v) out.push(v)
      }
    }
    return out
  })
  const result: ScreenText = { english: [], keys: [], spanish: 0, matched: 0 }
  for (const run of runs) {
    const { isSpanish, englishKey, library } = readRun(run)
    if (rawKey.test(run)) result.keys.push(run)
    if (isSpanish) result.spanish++
    if (isSpanish || englishKey !== undefined) result.matched++
    if (!isSpanish && englishKey !== undefined) result.english.push(`${run}  (${englishKey})`)
    if (library) result.english.push(`${run}  (library default)`)
  }
  return result
}

