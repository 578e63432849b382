// Shop-built sections: each wall is cut into panels of 10–15 blocks (configurable) that two people can
// carry and set. Courses are grouped into bands; each band is cut into sections. Straight walls prefer
// rectangles; curved walls use stepped cuts, alternating direction band to band, so seams do not line up
// and neighbouring sections interlock. A small search picks the cheapest banding.
import type { SectionOptions } from '../schemas/takeoff.js'
import { poundsToKg } from '../units.js'

export const defaultSectionOptions: SectionOptions = {
  minBlocks: 10,
  maxBlocks: 15,
  targetBlocks: 12,
  // 50 lb per person (common practice), close to the 51 lb load constant of the NIOSH lifting equation (from memory).
  liftPerPersonKg: poundsToKg(50),
  people: 2,
  // Spacers and sealant set in a section before it is carried (assumed, common practice).
  allowanceKg: 1,
}

export interface SectionCell {
  course: number
  column: number
}

export interface Section {
  index: number
  band: number
  cells: SectionCell[]
  blocks: number
  weightKg: number
  overweight: boolean
  rectangular: boolean
  courseRange: [number, number]
  columnRange: [number, number]
}

export interface SectionPlan {
  sections: Section[]
  bands: { startCourse: number; courses: number }[]
  liftLimitKg: number
  /** Every section holds minBlocks–maxBlocks. */
  withinRange: boolean
  /** Whether any whole number of sections in range adds up to the wall's blocks. */
  arithmeticallyPossible: boolean
  notes: string[]
}

export interface SectionWall {
  columns: number
  courses: number
  curved: boolean
  blockWeightKg: number
}

type Chunk = SectionCell[] // cells relative to the band: course = row within the band
interface BandLayout { chunks: Chunk[]; cost: number; bottomSeams: Set<number>; topSeams: Set<number> }

/** True when some k sections of min..max blocks add up to total: k·min ≤ total ≤ k·max. */
export function rangeFeasible(total: number, min: number, max: number): boolean {
  return Math.floor(total / min) >= Math.ceil(total / max)
}

/** Split counts into k near-equal parts, choosing k so parts sit in range and near the target. */
export function chunkSizes(total: number, min: number, max: number, target: number): number[] {
  const low = Math.max(1, Math.ceil(total / max))
  const high = Math.floor(total / min)
  let k = low
  for (let c = low; c <= high; c++) {
    if (Math.abs(total / c - target) < Math.abs(total / k - target)) k = c
  }
  const base = Math.floor(total / k)
  return Array.from({ length: k }, (_, i) => base + (i < total % k ? 1 : 0))
}

function columnOrder(columns: number, reverse: boolean): number[] {
  const order = Array.from({ length: columns }, (_, i) => i)
  return reverse ? order.reverse() : order
}

/** Whole-column rectangles when widths in range exist; undefined otherwise. */
function rectangleChunks(height: number, columns: number, opts: SectionOptions, reverse: boolean): Chunk[] | undefined {
  const minWidth = Math.ceil(opts.minBlocks / height)
  const maxWidth = Math.floor(opts.maxBlocks / height)
  if (minWidth > maxWidth || columns < minWidth) return undefined
  const widths = chunkSizes(columns, minWidth, maxWidth, opts.targetBlocks / height)
  if (widths.some((w) => w < minWidth || w > maxWidth)) return undefined
  const order = columnOrder(columns, reverse)
  const chunks: Chunk[] = []
  let at = 0
  for (const width of widths) {
    const cols = order.slice(at, at + width)
    at += width
    chunks.push(cols.flatMap((column) => Array.from({ length: height }, (_, course) => ({ course, column }))))
  }
  return chunks
}

/** Cells taken column by column, bottom to top, cut into near-equal runs: stepped seams. */
function steppedChunks(height: number, columns: number, opts: SectionOptions, reverse: boolean): Chunk[] {
  const cells = columnOrder(columns, reverse).flatMap((column) =>
    Array.from({ length: height }, (_, course) => ({ course, column })),
  )
  const chunks: Chunk[] = []
  let at = 0
  for (const size of chunkSizes(cells.length, opts.minBlocks, opts.maxBlocks, opts.targetBlocks)) {
    chunks.push(cells.slice(at, at + size))
    at += size
  }
  return chunks
}

