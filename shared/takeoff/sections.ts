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
  notes: PlanNote[]
}

export interface SectionWall {
  columns: number
  courses: number
  curved: boolean
  blockWeightKg: number
}

type Chunk = SectionCell[]

/**
 * A band's cut as the planner scores it, without listing its cells: the cost, and the column
 * boundaries where its bottom and top rows change section (seams). Scoring every candidate band this
 * way keeps the search linear in the wall's columns; only the chosen bands are listed cell by cell.
 */
interface BandScore { cost: number; bottomSeams: Uint8Array; topSeams: Uint8Array }

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

/** Whole-column widths in range, when they exist: a band of whole-column rectangles. */
function rectangleWidths(height: number, columns: number, opts: SectionOptions): number[] | undefined {
  const minWidth = Math.ceil(opts.minBlocks / height)
  const maxWidth = Math.floor(opts.maxBlocks / height)
  if (minWidth > maxWidth || columns < minWidth) return undefined
  const widths = chunkSizes(columns, minWidth, maxWidth, opts.targetBlocks / height)
  return widths.some((w) => w < minWidth || w > maxWidth) ? undefined : widths
}

/** Whole-column rectangles when widths in range exist; undefined otherwise. Courses from `startCourse`. */
function rectangleChunks(height: number, columns: number, opts: SectionOptions, reverse: boolean, startCourse: number): Chunk[] | undefined {
  const widths = rectangleWidths(height, columns, opts)
  if (!widths) return undefined
  const order = columnOrder(columns, reverse)
  const chunks: Chunk[] = []
  let at = 0
  for (const width of widths) {
    const chunk: Chunk = []
    for (let k = at; k < at + width; k++) for (let row = 0; row < height; row++) chunk.push({ course: startCourse + row, column: order[k] })
    chunks.push(chunk)
    at += width
  }
  return chunks
}

/** Cells taken column by column, bottom to top, cut into near-equal runs: stepped seams. */
function steppedChunks(height: number, columns: number, opts: SectionOptions, reverse: boolean, startCourse: number): Chunk[] {
  const order = columnOrder(columns, reverse)
  const chunks: Chunk[] = []
  let at = 0
  for (const size of chunkSizes(columns * height, opts.minBlocks, opts.maxBlocks, opts.targetBlocks)) {
    const chunk: Chunk = []
    for (let k = at; k < at + size; k++) chunk.push({ course: startCourse + (k % height), column: order[Math.floor(k / height)] })
    chunks.push(chunk)
    at += size
  }
  return chunks
}

/** Cost of one section of `size` blocks, given whether it holds together and is a plain rectangle. */
function pieceCost(size: number, connected: boolean, rectangular: boolean, wall: SectionWall, opts: SectionOptions, height: number): number {
  if (!connected) return Number.POSITIVE_INFINITY
  // Bands of about three courses carry well; a one-course strip is long and flimsy.
  let cost = 4 + Math.abs(size - opts.targetBlocks) + Math.abs(height - 3) + (height === 1 ? 6 : 0)
  if (size < opts.minBlocks) cost += 1000 + 10 * (opts.minBlocks - size)
  if (size > opts.maxBlocks) cost += 5000
  if (size * wall.blockWeightKg + opts.allowanceKg > opts.liftPerPersonKg * opts.people) cost += 25
  if (!wall.curved && !rectangular) cost += 6
  return cost
}

/** Marks the column boundaries x (1..columns−1) where the owner of a row changes. */
function seamsOf(owner: Int32Array): Uint8Array {
  const seams = new Uint8Array(owner.length)
  for (let x = 1; x < owner.length; x++) if (owner[x] !== owner[x - 1]) seams[x] = 1
  return seams
}

/**
 * Scores a band from its shape alone. Stepped sections are runs of the column-by-column cell order:
 * a run from (position p1, row r1) to (p2, r2) is connected unless it spans exactly two neighbouring
 * columns that share no row (r1 > r2), and rectangular when it stays in one column or fills whole
 * columns (r1 = 0 and r2 = top row).
 */
