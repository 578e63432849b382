// Renders a wall drawing model to a standalone SVG string: the elevation with one tone per section, the
// plan view of a turning run, and a legend. Lumenyard's own look: cool glass tones on a white sheet.
import { formatLength, type LengthUnit } from '../units.js'
import type { ElevationBlock, WallDrawing, WallElevation } from './drawing.js'
import type { Point, WallPlanView } from './planView.js'

/** The drawing's words, so a screen can pass them in the reader's language. */
export interface SvgWords {
  elevation: string
  plan: string
  freeEnd: string
  /** "Section {n}: {blocks} blocks, {kg} kg" */
  section: (n: number, blocks: number, kg: string, heavy: boolean) => string
  key: string
  /** "… and {n} more sections" */
  moreSections: (n: number) => string
}

export const SVG_WORDS_EN: SvgWords = {
  elevation: 'Elevation (developed)',
  plan: 'Plan',
  freeEnd: 'free end',
  section: (n, blocks, kg, heavy) => `Section ${n}: ${blocks} blocks, ${kg} kg${heavy ? ' (heavy)' : ''}`,
  key: '▲ anchor  ● screw  heavy edge: finished unit',
  moreSections: (n) => `… and ${n} more sections`,
}

export interface SvgOptions {
  view?: 'elevation' | 'plan' | 'both'
  /** Overall width of the SVG in px. */
  widthPx?: number
  title?: string
  legend?: boolean
  /** The unit to write lengths in, when not the drawing's own. */
  unit?: LengthUnit
  words?: SvgWords
}

const MARGIN = 24
const LINE = 18
const INK = '#22313f'
const WARN = '#b3261e'

// Two decimals, written the short way (12.5, not 12.50); a drawing writes thousands of these.
const num = (v: number) => String(Math.round(v * 100) / 100)

export function escapeXml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&apos;' })[c] as string)
}

/** Distinct tones per section: hues a golden angle apart, soft like tinted glass. */
export function sectionTone(index: number): { fill: string; stroke: string } {
  if (index < 0) return { fill: '#eeeeee', stroke: '#888888' }
  const hue = (200 + index * 137.508) % 360
  return { fill: `hsl(${num(hue)}, 48%, 80%)`, stroke: `hsl(${num(hue)}, 40%, 38%)` }
}

function text(x: number, y: number, body: string, extra = ''): string {
  return `<text x="${num(x)}" y="${num(y)}" fill="${INK}"${extra}>${escapeXml(body)}</text>`
}

function blockRect(b: ElevationBlock, x0: number, y0: number, s: number, heightMm: number, heavy: Set<number>, tones: Map<number, { fill: string; stroke: string }>): string {
  let tone = tones.get(b.section)
  if (!tone) tones.set(b.section, (tone = sectionTone(b.section)))
  const x = x0 + b.xMm * s
  const y = y0 + (heightMm - b.yMm - b.heightMm) * s
  const stroke = heavy.has(b.section) ? WARN : tone.stroke
  const dash = b.kind === 'corner' ? ' stroke-dasharray="3 2"' : b.kind === 'angle' ? ' stroke-dasharray="1 2"' : ''
  const width = b.kind === 'end' ? 2 : b.kind === 'double' ? 3 : 1
  return `<rect x="${num(x)}" y="${num(y)}" width="${num(b.widthMm * s)}" height="${num(b.heightMm * s)}" ` +
    `fill="${tone.fill}" stroke="${stroke}" stroke-width="${width}"${dash} data-section="${b.section + 1}" ` +
    `data-course="${b.course + 1}" data-column="${b.column + 1}" data-unit="${b.kind}"/>`
}

/**
 * Walls larger than this are drawn coarser: each section one tinted strip per course and the joints as one
 * grid, instead of a rectangle per block. A block is then a few pixels wide anyway, and the drawing of the
 * largest takeoff allowed stays a few hundred kilobytes, not megabytes.
 */
export const DETAILED_BLOCKS = 1500

/** Each section's cells in one course are side by side in stack bond: one strip per section and course. */
function sectionStrips(e: WallElevation, x0: number, y0: number, s: number, heavy: Set<number>): string[] {
  const strips = new Map<string, { section: number; x1: number; x2: number; y: number; h: number }>()
  for (const b of e.blocks) {
    const key = `${b.section}|${b.course}`
    const strip = strips.get(key)
    if (!strip) strips.set(key, { section: b.section, x1: b.xMm, x2: b.xMm + b.widthMm, y: b.yMm, h: b.heightMm })
    else {
      strip.x1 = Math.min(strip.x1, b.xMm)
      strip.x2 = Math.max(strip.x2, b.xMm + b.widthMm)
    }
  }
  const tones = new Map<number, { fill: string; stroke: string }>()
  return [...strips.values()].map((r) => {
    let tone = tones.get(r.section)
    if (!tone) tones.set(r.section, (tone = sectionTone(r.section)))
    const fill = heavy.has(r.section) ? WARN : tone.fill
    return `<rect x="${num(x0 + r.x1 * s)}" y="${num(y0 + (e.heightMm - r.y - r.h) * s)}" width="${num((r.x2 - r.x1) * s)}" ` +
      `height="${num(r.h * s)}" fill="${fill}" data-section="${r.section + 1}"/>`
  })
}

