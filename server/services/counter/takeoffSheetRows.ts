// Rows of Lumenyard's takeoff sheet to a takeoff: segment rows grouped into walls by name, loose item
// rows to loose lines, and every problem tied to the row and column it came from.
import { wallBlockFields } from '../../../shared/counter/counterBill.js'
import { lengthProblem, problem } from '../../../shared/errors/errorCodes.js'
import { zodIssueProblem } from '../../../shared/errors/zodProblems.js'
import type { CounterCatalog } from '../../../shared/schemas/counter.js'
import { takeoffSchema, type LooseLine, type Segment, type Takeoff, type Wall } from '../../../shared/schemas/takeoff.js'
import { JOINT_FACTS } from '../../../shared/takeoff/geometry.js'
import { tryParseLength, type LengthUnit } from '../../../shared/units.js'
import type { CellValue, ImportRow, RowIssue } from '../imports/importTypes.js'

interface Ctx { catalog: CounterCatalog; unit: LengthUnit; issues: RowIssue[] }
type Values = Record<string, CellValue>

const WALL_LEVEL = ['block_sku', 'joint', 'joint_width', 'sizing', 'height', 'courses', 'free_start', 'free_end', 'free_top', 'exposure', 'wet_area', 'wind_psf']
/** Schema field → sheet column, to put a schema message on the cell it came from. */
const COLUMN_OF: Record<string, string> = {
  name: 'wall', heightMm: 'height', courses: 'courses', jointMm: 'joint_width', lengthMm: 'length', blocks: 'blocks',
  insideRadiusMm: 'inside_radius', arcAngleDeg: 'arc_angle', arcLengthMm: 'arc_length', designWindPressurePsf: 'wind_psf',
  sku: 'item_sku', quantity: 'quantity', note: 'note',
}

const text = (v: CellValue) => (v === null ? '' : String(v).trim())

function length(ctx: Ctx, row: ImportRow, column: string): number | undefined {
  const raw = text(row.values[column] ?? null)
  if (raw === '') return undefined
  const parsed = tryParseLength(raw, ctx.unit)
  if (parsed.ok) return parsed.mm
  ctx.issues.push({ row: row.row, column, problem: lengthProblem(parsed.code, raw) })
  return undefined
}

function choice<T extends string>(ctx: Ctx, row: ImportRow, column: string, options: readonly T[], fallback?: T): T | undefined {
  const raw = text(row.values[column] ?? null).toLowerCase()
  if (raw === '') {
    if (fallback === undefined) ctx.issues.push({ row: row.row, column, problem: problem('cell_choice_needed', { options: [...options] }) })
    return fallback
  }
  if ((options as readonly string[]).includes(raw)) return raw as T
  ctx.issues.push({ row: row.row, column, problem: problem('cell_choice', { options: [...options], text: raw.slice(0, 40) }) })
  return fallback
}

function segmentOf(ctx: Ctx, row: ImportRow, sizing: Wall['sizing']): Segment | undefined {
  const kind = choice(ctx, row, 'segment', ['straight', 'curved', 'corner'] as const)
  const v = row.values
  const turn = choice(ctx, row, 'turn', ['left', 'right'] as const, 'left')!
  const blocks = typeof v.blocks === 'number' ? v.blocks : undefined
  if (kind === 'corner') return { kind, direction: turn }
  if (kind === 'straight') return sizing === 'opening' ? { kind, lengthMm: length(ctx, row, 'length') } : { kind, blocks }
  if (kind !== 'curved') return undefined
  const angle = text(v.arc_angle ?? null)
  return {
    kind,
    insideRadiusMm: length(ctx, row, 'inside_radius') ?? 0,
    direction: turn,
    ...(angle ? { arcAngleDeg: Number(angle) } : {}),
    ...(text(v.arc_length ?? null) ? { arcLengthMm: length(ctx, row, 'arc_length') } : {}),
    ...(blocks !== undefined ? { blocks } : {}),
  }
}

/** Later rows of a wall may repeat its wall-level cells, never contradict them. */
function checkRepeats(ctx: Ctx, rows: ImportRow[]) {
  for (const row of rows.slice(1)) {
    for (const column of WALL_LEVEL) {
      const value = row.values[column] ?? null
      if (value !== null && text(value) !== text(rows[0].values[column] ?? null)) {
        ctx.issues.push({ row: row.row, column, problem: problem('wall_row_differs', { row: rows[0].row }) })
      }
    }
  }
}