function scoreBand(height: number, reverse: boolean, wall: SectionWall, opts: SectionOptions): BandScore {
  const columns = wall.columns
  const at = (position: number) => (reverse ? columns - 1 - position : position)
  const bottom = new Int32Array(columns)
  const top = new Int32Array(columns)
  let cost = 0
  const widths = wall.curved ? undefined : rectangleWidths(height, columns, opts)
  if (widths) {
    let position = 0
    widths.forEach((width, i) => {
      cost += pieceCost(width * height, true, true, wall, opts, height)
      for (let k = 0; k < width; k++, position++) bottom[at(position)] = top[at(position)] = i
    })
  } else {
    let start = 0
    chunkSizes(columns * height, opts.minBlocks, opts.maxBlocks, opts.targetBlocks).forEach((size, i) => {
      const end = start + size - 1
      const [p1, r1, p2, r2] = [Math.floor(start / height), start % height, Math.floor(end / height), end % height]
      const connected = p2 !== p1 + 1 || r1 <= r2
      const rectangular = p1 === p2 || (r1 === 0 && r2 === height - 1)
      cost += pieceCost(size, connected, rectangular, wall, opts, height)
      for (let p = p1; p <= p2; p++) {
        if (p > p1 || r1 === 0) bottom[at(p)] = i
        if (p < p2 || r2 === height - 1) top[at(p)] = i
      }
      start += size
    })
  }
  return { cost, bottomSeams: seamsOf(bottom), topSeams: seamsOf(top) }
}

/** The chosen band's sections, cell by cell. */
function bandChunks(height: number, reverse: boolean, wall: SectionWall, opts: SectionOptions, startCourse: number): Chunk[] {
  const rect = wall.curved ? undefined : rectangleChunks(height, wall.columns, opts, reverse, startCourse)
  return rect ?? steppedChunks(height, wall.columns, opts, reverse, startCourse)
}

/**
 * Cheapest banding of the courses, bottom-up; curved walls pay for seams that run on from the band below.
 * A straight wall's band cost does not depend on the band below or on alternating direction, so its
 * search runs over courses alone; a curved wall's also tracks the parity and the height of the band below.
 */
function chooseBands(wall: SectionWall, opts: SectionOptions): number[] {
  const top = wall.courses
  const maxBand = Math.min(top, Math.max(opts.maxBlocks, 1))
  if (!wall.curved) {
    const costs = Array.from({ length: maxBand + 1 }, (_, h) => (h === 0 ? 0 : scoreBand(h, false, wall, opts).cost))
    return chooseStraightBands(top, maxBand, costs)
  }
  // Score every band height in both directions, and how many seams each lines up with each band below.
  const span = maxBand + 1
  const scores: BandScore[] = []
  for (let h = 1; h <= maxBand; h++) for (const odd of [0, 1]) scores[h * 2 + odd] = scoreBand(h, odd === 1, wall, opts)
  const bandCost = new Float64Array(span * 2)
  const aligned = new Float64Array(span * 2 * span)
  for (let h = 1; h <= maxBand; h++) {
    for (let odd = 0; odd < 2; odd++) {
      const over = scores[h * 2 + odd]
      bandCost[h * 2 + odd] = over.cost
      for (let below = 1; below <= maxBand; below++) {
        const under = scores[below * 2 + (1 - odd)].topSeams
        let count = 0
        for (let x = 1; x < under.length; x++) if (over.bottomSeams[x] && under[x]) count++
        aligned[(h * 2 + odd) * span + below] = count
      }
    }
  }
  // State: first course of the next band, its parity, and the height of the band below (0 = the curb).
  const cost = new Float64Array((top + 1) * 2 * span).fill(Number.POSITIVE_INFINITY)
  const pick = new Int32Array(cost.length).fill(1)
  for (let i = (top * 2) * span; i < cost.length; i++) cost[i] = 0
  for (let course = top - 1; course >= 0; course--) {
    const tallest = Math.min(maxBand, top - course)
    for (let odd = 0; odd < 2; odd++) {
      for (let below = 0; below <= maxBand; below++) {
        let bestCost = Number.POSITIVE_INFINITY
        let bestHeight = 1
        for (let h = 1; h <= tallest; h++) {
          const next = ((course + h) * 2 + (1 - odd)) * span + h
          const c = bandCost[h * 2 + odd] + 3 * aligned[(h * 2 + odd) * span + below] + cost[next]
          if (c < bestCost) {
            bestCost = c
            bestHeight = h
          }
        }
        const state = (course * 2 + odd) * span + below
        cost[state] = bestCost
        pick[state] = bestHeight
      }
    }
  }
  const heights: number[] = []
  for (let course = 0, odd = 0, below = 0; course < top; odd = 1 - odd) {
    const h = pick[(course * 2 + odd) * span + below]
    heights.push(h)
    course += h
    below = h
  }
  return heights
}

