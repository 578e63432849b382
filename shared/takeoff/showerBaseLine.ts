// The made-to-order shower base: one line per takeoff carrying its full spec, never drawn from stock.
import type { CatalogItem, ShowerBase } from '../schemas/takeoff.js'
import type { BomLine } from './billOfMaterials.js'
import { roleLabels } from './materials.js'

/** Inch entries arrive as 1219.1999999999998 mm; the explanation shows a tenth of a millimetre. */
const mm = (value: number) => Number(value.toFixed(1))

function specInputs(base: ShowerBase): Record<string, string | number> {
  return {
    widthMm: mm(base.widthMm),
    depthMm: mm(base.depthMm),
    curb: base.curbless ? 'curbless' : base.curb ? `curved, R ${mm(base.curb.radiusMm)} mm, ${base.curb.arcDeg}°` : 'straight',
    drainFromLeftMm: mm(base.drain.fromLeftMm),
    drainFromBackMm: mm(base.drain.fromBackMm),
    entry: base.entry,
    ...(base.note ? { note: base.note } : {}),
  }
}

/** One base made to the spec; undefined when the takeoff has none. */
export function showerBaseLine(base: ShowerBase | undefined, item: CatalogItem | undefined): BomLine | undefined {
  if (!base) return undefined
  return {
    role: 'showerBase',
    sku: item?.sku ?? null,
    name: item?.name ?? roleLabels.showerBase,
    quantity: 1,
    unit: item?.unit ?? 'each',
    needed: 1,
    walls: [],
    explanation: {
      inputs: specInputs(base),
      rule: 'One base made to order for the takeoff, to the footprint, curb, drain and entry given.',
      formula: '1 base',
      rounding: 'made to order: exactly 1, no waste allowance',
    },
    issue: item ? undefined : 'No catalog item is mapped to this role',
  }
}
