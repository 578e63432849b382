// Binds a takeoff to the yard's catalog and computes its bill: each wall's block SKU picks its block
// sizes and, through the role → item mapping, the items that fill every material role. The browser
// runs this as the user types; the server runs the same function when it computes or saves.
import type { BlockOption, CounterCatalog, LineAvailability, RoleItemRecord } from '../schemas/counter.js'
import type { CatalogItem, CatalogMap, JointKind, LengthUnitName, Takeoff, Wall } from '../schemas/takeoff.js'
import { materialRoleSchema } from '../schemas/takeoff.js'
import { computeTakeoff, lineIssueCaution, type BomLine, type TakeoffResult, type WallResult } from '../takeoff/billOfMaterials.js'
import type { Caution } from '../takeoff/cautions.js'
import { RADIUS_TOLERANCE_MM, minInsideRadiusMm } from '../takeoff/curve.js'
import { edgeAllowanceMm, fitOpening, resolveJoint } from '../takeoff/geometry.js'
import { siteFigures } from '../takeoff/siteFigures.js'

export interface CounterBillLine extends BomLine {
  itemId: number | null
  madeToOrder: boolean
}

/** A catalog block the wall could be laid in instead, and what it would change. */
export interface BlockSwap {
  sku: string
  name: string
  nominal: string
  /** Set on end: the short side along the wall. */
  onEnd: boolean
  /** The tightest inside radius it turns with the wall's joints (radius advice). */
  smallestRadiusMm?: number
  /** The largest space left at a jamb or the head with it (leftover advice). */
  gapMm?: number
}

/** Blocks that would cure a wall's problem: a radius too tight, or space left after whole blocks. */
export interface WallAdvice {
  wall: number
  reason: 'radius' | 'leftover'
  swaps: BlockSwap[]
}

export interface CounterBill extends Omit<TakeoffResult, 'lines'> {
  lines: CounterBillLine[]
  /** The takeoff as computed: block sizes and per-wall items filled from the catalog. */
  bound: Takeoff
  /** The unit the bill was computed in: the takeoff's own, else the one asked for. */
  unit: LengthUnitName
  advice: WallAdvice[]
}

/** How closely a mapping row fits: a row for this very block beats one for any block, joint likewise. */
function fit(row: RoleItemRecord, blockItemId: number | undefined, jointKind: JointKind | undefined): number {
  if (row.blockItemId !== null && row.blockItemId !== blockItemId) return -1
  if (row.jointKind !== null && row.jointKind !== jointKind) return -1
  if (!row.item.active) return -1
  return (row.blockItemId !== null ? 2 : 0) + (row.jointKind !== null ? 1 : 0)
}

const bare = (item: RoleItemRecord['item']): CatalogItem => {
  const { itemId: _id, madeToOrder: _mto, active: _active, ...rest } = item
  return rest
}

/** The catalog map for one wall: the picked block fills 'block', mapping rows fill the other roles. */
export function resolveWallCatalog(rows: RoleItemRecord[], block: BlockOption | undefined, jointKind: JointKind | undefined): CatalogMap {
  const map: CatalogMap = {}
  for (const role of materialRoleSchema.options) {
    if (role === 'block') continue
    let best: RoleItemRecord | undefined
    let bestFit = -1
    for (const row of rows) {
      if (row.role !== role) continue
      const f = fit(row, block?.itemId, jointKind)
      if (f > bestFit || (f === bestFit && best && row.id < best.id)) [best, bestFit] = [row, f]
    }
    if (best && bestFit >= 0) map[role] = bare(best.item)
  }
  if (block) map.block = block.item
  return map
}

/** A wall's block sizes from the catalog item, and the SKU that ties the wall to it. */
export function wallBlockFields(block: BlockOption): Pick<Wall, 'block' | 'catalog'> {
  return {
    block: {
      nominal: block.nominal,
      faceWidthMm: block.faceWidthMm,
      faceHeightMm: block.faceHeightMm,
      depthMm: block.depthMm,
      thicknessClass: block.thicknessClass,
      weightKg: block.weightKg,
      ...(block.pattern ? { pattern: block.pattern } : {}),
    },
    catalog: { block: block.item },
  }
}

