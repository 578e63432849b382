// Selling price levels and their price rules (quantity breaks: a price or a percent off from a quantity on),
// in the columns of the everything-out files price-levels.xlsx and price-rules.xlsx. New records only.
import { problem } from '../../../shared/errors/errorCodes.js'
import { priceLevelInputSchema, priceRuleInputSchema } from '../../../shared/schemas/pricing.js'
import type { ImportSpec } from './importTypes.js'
import { cellText, distinctOf, heldValues, inChunks, itemsBySku, marks, namedItem, notOwn, type ItemFacts } from './importFacts.js'
import { firstTimeIds, insertRows, recordsImport } from './recordsImport.js'

export const PRICE_LEVELS_SPEC: ImportSpec = {
  columns: [
    { key: 'code', header: 'Code', aliases: ['Price level', 'Level'], required: true, kind: 'text' },
    { key: 'name', header: 'Name', required: true, kind: 'text' },
    { key: 'percentOff', header: 'Percent off', aliases: ['Discount'], kind: 'decimal' },
    { key: 'active', header: 'Active', kind: 'boolean' },
  ],
  maxRows: 500,
  maxColumns: 20,
}

export const PRICE_LEVELS_GUIDE: Record<string, string> = {
  code: 'Your code for the level: 2 to 20 letters, digits or dashes. A code already in Lumenyard is refused.',
  name: 'Its name.',
  percentOff: 'Percent off list price for accounts on this level, 0 to 100 with up to 2 decimals (blank: only its own rules).',
  active: 'no for a level no longer offered (blank: yes).',
}

export const PRICE_RULES_SPEC: ImportSpec = {
  columns: [
    { key: 'level', header: 'Price level', aliases: ['Level'], kind: 'text' },
    { key: 'sku', header: 'SKU', required: true, kind: 'text' },
    { key: 'minQty', header: 'From quantity', aliases: ['From', 'Minimum quantity'], kind: 'integer' },
    { key: 'basis', header: 'Basis', kind: 'text' },
    { key: 'price', header: 'Price', kind: 'decimal' },
    { key: 'percentOff', header: 'Percent off', kind: 'decimal' },
  ],
  maxRows: 20_000,
  maxColumns: 20,
}

export const PRICE_RULES_GUIDE: Record<string, string> = {
  level: 'A price level code already in Lumenyard (blank: the rule holds for every account).',
  sku: 'An item already in the catalog.',
  minQty: 'The rule holds from this many stock units (or packs) on (blank: 1). Several rows for one item make quantity breaks.',
  basis: 'unit for a price per stock unit, pack for a price per case (blank: unit).',
  price: 'The price, up to 2 decimals, no currency sign. Give a price or a percent off, not both.',
  percentOff: 'Percent off list price, 0 to 100.',
}

interface LevelWrite { code: string; name: string; percentOff: string | null; active: boolean }

export const priceLevelsImport = recordsImport<LevelWrite, object>({
  kind: 'price_levels',
  spec: PRICE_LEVELS_SPEC,
  async facts(em, part, importId) {
    return { held: await heldValues(em, 'price_levels', 'code', distinctOf(part, 'code'), importId) }
  },
  read(values, _facts, reader) {
    const parsed = priceLevelInputSchema.safeParse({ code: values.code ?? '', name: values.name ?? '', percentOff: values.percentOff ?? null, active: values.active ?? undefined })
    if (!parsed.success) {
      reader.issues(parsed.error.issues)
      return null
    }
    return parsed.data
  },
  identity: (l) => l.code,
  identityColumn: 'code',
  preview: (l, values) => ({ label: l?.code ?? (cellText(values.code) || null), place: l?.name ?? null }),
  async insert(em, importId, rows) {
    await insertRows(em, 'price_levels', ['code', 'name', 'percent_off', 'active'], importId, rows, (l) => [l.code, l.name, l.percentOff, l.active ? 1 : 0])
    return { priceLevels: rows.length }
  },
  async inUse(em, importId) {
    const [used]: { code: string }[] = await em.query(
      `SELECT l.code FROM price_levels l WHERE l.import_id = ? AND (EXISTS (SELECT 1 FROM customer_terms t WHERE t.price_level_id = l.id)
         OR EXISTS (SELECT 1 FROM price_rules r WHERE r.level_id = l.id AND (r.import_id IS NULL OR r.import_id <> l.import_id))) LIMIT 1`, [importId])
    return used?.code ?? null
  },
  remove: (em, importId) => em.query('DELETE FROM price_levels WHERE import_id = ?', [importId]),
})