function chooseStraightBands(top: number, maxBand: number, bandCost: number[]): number[] {
  const cost = new Float64Array(top + 1).fill(Number.POSITIVE_INFINITY)
  const pick = new Int32Array(top + 1).fill(1)
  cost[top] = 0
  for (let course = top - 1; course >= 0; course--) {
    for (let h = 1; h <= Math.min(maxBand, top - course); h++) {
      const c = bandCost[h] + cost[course + h]
      if (c < cost[course]) {
        cost[course] = c
        pick[course] = h
      }
    }
  }
  const heights: number[] = []
  for (let course = 0; course < top; course += pick[course]) heights.push(pick[course])
  return heights
}

function toSection(cells: Chunk, band: number, index: number, wall: SectionWall, opts: SectionOptions): Section {
  let minCourse = Infinity, maxCourse = -Infinity, minColumn = Infinity, maxColumn = -Infinity
  for (const c of cells) {
    if (c.course < minCourse) minCourse = c.course
    if (c.course > maxCourse) maxCourse = c.course
    if (c.column < minColumn) minColumn = c.column
    if (c.column > maxColumn) maxColumn = c.column
  }
  const weightKg = cells.length * wall.blockWeightKg + opts.allowanceKg
  return {
    index,
    band,
    cells,
    blocks: cells.length,
    weightKg,
    overweight: weightKg > opts.liftPerPersonKg * opts.people,
    rectangular: (maxCourse - minCourse + 1) * (maxColumn - minColumn + 1) === cells.length,
    courseRange: [minCourse, maxCourse],
    columnRange: [minColumn, maxColumn],
  }
}

/** One of the planner's notes: its kind and figures (for a screen to word it) and the English text. */
export interface PlanNote {
  variant: 'one' | 'uneven' | 'shape' | 'heavy'
  params: Record<string, string | number>
  message: string
}

function planNotes(total: number, plan: Omit<SectionPlan, 'notes'>, opts: SectionOptions): PlanNote[] {
  const notes: PlanNote[] = []
  const range = `${opts.minBlocks}–${opts.maxBlocks}`
  const params = { blocks: total, min: opts.minBlocks, max: opts.maxBlocks }
  if (total < opts.minBlocks) notes.push({ variant: 'one', params, message: `The wall has ${total} blocks, fewer than one ${range} block section: it is one section.` })
  else if (!plan.arithmeticallyPossible) {
    notes.push({ variant: 'uneven', params, message: `${total} blocks cannot be split into whole sections of ${range} blocks; sections stay at or under ${opts.maxBlocks}, some hold fewer.` })
  } else if (!plan.withinRange) notes.push({ variant: 'shape', params, message: `The wall's shape forced some sections outside ${range} blocks.` })
  const heavy = plan.sections.filter((s) => s.overweight).map((s) => s.index + 1)
  if (heavy.length > 0) {
    notes.push({ variant: 'heavy', params: { sections: heavy.join(', '), people: opts.people }, message: `Sections ${heavy.join(', ')} weigh more than a ${opts.people}-person lift.` })
  }
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
    const chunks = bandChunks(h, wall.curved && band % 2 === 1, wall, opts, startCourse)
    chunks.forEach((chunk) => sections.push(toSection(chunk, band, sections.length, wall, opts)))
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

/** Which section holds each cell, indexed course × columns + column (−1 where none does). */
export function sectionOwners(plan: SectionPlan, columns: number, courses: number): Int32Array {
  const owner = new Int32Array(columns * courses).fill(-1)
  for (const s of plan.sections) for (const c of s.cells) owner[c.course * columns + c.column] = s.index
  return owner
}
