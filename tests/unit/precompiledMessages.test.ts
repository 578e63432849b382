// The build compiles the messages (scripts/precompiledMessages.ts) so the client ships without vue-i18n's message
// compiler. Every English and Spanish message, compiled, must read exactly as vue-i18n's own compiler reads the
// text as written: with named values, in each plural form, and with linked messages. The reference is vue-i18n's
// full build compiling the source files at run time; the other side gets the build step's output only.
// source: vue-i18n v11 guide, "Message Format Syntax", "Pluralization" and "Message Compilation"
// (precompiled message ASTs are evaluated by the runtime-only build)
import { readdirSync } from 'node:fs'
import { join } from 'node:path'
import { createI18n } from 'vue-i18n'
import { describe, expect, it } from 'vitest'
import { precompile } from '../../scripts/precompiledMessages.js'

const I18N_DIR = join(import.meta.dirname, '../../src/i18n')
const LANGUAGES = ['en', 'es'] as const

async function sourceMessages(language: string): Promise<Record<string, unknown>> {
  const files = readdirSync(join(I18N_DIR, language)).filter((f) => f.endsWith('.ts'))
  const areas = await Promise.all(files.map(async (f) => [f.replace(/\.ts$/, ''), ((await import(join(I18N_DIR, language, f))) as { default: unknown }).default] as const))
  return Object.fromEntries(areas)
}

/** Each message as [key, text], arrays' items under their index. */
function leaves(value: unknown, prefix = ''): [string, unknown][] {
  if (typeof value !== 'object' || value === null) return [[prefix, value]]
  return Object.entries(value).flatMap(([k, v]) => leaves(v, prefix ? `${prefix}.${k}` : k))
}

/** Each named value a message asks for (`{name}`) reads as its own name in brackets, so a misplaced value shows. */
const valuesFor = (text: unknown) => Object.fromEntries([...String(text).matchAll(/\{\s*(\w+)\s*\}/g)].map((m) => [m[1], `‹${m[1]}›`]))

const sources = Object.fromEntries(await Promise.all(LANGUAGES.map(async (l) => [l, await sourceMessages(l)] as const)))
const compiled = Object.fromEntries(LANGUAGES.map((l) => [l, Object.fromEntries(Object.entries(sources[l]).map(([area, m]) => [area, precompile(m, `${l}:${area}`)]))]))
const options = { legacy: false as const, fallbackLocale: 'en', missingWarn: false, fallbackWarn: false, warnHtmlMessage: false }
type Translate = (key: string, named: Record<string, unknown>, plural?: number) => string
function translator(messages: Record<string, unknown>) {
  const i18n = createI18n({ ...options, locale: 'en', messages: messages as never }).global as unknown as { locale: { value: string }; t: Translate }
  return { use: (language: string) => void (i18n.locale.value = language), t: i18n.t }
}
const reference = translator(sources)
const built = translator(compiled)

describe.each(LANGUAGES)('messages compiled at build time, %s', (language) => {
  const messages = leaves(sources[language])

  it('read as the run-time compiler reads them: named values and every plural form', () => {
    reference.use(language)
    built.use(language)
    const differing: string[] = []
    let withSyntax = 0
    for (const [key, source] of messages) {
      const named = valuesFor(source)
      const text = reference.t(key, named)
      if (built.t(key, named) !== text) differing.push(`${key}: ${built.t(key, named)} ≠ ${text}`)
      for (const count of [0, 1, 2, 7]) {
        const form = reference.t(key, named, count)
        if (built.t(key, named, count) !== form) differing.push(`${key} (${count}): ${built.t(key, named, count)} ≠ ${form}`)
      }
      if (/[{}@|]/.test(String(source))) withSyntax++
    }
    expect(differing).toEqual([])
    // Not vacuous: many messages carry values or plural forms, and those became syntax trees, not text.
    expect(withSyntax).toBeGreaterThan(100)
  })

  it('keeps plain text as text and turns every message with syntax into a tree', () => {
    const bad: string[] = []
    const walk = (src: unknown, out: unknown, key: string) => {
      if (typeof src === 'string') {
        const tree = typeof out === 'object' && out !== null && 'b' in out
        if (/[{}@|]/.test(src) !== tree || (!tree && out !== src)) bad.push(key)
        return
      }
      for (const [k, v] of Object.entries(src as object)) walk(v, (out as Record<string, unknown>)[k], `${key}.${k}`)
    }
    walk(sources[language], compiled[language], language)
    expect(bad).toEqual([])
  })
})

describe('a message that does not parse', () => {
  it('fails the build, naming the key', () => {
    expect(() => precompile({ title: 'Open {brace' }, 'en:demo')).toThrow(/en:demo\.title/)
    expect(() => precompile({ count: 3 }, 'en:demo')).toThrow(/en:demo\.count is a number/)
  })
})
