// The takeoff's computed words in the reader's language and unit: cautions, refusals and field problems
// carry a key and their figures (lengths in mm); these helpers word them through vue-i18n, and fall
// back to the English text the computation wrote when a key has no translation.
import type { ZodError } from 'zod'
import type { Caution } from '@shared/takeoff/cautions'
import type { SvgWords } from '@shared/takeoff/drawingSvg'
import { englishPhrase, explainText, type ExplainToken } from '@shared/takeoff/explainWords'
import { lineIssueCaution } from '@shared/takeoff/billOfMaterials'
import type { MaterialRule } from '@shared/schemas/takeoff'
import { defaultMaterialRules, ruleWordKey } from '@shared/takeoff/materials'
import { takeoffIssueProblem, takeoffIssues } from '@shared/takeoff/issues'
import { formatLength, type LengthUnit } from '@shared/units'
import { problemText } from '@/i18n/errorText'

type Translate = (key: string, values?: Record<string, unknown>) => string
type Exists = (key: string) => boolean

/** Lengths (…Mm) in the reader's unit, a smallest radius rounded up so the size named works. */
export function wordParams(params: Record<string, string | number> = {}, unit: LengthUnit, t?: Translate): Record<string, string | number> {
  const out: Record<string, string | number> = {}
  for (const [k, v] of Object.entries(params)) {
    if (typeof v === 'number' && /Mm$/.test(k)) {
      out[k] = formatLength(v, unit, { feet: v >= 120 * 25.4, style: 'words', rounding: /^smallest/.test(k) ? 'up' : 'nearest' })
    } else if (t && k === 'side') out[k] = t(`takeoff.side.${v}`)
    else if (t && (k === 'role' || k === 'lineRole')) out[k] = t(`takeoff.roleName.${v}`)
    else if (t && (k === 'exposure' || k === 'thickness')) out[k] = t(`takeoff.${k}.${v}`)
    else if (t && k === 'fields') out[k] = String(v).split(',').map((f) => t(`takeoff.mismatch.${f}`)).join(', ')
    else out[k] = v
  }
  return out
}

function keyed(prefix: string, item: { key?: string; params?: Record<string, string | number> }): string | undefined {
  if (!item.key) return undefined
  if (item.key === 'leftover_space') return `${prefix}.leftover_space.${item.params?.where ?? 'jambs'}`
  if (item.params?.variant !== undefined) return `${prefix}.${item.key}.${item.params.variant}`
  return `${prefix}.${item.key}`
}

/** A caution in the reader's language and unit; its English text when it has no key. */
export function cautionText(c: Caution, unit: LengthUnit, t: Translate, te: Exists): string {
  const key = keyed('takeoff.caution', c) ?? keyed('takeoff.refusal', c)
  for (const k of [key, c.key ? `takeoff.refusal.${c.key}` : undefined]) {
    if (k && te(k)) return t(k, wordParams(c.params, unit, t))
  }
  return c.message
}

/** What stops a bill from being saved, named by its wall where it has one. */
export function blockerText(c: Caution, unit: LengthUnit, t: Translate, te: Exists): string {
  const text = cautionText(c, unit, t, te)
  return text !== c.message && c.wall ? `${c.wall}: ${text}` : text
}

/** Why a wall cannot be built, in the reader's language and unit. */
export function refusalText(w: { key?: string; params?: Record<string, string | number>; reason: string }, unit: LengthUnit, t: Translate, te: Exists): string {
  const k = w.key ? `takeoff.refusal.${w.key}` : undefined
  return k && te(k) ? t(k, wordParams(w.params, unit, t)) : w.reason
}

