// The takeoff computation: walls to a bill of materials in which every line explains itself (inputs,
// rule, formula, rounding). Pure and deterministic, so the client runs it as the user types and the
// server runs the same code when it saves.
import type {
  CatalogItem,
  CatalogMap,
  MaterialFamily,
  MaterialRole,
  MaterialRule,
  Takeoff,
  TakeoffOptions,
  Wall,
} from '../schemas/takeoff.js'
import { materialRoleSchema } from '../schemas/takeoff.js'
import { CLOSING_CAUTION, showerBaseCautions, wallCautions, withClosingLine, type Caution } from './cautions.js'
import type { CurveLayout } from './curve.js'
import { buildWallDrawing, type WallDrawing } from './drawing.js'
import { jambScrews, panelAnchors, reinforcedBedJoints, type Fixing } from './fasteners.js'
import { defaultMaterialRules, evaluateRule, roleLabels, wasteFor, type RuleNeed } from './materials.js'
import { roundUpToStock } from './packRounding.js'
import { planSections, type SectionPlan } from './sections.js'
import { measureWall, type WallMeasures } from './wallMeasures.js'
import { isWallRefusal, layoutWall, type WallGeometry } from './wallLayout.js'
import { showerBaseLine } from './showerBaseLine.js'

export interface BomExplanation {
  inputs: Record<string, string | number>
  rule: string
  formula: string
  rounding: string
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
  geometry: WallGeometry
  curve?: CurveLayout[]
  sections: SectionPlan
  drawing: WallDrawing
  measures: WallMeasures
  fixings: Fixing[]
  cautions: Caution[]
}

export interface WallResultRefused {
  status: 'refused'
  name: string
  reason: string
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
}

export type ComputeOptions = Partial<TakeoffOptions>

interface Contribution { wall: string; need: RuleNeed; rule: MaterialRule; item?: CatalogItem }
interface Pending { role: MaterialRole; family: MaterialFamily; item?: CatalogItem; parts: Contribution[] }

function rulesFor(wall: Wall, options: ComputeOptions): MaterialRule[] {
  return (options.rules ?? defaultMaterialRules).filter((r) => r.systems.includes(wall.joint.kind))
}

function computeWall(wall: Wall, catalog: CatalogMap, options: ComputeOptions): { result: WallResult; needs: Contribution[] } {
  const unit = options.unit ?? 'in'
  const geometry = layoutWall(wall, unit)
  if (isWallRefusal(geometry)) {
    const cautions = withClosingLine([{ level: 'stop', message: geometry.reason, wall: wall.name }])
    const { reason, smallestRadiusMm } = geometry
    return { result: { status: 'refused', name: wall.name, reason, smallestRadiusMm, cautions }, needs: [] }
  }
  const plan = planSections(
    { columns: geometry.blocksAcross, courses: geometry.courses, curved: geometry.hasCurve, blockWeightKg: wall.block.weightKg },
    options.sections,
  )
  const anchors = panelAnchors(geometry, wall.freeEnds, options.anchorSpacingMm)
  const screws = geometry.joint.kind === 'spacer' ? jambScrews(geometry, plan, wall.freeEnds, options.screwsPerJambContact) : []
  const reinforcedJoints = reinforcedBedJoints(geometry, options.reinforcementSpacingMm)
  const measured = measureWall({
    geometry, plan, anchors, screws, reinforcedJoints, blockDepthMm: wall.block.depthMm, groutDepthMm: options.groutDepthMm,
  })
  const fixings = [...anchors, ...screws]
  const curve = geometry.segments.flatMap((s) => (s.kind === 'curved' ? [s.curve] : []))
  const result: WallResultOk = {
    status: 'ok',
    name: wall.name,
    geometry,
    curve: curve.length > 0 ? curve : undefined,
    sections: plan,
    drawing: buildWallDrawing({ wall, geometry, plan, fixings, unit }),
    measures: measured.measures,
    fixings,
    cautions: wallCautions({ wall, geometry, plan, fixings: fixings.length, unit }),
  }
  const needs = rulesFor(wall, options).map((rule) => {
    const item = wall.catalog?.[rule.role] ?? catalog[rule.role]
    return { wall: wall.name, rule, item, need: evaluateRule(rule, measured, item) }
  })
  return { result, needs }
}

/** Groups needs by role and stock item so each item is rounded once across all walls. */
function groupNeeds(walls: Wall[], options: ComputeOptions, catalog: CatalogMap) {
  const pending = new Map<string, Pending>()
  const results: WallResult[] = []
  for (const wall of walls) {
    const { result, needs } = computeWall(wall, catalog, options)
    results.push(result)
    for (const c of needs) {
      const key = `${c.rule.role}|${c.item?.sku ?? ''}`
      const entry = pending.get(key) ?? { role: c.rule.role, family: c.rule.family, item: c.item, parts: [] }
      entry.parts.push(c)
      pending.set(key, entry)
    }
  }
  return { pending, results }
}

function explanationOf(entry: Pending): Omit<BomExplanation, 'rounding'> {
  const many = new Set(entry.parts.map((p) => p.wall)).size > 1
  const inputs: Record<string, string | number> = {}
  for (const p of entry.parts) {
    for (const [k, v] of Object.entries(p.need.inputs)) inputs[many ? `${p.wall} · ${k}` : k] = v
  }
  const rules = [...new Map(entry.parts.map((p) => [p.rule.id, `${p.rule.note} (${p.rule.source})`])).values()]
  const total = entry.parts.reduce((s, p) => s + p.need.needed, 0)
  const formula = entry.parts.map((p) => (many ? `${p.wall}: ${p.need.formula}` : p.need.formula)).join('; ')
  return { inputs, rule: rules.join(' '), formula: many ? `${formula}; total ${Number(total.toFixed(3))}` : formula }
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
    explanation: { ...explanationOf(entry), rounding: rounded.text },
    issue,
  }
}

const ROLE_ORDER = materialRoleSchema.options

function looseLines(takeoff: Takeoff): BomLine[] {
  return takeoff.looseLines.map((l) => ({
    role: 'loose',
    sku: l.sku,
    name: l.name,
    quantity: l.quantity,
    unit: l.unit,
    needed: l.quantity,
    walls: [],
    explanation: {
      inputs: { quantity: l.quantity, ...(l.note ? { note: l.note } : {}) },
      rule: 'Entered by hand',
      formula: `${l.quantity} ${l.unit} as entered`,
      rounding: 'none',
    },
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
  const base = showerBaseLine(takeoff.showerBase, catalog.showerBase)
  const lines = [...wallLines, ...(base ? [base] : []), ...looseLines(takeoff)]
  const issues: Caution[] = lines
    .filter((l) => l.issue)
    .map((l) => ({ level: 'warn', message: `${l.name}: ${l.issue}; the quantity cannot be ordered until it is fixed.` }))
  const cautions = withClosingLine([
    ...results.flatMap((w) => w.cautions.filter((c) => c !== CLOSING_CAUTION)),
    ...showerBaseCautions(takeoff.showerBase),
    ...issues,
  ])
  return { walls: results, lines, cautions, totals: totalsOf(results, lines, cautions, takeoff) }
}
