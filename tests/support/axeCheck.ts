// axe-core (a general-purpose accessibility checker from the npm registry) run on the page as it stands,
// with the rules for WCAG 2.0, 2.1 and 2.2, levels A and AA.
import axe from 'axe-core'
import type { Page } from 'playwright-core'

// source: axe-core rule tags for the WCAG 2.0/2.1/2.2 A and AA success criteria (axe-core API docs, "Axe-core Tags")
export const WCAG22_AA_TAGS = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22a', 'wcag22aa']

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
    (tags) => (window as unknown as { axe: typeof axe }).axe.run(document, { runOnly: { type: 'tag', values: tags }, resultTypes: ['violations'] }),
    WCAG22_AA_TAGS,
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