/** The joints of a coarse drawing: a line at each column's edges and each course's edges, in one path. */
function jointGrid(e: WallElevation, x0: number, y0: number, s: number): string {
  const xs = new Set<number>()
  const ys = new Set<number>()
  for (const b of e.blocks) {
    xs.add(b.xMm).add(b.xMm + b.widthMm)
    ys.add(b.yMm).add(b.yMm + b.heightMm)
  }
  const top = y0
  const bottom = y0 + e.heightMm * s
  const d = [
    ...[...xs].map((x) => `M${num(x0 + x * s)} ${num(top)}V${num(bottom)}`),
    ...[...ys].map((y) => `M${num(x0)} ${num(y0 + (e.heightMm - y) * s)}H${num(x0 + e.widthMm * s)}`),
  ]
  return `<path d="${d.join('')}" fill="none" stroke="${INK}" stroke-opacity=".35" stroke-width=".5" class="joints"/>`
}

function fixingMarks(e: WallElevation, x0: number, y0: number, s: number): string[] {
  return e.fixings.map((f) => {
    const x = x0 + f.xMm * s
    const y = y0 + (e.heightMm - f.yMm) * s
    const data = ` data-fixing="${f.side}" data-at-mm="${num(f.side === 'head' ? f.xMm : f.yMm)}"`
    if (f.kind === 'screw') return `<circle cx="${num(x)}" cy="${num(y)}" r="3" fill="${INK}"${data}/>`
    return `<path d="M${num(x - 4)} ${num(y + 4)} L${num(x + 4)} ${num(y + 4)} L${num(x)} ${num(y - 4)} Z" fill="${WARN}"${data}/>`
  })
}

/** Each section's number at the middle of its blocks (one pass over the blocks, whatever the wall's size). */
function sectionNumbers(e: WallElevation, x0: number, y0: number, s: number): string[] {
  const sums = new Map<number, { x: number; y: number; n: number }>()
  for (const b of e.blocks) {
    const sum = sums.get(b.section) ?? { x: 0, y: 0, n: 0 }
    sum.x += b.xMm + b.widthMm / 2
    sum.y += b.yMm + b.heightMm / 2
    sum.n++
    sums.set(b.section, sum)
  }
  return e.sections.flatMap((sec) => {
    const sum = sums.get(sec.index)
    if (!sum) return []
    return [text(x0 + (sum.x / sum.n) * s, y0 + (e.heightMm - sum.y / sum.n) * s + 4, `${sec.index + 1}`, ' text-anchor="middle" font-weight="600"')]
  })
}

function elevationSvg(d: WallDrawing, top: number, widthPx: number, unit: LengthUnit, words: SvgWords): { body: string[]; height: number } {
  const e = d.elevation
  const s = e.widthMm > 0 ? widthPx / e.widthMm : 1
  const heavy = new Set(e.sections.filter((x) => x.overweight).map((x) => x.index))
  const tones = new Map<number, { fill: string; stroke: string }>()
  const y0 = top + LINE
  const body = [
    '<g class="elevation">',
    text(MARGIN, top + 12, `${words.elevation} · ${formatLength(e.widthMm, unit, { feet: true })} × ${formatLength(e.heightMm, unit, { feet: true })}`, ' font-weight="600"'),
    ...(e.blocks.length <= DETAILED_BLOCKS
      ? e.blocks.map((b) => blockRect(b, MARGIN, y0, s, e.heightMm, heavy, tones))
      : [...sectionStrips(e, MARGIN, y0, s, heavy), jointGrid(e, MARGIN, y0, s)]),
    ...fixingMarks(e, MARGIN, y0, s),
    ...sectionNumbers(e, MARGIN, y0, s),
  ]
  if (e.freeEnds.start) body.push(text(MARGIN, y0 + e.heightMm * s + 14, words.freeEnd))
  if (e.freeEnds.end) body.push(text(MARGIN + e.widthMm * s, y0 + e.heightMm * s + 14, words.freeEnd, ' text-anchor="end"'))
  body.push('</g>')
  return { body, height: LINE + e.heightMm * s + LINE + 6 }
}

function arcPoints(centre: Point, r: number, startDeg: number, endDeg: number): Point[] {
  const steps = 48
  return Array.from({ length: steps + 1 }, (_, i) => {
    const a = ((startDeg + ((endDeg - startDeg) * i) / steps) * Math.PI) / 180
    return { x: centre.x + r * Math.cos(a), y: centre.y + r * Math.sin(a) }
  })
}

