// English and Spanish hold the same messages: the same areas, the same keys, and in each message the same
// named values ({name}, vue-i18n's named interpolation) and the same number of plural forms (`|`,
// vue-i18n v11 guide, "Pluralization"). A screen that shows a key in one language shows it in the other.
import { describe, expect, it } from 'vitest'

type Tree = Record<string, unknown>
const load = (mods: Record<string, { default: Tree }>) =>
  Object.fromEntries(Object.entries(mods).map(([file, mod]) => [file.replace(/^.*\/([^/]+)\.ts$/, '$1'), mod.default]))

const en = load(import.meta.glob<{ default: Tree }>('../../../src/i18n/en/*.ts', { eager: true }))
const es = load(import.meta.glob<{ default: Tree }>('../../../src/i18n/es/*.ts', { eager: true }))

function leaves(value: unknown, prefix: string, out: Map<string, string>): Map<string, string> {
  if (typeof value === 'string') out.set(prefix, value)
  else if (value && typeof value === 'object') for (const [k, v] of Object.entries(value)) leaves(v, prefix ? `${prefix}.${k}` : k, out)
  return out
}
const all = (files: Record<string, Tree>) => leaves(files, '', new Map())
const names = (text: string) => [...new Set([...text.matchAll(/\{(\w+)\}/g)].map((m) => m[1]))].sort()
const forms = (text: string) => text.replace(/\{'[^']*'\}/g, '').split('|').length

describe('message files', () => {
  const enKeys = all(en)
  const esKeys = all(es)

  it('every area has a file in both languages', () => {
    expect(Object.keys(es).sort()).toEqual(Object.keys(en).sort())
  })

  it('every English key has a Spanish message, and Spanish has no key English lacks', () => {
    expect([...enKeys.keys()].filter((k) => !esKeys.has(k))).toEqual([])
    expect([...esKeys.keys()].filter((k) => !enKeys.has(k))).toEqual([])
  })

  it('no message is empty', () => {
    expect([...enKeys, ...esKeys].filter(([, text]) => !text.trim()).map(([k]) => k)).toEqual([])
  })

  it('each Spanish message takes the same named values and plural forms as its English one', () => {
    const differ: string[] = []
    for (const [key, text] of enKeys) {
      const other = esKeys.get(key)
      // An English message that is only the server's own English ({text}) has a general Spanish sentence.
      if (other === undefined || text === '{text}') continue
      if (names(text).join() !== names(other).join()) differ.push(`${key}: {${names(text)}} vs {${names(other)}}`)
      if (forms(text) !== forms(other)) differ.push(`${key}: ${forms(text)} plural forms vs ${forms(other)}`)
    }
    expect(differ).toEqual([])
  })
})
