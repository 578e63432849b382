// What the takeoff needs from the catalog, read straight from the items table: glass blocks with their
// face sizes, the role → item mapping, the effective material rules and waste allowances, and the items
// a loose line may name. The editor gets the same object, so the browser computes what the server saves.
import type { EntityManager } from 'typeorm'
import type { BlockOption, CounterCatalog, LooseItemOption, RoleItemRecord, RuleRecord } from '../../../shared/schemas/counter.js'
import { materialRuleSchema, siteFiguresSchema, type MaterialFamily, type MaterialRole, type SiteFigures, type ThicknessClass } from '../../../shared/schemas/takeoff.js'
import { defaultMaterialRules, defaultWastePct } from '../../../shared/takeoff/materials.js'
import { DEFAULT_SITE_FIGURES } from '../../../shared/takeoff/siteFigures.js'
import { MM_PER_FOOT } from '../../../shared/units.js'
import { AppSetting } from '../../entities/AppSetting.js'
import { Item } from '../../entities/Item.js'
import { MaterialRoleItem, MaterialRuleRow, WasteAllowance } from '../../entities/TakeoffSettings.js'

const num = (v: string | null | undefined): number | undefined => (v === null || v === undefined ? undefined : Number(v))

function blockOption(i: Item): BlockOption | undefined {
  const w = num(i.faceWidthMm)
  const h = num(i.faceHeightMm)
  const d = num(i.depthMm)
  const weight = num(i.weightKg) ?? 0
  if (!w || !h || !d || !i.thicknessClass || weight <= 0) return undefined
  return {
    itemId: i.id,
    sku: i.sku,
    name: i.name,
    nominal: i.nominalSize ?? i.sku,
    faceWidthMm: w,
    faceHeightMm: h,
    depthMm: d,
    thicknessClass: i.thicknessClass as ThicknessClass,
    weightKg: weight,
    pattern: i.pattern,
    shape: i.shape,
    item: { sku: i.sku, name: i.name, unit: i.stockUnit, packSize: i.caseQty ?? 1, sellByPack: i.sellByPack },
  }
}

/** A mapping row's item as the takeoff math sees it; a per-foot item is a 1 ft piece. */
export function roleItemRecord(row: MaterialRoleItem, item: Item, blockSku: string | null): RoleItemRecord {
  const pieceLengthMm = num(row.pieceLengthMm) ?? (item.stockUnit === 'foot' ? MM_PER_FOOT : undefined)
  const yieldMl = num(row.yieldMl) ?? num(item.groutYieldMl)
  return {
    id: row.id,
    role: row.role as MaterialRole,
    jointKind: row.jointKind,
    blockItemId: row.blockItemId,
    blockSku,
    itemId: item.id,
    pieceLengthMm: num(row.pieceLengthMm) ?? null,
    yieldMl: num(row.yieldMl) ?? null,
    note: row.note,
    item: {
      itemId: item.id,
      sku: item.sku,
      name: item.name,
      unit: item.stockUnit,
      packSize: item.caseQty ?? 1,
      sellByPack: item.sellByPack,
      madeToOrder: item.madeToOrder,
      active: item.active,
      ...(num(item.cartridgeMl) ? { cartridgeMl: num(item.cartridgeMl) } : {}),
      ...(yieldMl ? { groutYieldMl: yieldMl, mortarYieldMl: yieldMl } : {}),
      ...(pieceLengthMm ? { pieceLengthMm } : {}),
    },
  }
}

export async function loadRoleItems(em: EntityManager): Promise<RoleItemRecord[]> {
  const rows = await em.find(MaterialRoleItem, { order: { role: 'ASC', id: 'ASC' } })
  const ids = [...new Set(rows.flatMap((r) => [r.itemId, r.blockItemId ?? 0]))].filter((id) => id > 0)
  const items = ids.length ? await em.getRepository(Item).createQueryBuilder('i').where('i.id IN (:...ids)', { ids }).getMany() : []
  const byId = new Map(items.map((i) => [i.id, i]))
  return rows.flatMap((r) => {
    const item = byId.get(r.itemId)
    if (!item) return []
    return [roleItemRecord(r, item, r.blockItemId ? (byId.get(r.blockItemId)?.sku ?? null) : null)]
  })
}

