// The everything-out README and the import templates' guide sheets in Spanish: their own labels have the same
// keys in both languages, and every description they write (of a file, a column, an import, a table left out,
// what a template's column takes) has its Spanish. A text added
// or changed in English without its Spanish fails here, as does a Spanish text no longer written.
import { describe, expect, it } from 'vitest'
import { ITEM_COLUMNS, itemColumnAllowed } from '../../server/services/catalogSheet.js'
import { EXPORT_PARTS } from '../../server/services/exports/businessExport.js'
import { LEFT_OUT } from '../../server/services/exports/recordParts.js'
import { README_SPANISH, README_WORDS } from '../../server/services/exports/readmeWords.js'
import { DATA_IMPORT_GUIDES } from '../../server/services/imports/dataImportKinds.js'

/** Every English description the README and the templates write, read from the parts and guides as declared. */
const written = new Set([
  ...Object.values(DATA_IMPORT_GUIDES).flatMap((g) => Object.values(g.guide)),
  ...ITEM_COLUMNS.map(itemColumnAllowed).filter(Boolean),
  ...EXPORT_PARTS.flatMap((p) => [p.about, ...p.columns.flatMap((c) => [c.about, ...(c.allowed ? [c.allowed] : []), ...(c.readBy ? [c.readBy] : [])])]),
  ...LEFT_OUT.map((l) => l.why),
])
const placeholders = (s: string) => [...s.matchAll(/\{(\w+)\}/g)].map((m) => m[1]).sort()

describe('the README words', () => {
  it('has the same labels in English and Spanish, each with the same placeholders', () => {
    // common practice: a message catalogue is complete in every language it ships
    expect(Object.keys(README_WORDS.es).sort()).toEqual(Object.keys(README_WORDS.en).sort())
    for (const [key, en] of Object.entries(README_WORDS.en)) {
      const es = README_WORDS.es[key as keyof typeof README_WORDS.en]
      expect(es.trim(), key).not.toBe('')
      expect(placeholders(es), key).toEqual(placeholders(en))
    }
  })

  it('has a Spanish text for every description the README or a template writes, and none it no longer writes', () => {
    expect(written.size).toBeGreaterThan(300)
    const missing = [...written].filter((en) => !README_SPANISH[en]?.trim())
    expect(missing).toEqual([])
    expect(Object.keys(README_SPANISH).filter((en) => !written.has(en))).toEqual([])
    // A Spanish text is not the English one copied (code lists keep their codes but say what they are).
    expect(Object.entries(README_SPANISH).filter(([en, es]) => en === es).map(([en]) => en)).toEqual([])
  })
})
