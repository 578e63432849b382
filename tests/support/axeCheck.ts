// axe-core (a general-purpose accessibility checker from the npm registry) run on the page as it stands,
// with the rules for WCAG 2.0, 2.1 and 2.2, levels A and AA.
import axe from 'axe-core'
import type { Page } from 'playwright-core'

// source: axe-core rule tags for the WCAG 2.0/2.1/2.2 A and AA success criteria (axe-core API docs, "Axe-core Tags")
export const WCAG22_AA_TAGS = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22a', 'wcag22aa']

/**
 * Rows of a table or grid after its first three: drawn from the same template as the rows before them, so
 * checking them again finds nothing new and only costs time (a list of 50 rows took axe seconds). Every
 * other part of the page is checked.
 */
export const REPEATED_ROWS = ['tbody > tr:nth-child(n+4)', '.ag-row:nth-child(n+4)']

export interface AxeFinding {
  where: string
  rule: string
  impact: string
  help: string
  /** How many elements break the rule. */
  nodes: number
  targets: string[]
}

/** The violations axe finds on the page, one finding per rule, with up to five of the elements it names. */
export async function axeFindings(page: Page, where: string): Promise<AxeFinding[]> {
  // axe's own source is put into the page once per load (the app has no frames), then run on the document.
  if (!(await page.evaluate(() => 'axe' in window))) await page.evaluate(axe.source)
  const result = await page.evaluate(
    ([tags, exclude]) =>
      (window as unknown as { axe: typeof axe }).axe.run({ exclude }, { runOnly: { type: 'tag', values: tags }, resultTypes: ['violations'] }),
    [WCAG22_AA_TAGS, REPEATED_ROWS] as const,
  )
  return result.violations.map((v) => ({
    where,
    rule: v.id,
    impact: v.impact ?? 'unknown',
    help: v.help,
    nodes: v.nodes.length,
    targets: v.nodes.slice(0, 5).map((n) => `${n.target.join(' ')} ${n.html.slice(0, 160)}${n.failureSummary ? ` — ${n.failureSummary.split('\n').slice(1, 2).join('').trim()}` : ''}`),
  }))
}

/** Critical and serious findings: the ones a screen may not have. */
export const blocking = (findings: AxeFinding[]) => findings.filter((f) => f.impact === 'critical' || f.impact === 'serious')

export function describeFindings(findings: AxeFinding[]): string {
  return findings.map((f) => `${f.where}: [${f.impact}] ${f.rule} (${f.help})\n    ${f.targets.join('\n    ')}`).join('\n')
}

/** Per impact: how many places (screen or dialog) have it, how many rule breaks and how many elements. */
export function tally(findings: AxeFinding[]): Record<string, { places: number; rules: number; elements: number }> {
  const out: Record<string, { places: Set<string>; rules: number; elements: number }> = {}
  for (const f of findings) {
    const t = (out[f.impact] ??= { places: new Set(), rules: 0, elements: 0 })
    t.places.add(f.where)
    t.rules++
    t.elements += f.nodes
  }
  return Object.fromEntries(Object.entries(out).map(([k, v]) => [k, { places: v.places.size, rules: v.rules, elements: v.elements }]))
}

/**
 * Data tables and grids with no accessible name: a table names itself by its caption or its own
 * aria-label/aria-labelledby, or sits inside a region so named (the component library's table draws its
 * header and body as two tables in one box, the grid draws rows in several; the named box stands for them).
 * Layout tables (role presentation or none) are left out. One finding listing the nameless ones.
 */
