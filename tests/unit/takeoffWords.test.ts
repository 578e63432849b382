// Feature: every caution, refusal and blocker of a takeoff reaches the clerk in English and Spanish. Each
// carries a stable key and its figures; this checks, over walls that raise nearly every caution there is,
// that both languages have a message for each key, with the same placeholders, and that the lengths in
// them are figures a screen can put in the reader's unit.
import path from 'node:path'
import { describe, expect, it } from 'vitest'
import { billBlockers, computeCounterBill } from '../../shared/counter/counterBill.js'
import type { CounterCatalog } from '../../shared/schemas/counter.js'
import type { Takeoff } from '../../shared/schemas/takeoff.js'
import { computeTakeoff } from '../../shared/takeoff/billOfMaterials.js'
import type { Caution } from '../../shared/takeoff/cautions.js'
import { EXPLAIN_EN, type ExplainToken } from '../../shared/takeoff/explainWords.js'
import { defaultMaterialRules } from '../../shared/takeoff/materials.js'
import { DEFAULT_SITE_FIGURES } from '../../shared/takeoff/siteFigures.js'
import { block8, FT, IN, wallMaker } from '../support/takeoffFixtures.js'

type Tree = { [k: string]: string | Tree }

// The client's message files, read as the screen reads them (they sit outside the server's type project).
const messages = async (lang: 'en' | 'es') =>
  ((await import(path.resolve(import.meta.dirname, `../../src/i18n/${lang}/takeoff.ts`))) as { default: Tree }).default
const en = await messages('en')
const es = await messages('es')

function messageAt(tree: Tree, c: Caution): string | undefined {
  const variant = c.key === 'leftover_space' ? c.params?.where : c.params?.variant
  for (const area of ['caution', 'refusal']) {
    const node = (tree[area] as Tree)[c.key as string]
    const found = typeof node === 'string' ? node : node && variant !== undefined ? node[String(variant)] : undefined
    if (typeof found === 'string') return found
  }
  return undefined
}

const placeholders = (text: string) => [...text.matchAll(/\{(\w+)\}/g)].map((m) => m[1]).sort()

const wall = wallMaker('Words test')
const takeoff = (t: Partial<Takeoff>): Takeoff => ({ walls: [], looseLines: [], ...t })

/** Walls and a base that between them raise the code, joint, curve, edge, section, base and line cautions. */
function cautionsOfManyWalls(): Caution[] {
  const walls = [
    // exterior, larger than 144 ft² and 25 ft × 20 ft (IRC 2021 R607.4.1): area, length and height stops
    wall({ name: 'Big exterior', exposure: 'exterior', joint: { kind: 'mortar', jointMm: IN / 2 }, heightMm: 21 * FT, segments: [{ kind: 'straight', lengthMm: 26 * FT }] }),
    // thin unit outside at 30 psf (IRC 2021 R607.4.2), and a unit under 3 1/8 in (R607.3)
    wall({ name: 'Thin outside', exposure: 'exterior', designWindPressurePsf: 30, block: { ...block8, depthMm: 3 * IN, thicknessClass: 'thin' } }),
    wall({ name: 'Windy', exposure: 'exterior', designWindPressurePsf: 30 }),
    wall({ name: 'No wind given', exposure: 'exterior' }),
    wall({ name: 'Standard but thin', block: { ...block8, depthMm: 3.5 * IN } }),
    // a curve that reverses, free ends and top, wet, sized from an opening that leaves space
    wall({
      name: 'Serpentine', sizing: 'count', heightMm: undefined, courses: 9, wetArea: true, freeEnds: { start: true, end: true, top: true },
      segments: [
        { kind: 'curved', insideRadiusMm: 70 * IN, arcAngleDeg: 90, direction: 'left' },
        { kind: 'curved', insideRadiusMm: 70 * IN, arcAngleDeg: 90, direction: 'right', closing: 'radius' },
      ],
    }),
    wall({ name: 'Free start', freeEnds: { start: true, end: false, top: false }, segments: [{ kind: 'straight', lengthMm: 78 * IN }] }),
    wall({ name: 'Small', sizing: 'count', heightMm: undefined, courses: 2, segments: [{ kind: 'straight', blocks: 3 }], freeEnds: { start: false, end: true, top: false } }),
    wall({ name: 'Sixteen', sizing: 'count', heightMm: undefined, courses: 4, segments: [{ kind: 'straight', blocks: 4 }] }),
    wall({ name: 'Heavy', block: { ...block8, weightKg: 9 } }),
    wall({ name: 'Too tight', sizing: 'count', heightMm: undefined, courses: 3, segments: [{ kind: 'curved', insideRadiusMm: 20 * IN, arcAngleDeg: 90, direction: 'left' }] }),
  ]
  const base = { widthMm: 36 * IN, depthMm: 36 * IN, drain: { fromLeftMm: 60 * IN, fromBackMm: 18 * IN }, entry: 'right' as const, curbless: true }
  const r = computeTakeoff(takeoff({ walls, showerBase: base, looseLines: [] }), {}, { unit: 'in' })
  return r.cautions
}

