// Every text and control colour of the theme against every background it is drawn on, read from the
// theme's own CSS variables (src/assets/theme.css), the ratio computed by axe-core's colour module (a
// general-purpose reference library from the npm registry; the WCAG 2.2 relative-luminance formula).
import { readFileSync } from 'node:fs'
import path from 'node:path'
import axe from 'axe-core'
import { describe, expect, it } from 'vitest'

const css = readFileSync(path.resolve(import.meta.dirname, '../../src/assets/theme.css'), 'utf8')
const root = css.slice(css.indexOf(':root'), css.indexOf('}', css.indexOf(':root')))
const vars = new Map([...root.matchAll(/(--[\w-]+):\s*(#[0-9a-fA-F]{6})\s*;/g)].map((m) => [m[1], m[2]]))

function hex(name: string): string {
  const value = name.startsWith('#') ? name : vars.get(name)
  if (!value) throw new Error(`${name} is not a colour on :root in theme.css`)
  return value
}
// axe-core's colour module is public at run time but not in its type declarations.
interface AxeColour { getContrast(a: object, b: object): number; Color: new (r: number, g: number, b: number, a: number) => object }
const axeColour = (axe.commons as unknown as { color: AxeColour }).color

function colour(name: string) {
  const h = hex(name)
  return new axeColour.Color(parseInt(h.slice(1, 3), 16), parseInt(h.slice(3, 5), 16), parseInt(h.slice(5, 7), 16), 1)
}
const ratio = (fg: string, bg: string) => axeColour.getContrast(colour(fg), colour(bg))

const PAGES = ['--el-bg-color', '--ly-paper', '--el-fill-color-light', '--ly-glass']
const SIGNALS = ['primary', 'danger', 'error', 'warning', 'success', 'info']

describe('theme contrast (WCAG 2.2)', () => {
  it('computes ratios as the WCAG definition does', () => {
    // source: WCAG 2.2, definition of contrast ratio: black on white is 21:1, a colour on itself 1:1
    expect(ratio('#000000', '#ffffff')).toBeCloseTo(21, 5)
    expect(ratio('#767676', '#767676')).toBeCloseTo(1, 5)
    // from memory: #767676 is the lightest grey that reaches 4.5:1 on white (4.54:1)
    expect(ratio('#767676', '#ffffff')).toBeCloseTo(4.54, 2)
  })

  // source: WCAG 2.2 SC 1.4.3 Contrast (Minimum), level AA: text at least 4.5:1
  it.each(['--el-text-color-primary', '--el-text-color-regular', '--el-text-color-secondary', '--el-text-color-placeholder', '--ly-ink', '--ly-ink-soft', '--ly-ink-quiet', '--ly-ink-hint'])(
    'text %s reaches 4.5:1 on every page background',
    (fg) => {
      for (const bg of PAGES) expect(ratio(fg, bg), `${fg} on ${bg}`).toBeGreaterThanOrEqual(4.5)
    },
  )

  // source: WCAG 2.2 SC 1.4.3: link buttons and plain tags draw the signal colour on white and on its
  // lightest tint; solid buttons and tags draw white on the signal colour.
  it.each(SIGNALS)('the %s colour reaches 4.5:1 as text and behind white text', (name) => {
    const c = `--el-color-${name}`
    for (const bg of ['--el-bg-color', '--ly-paper', `--el-color-${name}-light-9`]) expect(ratio(c, bg), `${c} on ${bg}`).toBeGreaterThanOrEqual(4.5)
    expect(ratio('#ffffff', c), `white on ${c}`).toBeGreaterThanOrEqual(4.5)
    expect(ratio('#ffffff', `--el-color-${name}-dark-2`), `white on ${c}-dark-2 (pressed)`).toBeGreaterThanOrEqual(4.5)
  })

  // source: WCAG 2.2 SC 1.4.3 exempts an inactive control's text, but a primary button that is inactive only
  // while something is worked out (Save bill) is read the moment before it wakes: its words keep 4.5:1.
  it('an inactive primary button keeps its words at 4.5:1', () => {
    expect(css).toMatch(/--el-button-disabled-text-color:\s*var\(--el-color-primary\);\s*--el-button-disabled-bg-color:\s*var\(--el-color-primary-light-8\)/)
    expect(ratio('--el-color-primary', '--el-color-primary-light-8')).toBeGreaterThanOrEqual(4.5)
  })

  // source: WCAG 2.2 SC 1.4.3: a link is text. Every link takes one colour of ours (not the browser's blue
  // and purple), read from the rule itself, and it reaches 4.5:1 on each page background, hovered too.
  it('links take the theme colour and reach 4.5:1', () => {
    const link = /:where\(a:any-link\) \{ color: var\((--[\w-]+)\); \}/.exec(css)
    const hover = /:where\(a:any-link\):hover \{ color: var\((--[\w-]+)\); \}/.exec(css)
    expect(link, 'a link colour rule in theme.css').not.toBeNull()
    expect(hover, 'a hovered link colour rule in theme.css').not.toBeNull()
    for (const fg of [link![1], hover![1]]) {
      for (const bg of PAGES) expect(ratio(fg, bg), `${fg} on ${bg}`).toBeGreaterThanOrEqual(4.5)
    }
  })

  // source: WCAG 2.2 SC 1.4.11 Non-text Contrast, level AA: control edges and focus indicators at least 3:1
  it('control edges and the focus ring reach 3:1 on the page backgrounds', () => {
    for (const fg of ['--el-border-color', '--ly-focus', '--ly-edge']) {
      for (const bg of PAGES) expect(ratio(fg, bg), `${fg} on ${bg}`).toBeGreaterThanOrEqual(3)
    }
    // The ring turns white on the lagoon navigation rail (AppShell.vue).
    expect(ratio('#ffffff', '--ly-lagoon')).toBeGreaterThanOrEqual(3)
  })
})
