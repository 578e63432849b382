// Feature: the wall drawing model (developed elevation and plan view) and its standalone SVG
// (shared/takeoff/drawing.ts, planView.ts, drawingSvg.ts).
import { describe, expect, it } from 'vitest'
import { takeoffSchema, wallSchema, type Wall } from '../../shared/schemas/takeoff.js'
import { computeTakeoff, type WallResultOk } from '../../shared/takeoff/billOfMaterials.js'
import { toSvg } from '../../shared/takeoff/drawing.js'
import { sectionTone } from '../../shared/takeoff/drawingSvg.js'
import { block8, IN } from '../support/takeoffFixtures.js'

function wall(over: Partial<Wall> = {}): Wall {
  return wallSchema.parse({
    name: 'Lindqvist shower',
    sizing: 'count',
    courses: 8,
    block: block8,
    joint: { kind: 'spacer', jointMm: IN / 8 },
    segments: [{ kind: 'straight', blocks: 3 }, { kind: 'curved', insideRadiusMm: 1700, arcAngleDeg: 90, direction: 'left' }, { kind: 'straight', blocks: 2 }],
    freeEnds: { start: false, end: true, top: true },
    exposure: 'interior',
    wetArea: true,
    ...over,
  })
}

function computed(w: Wall): WallResultOk {
  const r = computeTakeoff(takeoffSchema.parse({ walls: [w], looseLines: [] }), {}, { unit: 'in' })
  if (r.walls[0].status !== 'ok') throw new Error('refused')
  return r.walls[0]
}

describe('elevation model', () => {
  const w = computed(wall())
  const e = w.drawing!.elevation

  it('one rectangle per block, each in a section, placed on the column grid', () => {
    expect(e.blocks).toHaveLength(w.geometry.totalBlocks)
    expect(e.blocks.every((b) => b.section >= 0 && b.section < w.sections.sections.length)).toBe(true)
    for (const b of e.blocks) {
      expect(b.xMm).toBeCloseTo(w.geometry.columns[b.column].xMm, 9)
      // courses repeat every face height + one joint: 7.75 + 0.125 = 7.875 in
      expect(b.yMm).toBeCloseTo(b.course * 7.875 * IN, 9)
    }
    const top = Math.max(...e.blocks.map((b) => b.yMm + b.heightMm))
    expect(top).toBeCloseTo(e.heightMm, 9)
  })

  it('tags finished units along the free end and free top, and screws at the framed jamb', () => {
    const last = w.geometry.blocksAcross - 1
    const top = 7
    // free end: courses 1–7 of the last column show one edge; free top: every other column of course 8;
    // where they meet, one unit shows two (common practice: every exposed edge finished)
    const ends = e.blocks.filter((b) => b.kind === 'end')
    expect(ends.every((b) => (b.column === last && b.course < top) || (b.course === top && b.column < last))).toBe(true)
    expect(ends).toHaveLength(7 + last)
    expect(e.blocks.filter((b) => b.kind === 'double').map((b) => [b.column, b.course])).toEqual([[last, top]])
    expect(e.fixings.length).toBeGreaterThan(0)
    expect(e.fixings.every((f) => f.kind === 'screw' && f.side === 'start' && f.xMm === 0)).toBe(true)
    expect(e.fixings.every((f) => f.yMm > 0 && f.yMm < e.heightMm)).toBe(true)
  })
})

