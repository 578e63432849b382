// The takeoff computation: walls to a bill of materials in which every line explains itself (inputs,
// rule, formula, rounding). Pure and deterministic, so the client runs it as the user types and the
// server runs the same code when it saves.
import type {
  BlockSpec,
  CatalogItem,
  CatalogMap,
  MaterialFamily,
  MaterialRole,
  MaterialRule,
  Takeoff,
  SiteFigures,
  TakeoffOptions,
  Wall,
} from '../schemas/takeoff.js'
import { materialRoleSchema } from '../schemas/takeoff.js'
import { CLOSING_CAUTION, showerBaseCautions, wallCautions, withClosingLine, type Caution } from './cautions.js'
import type { CurveLayout } from './curve.js'
import { buildWallDrawing, type WallDrawing } from './drawing.js'
import { edgeFixings, reinforcedBedJoints, type Fixing } from './fasteners.js'
import { englishPhrase, explainText, joinTokens, type ExplainPhrases, type ExplainToken } from './explainWords.js'
import { defaultMaterialRules, evaluateRule, roleLabels, ruleWordKey, wasteFor, type RuleNeed } from './materials.js'
import { roundUpToStock } from './packRounding.js'
import { planSections, type SectionPlan } from './sections.js'
import { fitShowerBase, showerBaseLine, type ShowerBaseFit } from './showerBaseLine.js'
import { siteFigures } from './siteFigures.js'
import { measureWall, type WallMeasures } from './wallMeasures.js'
import { isWallRefusal, layoutWall, type WallGeometry } from './wallLayout.js'

export interface BomExplanation {
  inputs: Record<string, string | number>
  /** The rule, formula and rounding in English (logs, exports, bills saved before phrases). */
  rule: string
  formula: string
  rounding: string
  /** The same as phrases, for screens in the reader's language. */
  words?: ExplainPhrases
}

export interface BomLine {
  role: MaterialRole | 'loose'
  sku: string | null
  name: string
  /** Stock units to order (whole packs when sold by the pack). */
  quantity: number
  unit: string
  packs?: number
  packSize?: number
  /** Exact need before waste and rounding. */
  needed: number
  walls: string[]
  explanation: BomExplanation
  /** Why the line cannot be ordered as it stands (no item mapped, item lacks a yield). */
  issue?: string
}

export interface WallResultOk {
  status: 'ok'
  name: string
  /** The block as laid (a unit set on end has its faces swapped). */
  block: BlockSpec
  geometry: WallGeometry
  curve?: CurveLayout[]
  sections: SectionPlan
  /** The drawing model; left out of a lean computation (the compute endpoint's answer). */
  drawing?: WallDrawing
  measures: WallMeasures
  fixings: Fixing[]
  cautions: Caution[]
}

export interface WallResultRefused {
  status: 'refused'
  name: string
  reason: string
  /** The refusal's stable name and figures (lengths in mm), for screens to word in any language and unit. */
  key: string
  params: Record<string, string | number>
  smallestRadiusMm?: number
  cautions: Caution[]
}

export type WallResult = WallResultOk | WallResultRefused

export interface TakeoffTotals {
  blocksNeeded: number
  blocksOrdered: number
  sections: number
  panelAreaM2: number
  panelAreaFt2: number
  blockWeightKg: number
  lines: number
  stops: number
}

export interface TakeoffResult {
  walls: WallResult[]
  lines: BomLine[]
  cautions: Caution[]
  totals: TakeoffTotals
  /** The made-to-order base as it will be ordered: its true size, and whether it fits its wall. */
  showerBase?: ShowerBaseFit
}

export type ComputeOptions = Partial<TakeoffOptions> & {
  /** 'lean' skips the drawing models: the bill and cautions only (the server's compute answer). */
  detail?: 'full' | 'lean'
}

interface Contribution { wall: string; need: RuleNeed; rule: MaterialRule; item?: CatalogItem; role: MaterialRole; standIn?: boolean }
interface Pending { role: MaterialRole; family: MaterialFamily; item?: CatalogItem; parts: Contribution[] }

function rulesFor(wall: Wall, rules: MaterialRule[]): MaterialRule[] {
  return rules.filter((r) => r.systems.includes(wall.joint.kind) && (!r.wetAreaOnly || wall.wetArea))
}

