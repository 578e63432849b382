// Binds a takeoff to the yard's catalog and computes its bill: each wall's block SKU picks its block
// sizes and, through the role → item mapping, the items that fill every material role. The browser
// runs this as the user types; the server runs the same function when it computes or saves.
import type { BlockOption, CounterCatalog, LineAvailability, RoleItemRecord } from '../schemas/counter.js'
import type { CatalogItem, CatalogMap, JointKind, LengthUnitName, Takeoff, Wall } from '../schemas/takeoff.js'
import { materialRoleSchema } from '../schemas/takeoff.js'
import { computeTakeoff, type BomLine, type TakeoffResult } from '../takeoff/billOfMaterials.js'
import type { Caution } from '../takeoff/cautions.js'

export interface CounterBillLine extends BomLine {
  itemId: number | null
  madeToOrder: boolean
}

export interface CounterBill extends Omit<TakeoffResult, 'lines'> {
  lines: CounterBillLine[]
  /** The takeoff as computed: block sizes and per-wall items filled from the catalog. */
  bound: Takeoff
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

function bindWall(wall: Wall, catalog: CounterCatalog, problems: Caution[]): Wall {
  const sku = wall.catalog?.block?.sku
  const block = sku ? catalog.blocks.find((b) => b.sku === sku) : undefined
  if (sku && !block) problems.push({ level: 'warn', wall: wall.name, message: `${wall.name}: block SKU ${sku} is not an active glass block in the catalog.` })
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

/** The takeoff's bill against the catalog, rules and waste allowances the admin set. */
export function computeCounterBill(takeoff: Takeoff, catalog: CounterCatalog, unit: LengthUnitName): CounterBill {
  const problems: Caution[] = []
  const bound: Takeoff = { ...takeoff, walls: takeoff.walls.map((w) => bindWall(w, catalog, problems)) }
  const globalMap = resolveWallCatalog(catalog.roleItems, undefined, undefined)
  const result = computeTakeoff(bound, globalMap, { unit, rules: catalog.rules, wastePct: catalog.wastePct })
  const lines = tieLines(result.lines, catalog)
  const looseIssues: Caution[] = lines
    .filter((l) => l.role === 'loose' && l.issue)
    .map((l) => ({ level: 'warn', message: `${l.name}: ${l.issue}; the line cannot be ordered until it is fixed.` }))
  // Keep the closing line (deferring to local codes) last.
  const closing = result.cautions[result.cautions.length - 1]
  const cautions = [...problems, ...result.cautions.slice(0, -1), ...looseIssues, closing]
  return { ...result, lines, cautions, bound }
}

/** Why a bill may not be saved as it stands: walls that cannot be built, lines that cannot be ordered, code stops. */
export function saveBlockers(bill: CounterBill): string[] {
  const out: string[] = []
  for (const w of bill.walls) if (w.status === 'refused') out.push(`${w.name}: ${w.reason}`)
  for (const l of bill.lines) if (l.issue) out.push(`${l.name}: ${l.issue}`)
  for (const c of bill.cautions) if (c.level === 'stop' && !out.some((o) => o.endsWith(c.message))) out.push(c.message)
  return [...new Set(out)]
}

/** The compute endpoint's answer: the bill, stock per warehouse of each stocked line, and what blocks saving. */
export interface ComputeAnswer extends Omit<CounterBill, 'bound'> {
  availability: LineAvailability[]
  blockers: string[]
}