function isConnected(chunk: Chunk): boolean {
  const key = (c: SectionCell) => `${c.course},${c.column}`
  const present = new Set(chunk.map(key))
  const seen = new Set<string>([key(chunk[0])])
  const queue = [chunk[0]]
  while (queue.length > 0) {
    const { course, column } = queue.pop() as SectionCell
    for (const n of [
      { course: course + 1, column }, { course: course - 1, column },
      { course, column: column + 1 }, { course, column: column - 1 },
    ]) {
      if (present.has(key(n)) && !seen.has(key(n))) {
        seen.add(key(n))
        queue.push(n)
      }
    }
  }
  return seen.size === chunk.length
}

export function isRectangular(cells: SectionCell[]): boolean {
  const courses = cells.map((c) => c.course)
  const columns = cells.map((c) => c.column)
  const area = (Math.max(...courses) - Math.min(...courses) + 1) * (Math.max(...columns) - Math.min(...columns) + 1)
  return area === cells.length
}

/** Column boundaries (1..columns−1) where the given row changes section. */
function seamsInRow(chunks: Chunk[], row: number, columns: number): Set<number> {
  const owner = new Array<number>(columns).fill(-1)
  chunks.forEach((chunk, i) => chunk.filter((c) => c.course === row).forEach((c) => (owner[c.column] = i)))
  const seams = new Set<number>()
  for (let x = 1; x < columns; x++) if (owner[x] !== owner[x - 1]) seams.add(x)
  return seams
}

function chunkCost(chunk: Chunk, wall: SectionWall, opts: SectionOptions, height: number): number {
  if (!isConnected(chunk)) return Number.POSITIVE_INFINITY
  const size = chunk.length
  // Bands of about three courses carry well; a one-course strip is long and flimsy.
  let cost = 4 + Math.abs(size - opts.targetBlocks) + Math.abs(height - 3) + (height === 1 ? 6 : 0)
  if (size < opts.minBlocks) cost += 1000 + 10 * (opts.minBlocks - size)
  if (size > opts.maxBlocks) cost += 5000
  if (size * wall.blockWeightKg + opts.allowanceKg > opts.liftPerPersonKg * opts.people) cost += 25
  if (!wall.curved && !isRectangular(chunk)) cost += 6
  return cost
}

function layoutBand(height: number, reverse: boolean, wall: SectionWall, opts: SectionOptions): BandLayout {
  const rect = wall.curved ? undefined : rectangleChunks(height, wall.columns, opts, reverse)
  const chunks = rect ?? steppedChunks(height, wall.columns, opts, reverse)
  const cost = chunks.reduce((sum, chunk) => sum + chunkCost(chunk, wall, opts, height), 0)
  return {
    chunks,
    cost,
    bottomSeams: seamsInRow(chunks, 0, wall.columns),
    topSeams: seamsInRow(chunks, height - 1, wall.columns),
  }
}

