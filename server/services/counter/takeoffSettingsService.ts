// The admin's side of the takeoff: material rules (change a shipped one, add one, switch one off, go back
// to the shipped rule), waste allowances per family, and which catalog item fills each material role.
import type { DataSource, EntityManager } from 'typeorm'
import type { RoleItemInput, RoleItemRecord, RuleOverrideInput, RuleRecord, SiteFiguresUpdateInput, WasteUpdateInput } from '../../../shared/schemas/counter.js'
import { LENGTH_ROLES, ROLE_FAMILIES, YIELD_ROLES } from '../../../shared/counter/roleFamilies.js'
import type { MaterialFamily, SiteFigures } from '../../../shared/schemas/takeoff.js'
import { defaultMaterialRules } from '../../../shared/takeoff/materials.js'
import { Item } from '../../entities/Item.js'
import { MaterialRoleItem, MaterialRuleRow, WasteAllowance } from '../../entities/TakeoffSettings.js'
import { inTransaction, isDuplicateKey } from '../../db/transaction.js'
import { AppError } from '../../errors.js'
import { audit, type AuditActor } from '../auditService.js'
import { FIGURE_KEYS, loadRoleItems, loadRuleRecords, loadSiteFigures, loadWastePct, roleItemRecord } from './counterCatalog.js'

export const listRules = (ds: DataSource): Promise<RuleRecord[]> => loadRuleRecords(ds.manager)

export async function saveRule(ds: DataSource, actor: AuditActor, ruleKey: string, input: RuleOverrideInput): Promise<RuleRecord[]> {
  if (input.rule.id !== ruleKey) throw AppError.badRequest('The rule id must match the address.', { 'rule.id': 'Must match the rule being saved' })
  await inTransaction(ds, async (em) => {
    const row = (await em.findOne(MaterialRuleRow, { where: { ruleKey }, lock: { mode: 'pessimistic_write' } })) ?? em.create(MaterialRuleRow, { ruleKey })
    row.ruleJson = JSON.stringify(input.rule)
    row.enabled = input.enabled
    row.updatedBy = actor.userId
    await em.save(row)
    await audit(em, actor, 'takeoff.rule.save', 'material_rule', ruleKey, input)
  })
  return listRules(ds)
}

/** A shipped rule goes back to as shipped; an added rule is removed. */
export async function resetRule(ds: DataSource, actor: AuditActor, ruleKey: string): Promise<RuleRecord[]> {
  await inTransaction(ds, async (em) => {
    const { affected } = await em.delete(MaterialRuleRow, { ruleKey })
    if (!affected) {
      const shipped = defaultMaterialRules.some((r) => r.id === ruleKey)
      throw shipped ? AppError.conflict('That rule is already as shipped.', 'unchanged') : AppError.notFound('That rule')
    }
    await audit(em, actor, 'takeoff.rule.reset', 'material_rule', ruleKey)
  })
  return listRules(ds)
}

export const getWaste = (ds: DataSource) => loadWastePct(ds.manager)

/** A null percentage goes back to the shipped default. */
export async function updateWaste(ds: DataSource, actor: AuditActor, input: WasteUpdateInput): Promise<Record<MaterialFamily, number>> {
  await inTransaction(ds, async (em) => {
    for (const [family, pct] of Object.entries(input)) {
      if (pct === null) await em.delete(WasteAllowance, { family })
      else if (pct !== undefined) await em.save(WasteAllowance, { family, pct: pct.toFixed(2), updatedBy: actor.userId })
    }
    await audit(em, actor, 'takeoff.waste.update', 'waste_allowance', null, input)
  })
  return getWaste(ds)
}

export const getSiteFigures = (ds: DataSource) => loadSiteFigures(ds.manager)

/** A number sets a figure; null puts it back to the default. */
export async function updateSiteFigures(ds: DataSource, actor: AuditActor, input: SiteFiguresUpdateInput): Promise<SiteFigures> {
  await inTransaction(ds, async (em) => {
    for (const [name, value] of Object.entries(input) as [keyof SiteFigures, number | null | undefined][]) {
      if (value === undefined) continue
      if (value === null) await em.query('DELETE FROM app_settings WHERE setting_key = ?', [FIGURE_KEYS[name]])
      else {
        await em.query(
          'INSERT INTO app_settings (setting_key, value, updated_by) VALUES (?, ?, ?) ON DUPLICATE KEY UPDATE value = VALUES(value), updated_by = VALUES(updated_by)',
          [FIGURE_KEYS[name], String(value), actor.userId],
        )
      }
    }
    await audit(em, actor, 'takeoff.figures.update', 'app_settings', 'takeoff', input)
  })
  return getSiteFigures(ds)
}