/** A rectangular unit set on end: its short side runs along the wall. */
function laidBlock(wall: Wall): Wall {
  if (!wall.blockOnEnd) return wall
  return { ...wall, block: { ...wall.block, faceWidthMm: wall.block.faceHeightMm, faceHeightMm: wall.block.faceWidthMm } }
}

/** The item for a rule's role, or its stand-in role's item when the catalog has none (said on the line). */
function itemFor(rule: MaterialRule, wall: Wall, catalog: CatalogMap): { item?: CatalogItem; role: MaterialRole; standIn: boolean } {
  const own = wall.catalog?.[rule.role] ?? catalog[rule.role]
  if (own || !rule.fallbackRole) return { item: own, role: rule.role, standIn: false }
  const standIn = wall.catalog?.[rule.fallbackRole] ?? catalog[rule.fallbackRole]
  return standIn ? { item: standIn, role: rule.fallbackRole, standIn: true } : { item: undefined, role: rule.role, standIn: false }
}

/**
 * Section plans of one computation by wall shape: a job's walls of the same size and block (a row of
 * identical windows) are planned once. The plan depends on nothing else in a computation.
 */
type SectionMemo = Map<string, SectionPlan>

function sectionsFor(memo: SectionMemo, wall: { columns: number; courses: number; curved: boolean; blockWeightKg: number }, options: ComputeOptions): SectionPlan {
  const key = `${wall.columns}|${wall.courses}|${wall.curved}|${wall.blockWeightKg}`
  let plan = memo.get(key)
  if (!plan) memo.set(key, (plan = planSections(wall, options.sections)))
  return plan
}

/** What every wall of one computation shares: its options, site figures, rules, section plans and walls. */
interface WallContext {
  options: ComputeOptions
  figures: SiteFigures
  rules: MaterialRule[]
  memo: SectionMemo
  /** Walls already computed, by everything but their name: a row of alike walls is worked out once. */
  walls: Map<string, { result: WallResult; needs: Contribution[] }>
}

/** A wall computed under another name, given this one: the same figures, its own name on every part. */
function renamed(done: { result: WallResult; needs: Contribution[] }, name: string): { result: WallResult; needs: Contribution[] } {
  const cautions = done.result.cautions.map((c) => (c.wall === undefined ? c : { ...c, wall: name }))
  const result: WallResult = done.result.status === 'ok' && done.result.drawing
    ? { ...done.result, name, cautions, drawing: { ...done.result.drawing, wallName: name } }
    : { ...done.result, name, cautions }
  return { result, needs: done.needs.map((c) => ({ ...c, wall: name })) }
}

function computeWallOnce(entered: Wall, catalog: CatalogMap, ctx: WallContext): { result: WallResult; needs: Contribution[] } {
  const key = JSON.stringify({ ...entered, name: '' })
  const done = ctx.walls.get(key)
  if (done) return renamed(done, entered.name)
  const computed = computeWall(entered, catalog, ctx)
  ctx.walls.set(key, computed)
  return computed
}

function computeWall(entered: Wall, catalog: CatalogMap, ctx: WallContext): { result: WallResult; needs: Contribution[] } {
  const { options, figures, memo } = ctx
  const unit = options.unit ?? 'in'
  const wall = laidBlock(entered)
  const geometry = layoutWall(wall, unit)
  if (isWallRefusal(geometry)) {
    const { reason, smallestRadiusMm, key, params } = geometry
    const cautions = withClosingLine([{ level: 'stop', message: reason, wall: wall.name, key, params }])
    return { result: { status: 'refused', name: wall.name, reason, key, params, smallestRadiusMm, cautions }, needs: [] }
  }
  const plan = sectionsFor(memo, { columns: geometry.blocksAcross, courses: geometry.courses, curved: geometry.hasCurve, blockWeightKg: wall.block.weightKg }, options)
  const fixings = edgeFixings(geometry, wall.freeEnds, figures.fixingSpacingMm)
  const reinforcedJoints = reinforcedBedJoints(geometry, options.reinforcementSpacingMm)
  const measured = measureWall({
    geometry, plan, fixings, reinforcedJoints, blockDepthMm: wall.block.depthMm,
    groutDepthMm: figures.groutDepthMm, fixingSpacingMm: figures.fixingSpacingMm,
  })
  const curve = geometry.segments.flatMap((s) => (s.kind === 'curved' ? [s.curve] : []))
  const needs = rulesFor(wall, ctx.rules).map((rule): Contribution => {
    const { item, role, standIn } = itemFor(rule, wall, catalog)
    return { wall: wall.name, rule, item, role, standIn, need: evaluateRule(rule, measured, item) }
  })
  const standIns = needs.filter((c) => c.standIn && c.need.demand > 0)
  const result: WallResultOk = {
    status: 'ok',
    name: wall.name,
    block: wall.block,
    geometry,
    curve: curve.length > 0 ? curve : undefined,
    sections: plan,
    drawing: options.detail === 'lean' ? undefined : buildWallDrawing({ wall, geometry, plan, fixings, unit }),
    measures: measured.measures,
    fixings,
    cautions: wallCautions({ wall, geometry, plan, fixings, unit, figures, standIns: standIns.map((c) => c.rule.role) }),
  }
  return { result, needs }
}

