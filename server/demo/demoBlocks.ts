// The demo supplier's glass blocks: sizes × patterns × shapes × thickness. Invented products;
// the physical facts they lean on are marked with where they come from.
import { withCheckDigit } from '../../shared/barcode/checkDigit.js'
import type { BlockShape, ThicknessClass } from '../../shared/catalog.js'
import { MoneyDecimal } from '../../shared/money.js'
import { actualFaceFromNominal } from '../../shared/blockFace.js'
import { MM_PER_INCH } from '../../shared/units.js'
import type { DemoItem } from './demoItemTypes.js'

/** Invented GS1 company prefix for the demo supplier's own-label packs (demo only). */
export const DEMO_COMPANY_PREFIX = '0847613'
export const demoGtin = (itemRef: number) => withCheckDigit(DEMO_COMPANY_PREFIX + String(itemRef).padStart(4, '0')).padStart(14, '0')

interface SizeSpec {
  nominal: string
  code: string
  label: string
  /** Actual face, mm: inch blocks nominal − 1/4 in (common practice); metric blocks as named. */
  widthMm: number
  heightMm: number
  /** Weight of a standard-depth square unit, kg (from memory). */
  weightKg: number
  cost: string
  caseQty: number
  palletQty: number
  metric: boolean
  popularity: number
}

const face = (nominal: string) => {
  const f = actualFaceFromNominal(nominal)!
  return { widthMm: f.widthMm, heightMm: f.heightMm }
}
const lb = (pounds: number) => pounds * 0.45359237 // NIST SP 811: 1 lb = 0.45359237 kg

const SIZES: SizeSpec[] = [
  { nominal: '8x8', code: '0808', label: '8×8 in', ...face('8x8'), weightKg: lb(6.3), cost: '7.80', caseQty: 8, palletQty: 320, metric: false, popularity: 10 },
  { nominal: '6x6', code: '0606', label: '6×6 in', ...face('6x6'), weightKg: lb(3.9), cost: '5.60', caseQty: 12, palletQty: 480, metric: false, popularity: 4 },
  { nominal: '4x8', code: '0408', label: '4×8 in', ...face('4x8'), weightKg: lb(3.6), cost: '5.90', caseQty: 10, palletQty: 500, metric: false, popularity: 3 },
  { nominal: '6x8', code: '0608', label: '6×8 in', ...face('6x8'), weightKg: lb(4.9), cost: '6.70', caseQty: 10, palletQty: 400, metric: false, popularity: 3 },
  { nominal: '12x12', code: '1212', label: '12×12 in', ...face('12x12'), weightKg: lb(15.5), cost: '21.50', caseQty: 4, palletQty: 96, metric: false, popularity: 1.2 },
  { nominal: '190x190', code: 'M190', label: '190×190 mm', ...face('190x190'), weightKg: 2.3, cost: '6.90', caseQty: 10, palletQty: 400, metric: true, popularity: 3 },
  { nominal: '240x240', code: 'M240', label: '240×240 mm', ...face('240x240'), weightKg: 3.9, cost: '11.40', caseQty: 6, palletQty: 216, metric: true, popularity: 1 },
  { nominal: '190x90', code: 'M199', label: '190×90 mm', ...face('190x90'), weightKg: 1.3, cost: '5.20', caseQty: 16, palletQty: 640, metric: true, popularity: 1 },
  { nominal: '115x115', code: 'M115', label: '115×115 mm', ...face('115x115'), weightKg: 0.9, cost: '4.10', caseQty: 24, palletQty: 960, metric: true, popularity: 1 },
]

const PATTERNS: Record<string, { code: string; label: string; costAdd: string; popularity: number }> = {
  clear: { code: 'CL', label: 'Clear', costAdd: '0', popularity: 1 },
  frosted: { code: 'FR', label: 'Frosted', costAdd: '1.60', popularity: 0.7 },
  wavy: { code: 'WV', label: 'Wavy', costAdd: '0.20', popularity: 1.3 },
  rippled: { code: 'RP', label: 'Rippled', costAdd: '0.40', popularity: 0.5 },
  fluted: { code: 'FL', label: 'Fluted', costAdd: '0.90', popularity: 0.3 },
  dimpled: { code: 'DM', label: 'Dimpled', costAdd: '0.70', popularity: 0.3 },
  prism: { code: 'PR', label: 'Prism', costAdd: '1.20', popularity: 0.25 },
  tinted: { code: 'TN', label: 'Sea-glass tinted', costAdd: '3.50', popularity: 0.2 },
}