function planSvg(plan: WallPlanView, top: number, widthPx: number, unit: LengthUnit, words: SvgWords): { body: string[]; height: number } {
  const b = plan.bounds
  const spanX = Math.max(b.maxX - b.minX, 1)
  const spanY = Math.max(b.maxY - b.minY, 1)
  const s = Math.min(widthPx / spanX, (1.5 * widthPx) / spanY)
  const y0 = top + LINE
  const at = (p: Point) => `${num(MARGIN + (p.x - b.minX) * s)},${num(y0 + (b.maxY - p.y) * s)}`
  const body = ['<g class="plan">', text(MARGIN, top + 12, words.plan, ' font-weight="600"')]
  for (const f of plan.footprints) {
    const fill = f.kind === 'curved' ? '#cfe6ef' : f.kind === 'corner' ? '#d9d4ec' : '#e3eef2'
    body.push(`<polygon points="${f.corners.map(at).join(' ')}" fill="${fill}" stroke="${INK}" stroke-width="0.8"/>`)
  }
  for (const arc of plan.arcs) {
    body.push(`<polyline points="${arcPoints(arc.centre, arc.radiusMm, arc.startDeg, arc.endDeg).map(at).join(' ')}" fill="none" stroke="${INK}" stroke-dasharray="6 4" class="layout-arc"/>`)
  }
  for (const l of plan.labels) {
    const [x, y] = at(l.at).split(',').map(Number)
    body.push(text(x, y, l.radiusMm !== undefined ? `R ${formatLength(l.radiusMm, unit)}` : l.text, ' text-anchor="middle"'))
  }
  body.push('</g>')
  return { body, height: LINE + spanY * s + LINE }
}

/** Sections listed by name in a drawing's legend before the rest are counted. */
const LEGEND_SECTIONS = 24

function legendSvg(d: WallDrawing, top: number, widthPx: number, words: SvgWords): { body: string[]; height: number } {
  const perRow = Math.max(1, Math.floor(widthPx / 200))
  // A long wall lists its first sections and the heavy ones; the rest are on the elevation by number.
  const all = d.elevation.sections
  const listed = all.length <= LEGEND_SECTIONS ? all : all.filter((sec, i) => i < LEGEND_SECTIONS || sec.overweight).slice(0, 2 * LEGEND_SECTIONS)
  const items = listed.map((sec) => {
    const tone = sectionTone(sec.index)
    const label = words.section(sec.index + 1, sec.blocks, sec.weightKg.toFixed(1), sec.overweight)
    return { fill: tone.fill, stroke: sec.overweight ? WARN : tone.stroke, label }
  })
  if (listed.length < all.length) items.push({ fill: '#ffffff', stroke: '#ffffff', label: words.moreSections(all.length - listed.length) })
  items.push({ fill: '#ffffff', stroke: INK, label: words.key })
  const body = ['<g class="legend">']
  items.forEach((item, i) => {
    const x = MARGIN + (i % perRow) * 200
    const y = top + Math.floor(i / perRow) * LINE
    body.push(`<rect x="${x}" y="${y}" width="12" height="12" fill="${item.fill}" stroke="${item.stroke}"/>`)
    body.push(text(x + 18, y + 11, item.label))
  })
  body.push('</g>')
  return { body, height: Math.ceil(items.length / perRow) * LINE + 8 }
}

/** A standalone SVG of one wall drawing. */
export function toSvg(drawing: WallDrawing, options: SvgOptions = {}): string {
  const widthPx = options.widthPx ?? 800
  const inner = widthPx - 2 * MARGIN
  const view = options.view ?? 'both'
  const title = options.title ?? drawing.wallName
  const unit = options.unit ?? drawing.unit
  const words = options.words ?? SVG_WORDS_EN
  const parts: string[] = [text(MARGIN, MARGIN, title, ' font-size="15" font-weight="700"')]
  let y = MARGIN + 10
  if (view !== 'plan') {
    const e = elevationSvg(drawing, y, inner, unit, words)
    parts.push(...e.body)
    y += e.height
  }
  if (view !== 'elevation' && drawing.plan) {
    const p = planSvg(drawing.plan, y, inner, unit, words)
    parts.push(...p.body)
    y += p.height
  }
  if (options.legend !== false) {
    const l = legendSvg(drawing, y, inner, words)
    parts.push(...l.body)
    y += l.height
  }
  const height = Math.ceil(y + MARGIN)
  return [
    `<svg xmlns="http://www.w3.org/2000/svg" width="${widthPx}" height="${height}" viewBox="0 0 ${widthPx} ${height}" font-family="'Open Sans', sans-serif" font-size="12">`,
    `<title>${escapeXml(title)}</title>`,
    `<rect width="100%" height="100%" fill="#ffffff"/>`,
    ...parts,
    '</svg>',
  ].join('\n')
}
