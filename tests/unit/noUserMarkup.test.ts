// No user data reaches the page as markup (OWASP ASVS 5.0 V3.2.2, safe rendering of dynamic content;
// number from memory). Every v-html in the client is listed here with what produces its HTML; a new one
// fails until it is reviewed and added. The one that carries user text (a wall's name in its drawing)
// is rendered with hostile text and checked for escaping.
import { readdirSync, readFileSync, statSync } from 'node:fs'
import path from 'node:path'
import { describe, expect, it } from 'vitest'
import { takeoffSchema, wallSchema } from '../../shared/schemas/takeoff.js'
import { computeTakeoff } from '../../shared/takeoff/billOfMaterials.js'
import { toSvg } from '../../shared/takeoff/drawing.js'
import { block8, IN } from '../support/takeoffFixtures.js'

const SRC = path.resolve(import.meta.dirname, '..', '..', 'src')

/** Reviewed v-html sites: file → the expression bound, and where its markup comes from. */
const REVIEWED: Record<string, { bound: string; producer: string }> = {
  'components/counter/WallDrawing.vue': { bound: 'd.svg', producer: 'shared/takeoff/drawing toSvg, which escapes every text (checked below)' },
}

function vueFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const full = path.join(dir, name)
    return statSync(full).isDirectory() ? vueFiles(full) : name.endsWith('.vue') ? [full] : []
  })
}

describe('v-html', () => {
  it('appears only where reviewed, bound to the reviewed expression', () => {
    const found: Record<string, string[]> = {}
    for (const file of vueFiles(SRC)) {
      const bound = [...readFileSync(file, 'utf8').matchAll(/v-html="([^"]+)"/g)].map((m) => m[1])
      if (bound.length) found[path.relative(SRC, file)] = bound
    }
    expect(found).toEqual(Object.fromEntries(Object.entries(REVIEWED).map(([f, r]) => [f, [r.bound]])))
  })

  it('escapes a wall name full of markup in the drawing', () => {
    const hostile = `<img src=x onerror="alert(1)"> & </title><script>alert(2)</script>`
    const wall = wallSchema.parse({
      name: hostile, sizing: 'count', courses: 4, block: block8, joint: { kind: 'spacer', jointMm: IN / 8 },
      segments: [{ kind: 'straight', blocks: 3 }], freeEnds: { start: false, end: false, top: false }, exposure: 'interior', wetArea: false,
    })
    const result = computeTakeoff(takeoffSchema.parse({ walls: [wall], looseLines: [] }), {}, { unit: 'in' }).walls[0]
    if (result.status !== 'ok' || !result.drawing) throw new Error('the test wall was refused or drawn without its drawing')
    const svg = toSvg(result.drawing, { widthPx: 760, title: hostile })
    expect(svg).not.toMatch(/<img|<script|onerror="/)
    // source: XML 1.0 §2.4, & and < in character data are written as &amp; and &lt;
    expect(svg).toContain('&lt;img src=x onerror=')
  })
})