const SHAPES: Record<BlockShape, { code: string; label: string; costFactor: string; popularity: number }> = {
  square: { code: 'SQ', label: 'block', costFactor: '1', popularity: 1 },
  rectangle: { code: 'RC', label: 'block', costFactor: '1', popularity: 1 },
  end_finish: { code: 'EF', label: 'end-finish block', costFactor: '1.6', popularity: 0.18 },
  double_end_finish: { code: 'DE', label: 'double end-finish block', costFactor: '2.1', popularity: 0.06 },
  corner: { code: 'CR', label: 'corner block', costFactor: '2.4', popularity: 0.08 },
  angle_45: { code: 'AN', label: '45° angle block', costFactor: '2.6', popularity: 0.05 },
}

// IRC 2021 R607.3: standard units at least 3 7/8 in thick, thin units at least 3 1/8 in.
const DEPTHS: Record<ThicknessClass, { inchMm: number; label: string; weightFactor: number; costFactor: string }> = {
  standard: { inchMm: 3.875 * MM_PER_INCH, label: 'standard (3 7/8 in)', weightFactor: 1, costFactor: '1' },
  thin: { inchMm: 3.125 * MM_PER_INCH, label: 'thin (3 1/8 in)', weightFactor: 0.78, costFactor: '0.9' },
}

/** Which patterns and shapes the yard stocks per size and thickness (metric: depth 80 or 100 mm). */
const RANGE: { size: string; thickness: ThicknessClass; depthMm?: number; patterns: string[]; shapes: Partial<Record<BlockShape, string[]>> }[] = [
  { size: '8x8', thickness: 'standard', patterns: ['clear', 'frosted', 'wavy', 'rippled', 'fluted', 'dimpled', 'prism', 'tinted'],
    shapes: { end_finish: ['clear', 'wavy', 'frosted', 'rippled'], double_end_finish: ['clear', 'wavy'], corner: ['clear', 'wavy', 'frosted'], angle_45: ['clear', 'wavy', 'frosted'] } },
  { size: '8x8', thickness: 'thin', patterns: ['clear', 'frosted', 'wavy', 'rippled', 'dimpled'], shapes: { end_finish: ['clear', 'wavy', 'frosted'], double_end_finish: ['wavy'], corner: ['wavy'] } },
  { size: '6x6', thickness: 'standard', patterns: ['clear', 'frosted', 'wavy', 'rippled', 'fluted', 'prism'],
    shapes: { end_finish: ['clear', 'wavy'], double_end_finish: ['wavy'], corner: ['clear', 'wavy'], angle_45: ['wavy'] } },
  { size: '6x6', thickness: 'thin', patterns: ['clear', 'wavy'], shapes: {} },
  { size: '4x8', thickness: 'standard', patterns: ['clear', 'frosted', 'wavy', 'rippled'], shapes: { end_finish: ['clear', 'wavy'], double_end_finish: ['wavy'], corner: ['wavy'] } },
  { size: '4x8', thickness: 'thin', patterns: ['wavy', 'clear'], shapes: {} },
  { size: '6x8', thickness: 'standard', patterns: ['clear', 'frosted', 'wavy', 'rippled', 'prism'], shapes: { end_finish: ['clear', 'wavy'], double_end_finish: ['wavy'], corner: ['wavy'] } },
  { size: '6x8', thickness: 'thin', patterns: ['clear', 'wavy'], shapes: {} },
  { size: '12x12', thickness: 'standard', patterns: ['clear', 'frosted', 'wavy', 'fluted', 'rippled'], shapes: { end_finish: ['wavy', 'clear'] } },
  // 80 mm metric units are thicker than 3 1/8 in but thinner than 3 7/8 in: thin units under R607.3.
  { size: '190x190', thickness: 'thin', depthMm: 80, patterns: ['clear', 'frosted', 'wavy', 'rippled', 'dimpled', 'tinted', 'fluted', 'prism'],
    shapes: { end_finish: ['clear', 'wavy'], double_end_finish: ['wavy'], corner: ['wavy'], angle_45: ['clear'] } },
  { size: '190x190', thickness: 'standard', depthMm: 100, patterns: ['clear', 'wavy'], shapes: {} },
  { size: '240x240', thickness: 'thin', depthMm: 80, patterns: ['clear', 'frosted', 'wavy', 'rippled'], shapes: { end_finish: ['wavy'] } },
  { size: '190x90', thickness: 'thin', depthMm: 80, patterns: ['clear', 'frosted', 'wavy'], shapes: { end_finish: ['wavy'] } },
  { size: '115x115', thickness: 'thin', depthMm: 80, patterns: ['clear', 'frosted', 'wavy', 'tinted'], shapes: { end_finish: ['clear'] } },
]