/** How many swaps to offer at most: a short list a clerk can read at the counter. */
const MAX_SWAPS = 6

/** Each catalog block as laid, and set on end when its face is oblong. */
function orientations(catalog: CounterCatalog): { block: BlockOption; onEnd: boolean; widthMm: number; heightMm: number }[] {
  return catalog.blocks.flatMap((block) => {
    const laid = { block, onEnd: false, widthMm: block.faceWidthMm, heightMm: block.faceHeightMm }
    return block.faceHeightMm < block.faceWidthMm - 0.5 ? [laid, { block, onEnd: true, widthMm: block.faceHeightMm, heightMm: block.faceWidthMm }] : [laid]
  })
}

const isCurrent = (wall: Wall, o: { block: BlockOption; onEnd: boolean }) => o.block.sku === wall.catalog?.block?.sku && o.onEnd === !!wall.blockOnEnd

/** One swap per size, way up and thickness (the first, most alike one): a choice of sizes, not of patterns. */
function bySize<T extends { o: { block: BlockOption; onEnd: boolean } }>(list: T[]): T[] {
  const seen = new Set<string>()
  return list.filter(({ o }) => {
    const key = `${o.block.nominal}|${o.onEnd}|${o.block.thicknessClass}|${o.block.depthMm}`
    if (seen.has(key)) return false
    seen.add(key)
    return true
  })
}

/** Closest to the wall's own block first: same pattern, same thickness class. */
function likeness(wall: Wall, block: BlockOption): number {
  return Number(block.pattern !== (wall.block.pattern ?? null)) * 2 + Number(block.thicknessClass !== wall.block.thicknessClass)
}

/** Blocks that turn every curve of a wall refused for a radius too tight, each with its smallest radius. */
function radiusSwaps(wall: Wall, catalog: CounterCatalog): BlockSwap[] {
  const radii = wall.segments.flatMap((s) => (s.kind === 'curved' ? [s.insideRadiusMm] : []))
  if (radii.length === 0) return []
  const tightest = Math.min(...radii)
  const joint = resolveJoint(wall.joint)
  const fits = orientations(catalog)
    .map((o) => ({ o, smallest: minInsideRadiusMm(o.widthMm, o.block.depthMm, joint.curveInsideJointMm, joint.maxOutsideJointMm) }))
    .filter(({ o, smallest }) => smallest <= tightest + RADIUS_TOLERANCE_MM && !isCurrent(wall, o))
    .sort((a, b) => likeness(wall, a.o.block) - likeness(wall, b.o.block) || b.smallest - a.smallest || a.o.block.sku.localeCompare(b.o.block.sku))
  return bySize(fits)
    .slice(0, MAX_SWAPS)
    .map(({ o, smallest }) => ({ sku: o.block.sku, name: o.block.name, nominal: o.block.nominal, onEnd: o.onEnd, smallestRadiusMm: smallest }))
}

/** Blocks whose whole units leave no more than the set gap at the jambs and head of a one-run opening. */
function leftoverSwaps(wall: Wall, catalog: CounterCatalog, limitMm: number): BlockSwap[] {
  const run = wall.segments.length === 1 ? wall.segments[0] : undefined
  if (wall.sizing !== 'opening' || run?.kind !== 'straight' || run.lengthMm === undefined) return []
  const joint = resolveJoint(wall.joint)
  const allowance = edgeAllowanceMm(joint.expansionMm, joint.jointMm)
  const gapOf = (openingMm: number, faceMm: number, extra: number) => {
    const n = fitOpening(openingMm, faceMm, joint.jointMm).blocks
    return n === 0 ? Infinity : openingMm - (n * (faceMm + joint.jointMm) + extra)
  }
  const fits = orientations(catalog)
    .filter((o) => !isCurrent(wall, o))
    .map((o) => {
      const jambs = gapOf(run.lengthMm as number, o.widthMm, 2 * allowance - joint.jointMm) / 2
      const head = wall.freeEnds.top ? 0 : gapOf(wall.heightMm ?? 0, o.heightMm, allowance)
      return { o, gap: Math.max(jambs, head), fits: jambs >= -1e-9 && head >= -1e-9 }
    })
    .filter(({ gap, fits }) => fits && gap <= limitMm + 1e-9)
    .sort((a, b) => likeness(wall, a.o.block) - likeness(wall, b.o.block) || a.gap - b.gap || a.o.block.sku.localeCompare(b.o.block.sku))
  return bySize(fits)
    .slice(0, MAX_SWAPS)
    .map(({ o, gap }) => ({ sku: o.block.sku, name: o.block.name, nominal: o.block.nominal, onEnd: o.onEnd, gapMm: gap }))
}