describe('plan model', () => {
  const w = computed(wall())
  const plan = w.drawing!.plan

  it('traces one footprint per column, curved ones with inside corners on the layout circle', () => {
    expect(plan).toBeDefined()
    if (!plan) return
    expect(plan.footprints).toHaveLength(w.geometry.blocksAcross)
    const arc = plan.arcs[0]
    expect(arc.radiusMm).toBe(1700)
    for (const f of plan.footprints.filter((x) => x.kind === 'curved')) {
      for (const p of f.corners.slice(0, 2)) expect(Math.hypot(p.x - arc.centre.x, p.y - arc.centre.y)).toBeCloseTo(1700, 6)
      // every footprint stays a w × t rectangle
      const [a, b, c] = f.corners
      expect(Math.hypot(b.x - a.x, b.y - a.y)).toBeCloseTo(7.75 * IN, 6)
      expect(Math.hypot(c.x - b.x, c.y - b.y)).toBeCloseTo(3.875 * IN, 6)
    }
    // 1700 mm ÷ 25.4 = 66.929 in = 1070.9 sixteenths → 1071/16 = 66 15/16 in
    expect(plan.labels.map((l) => l.text).join(' ')).toContain('R 66 15/16″')
  })

  it('a straight wall has no plan view', () => {
    expect(computed(wall({ segments: [{ kind: 'straight', blocks: 6 }] })).drawing!.plan).toBeUndefined()
  })
})

describe('SVG', () => {
  const w = computed(wall({ name: 'Bath <north> & "east"' }))
  const svg = toSvg(w.drawing!)

  it('is a standalone document with a rectangle per block and a legend entry per section', () => {
    expect(svg.startsWith('<svg xmlns="http://www.w3.org/2000/svg"')).toBe(true)
    expect(svg.trim().endsWith('</svg>')).toBe(true)
    expect(svg.match(/data-section=/g)?.length).toBe(w.geometry.totalBlocks)
    expect(svg.match(/<polygon /g)?.length).toBe(w.geometry.blocksAcross)
    for (const s of w.sections.sections) expect(svg).toContain(`Section ${s.index + 1}: ${s.blocks} blocks`)
    expect((svg.match(/<g /g) ?? []).length).toBe((svg.match(/<\/g>/g) ?? []).length)
  })

  it('escapes text and can leave out views', () => {
    expect(svg).toContain('Bath &lt;north&gt; &amp; &quot;east&quot;')
    expect(svg).not.toContain('<north>')
    expect(toSvg(w.drawing!, { view: 'elevation' })).not.toContain('class="plan"')
    expect(toSvg(w.drawing!, { view: 'plan', legend: false })).not.toContain('data-section=')
  })

  it('draws every fixing on the elevation, and writes lengths in the unit asked', () => {
    expect(svg.match(/data-fixing="start"/g)?.length).toBe(w.fixings.filter((f) => f.side === 'start').length)
    expect(w.fixings.length).toBeGreaterThan(0)
    // 1700 mm = 66 15/16 in (÷ 25.4); in millimetres the plan label reads 1700 mm
    expect(toSvg(w.drawing!, { unit: 'mm' })).toContain('R 1700 mm')
  })

  it('gives neighbouring sections distinct tones', () => {
    const tones = Array.from({ length: 12 }, (_, i) => sectionTone(i).fill)
    expect(new Set(tones).size).toBe(12)
  })
})

describe('the drawing of a large wall', () => {
  // 90 across × 100 courses = 9,000 blocks, past the 1,500 a drawing shows block by block
  const big = computed(wall({ courses: 100, segments: [{ kind: 'straight', blocks: 90 }], freeEnds: { start: false, end: false, top: false }, wetArea: false }))
  const svg = toSvg(big.drawing!, { widthPx: 760 })

  it('draws each section one strip per course and the joints as one grid, not a rectangle per block', () => {
    // independent count: the (section, course) pairs the section plan's cells cover
    const strips = new Set(big.sections.sections.flatMap((s) => s.cells.map((c) => `${s.index}|${c.course}`)))
    const drawn = svg.match(/<rect [^>]*data-section="/g) ?? []
    expect(drawn).toHaveLength(strips.size)
    expect(strips.size).toBeLessThan(big.geometry.totalBlocks)
    expect(svg.match(/class="joints"/g)).toHaveLength(1)
    // the grid: a line at each column edge (90 blocks → 180 edges) and each course edge (100 courses → 200)
    const grid = /<path d="([^"]+)"[^>]*class="joints"/.exec(svg)![1]
    expect(grid.match(/V/g)).toHaveLength(180)
    expect(grid.match(/H/g)).toHaveLength(200)
  })

  it('stays small enough for a page to show at once', () => {
    expect(svg.length).toBeLessThan(600_000)
  })
})
