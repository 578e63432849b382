// The made-to-order shower base: ordered to the wall it carries. Its curb radius and arc come from that
// wall's curve as built and its footprint from the wall's plan (or, entered by hand, are checked against
// them); one bill line carries the true size, never drawn from stock.
import type { CatalogItem, ShowerBase, Takeoff } from '../schemas/takeoff.js'
import type { SiteFigures } from '../schemas/takeoff.js'
import { formatLength, formatSize, type LengthUnit } from '../units.js'
import { phrased, type BomLine, type WallResult, type WallResultOk } from './billOfMaterials.js'
import { roleLabels } from './materials.js'
import { buildPlanView } from './planView.js'

/** What the wall as built asks of the base it stands on. */
export interface BaseFromWall {
  /** The wall's plan extents to its outside face: along its first run, and across it. */
  alongMm: number
  acrossMm: number
  /** The curve the curb follows: the first curved run's layout radius and built arc. */
  curb?: { radiusMm: number; arcDeg: number }
  curved: boolean
}

export type BaseMismatchField = 'footprint' | 'curbRadius' | 'curbArc' | 'curbShape'

export interface BaseMismatch {
  field: BaseMismatchField
  /** As entered and as the wall needs it: mm for lengths, degrees for the arc. */
  entered: number | string
  wall: number | string
}

export interface ShowerBaseFit {
  /** The base as it will be made: the wall's figures when it follows the wall, else as entered. */
  base: ShowerBase
  entered: ShowerBase
  fit: 'follow' | 'check' | 'none'
  wall?: string
  fromWall?: BaseFromWall
  mismatches: BaseMismatch[]
  /** Why the wall could not be used: not in the takeoff, or not built. */
  wallProblem?: 'missing' | 'refused'
  /** The drain falls outside the footprint the base is made to. */
  drainOutside: boolean
  /** The true size in words, in the takeoff's unit: "70 1/2 × 52 in, curved curb R 48 in, 90°". */
  label: string
}

/** Inch entries arrive as 1219.1999999999998 mm; the explanation shows a tenth of a millimetre. */
const mm = (value: number) => Number(value.toFixed(1))

/** Footprint and curb of the base a wall needs: its one-course plan extents and its first curve. */
export function baseFromWall(wall: WallResultOk): BaseFromWall {
  const g = wall.geometry
  const plan = wall.drawing?.plan ?? buildPlanView(g.segments, wall.block, g.joint.jointMm, 'mm')
  const curve = wall.curve?.[0]
  return {
    alongMm: plan.bounds.maxX - plan.bounds.minX,
    acrossMm: plan.bounds.maxY - plan.bounds.minY,
    curb: curve ? { radiusMm: curve.insideRadiusMm, arcDeg: curve.builtAngleDeg } : undefined,
    curved: g.hasCurve,
  }
}

/** The base's footprint matches the wall's when its two sides match the wall's two extents, either way round. */
function footprintMismatch(base: ShowerBase, fromWall: BaseFromWall, tolMm: number): BaseMismatch | undefined {
  const near = (a: number, b: number) => Math.abs(a - b) <= tolMm + 1e-9
  const [w, d] = [base.widthMm, base.depthMm]
  const ok = fromWall.curved
    ? (near(w, fromWall.alongMm) && near(d, fromWall.acrossMm)) || (near(w, fromWall.acrossMm) && near(d, fromWall.alongMm))
    : near(w, fromWall.alongMm) || near(d, fromWall.alongMm)
  if (ok) return undefined
  const wallSize = fromWall.curved ? `${mm(fromWall.alongMm)} × ${mm(fromWall.acrossMm)}` : `${mm(fromWall.alongMm)}`
  return { field: 'footprint', entered: `${mm(w)} × ${mm(d)}`, wall: wallSize }
}

function curbMismatches(base: ShowerBase, fromWall: BaseFromWall, figures: SiteFigures): BaseMismatch[] {
  if (base.curbless) return []
  if (!fromWall.curb) return base.curb ? [{ field: 'curbShape', entered: 'curved', wall: 'straight' }] : []
  if (!base.curb) return [{ field: 'curbShape', entered: 'straight', wall: 'curved' }]
  const out: BaseMismatch[] = []
  if (Math.abs(base.curb.radiusMm - fromWall.curb.radiusMm) > figures.baseToleranceMm + 1e-9) {
    out.push({ field: 'curbRadius', entered: mm(base.curb.radiusMm), wall: mm(fromWall.curb.radiusMm) })
  }
  if (Math.abs(base.curb.arcDeg - fromWall.curb.arcDeg) > figures.baseToleranceDeg + 1e-9) {
    out.push({ field: 'curbArc', entered: Number(base.curb.arcDeg.toFixed(2)), wall: Number(fromWall.curb.arcDeg.toFixed(2)) })
  }
  return out
}

/** The base following the wall: footprint from its plan (across kept as entered for a straight wall), curb from its curve. */
function followed(entered: ShowerBase, fromWall: BaseFromWall): ShowerBase {
  const base: ShowerBase = { ...entered, widthMm: fromWall.alongMm, depthMm: fromWall.curved ? fromWall.acrossMm : entered.depthMm }
  if (entered.curbless) return { ...base, curb: undefined }
  return { ...base, curb: fromWall.curb ? { radiusMm: fromWall.curb.radiusMm, arcDeg: fromWall.curb.arcDeg } : undefined }
}