/** Shipped rules with an admin's changes applied, then the admin's own rules. */
export async function loadRuleRecords(em: EntityManager): Promise<RuleRecord[]> {
  const rows = await em.find(MaterialRuleRow, { order: { id: 'ASC' } })
  const byKey = new Map(rows.map((r) => [r.ruleKey, r]))
  const parsed = (r: MaterialRuleRow) => materialRuleSchema.parse(JSON.parse(r.ruleJson))
  const shipped: RuleRecord[] = defaultMaterialRules.map((rule) => {
    const row = byKey.get(rule.id)
    return row ? { rule: parsed(row), enabled: row.enabled, origin: 'changed' as const } : { rule, enabled: true, origin: 'default' as const }
  })
  const shippedIds = new Set(defaultMaterialRules.map((r) => r.id))
  const added = rows.filter((r) => !shippedIds.has(r.ruleKey)).map((r) => ({ rule: parsed(r), enabled: r.enabled, origin: 'added' as const }))
  return [...shipped, ...added]
}

export async function loadWastePct(em: EntityManager): Promise<Record<MaterialFamily, number>> {
  const rows = await em.find(WasteAllowance)
  const out = { ...defaultWastePct }
  for (const r of rows) if (r.family in out) out[r.family as MaterialFamily] = Number(r.pct)
  return out
}

/** app_settings key of each site figure. */
export const FIGURE_KEYS: Record<keyof SiteFigures, string> = {
  groutDepthMm: 'takeoff.grout_depth_mm',
  fixingSpacingMm: 'takeoff.fixing_spacing_mm',
  leftoverWarnMm: 'takeoff.leftover_warn_mm',
  baseToleranceMm: 'takeoff.base_tolerance_mm',
  baseToleranceDeg: 'takeoff.base_tolerance_deg',
}

/** The site figures in force: an admin's stored value where it still passes the schema, else the default. */
export async function loadSiteFigures(em: EntityManager): Promise<SiteFigures> {
  const rows = await em.getRepository(AppSetting).find()
  const byKey = new Map(rows.map((r) => [r.key, r.value]))
  const out = { ...DEFAULT_SITE_FIGURES }
  for (const [name, key] of Object.entries(FIGURE_KEYS) as [keyof SiteFigures, string][]) {
    const stored = byKey.get(key)
    const value = stored === undefined ? undefined : Number(stored)
    if (value !== undefined && siteFiguresSchema.shape[name].safeParse(value).success) out[name] = value
  }
  return out
}

async function loadBlocksAndLooseItems(em: EntityManager): Promise<{ blocks: BlockOption[]; looseItems: LooseItemOption[] }> {
  const items = await em.find(Item, { where: { active: true }, order: { sku: 'ASC' } })
  // Walls are laid in the base block; end-finish and corner shapes come in through the role mapping.
  const base = (i: Item) => i.family === 'glass_block' && (i.shape === null || i.shape === 'square' || i.shape === 'rectangle')
  const blocks = items.filter(base).map(blockOption).filter((b): b is BlockOption => b !== undefined)
  const looseItems = items.map((i) => ({ itemId: i.id, sku: i.sku, name: i.name, unit: i.stockUnit, family: i.family, madeToOrder: i.madeToOrder }))
  return { blocks, looseItems }
}

export async function loadCounterCatalog(em: EntityManager): Promise<CounterCatalog> {
  const [{ blocks, looseItems }, roleItems, rules, wastePct, figures] = await Promise.all([
    loadBlocksAndLooseItems(em),
    loadRoleItems(em),
    loadRuleRecords(em),
    loadWastePct(em),
    loadSiteFigures(em),
  ])
  return { blocks, looseItems, roleItems, rules: rules.filter((r) => r.enabled).map((r) => r.rule), wastePct, figures }
}