/** Field problems of a takeoff form, per path, in the reader's language and unit ("At most 100 ft"). */
export function fieldProblems(error: ZodError, unit: LengthUnit, t: Translate, te: Exists): Record<string, string> {
  const out: Record<string, string> = {}
  for (const issue of takeoffIssues(error, unit)) {
    const k = `takeoff.errors.${issue.key}`
    const p = issue.params
    const values = {
      ...wordParams(p, unit, t),
      ...(typeof p.maxMm === 'number' ? { max: formatLength(p.maxMm, unit, { feet: true, style: 'words' }) } : {}),
      ...(typeof p.minMm === 'number' ? { min: formatLength(p.minMm, unit, { feet: true, style: 'words' }) } : {}),
    }
    out[issue.path] = te(k) ? t(k, values) : (problemText(takeoffIssueProblem(issue), unit) ?? t('errors.fallback.field'))
  }
  return out
}

/** The drawing's words in the reader's language. */
export function svgWords(t: Translate): SvgWords {
  return {
    elevation: t('takeoff.svg.elevation'),
    plan: t('takeoff.svg.plan'),
    freeEnd: t('takeoff.svg.freeEnd'),
    section: (n, blocks, kg, heavy) => `${t('takeoff.svg.section', { n, blocks, kg })}${heavy ? ` ${t('takeoff.svg.heavy')}` : ''}`,
    key: t('takeoff.svg.key'),
    moreSections: (n) => t('takeoff.svg.moreSections', { n }),
  }
}

/**
 * A bill line's rule, formula or rounding in the reader's language: its phrases worded through
 * `takeoff.explain.*` (a role or stock unit named in them too); the English text for a bill saved before
 * lines carried phrases.
 */
export function explainWords(tokens: ExplainToken[] | undefined, english: string, t: Translate, te: Exists): string {
  if (!tokens) return english
  return explainText(tokens, (k, p = {}) => {
    const key = `takeoff.explain.${k}`
    if (!te(key)) return englishPhrase(k, p)
    const values: Record<string, string | number> = { ...p }
    if (typeof p.role === 'string') values.role = t(`takeoff.roleName.${p.role}`)
    if (typeof p.unit === 'string' && te(`units.name.${p.unit}`)) values.unit = t(`units.name.${p.unit}`)
    return t(key, values)
  })
}

/** An input's name in the Explain panel: "<wall> · <measure>", the walls past the listed ones summed. */
export function explainInputLabel(name: string, t: Translate, te: Exists): string {
  const cut = name.lastIndexOf(' · ')
  const [wall, key] = cut >= 0 ? [name.slice(0, cut), name.slice(cut + 3)] : ['', name]
  const words = te(`takeoff.measure.${key}`) ? t(`takeoff.measure.${key}`) : key.replace(/([a-z])([A-Z])/g, '$1 $2').toLowerCase()
  // the computation names the summed rest "<n> other walls"
  const others = /^(\d+) other walls$/.exec(wall)
  const where = others ? t('takeoff.explain.step.otherWalls', { n: Number(others[1]) }) : wall
  return where ? `${where} · ${words}` : words
}

/** Why a bill line cannot be ordered, in the reader's language (its words carry no lengths). */
export function lineIssueText(row: { role: string | null; name: string; sku: string | null; issue?: string }, t: Translate, te: Exists): string {
  if (!row.issue) return ''
  return cautionText(lineIssueCaution({ role: (row.role ?? 'loose') as 'loose', name: row.name, sku: row.sku, issue: row.issue }, 'the line'), 'mm', t, te)
}

/**
 * A rule's note and source in the reader's language: the words of a rule as shipped come from the messages
 * (by the rule's key), an admin's own words stay as typed.
 */
export function ruleWords(rule: Pick<MaterialRule, 'id' | 'note' | 'source'>, t: Translate, te: Exists): { note: string; source: string } {
  const stock = defaultMaterialRules.find((r) => r.id === rule.id)
  const key = ruleWordKey(rule.id)
  const word = (kind: 'ruleNote' | 'ruleSource', own: string, shipped: string | undefined) =>
    own === shipped && te(`takeoff.explain.${kind}.${key}`) ? t(`takeoff.explain.${kind}.${key}`) : own
  return { note: word('ruleNote', rule.note, stock?.note), source: word('ruleSource', rule.source, stock?.source) }
}