/** Groups needs by role and stock item so each item is rounded once across all walls. */
function groupNeeds(walls: Wall[], options: ComputeOptions, catalog: CatalogMap) {
  const pending = new Map<string, Pending>()
  const results: WallResult[] = []
  const ctx: WallContext = { options, figures: siteFigures(options.figures), rules: options.rules ?? defaultMaterialRules, memo: new Map(), walls: new Map() }
  for (const wall of walls) {
    const { result, needs } = computeWallOnce(wall, catalog, ctx)
    results.push(result)
    for (const c of needs) {
      // A stand-in joins the line of the item it borrows, so one item is rounded once.
      const key = `${c.role}|${c.item?.sku ?? ''}`
      const entry = pending.get(key) ?? { role: c.role, family: c.rule.family, item: c.item, parts: [] }
      entry.parts.push(c)
      pending.set(key, entry)
    }
  }
  return { pending, results }
}

/** Walls whose working a line lists one by one; a longer job lists these and sums the rest. */
export const EXPLAINED_WALLS = 8

/** Numeric inputs summed across parts (lengths, counts, volumes); other values as the first part gave them. */
const SUMMED = /Mm$|Ml$|Blocks$|Intersections|Ft$|^sections$|Screws$|Anchors$/
const summable = new Map<string, boolean>()

function summedInputs(parts: Contribution[]): Record<string, string | number> {
  const out: Record<string, string | number> = {}
  for (const p of parts) {
    for (const k in p.need.inputs) {
      const v = p.need.inputs[k]
      const before = out[k]
      let sum = summable.get(k)
      if (sum === undefined) summable.set(k, (sum = SUMMED.test(k) && !/^(piece|lap|bead|cartridge)/.test(k)))
      if (before === undefined) out[k] = v
      else if (sum && typeof v === 'number' && typeof before === 'number') out[k] = before + v
    }
  }
  for (const k in out) if (typeof out[k] === 'number') out[k] = Number((out[k] as number).toFixed(3))
  return out
}

/** English of a line's phrases: a role named in a phrase reads as the catalog's role label. */
const english = (tokens: ExplainToken[]) =>
  explainText(tokens, (k, p) => englishPhrase(k, p?.role !== undefined ? { ...p, role: roleLabels[p.role as MaterialRole].toLowerCase() } : p))

/** A rule's note and source: the default rule's by key, an admin's edited words as typed. */
function ruleTokens(p: Contribution): ExplainToken[] {
  const key = ruleWordKey(p.rule.id)
  const stock = defaultMaterialRules.find((r) => r.id === p.rule.id)
  const note: ExplainToken = stock?.note === p.rule.note ? { k: `ruleNote.${key}` } : p.rule.note
  const source: ExplainToken = stock?.source === p.rule.source ? { k: `ruleSource.${key}` } : p.rule.source
  return [note, ' (', source, ')', ...(p.standIn ? [' ', { k: 'step.standIn', p: { role: p.rule.role } }] : [])]
}