const mm = (value: number) => value.toFixed(2)

function blockItem(size: SizeSpec, thickness: ThicknessClass, depthMmGiven: number | undefined, pattern: string, shape: BlockShape, ref: number): DemoItem {
  const p = PATTERNS[pattern]
  const s = SHAPES[shape]
  const d = DEPTHS[thickness]
  const depthMm = depthMmGiven ?? d.inchMm
  const depthLabel = size.metric ? `${depthMm} mm deep` : d.label
  const suffix = size.metric ? `-${depthMm}` : thickness === 'thin' ? '-T' : ''
  const weightFactor = size.metric ? depthMm / 100 + 0.05 : d.weightFactor
  const cost = new MoneyDecimal(size.cost).plus(p.costAdd).times(s.costFactor).times(d.costFactor).toDecimalPlaces(2)
  // List prices: about 1.8× cost, ending in .95 (the demo's own pricing habit).
  const list = cost.times('1.8').floor().plus('0.95')
  const special = shape !== 'square' && shape !== 'rectangle'
  return {
    row: {
      sku: `GB-${size.code}-${p.code}-${s.code}${suffix}`,
      name: `${size.label} ${p.label} ${s.label}, ${depthLabel}`,
      family: 'glass_block',
      stockUnit: 'each',
      caseQty: size.caseQty,
      palletQty: special ? null : size.palletQty,
      gtin: ref % 3 === 0 ? null : demoGtin(ref),
      weightKg: (size.weightKg * weightFactor).toFixed(3),
      cost: cost.toFixed(4),
      listPrice: list.toFixed(2),
      matchLot: true,
      nominalSize: size.nominal,
      faceWidthMm: mm(size.widthMm),
      faceHeightMm: mm(size.heightMm),
      depthMm: mm(depthMm),
      thicknessClass: thickness,
      pattern,
      shape,
      description: special ? `${s.label[0].toUpperCase()}${s.label.slice(1)} with a finished face for panel ends and edges.` : null,
    },
    popularity: size.popularity * p.popularity * s.popularity * (thickness === 'thin' && !size.metric ? 0.45 : 1),
    lineQty: size.nominal === '12x12' ? [2, 30] : [4, 96],
  }
}

export function demoBlocks(): DemoItem[] {
  const items: DemoItem[] = []
  let ref = 100
  for (const r of RANGE) {
    const size = SIZES.find((s) => s.nominal === r.size)!
    const base: BlockShape = size.widthMm === size.heightMm ? 'square' : 'rectangle'
    for (const pattern of r.patterns) items.push(blockItem(size, r.thickness, r.depthMm, pattern, base, ref++))
    for (const [shape, patterns] of Object.entries(r.shapes) as [BlockShape, string[]][]) {
      for (const pattern of patterns) items.push(blockItem(size, r.thickness, r.depthMm, pattern, shape, ref++))
    }
  }
  return items
}
