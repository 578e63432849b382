// Every error code the server can answer (the registry in shared/errors/errorCodes.ts, which AppError's
// type requires) has a message in English and in Spanish, and no message asks for a value its code does
// not carry. Placeholders are vue-i18n's named interpolation, `{name}` (vue-i18n v11 guide, "Message
// Format Syntax"); `|` separates plural forms (same guide, "Pluralization").
import { describe, expect, it } from 'vitest'
import { ERROR_CODES } from '../../shared/errors/errorCodes.js'
import en from '../../src/i18n/en/errors.js'
import es from '../../src/i18n/es/errors.js'

const GROUPS = new Set(['values', 'fallback', 'units'])
const codes = Object.keys(ERROR_CODES)
const placeholders = (text: string) => [...text.matchAll(/\{(\w+)\}/g)].map((m) => m[1])

function messages(file: Record<string, unknown>) {
  return Object.fromEntries(Object.entries(file).filter(([k]) => !GROUPS.has(k))) as Record<string, unknown>
}

function leafKeys(value: unknown, prefix = ''): string[] {
  if (typeof value !== 'object' || value === null) return [prefix]
  return Object.entries(value).flatMap(([k, v]) => leafKeys(v, prefix ? `${prefix}.${k}` : k))
}

describe.each([
  ['English', en],
  ['Spanish', es],
])('%s error messages', (_name, file) => {
  const own = messages(file)

  it('has a message for every registered code', () => {
    const missing = codes.filter((c) => typeof own[c] !== 'string' || !(own[c] as string).trim())
    expect(missing).toEqual([])
  })

  it('has no message for a code that is not registered (a typo or a code removed)', () => {
    expect(Object.keys(own).filter((k) => !codes.includes(k))).toEqual([])
  })

  it('uses only the values its code carries (and unit)', () => {
    const wrong: string[] = []
    for (const code of codes) {
      const allowed = new Set<string>([...ERROR_CODES[code as keyof typeof ERROR_CODES], 'unit'])
      for (const name of placeholders(String(own[code] ?? ''))) if (!allowed.has(name)) wrong.push(`${code}: {${name}}`)
    }
    expect(wrong).toEqual([])
  })

  it('keeps vue-i18n syntax out of the words (a bare @, $ or | changes the message; write {\'@\'})', () => {
    const risky = Object.entries(own).filter(([, text]) => /[@|$]/.test(String(text).replace(/\{'[^']*'\}/g, '')))
    expect(risky).toEqual([])
  })
})

describe('both languages', () => {
  it('have the same fallback, unit and value keys', () => {
    for (const group of GROUPS) {
      expect(leafKeys((es as Record<string, unknown>)[group]).sort(), group).toEqual(leafKeys((en as Record<string, unknown>)[group]).sort())
    }
  })

  it('say different things in Spanish (no English copied over), names and {text} aside', () => {
    const same = codes.filter((c) => {
      const text = String((en as Record<string, unknown>)[c])
      return text === String((es as Record<string, unknown>)[c]) && text !== '{text}'
    })
    expect(same).toEqual([])
  })
})