function explanationOf(entry: Pending): Pick<BomExplanation, 'inputs' | 'rule' | 'formula'> & { words: Omit<ExplainPhrases, 'rounding'> } {
  const walls = [...new Set(entry.parts.map((p) => p.wall))]
  const many = walls.length > 1
  const shown = new Set(walls.slice(0, EXPLAINED_WALLS))
  const detailed = entry.parts.filter((p) => shown.has(p.wall))
  const rest = entry.parts.filter((p) => !shown.has(p.wall))
  const inputs: Record<string, string | number> = {}
  for (const p of detailed) {
    for (const [k, v] of Object.entries(p.need.inputs)) inputs[many ? `${p.wall} · ${k}` : k] = v
  }
  if (rest.length > 0) {
    // read back by screens as "<n> other walls · <measure>" (billExplain.ts)
    const others = `${walls.length - shown.size} other walls`
    for (const [k, v] of Object.entries(summedInputs(rest))) inputs[`${others} · ${k}`] = v
  }
  const rule = joinTokens([...new Map(entry.parts.map((p) => [p.rule.id, ruleTokens(p)])).values()], ' ')
  const total = entry.parts.reduce((s, p) => s + p.need.needed, 0)
  const restTotal = rest.reduce((s, p) => s + p.need.needed, 0)
  const formula = joinTokens(detailed.map((p) => (many ? [`${p.wall}: `, ...p.need.formulaTokens] : p.need.formulaTokens)), '; ')
  if (rest.length > 0) formula.push('; ', { k: 'step.otherWalls', p: { n: walls.length - shown.size } }, `: ${Number(restTotal.toFixed(3))}`)
  if (many) formula.push('; ', { k: 'step.total', p: { n: Number(total.toFixed(3)) } })
  return { inputs, rule: english(rule), formula: english(formula), words: { rule, formula } }
}

function lineOf(entry: Pending, options: ComputeOptions): BomLine | undefined {
  const optional = entry.parts.every((p) => p.rule.optional)
  if (!entry.item && optional) return undefined
  if (entry.parts.every((p) => p.need.demand <= 0)) return undefined
  const needed = entry.parts.reduce((s, p) => s + p.need.needed, 0)
  const issue = !entry.item ? 'No catalog item is mapped to this role' : entry.parts.find((p) => p.need.issue)?.need.issue
  const unit = entry.parts[0].need.unit
  const waste = wasteFor(entry.family, options.wastePct)
  const rounded = roundUpToStock(needed, waste, entry.item?.packSize ?? 1, entry.item?.sellByPack ?? false, unit)
  return {
    role: entry.role,
    sku: entry.item?.sku ?? null,
    name: entry.item?.name ?? roleLabels[entry.role],
    quantity: rounded.quantity,
    unit,
    packs: rounded.packs,
    packSize: entry.item?.sellByPack ? entry.item.packSize : undefined,
    needed,
    walls: [...new Set(entry.parts.map((p) => p.wall))],
    explanation: (() => {
      const e = explanationOf(entry)
      return { ...e, rounding: rounded.text, words: { ...e.words, rounding: rounded.tokens } }
    })(),
    issue,
  }
}

const ROLE_ORDER = materialRoleSchema.options

/**
 * A line that cannot be ordered as it stands, as a caution: no catalog item for its role, or an item that
 * lacks the piece length or yield its rule divides by.
 */
export function lineIssueCaution(l: Pick<BomLine, 'role' | 'name' | 'sku' | 'issue'>, what: 'the quantity' | 'the line'): Caution {
  const issue = l.issue ?? ''
  const problem = l.sku === null ? 'no_item' : /^SKU /.test(issue) ? 'unknown_sku' : /piece length/.test(issue) ? 'piece_length' : /yield/i.test(issue) ? 'yield' : 'other'
  return {
    level: 'warn',
    key: 'line_issue',
    params: { variant: problem, lineRole: l.role, name: l.name, sku: l.sku ?? '', issue },
    message: `${l.name}: ${l.issue}; ${what} cannot be ordered until it is fixed.`,
  }
}

/** An explanation from its phrases, with the English beside them. */
export function phrased(inputs: Record<string, string | number>, words: ExplainPhrases): BomExplanation {
  return { inputs, rule: english(words.rule), formula: english(words.formula), rounding: english(words.rounding), words }
}

function looseLines(takeoff: Takeoff): BomLine[] {
  return takeoff.looseLines.map((l) => ({
    role: 'loose',
    sku: l.sku,
    name: l.name,
    quantity: l.quantity,
    unit: l.unit,
    needed: l.quantity,
    walls: [],
    explanation: phrased({ quantity: l.quantity, ...(l.note ? { note: l.note } : {}) }, {
      rule: [{ k: 'ruleNote.handEntered' }],
      formula: [{ k: 'step.asEntered', p: { qty: l.quantity, unit: l.unit } }],
      rounding: [{ k: 'step.none' }],
    }),
  }))
}