function adviceFor(bound: Takeoff, walls: WallResult[], catalog: CounterCatalog, leftoverLimitMm: number): WallAdvice[] {
  const out: WallAdvice[] = []
  walls.forEach((result, i) => {
    const wall = bound.walls[i]
    if (result.status === 'refused' && result.key === 'radius_too_tight') {
      out.push({ wall: i, reason: 'radius', swaps: radiusSwaps(wall, catalog) })
    } else if (result.status === 'ok' && result.geometry.gaps.some((g) => g.gapMm > leftoverLimitMm + 1e-9)) {
      out.push({ wall: i, reason: 'leftover', swaps: leftoverSwaps(wall, catalog, leftoverLimitMm) })
    }
  })
  return out
}

function bindWall(wall: Wall, catalog: CounterCatalog, problems: Caution[]): Wall {
  const sku = wall.catalog?.block?.sku
  const block = sku ? catalog.blocks.find((b) => b.sku === sku) : undefined
  if (sku && !block) {
    const message = `${wall.name}: block SKU ${sku} is not an active glass block in the catalog.`
    problems.push({ level: 'warn', wall: wall.name, key: 'block_not_in_catalog', params: { sku }, message })
  }
  const resolved = resolveWallCatalog(catalog.roleItems, block, wall.joint.kind)
  if (!block) return { ...wall, catalog: resolved }
  return { ...wall, block: wallBlockFields(block).block, catalog: resolved }
}

/** Item ids by SKU across everything the catalog offers, to tie bill lines to stock items. */
interface KnownItem { itemId: number; madeToOrder: boolean; unit?: string }

function itemIndex(catalog: CounterCatalog): Map<string, KnownItem> {
  const index = new Map<string, KnownItem>()
  for (const l of catalog.looseItems) index.set(l.sku, { itemId: l.itemId, madeToOrder: l.madeToOrder, unit: l.unit })
  for (const b of catalog.blocks) index.set(b.sku, { itemId: b.itemId, madeToOrder: false, unit: b.item.unit })
  for (const r of catalog.roleItems) index.set(r.item.sku, { itemId: r.itemId, madeToOrder: r.item.madeToOrder, unit: r.item.unit })
  return index
}

/** Lines keep the takeoff math's explanation; loose lines whose SKU the catalog lacks get an issue. */
function tieLines(lines: BomLine[], catalog: CounterCatalog): CounterBillLine[] {
  const index = itemIndex(catalog)
  return lines.map((line) => {
    const known = line.sku ? index.get(line.sku) : undefined
    const issue = line.issue ?? (line.role === 'loose' && !known ? `SKU ${line.sku} is not in the catalog` : undefined)
    // A loose line is counted in the item's stock unit, whatever was typed.
    const unit = line.role === 'loose' && known?.unit ? known.unit : line.unit
    return {
      ...line,
      unit,
      itemId: known?.itemId ?? null,
      madeToOrder: line.role === 'showerBase' || (known?.madeToOrder ?? false),
      ...(issue ? { issue } : {}),
    }
  })
}

/**
 * The takeoff's bill against the catalog, rules, waste allowances and site figures the admin set, in
 * the takeoff's own unit (else `unit`). 'lean' leaves the drawing models out (the server's compute answer).
 */