export const listRoleItems = (ds: DataSource): Promise<RoleItemRecord[]> => loadRoleItems(ds.manager)

async function checkRoleItem(em: EntityManager, input: RoleItemInput): Promise<{ item: Item; block: Item | null }> {
  if (input.role === 'block') throw AppError.badRequest('The block is the one picked on each wall.', { role: 'The block role is filled by the wall’s block' })
  const item = await em.findOneBy(Item, { id: input.itemId })
  if (!item) throw AppError.badRequest('Choose an existing item.', { itemId: 'No such item' })
  const families = ROLE_FAMILIES[input.role]
  if (!families.includes(item.family)) {
    throw AppError.badRequest(`${item.sku} is a ${item.family} item; this role takes ${families.join(' or ')}.`, { itemId: `Choose a ${families.join(' or ')} item` })
  }
  if (LENGTH_ROLES.includes(input.role) && item.stockUnit !== 'foot' && !input.pieceLengthMm) {
    throw AppError.badRequest('Give the length of one piece.', { pieceLengthMm: 'Needed: the item is not sold by the foot' })
  }
  if (YIELD_ROLES.includes(input.role) && !item.groutYieldMl && !input.yieldMl) {
    throw AppError.badRequest('Give the yield of one bag.', { yieldMl: 'Needed: the item has no yield' })
  }
  const block = input.blockItemId ? await em.findOneBy(Item, { id: input.blockItemId }) : null
  if (input.blockItemId && block?.family !== 'glass_block') throw AppError.badRequest('Choose a glass block.', { blockItemId: 'Not a glass block' })
  return { item, block }
}

const duplicateMapping = () =>
  new AppError(409, 'duplicate', 'A mapping for that role, joint system and block already exists; change it instead.', { role: 'Already mapped for this block and joint system' })

async function writeRoleItem(ds: DataSource, actor: AuditActor, id: number | null, input: RoleItemInput): Promise<RoleItemRecord> {
  try {
    return await inTransaction(ds, async (em) => {
      const { item, block } = await checkRoleItem(em, input)
      const row = id === null ? em.create(MaterialRoleItem, {}) : await em.findOne(MaterialRoleItem, { where: { id }, lock: { mode: 'pessimistic_write' } })
      if (!row) throw AppError.notFound('That mapping')
      Object.assign(row, {
        role: input.role,
        jointKind: input.jointKind,
        blockItemId: input.blockItemId,
        itemId: input.itemId,
        pieceLengthMm: input.pieceLengthMm === null ? null : input.pieceLengthMm.toFixed(2),
        yieldMl: input.yieldMl === null ? null : input.yieldMl.toFixed(2),
        note: input.note,
        updatedBy: actor.userId,
      })
      await em.save(row)
      await audit(em, actor, id === null ? 'takeoff.role-item.create' : 'takeoff.role-item.update', 'material_role_item', row.id, input)
      return roleItemRecord(row, item, block?.sku ?? null)
    })
  } catch (err) {
    if (isDuplicateKey(err)) throw duplicateMapping()
    throw err
  }
}

export const createRoleItem = (ds: DataSource, actor: AuditActor, input: RoleItemInput) => writeRoleItem(ds, actor, null, input)
export const updateRoleItem = (ds: DataSource, actor: AuditActor, id: number, input: RoleItemInput) => writeRoleItem(ds, actor, id, input)

export async function deleteRoleItem(ds: DataSource, actor: AuditActor, id: number): Promise<{ ok: true }> {
  return inTransaction(ds, async (em) => {
    const { affected } = await em.delete(MaterialRoleItem, { id })
    if (!affected) throw AppError.notFound('That mapping')
    await audit(em, actor, 'takeoff.role-item.delete', 'material_role_item', id)
    return { ok: true as const }
  })
}