function totalsOf(walls: WallResult[], lines: BomLine[], cautions: Caution[], takeoff: Takeoff): TakeoffTotals {
  const ok = walls.filter((w): w is WallResultOk => w.status === 'ok')
  const blockRoles = new Set<BomLine['role']>(['block', 'endBlock', 'cornerBlock'])
  const weights = takeoff.walls.map((w) => w.block.weightKg)
  const areaM2 = ok.reduce((s, w) => s + w.geometry.areaM2, 0)
  return {
    blocksNeeded: ok.reduce((s, w) => s + w.geometry.totalBlocks, 0),
    blocksOrdered: lines.filter((l) => blockRoles.has(l.role)).reduce((s, l) => s + l.quantity, 0),
    sections: ok.reduce((s, w) => s + w.sections.sections.length, 0),
    panelAreaM2: areaM2,
    panelAreaFt2: ok.reduce((s, w) => s + w.geometry.areaFt2, 0),
    blockWeightKg: walls.reduce((s, w, i) => s + (w.status === 'ok' ? w.geometry.totalBlocks * weights[i] : 0), 0),
    lines: lines.length,
    stops: cautions.filter((c) => c.level === 'stop').length,
  }
}

/** Walls named on one caution before the rest are counted. */
const NAMED_WALLS = 3

/**
 * The same caution from several walls once, naming the walls ("Bath, Hall, Stair and 4 more"): a job of
 * many alike walls reads as a few cautions, not hundreds. Each wall's result keeps its own list.
 */
function mergeWallCautions(list: Caution[]): Caution[] {
  const byText = new Map<string, { caution: Caution; walls: string[] }>()
  for (const c of list) {
    const key = `${c.level}|${c.code ?? ''}|${c.key ?? ''}|${c.message}`
    const found = byText.get(key)
    if (found) {
      if (c.wall && !found.walls.includes(c.wall)) found.walls.push(c.wall)
    } else byText.set(key, { caution: c, walls: c.wall ? [c.wall] : [] })
  }
  return [...byText.values()].map(({ caution, walls }) => {
    if (walls.length <= 1) return caution
    const named = walls.slice(0, NAMED_WALLS).join(', ')
    return { ...caution, wall: walls.length > NAMED_WALLS ? `${named} and ${walls.length - NAMED_WALLS} more` : named }
  })
}

/**
 * Walls to an explained bill of materials. `catalog` maps each material role to the stock item that fills
 * it (a wall's own `catalog` overrides it); unmapped roles still get a line, flagged with an issue.
 */
export function computeTakeoff(takeoff: Takeoff, catalog: CatalogMap = {}, options: ComputeOptions = {}): TakeoffResult {
  const { pending, results } = groupNeeds(takeoff.walls, options, catalog)
  const ordered = [...pending.values()].sort(
    (a, b) => ROLE_ORDER.indexOf(a.role) - ROLE_ORDER.indexOf(b.role) || (a.item?.sku ?? '').localeCompare(b.item?.sku ?? ''),
  )
  const wallLines = ordered.map((e) => lineOf(e, options)).filter((l): l is BomLine => l !== undefined)
  const unit = options.unit ?? 'in'
  const baseFit = takeoff.showerBase ? fitShowerBase(takeoff, results, siteFigures(options.figures), unit) : undefined
  const base = baseFit ? showerBaseLine(baseFit, catalog.showerBase, unit) : undefined
  const lines = [...wallLines, ...(base ? [base] : []), ...looseLines(takeoff)]
  const issues: Caution[] = lines.filter((l) => l.issue).map((l) => lineIssueCaution(l, 'the quantity'))
  const cautions = withClosingLine([
    ...mergeWallCautions(results.flatMap((w) => w.cautions.filter((c) => c !== CLOSING_CAUTION))),
    ...showerBaseCautions(takeoff.showerBase, baseFit, unit),
    ...issues,
  ])
  return { walls: results, lines, cautions, totals: totalsOf(results, lines, cautions, takeoff), ...(baseFit ? { showerBase: baseFit } : {}) }
}