interface RuleWrite { levelId: number | null; level: string; itemId: number; sku: string; minQty: number; basis: string; price: string | null; percentOff: string | null }

export const priceRulesImport = recordsImport<RuleWrite, { items: Map<string, ItemFacts>; levels: Map<string, { id: number; code: string }> }>({
  kind: 'price_rules',
  spec: PRICE_RULES_SPEC,
  async facts(em, part, importId) {
    const levels = await inChunks(distinctOf(part, 'level'), (c) => em.query(`SELECT id, code FROM price_levels WHERE code IN (${marks(c.length)})`, c) as Promise<{ id: number; code: string }[]>)
    const items = await itemsBySku(em, distinctOf(part, 'sku'))
    const [own, ownId] = notOwn('r.import_id', importId)
    const rules = await inChunks([...items.values()].map((i) => i.id), (c) => em.query(
      `SELECT l.code AS level, i.sku, r.basis, r.min_qty FROM price_rules r JOIN items i ON i.id = r.item_id LEFT JOIN price_levels l ON l.id = r.level_id
        WHERE r.item_id IN (${marks(c.length)})${own}`, [...c, ownId]) as Promise<{ level: string | null; sku: string; basis: string; min_qty: number }[]>)
    return {
      items,
      levels: new Map(levels.map((l) => [l.code.toUpperCase(), l])),
      held: new Set(rules.map((r) => ruleIdentity(r.level ?? '', r.sku, r.basis, r.min_qty).toUpperCase())),
    }
  },
  read(values, facts, reader) {
    const levelCode = cellText(values.level)
    const level = levelCode ? facts.levels.get(levelCode.toUpperCase()) : undefined
    if (levelCode && !level) reader.add('level', problem('import_price_level_unknown', { level: levelCode }))
    const { item } = namedItem(values.sku, facts.items, reader)
    const parsed = priceRuleInputSchema.safeParse({
      levelId: level?.id ?? null, itemId: item?.id ?? 1, minQty: values.minQty ?? undefined,
      basis: cellText(values.basis).toLowerCase() || undefined, price: values.price ?? null, percentOff: values.percentOff ?? null,
    })
    if (!parsed.success) {
      reader.issues(parsed.error.issues)
      return null
    }
    if (!item || (levelCode && !level)) return null
    const r = parsed.data
    return { levelId: r.levelId, level: level?.code ?? '', itemId: item.id, sku: item.sku, minQty: r.minQty, basis: r.basis, price: r.price, percentOff: r.percentOff }
  },
  identity: (r) => ruleIdentity(r.level, r.sku, r.basis, r.minQty),
  identityColumn: 'minQty',
  preview: (r, values) => ({ label: r?.sku ?? (cellText(values.sku) || null), place: r ? r.level || null : null, qty: r?.minQty ?? null }),
  async insert(em, importId, rows) {
    const items = await firstTimeIds(em, 'price_rules', 'item_id', importId, rows.map((r) => r.itemId))
    await insertRows(em, 'price_rules', ['level_id', 'item_id', 'min_qty', 'basis', 'price', 'percent_off'], importId, rows, (r) => [r.levelId, r.itemId, r.minQty, r.basis, r.price, r.percentOff])
    return { priceRules: rows.length, items }
  },
  // Quotes and orders copy their prices, so nothing refers to a rule.
  inUse: async () => null,
  remove: (em, importId) => em.query('DELETE FROM price_rules WHERE import_id = ?', [importId]),
})

function ruleIdentity(level: string, sku: string, basis: string, minQty: number): string {
  return `${level || '*'} ${sku} ${basis} ${minQty}`
}