function wallOf(ctx: Ctx, name: string, rows: ImportRow[]): Wall {
  const first = rows[0]
  const v: Values = first.values
  checkRepeats(ctx, rows)
  const sku = text(v.block_sku ?? null)
  const block = ctx.catalog.blocks.find((b) => b.sku.toLowerCase() === sku.toLowerCase())
  if (!sku) ctx.issues.push({ row: first.row, column: 'block_sku', problem: problem('block_sku_needed') })
  else if (!block) ctx.issues.push({ row: first.row, column: 'block_sku', problem: problem('block_not_in_catalog', { sku: sku.slice(0, 40) }) })
  const kind = choice(ctx, first, 'joint', ['spacer', 'mortar'] as const, 'spacer')!
  const sizing = choice(ctx, first, 'sizing', ['opening', 'count'] as const) ?? 'opening'
  const jointMm = length(ctx, first, 'joint_width') ?? (kind === 'mortar' ? JOINT_FACTS.mortarJointMm : JOINT_FACTS.spacerJointMm)
  const wind = text(v.wind_psf ?? null)
  return {
    name,
    sizing,
    ...(sizing === 'opening' ? { heightMm: length(ctx, first, 'height') } : { courses: typeof v.courses === 'number' ? v.courses : undefined }),
    ...(block ? wallBlockFields(block) : { block: { nominal: '?', faceWidthMm: 1, faceHeightMm: 1, depthMm: 1, thicknessClass: 'standard', weightKg: 1 } }),
    joint: { kind, jointMm },
    segments: rows.map((r) => segmentOf(ctx, r, sizing)).filter((s): s is Segment => s !== undefined),
    freeEnds: { start: v.free_start === true, end: v.free_end === true, top: v.free_top === true },
    exposure: choice(ctx, first, 'exposure', ['interior', 'exterior'] as const, 'interior')!,
    wetArea: v.wet_area === true,
    ...(wind ? { designWindPressurePsf: Number(wind) } : {}),
  }
}

function looseOf(ctx: Ctx, row: ImportRow): LooseLine | undefined {
  const sku = text(row.values.item_sku ?? null)
  const item = ctx.catalog.looseItems.find((i) => i.sku.toLowerCase() === sku.toLowerCase())
  if (!item) {
    ctx.issues.push({ row: row.row, column: 'item_sku', problem: problem('sku_not_in_catalog', { sku: sku.slice(0, 40) }) })
    return undefined
  }
  const quantity = row.values.quantity
  if (typeof quantity !== 'number') ctx.issues.push({ row: row.row, column: 'quantity', problem: problem('required') })
  const note = text(row.values.note ?? null)
  return { sku: item.sku, name: item.name, unit: item.unit, quantity: typeof quantity === 'number' ? quantity : 1, ...(note ? { note } : {}) }
}

/** Puts each schema message on the sheet row and column it came from. */
function schemaIssues(ctx: Ctx, takeoff: Takeoff, wallRows: ImportRow[][], itemRows: ImportRow[]) {
  const parsed = takeoffSchema.safeParse(takeoff)
  if (parsed.success) return parsed.data
  for (const issue of parsed.error.issues) {
    const [top, i, sub, j, field] = issue.path as (string | number)[]
    const rows = top === 'walls' ? wallRows[Number(i)] : undefined
    const row = top === 'looseLines' ? itemRows[Number(i)] : sub === 'segments' && rows ? rows[Number(j)] ?? rows[0] : rows?.[0]
    const key = String(sub === 'segments' ? field ?? '' : top === 'looseLines' ? sub ?? '' : sub ?? '')
    ctx.issues.push({ row: row?.row ?? 1, column: COLUMN_OF[key] ?? null, problem: zodIssueProblem(issue) })
  }
  return undefined
}

/** The takeoff the rows describe, or the problems, each tied to its row. */
export function takeoffFromRows(rows: ImportRow[], catalog: CounterCatalog, unit: LengthUnit, name: string): { takeoff?: Takeoff; issues: RowIssue[] } {
  const ctx: Ctx = { catalog, unit, issues: [] }
  const walls = new Map<string, ImportRow[]>()
  const itemRows: ImportRow[] = []
  for (const row of rows) {
    const wall = text(row.values.wall ?? null)
    const item = text(row.values.item_sku ?? null)
    if (wall && item) ctx.issues.push({ row: row.row, column: 'item_sku', problem: problem('row_wall_and_item') })
    else if (wall) walls.set(wall, [...(walls.get(wall) ?? []), row])
    else if (item) itemRows.push(row)
    else ctx.issues.push({ row: row.row, column: 'wall', problem: problem('row_wall_or_item') })
  }
  const wallRows = [...walls.values()]
  const takeoff: Takeoff = {
    name,
    walls: [...walls.entries()].map(([wallName, group]) => wallOf(ctx, wallName, group)),
    looseLines: itemRows.map((r) => looseOf(ctx, r)).filter((l): l is LooseLine => l !== undefined),
  }
  if (ctx.issues.length > 0) return { issues: ctx.issues }
  const valid = schemaIssues(ctx, takeoff, wallRows, itemRows)
  return valid ? { takeoff: valid, issues: [] } : { issues: ctx.issues }
}
