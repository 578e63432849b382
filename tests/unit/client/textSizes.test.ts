// Text grows with the browser's text-size setting: every font size in the client's styles is relative (rem,
// em, %), never a fixed length (px, pt…), so someone who sets larger text gets larger text everywhere.
// source: WCAG 2.2 SC 1.4.4 Resize Text (text can be resized up to 200 percent without assistive technology);
// fixed pixel sizes don't follow the browser's text size, rem does (common practice, MDN "font-size").
import { describe, expect, it } from 'vitest'
import { gridParams } from '@/components/grid/gridTheme'

// Every component's and the theme's styles as text (Vite's glob import, which the unit tests run under).
const SOURCES = import.meta.glob<string>(['../../../src/**/*.vue', '../../../src/**/*.css'], { query: '?raw', import: 'default', eager: true })

/**
 * Fixed sizes with a reason: printed paper, whose size is physical (a label of 2 5/8 × 1 in holds what fits
 * it, whatever the screen's text setting). A file is listed only with the reason, and only its own sizes in
 * points are let through.
 */
const PRINTED_AT_PHYSICAL_SIZE: Record<string, string> = {
  'src/components/labels/LabelCard.vue': 'a label printed on a sheet of fixed-size labels',
  'src/components/labels/BarcodeSymbol.vue': 'the warning printed under a barcode on a label',
  'src/views/counter/TakeoffEditorView.vue': 'the job name on the printed takeoff (print styles only)',
  'src/components/counter/BillOfMaterialsTable.vue': 'the printed bill, a table shown on paper only',
}

const FIXED = /(?:px|pt|pc|cm|mm|in|Q)$/

/** The font sizes a block of CSS declares: `font-size: x` and the size inside `font: … x/…`. */
export function fontSizes(css: string): string[] {
  const out: string[] = []
  for (const m of css.matchAll(/font-size\s*:\s*([^;}]+)/g)) out.push(m[1].trim())
  for (const m of css.matchAll(/(?<![-\w])font\s*:\s*([^;}]+)/g)) {
    const size = m[1].match(/(?:^|\s)(\d*\.?\d+[a-zA-Z%]+)(?:\/|\s)/)
    if (size) out.push(size[1])
  }
  return out
}

/** The <style> blocks of a single-file component, or the whole file for a stylesheet. */
const styles = (file: string, text: string) => (file.endsWith('.css') ? [text] : [...text.matchAll(/<style[^>]*>([\s\S]*?)<\/style>/g)].map((m) => m[1]))

describe('text sizes follow the browser setting', () => {
  it('reads the styles of the client', () => {
    expect(Object.keys(SOURCES).length).toBeGreaterThan(100)
  })
  it('finds fixed sizes where they are written (the reader itself)', () => {
    expect(fontSizes('.a { font-size: 12px; } .b { font: 600 13px/1.2 sans-serif } .c { font-size: .9rem }')).toEqual(['12px', '.9rem', '13px'])
  })
  it('sets no font size in px (or other fixed units) in any component or stylesheet', () => {
    const fixed: string[] = []
    for (const [rel, text] of Object.entries(SOURCES)) {
      const file = rel.replace(/^(\.\.\/)+/, '')
      for (const size of styles(file, text).flatMap(fontSizes)) {
        if (!FIXED.test(size)) continue
        if (PRINTED_AT_PHYSICAL_SIZE[file] && /pt\b/.test(size)) continue
        fixed.push(`${file}: font size ${size}`)
      }
    }
    expect(fixed).toEqual([])
  })
  it('gives the data grids a text size in rem', () => {
    expect(String(gridParams.fontSize)).toMatch(/^\d*\.?\d+rem$/)
  })
})