export function computeCounterBill(takeoff: Takeoff, catalog: CounterCatalog, unit: LengthUnitName, detail: 'full' | 'lean' = 'full'): CounterBill {
  const problems: Caution[] = []
  const bound: Takeoff = { ...takeoff, walls: takeoff.walls.map((w) => bindWall(w, catalog, problems)) }
  const globalMap = resolveWallCatalog(catalog.roleItems, undefined, undefined)
  const used = takeoff.unit ?? unit
  const figures = siteFigures(catalog.figures)
  const result = computeTakeoff(bound, globalMap, { unit: used, rules: catalog.rules, wastePct: catalog.wastePct, figures, detail })
  const lines = tieLines(result.lines, catalog)
  const looseIssues: Caution[] = lines
    .filter((l) => l.role === 'loose' && l.issue)
    .map((l) => lineIssueCaution(l, 'the line'))
  // Keep the closing line (deferring to local codes) last.
  const closing = result.cautions[result.cautions.length - 1]
  const cautions = [...problems, ...result.cautions.slice(0, -1), ...looseIssues, closing]
  return { ...result, lines, cautions, bound, unit: used, advice: adviceFor(bound, result.walls, catalog, figures.leftoverWarnMm) }
}

/**
 * Why a bill may not be saved as it stands: walls that cannot be built, lines that cannot be ordered, code
 * stops. Each keeps its stable name and figures, so a screen words it in the reader's language and unit.
 */
export function billBlockers(bill: CounterBill): Caution[] {
  const out: Caution[] = []
  for (const w of bill.walls) {
    if (w.status === 'refused') out.push({ level: 'stop', wall: w.name, key: w.key, params: w.params, message: `${w.name}: ${w.reason}` })
  }
  for (const l of bill.lines) if (l.issue) out.push({ ...lineIssueCaution(l, 'the line'), level: 'stop', message: `${l.name}: ${l.issue}` })
  for (const c of bill.cautions) if (c.level === 'stop' && !out.some((o) => o.message.endsWith(c.message))) out.push(c)
  const seen = new Set<string>()
  return out.filter((c) => !seen.has(c.message) && seen.add(c.message))
}

/** The blockers in English, for the server's refusal and its logs. */
export const saveBlockers = (bill: CounterBill): string[] => billBlockers(bill).map((c) => c.message)

/** One wall in the compute endpoint's answer: its counts and curves, not its layout or drawing. */
export interface WallSummary {
  name: string
  status: WallResult['status']
  reason?: string
  key?: string
  params?: Record<string, string | number>
  blocksAcross?: number
  courses?: number
  totalBlocks?: number
  sections?: number
  curves?: { insideRadiusMm: number; blocks: number; anglePerBlockDeg: number; builtAngleDeg: number; insideJointMm: number; outsideJointMm: number }[]
}

export function summariseWall(w: WallResult): WallSummary {
  if (w.status === 'refused') return { name: w.name, status: w.status, reason: w.reason, key: w.key, params: w.params }
  const g = w.geometry
  return {
    name: w.name,
    status: w.status,
    blocksAcross: g.blocksAcross,
    courses: g.courses,
    totalBlocks: g.totalBlocks,
    sections: w.sections.sections.length,
    curves: w.curve?.map((c) => ({
      insideRadiusMm: c.insideRadiusMm,
      blocks: c.blocks,
      anglePerBlockDeg: c.anglePerBlockDeg,
      builtAngleDeg: c.builtAngleDeg,
      insideJointMm: c.insideJointMm,
      outsideJointMm: c.outsideJointMm,
    })),
  }
}

/**
 * The compute endpoint's answer, lean: the lines, cautions and totals, each wall's counts, stock per
 * warehouse of each stocked line, and what blocks saving. The browser lays the walls out and draws them
 * itself from the same shared code; the server keeps the full layout for the bills it saves.
 */
export interface ComputeAnswer extends Omit<CounterBill, 'bound' | 'walls' | 'showerBase'> {
  walls: WallSummary[]
  showerBase?: { label: string; fit: 'follow' | 'check' | 'none'; wall?: string; mismatches: { field: string }[] }
  availability: LineAvailability[]
  blockers: string[]
}