export function baseSizeLabel(base: ShowerBase, unit: LengthUnit): string {
  const len = (v: number) => formatLength(v, unit, { style: 'words' })
  const size = formatSize([base.widthMm, base.depthMm], unit, { style: 'words' })
  const curb = base.curbless
    ? 'curbless'
    : base.curb
      ? `curved curb R ${len(base.curb.radiusMm)}, ${Number(base.curb.arcDeg.toFixed(1))}°`
      : 'straight curb'
  return `${size}, ${curb}`
}

/** The base as it will be ordered, against the wall it carries. */
export function fitShowerBase(takeoff: Takeoff, walls: WallResult[], figures: SiteFigures, unit: LengthUnit): ShowerBaseFit | undefined {
  const entered = takeoff.showerBase
  if (!entered) return undefined
  const fit = entered.wall ? (entered.fit ?? 'check') : 'none'
  const index = entered.wall ? takeoff.walls.findIndex((w) => w.name === entered.wall) : -1
  const result = index >= 0 ? walls[index] : undefined
  let wallProblem: ShowerBaseFit['wallProblem']
  let fromWall: BaseFromWall | undefined
  if (entered.wall && !result) wallProblem = 'missing'
  else if (result?.status === 'refused') wallProblem = 'refused'
  else if (result?.status === 'ok') fromWall = baseFromWall(result)
  const base = fromWall && fit === 'follow' ? followed(entered, fromWall) : entered
  const mismatches = fromWall && fit === 'check'
    ? [footprintMismatch(entered, fromWall, figures.baseToleranceMm), ...curbMismatches(entered, fromWall, figures)].filter((m): m is BaseMismatch => !!m)
    : []
  const drainOutside = base.drain.fromLeftMm > base.widthMm + 1e-9 || base.drain.fromBackMm > base.depthMm + 1e-9
  return { base, entered, fit, wall: entered.wall, fromWall, mismatches, wallProblem, drainOutside, label: baseSizeLabel(base, unit) }
}

function specInputs(fit: ShowerBaseFit): Record<string, string | number> {
  const base = fit.base
  return {
    widthMm: mm(base.widthMm),
    depthMm: mm(base.depthMm),
    curb: base.curbless ? 'curbless' : base.curb ? `curved, R ${mm(base.curb.radiusMm)} mm, ${Number(base.curb.arcDeg.toFixed(2))}°` : 'straight',
    drainFromLeftMm: mm(base.drain.fromLeftMm),
    drainFromBackMm: mm(base.drain.fromBackMm),
    entry: base.entry,
    ...(fit.wall ? { wall: fit.wall, sizedFrom: fit.fit === 'follow' ? 'the wall as built' : 'as entered, checked against the wall' } : {}),
    ...(base.note ? { note: base.note } : {}),
  }
}

/**
 * What a saved bill line stores for the base (bom_lines.spec_json, copied onto the special-order PO
 * line): the base's own fields at the size it will be made, plus `trueSize` (the same figures named
 * plainly, with the text in the takeoff's unit) and where the size came from.
 */
export function baseSpec(fit: ShowerBaseFit, unit: LengthUnit) {
  const { wall: _wall, fit: _fit, ...b } = fit.base
  const deg = (v: number) => Number(v.toFixed(2))
  return {
    ...b,
    // The made size to a tenth of a millimetre (an inch entry is 1219.1999999999998 mm in floats).
    widthMm: mm(b.widthMm),
    depthMm: mm(b.depthMm),
    ...(b.curb ? { curb: { radiusMm: mm(b.curb.radiusMm), arcDeg: deg(b.curb.arcDeg) } } : {}),
    drain: { fromLeftMm: mm(b.drain.fromLeftMm), fromBackMm: mm(b.drain.fromBackMm) },
    trueSize: {
      widthMm: mm(b.widthMm),
      depthMm: mm(b.depthMm),
      curb: b.curbless ? 'curbless' : b.curb ? 'curved' : 'straight',
      ...(b.curb && !b.curbless ? { curbRadiusMm: mm(b.curb.radiusMm), curbArcDeg: deg(b.curb.arcDeg) } : {}),
      text: fit.label,
      unit,
      sizedFrom: fit.fit === 'follow' ? 'wall' : 'entered',
      ...(fit.wall ? { wall: fit.wall } : {}),
    },
  }
}

/** One base made to the true size; its name says the size, whatever catalog item stands for it. */
export function showerBaseLine(fit: ShowerBaseFit, item: CatalogItem | undefined, unit: LengthUnit): BomLine {
  const how = fit.fit === 'follow' ? 'baseFollow' : fit.fit === 'check' ? 'baseCheck' : 'baseEntered'
  return {
    role: 'showerBase',
    sku: item?.sku ?? null,
    name: `${roleLabels.showerBase}, ${baseSizeLabel(fit.base, unit)}`,
    quantity: 1,
    unit: item?.unit ?? 'each',
    needed: 1,
    walls: fit.wall ? [fit.wall] : [],
    explanation: phrased(specInputs(fit), {
      rule: [{ k: `ruleNote.${how}`, ...(fit.wall ? { p: { wall: fit.wall } } : {}) }],
      formula: [{ k: 'step.oneBase' }],
      rounding: [{ k: 'step.madeToOrder' }],
    }),
    issue: item ? undefined : 'No catalog item is mapped to this role',
  }
}