/** Cheapest banding of the courses, bottom-up; curved walls pay for seams that run on from the band below. */
function chooseBands(wall: SectionWall, opts: SectionOptions): number[] {
  const top = wall.courses
  const maxBand = Math.min(top, Math.max(opts.maxBlocks, 1))
  const layouts = new Map<string, BandLayout>()
  const layout = (h: number, odd: boolean): BandLayout => {
    const key = `${h}|${odd}`
    if (!layouts.has(key)) layouts.set(key, layoutBand(h, wall.curved && odd, wall, opts))
    return layouts.get(key) as BandLayout
  }
  const seamCache = new Map<string, number>()
  const aligned = (h: number, odd: boolean, below: number): number => {
    if (!wall.curved || below === 0) return 0
    const key = `${h}|${odd}|${below}`
    if (!seamCache.has(key)) {
      const under = layout(below, !odd).topSeams
      seamCache.set(key, [...layout(h, odd).bottomSeams].filter((x) => under.has(x)).length)
    }
    return seamCache.get(key) as number
  }
  // State: first course of the next band, its parity, and the height of the band below (0 = the curb).
  const at = (course: number, odd: boolean, below: number) => (course * 2 + Number(odd)) * (maxBand + 1) + below
  const cost = new Float64Array((top + 1) * 2 * (maxBand + 1)).fill(Number.POSITIVE_INFINITY)
  const pick = new Int32Array(cost.length)
  for (let i = at(top, false, 0); i < cost.length; i++) cost[i] = 0
  for (let course = top - 1; course >= 0; course--) {
    for (const odd of [false, true]) {
      for (let below = 0; below <= maxBand; below++) {
        let bestCost = Number.POSITIVE_INFINITY
        let bestHeight = 1
        for (let h = 1; h <= Math.min(maxBand, top - course); h++) {
          const c = layout(h, odd).cost + 3 * aligned(h, odd, below) + cost[at(course + h, !odd, h)]
          if (c < bestCost) [bestCost, bestHeight] = [c, h]
        }
        cost[at(course, odd, below)] = bestCost
        pick[at(course, odd, below)] = bestHeight
      }
    }
  }
  const heights: number[] = []
  for (let course = 0, odd = false, below = 0; course < top; odd = !odd) {
    const h = pick[at(course, odd, below)]
    heights.push(h)
    course += h
    below = h
  }
  return heights
}

function toSection(chunk: Chunk, startCourse: number, band: number, index: number, wall: SectionWall, opts: SectionOptions): Section {
  const cells = chunk.map((c) => ({ course: c.course + startCourse, column: c.column }))
  const courses = cells.map((c) => c.course)
  const columns = cells.map((c) => c.column)
  const weightKg = cells.length * wall.blockWeightKg + opts.allowanceKg
  return {
    index,
    band,
    cells,
    blocks: cells.length,
    weightKg,
    overweight: weightKg > opts.liftPerPersonKg * opts.people,
    rectangular: isRectangular(cells),
    courseRange: [Math.min(...courses), Math.max(...courses)],
    columnRange: [Math.min(...columns), Math.max(...columns)],
  }
}

function planNotes(total: number, plan: Omit<SectionPlan, 'notes'>, opts: SectionOptions): string[] {
  const notes: string[] = []
  const range = `${opts.minBlocks}–${opts.maxBlocks}`
  if (total < opts.minBlocks) notes.push(`The wall has ${total} blocks, fewer than one ${range} block section: it is one section.`)
  else if (!plan.arithmeticallyPossible) {
    notes.push(`${total} blocks cannot be split into whole sections of ${range} blocks; sections stay at or under ${opts.maxBlocks}, some hold fewer.`)
  } else if (!plan.withinRange) notes.push(`The wall's shape forced some sections outside ${range} blocks.`)
  const heavy = plan.sections.filter((s) => s.overweight).map((s) => s.index + 1)
  if (heavy.length > 0) notes.push(`Sections ${heavy.join(', ')} weigh more than a ${opts.people}-person lift.`)
  return notes
}

/** Sections for a wall of columns × courses (stack bond). */
export function planSections(wall: SectionWall, options: Partial<SectionOptions> = {}): SectionPlan {
  const opts = { ...defaultSectionOptions, ...options }
  const total = wall.columns * wall.courses
  const heights = total === 0 ? [] : chooseBands(wall, opts)
  const sections: Section[] = []
  const bands: SectionPlan['bands'] = []
  let startCourse = 0
  heights.forEach((h, band) => {
    const { chunks } = layoutBand(h, wall.curved && band % 2 === 1, wall, opts)
    chunks.forEach((chunk) => sections.push(toSection(chunk, startCourse, band, sections.length, wall, opts)))
    bands.push({ startCourse, courses: h })
    startCourse += h
  })
  const plan = {
    sections,
    bands,
    liftLimitKg: opts.liftPerPersonKg * opts.people,
    withinRange: sections.every((s) => s.blocks >= opts.minBlocks && s.blocks <= opts.maxBlocks),
    arithmeticallyPossible: total >= opts.minBlocks && rangeFeasible(total, opts.minBlocks, opts.maxBlocks),
  }
  return { ...plan, notes: planNotes(total, plan, opts) }
}