describe('takeoff words in English and Spanish', () => {
  const cautions = cautionsOfManyWalls()

  it('raises the cautions this check is about', () => {
    const keys = new Set(cautions.map((c) => c.key))
    for (const k of ['panel_area', 'panel_length', 'panel_height', 'wind_thin', 'wind_chart', 'wind_assumed', 'too_thin', 'thinner_than_standard',
      'mortar_joint', 'spacer_system', 'curve_support', 'free_ends', 'wet_area', 'heavy_sections', 'sections_note', 'drilling', 'silicone_cure',
      'level_plumb', 'closing_line', 'radius_too_tight', 'leftover_space', 'base_curbless', 'base_made_to_order', 'line_issue']) {
      expect(keys, k).toContain(k)
    }
  })

  it('every caution has a key and a message in both languages with the same placeholders', () => {
    for (const c of cautions) {
      expect(c.key, c.message).toBeDefined()
      const english = messageAt(en, c)
      const spanish = messageAt(es, c)
      expect(english, `${c.key} in English`).toBeDefined()
      expect(spanish, `${c.key} in Spanish`).toBeDefined()
      expect(placeholders(spanish!), c.key).toEqual(placeholders(english!))
      // every placeholder has its figure
      for (const name of placeholders(english!)) expect(c.params ?? {}, `${c.key}.${name}`).toHaveProperty(name)
    }
  })

  it('blockers keep their keys: a wall refused, a line with no item, a code stop', () => {
    const catalog: CounterCatalog = { blocks: [], roleItems: [], rules: defaultMaterialRules, wastePct: {}, figures: DEFAULT_SITE_FIGURES, looseItems: [] }
    const bill = computeCounterBill(
      takeoff({ walls: [wall({ name: 'Tight', sizing: 'count', heightMm: undefined, courses: 3, segments: [{ kind: 'curved', insideRadiusMm: 20 * IN, arcAngleDeg: 90, direction: 'left' }] }), wall({ name: 'Plain' })] }),
      catalog,
      'in',
    )
    const blockers = billBlockers(bill)
    expect(blockers.map((b) => b.key)).toEqual(expect.arrayContaining(['radius_too_tight', 'line_issue']))
    for (const b of blockers) {
      expect(messageAt(en, b), b.message).toBeDefined()
      expect(messageAt(es, b), b.message).toBeDefined()
    }
  })

  it('English and Spanish hold the same keys in the takeoff area', () => {
    const paths = (tree: Tree, at = ''): string[] =>
      Object.entries(tree).flatMap(([k, v]) => (typeof v === 'string' ? [`${at}${k}`] : paths(v, `${at}${k}.`)))
    expect(paths(es).sort()).toEqual(paths(en).sort())
  })

  it('every phrase of every line\'s explanation has English and Spanish words with the same placeholders, and the Spanish keeps no English note', () => {
    const walls = [
      wall({ name: 'Curved wet', wetArea: true, freeEnds: { start: false, end: true, top: true }, sizing: 'count', heightMm: undefined, courses: 8,
        segments: [{ kind: 'curved', insideRadiusMm: 60 * IN, arcAngleDeg: 90, direction: 'left' }] }),
      wall({ name: 'Mortar partition', joint: { kind: 'mortar', jointMm: IN / 4 } }),
    ]
    const base = { widthMm: 36 * IN, depthMm: 36 * IN, drain: { fromLeftMm: 18 * IN, fromBackMm: 18 * IN }, entry: 'right' as const, curbless: true }
    const r = computeTakeoff(takeoff({ walls, showerBase: base, looseLines: [{ sku: 'TRIM-1', name: 'Tile trim', quantity: 3, unit: 'piece' }] }), {}, { unit: 'in' })
    const at = (tree: Tree, key: string) => key.split('.').reduce<string | Tree | undefined>((n, k) => (typeof n === 'object' ? n[k] : undefined), tree)
    const spanishNotes: string[] = []
    let phrases = 0
    for (const line of r.lines) {
      expect(line.explanation.words, line.name).toBeDefined()
      const tokens: ExplainToken[] = Object.values(line.explanation.words!).flat()
      for (const tk of tokens) {
        if (typeof tk === 'string') continue
        phrases++
        const english = at(en.explain as Tree, tk.k)
        const spanish = at(es.explain as Tree, tk.k)
        expect(typeof english, `${tk.k} in English`).toBe('string')
        expect(typeof spanish, `${tk.k} in Spanish`).toBe('string')
        expect(placeholders(spanish as string), tk.k).toEqual(placeholders(english as string))
        for (const name of placeholders(english as string)) expect(tk.p ?? {}, `${tk.k}.${name}`).toHaveProperty(name)
        if (tk.k.startsWith('ruleNote.')) spanishNotes.push(spanish as string)
      }
    }
    expect(phrases).toBeGreaterThan(40)
    // no Spanish note is left as the English one (a missing translation copied across)
    const englishNotes = new Set(Object.values(EXPLAIN_EN.ruleNote) as string[])
    expect(spanishNotes.length).toBeGreaterThan(5)
    for (const note of spanishNotes) expect(englishNotes.has(note), note).toBe(false)
    for (const [key, note] of Object.entries(EXPLAIN_EN.ruleNote)) expect(at(es.explain as Tree, `ruleNote.${key}`), key).not.toBe(note)
  })
})