export async function unnamedTables(page: Page, where: string): Promise<AxeFinding[]> {
  const nameless = await page.evaluate(() => {
    const named = (el: Element) =>
      !!el.getAttribute('aria-label')?.trim() ||
      !!el.getAttribute('aria-labelledby')?.split(/\s+/).some((id) => document.getElementById(id)?.textContent?.trim())
    const out: string[] = []
    for (const t of Array.from(document.querySelectorAll('table:not([role="presentation"]):not([role="none"]), [role="grid"], [role="treegrid"]'))) {
      if (!t.checkVisibility() || t.parentElement?.closest('[role="grid"], [role="treegrid"]')) continue
      if (t instanceof HTMLTableElement && t.caption?.textContent?.trim()) continue
      if (named(t)) continue
      const region = t.closest('[role="region"], section[aria-label], section[aria-labelledby]')
      if (region && named(region)) continue
      out.push(`${t.tagName.toLowerCase()}${t.getAttribute('role') ? `[role=${t.getAttribute('role')}]` : ''} in ${t.closest('[data-test]')?.getAttribute('data-test') ?? t.parentElement?.className ?? ''}`)
    }
    return out
  })
  // source: WCAG 2.2 SC 1.3.1 Info and Relationships and SC 2.4.6 Headings and Labels: a data table's
  // purpose is given by its caption or name (W3C WAI Tables tutorial, "Caption & Summary")
  return nameless.length
    ? [{ where, rule: 'table-name', impact: 'serious', help: 'Every data table and grid has an accessible name (caption or labelled region)', nodes: nameless.length, targets: nameless.slice(0, 8) }]
    : []
}

/**
 * Status told by colour alone: a tag, or any text drawn in one of the theme's signal colours (danger, warning,
 * success) where its colour starts, whose words (its text, screen-reader text included, or its aria-label)
 * hold no word, only a number or a symbol (a signed number counts as told). One finding listing them.
 */
export async function colourOnlyStatus(page: Page, where: string): Promise<AxeFinding[]> {
  const bare = await page.evaluate(() => {
    const probe = document.createElement('span')
    document.body.append(probe)
    const signals = new Set(
      ['danger', 'warning', 'success', 'error'].flatMap((k) => [`--el-color-${k}`, `--el-color-${k}-dark-2`]).map((v) => {
        probe.style.color = `var(${v})`
        return getComputedStyle(probe).color
      }),
    )
    probe.remove()
    const word = (el: Element) => /\p{L}{2,}/u.test(`${el.textContent ?? ''} ${el.getAttribute('aria-label') ?? ''}`)
    // The elements that hold text of their own, and every tag.
    const holders = new Set<Element>(Array.from(document.querySelectorAll('.el-tag')))
    const texts = document.createTreeWalker(document.body, NodeFilter.SHOW_TEXT)
    for (let n = texts.nextNode(); n; n = texts.nextNode()) if (n.textContent?.trim() && n.parentElement) holders.add(n.parentElement)
    const out: string[] = []
    for (const el of holders) {
      if (!(el instanceof HTMLElement) || el.closest('svg, canvas, [aria-hidden="true"]') || !el.checkVisibility()) continue
      // A select's chips are the values chosen (and its "+ 3" the count of more), not a status.
      const tag = el.classList.contains('el-tag') && !el.closest('.el-select__selection')
      const colour = getComputedStyle(el).color
      const starts = !el.parentElement || getComputedStyle(el.parentElement).color !== colour
      if (!tag && !(signals.has(colour) && starts)) continue
      // A signed number (-38 taken out, +12 put in) tells its direction by the sign as well as the colour.
      if (!word(el) && !/^[-−+]\s*\d/.test(el.textContent?.trim() ?? '')) out.push(`${el.tagName.toLowerCase()}.${String(el.className).split(' ')[0]} "${el.textContent?.trim().slice(0, 30)}"`)
    }
    return out
  })
  // source: WCAG 2.2 SC 1.4.1 Use of Color: colour is not the only visual means of conveying information
  return bare.length
    ? [{ where, rule: 'colour-only-status', impact: 'serious', help: 'A coloured status says it in words too (colour is never the only carrier)', nodes: bare.length, targets: bare.slice(0, 8) }]
    : []
}
