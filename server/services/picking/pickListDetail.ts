// One pick list as the sheet, the handheld and the counter's status page read it: lines in the
// warehouse's walking order with what to scan, handling cautions, who did what and when.
import { In, type EntityManager } from 'typeorm'
import { walkOrder } from '../../../shared/inventory/walkOrder.js'
import { lineHandling } from '../../../shared/picking/handling.js'
import type { ConfirmationView, PickLineView, PickListDetail, Person, ShortReason, StatusStep } from '../../../shared/schemas/picking.js'
import { PickConfirmation, PickList, PickShortage } from '../../entities/PickList.js'
import { User } from '../../entities/User.js'
import { Warehouse } from '../../entities/Warehouse.js'
import { AppError } from '../../errors.js'
import { pickListSummaries } from './pickListSummaries.js'
import { pickTransferViews, shortageViews } from './pickListExtras.js'
import { aisleList, walkConfigOf } from './pickWalk.js'

interface LineRow {
  id: number; bom_line_id: number; item_id: number; sku: string; item_name: string; gtin: string | null; family: string; stock_unit: string
  weight_kg: string; case_qty: number | null; pallet_qty: number | null; bin_id: number; bin_code: string; lot_id: number | null; lot_code: string | null
  qty: number; confirmed_qty: number; short_qty: number; issued_qty: number; sub_sku: string | null; sub_name: string | null
}

async function lineViews(em: EntityManager, listId: number, confirmations: PickConfirmation[]): Promise<PickLineView[]> {
  const rows = (await em.query(
    `SELECT pll.id, pll.bom_line_id, pll.item_id, i.sku, i.name AS item_name, i.gtin, i.family, i.stock_unit, i.weight_kg, i.case_qty, i.pallet_qty,
            pll.bin_id, b.code AS bin_code, pll.lot_id, l.code AS lot_code, pll.qty, pll.confirmed_qty, pll.short_qty, pll.issued_qty,
            si.sku AS sub_sku, si.name AS sub_name
       FROM pick_list_lines pll
       JOIN items i ON i.id = pll.item_id
       JOIN bins b ON b.id = pll.bin_id
       LEFT JOIN lots l ON l.id = pll.lot_id
       LEFT JOIN items si ON si.id = pll.substitute_for_item_id
      WHERE pll.pick_list_id = ?
      ORDER BY pll.id`,
    [listId],
  )) as LineRow[]
  const settled = (await em.query(
    `SELECT ps.pick_list_line_id AS line_id, ps.action, SUM(ps.qty) AS qty, si.sku
       FROM pick_shortages ps LEFT JOIN items si ON si.id = ps.substitute_item_id
      WHERE ps.pick_list_id = ? AND ps.pick_list_line_id IS NOT NULL
      GROUP BY ps.pick_list_line_id, ps.action, si.sku ORDER BY MIN(ps.id)`,
    [listId],
  )) as { line_id: number; action: 'backorder' | 'substitute'; qty: string; sku: string | null }[]
  return rows.map((r) => {
    const qty = Number(r.qty)
    const caseQty = r.case_qty === null ? null : Number(r.case_qty)
    const palletQty = r.pallet_qty === null ? null : Number(r.pallet_qty)
    const reasons = [...new Set(confirmations.filter((c) => c.lineId === Number(r.id) && c.shortReason).map((c) => c.shortReason as ShortReason))]
    const resolutions = settled.filter((x) => Number(x.line_id) === Number(r.id)).map((x) => ({ action: x.action, qty: Number(x.qty), sku: x.sku }))
    return {
      id: Number(r.id), bomLineId: Number(r.bom_line_id), itemId: Number(r.item_id), sku: r.sku, itemName: r.item_name, gtin: r.gtin,
      family: r.family, stockUnit: r.stock_unit, weightKg: String(r.weight_kg), caseQty, palletQty,
      binId: Number(r.bin_id), binCode: r.bin_code, lotId: r.lot_id === null ? null : Number(r.lot_id), lotCode: r.lot_code,
      qty, confirmedQty: Number(r.confirmed_qty), shortQty: Number(r.short_qty), shortReasons: reasons,
      shortResolvedQty: resolutions.reduce((a, x) => a + x.qty, 0), shortResolutions: resolutions,
      remaining: qty - Number(r.confirmed_qty) - Number(r.short_qty), issuedQty: Number(r.issued_qty),
      substituteFor: r.sub_sku ? { sku: r.sub_sku, name: r.sub_name ?? '' } : null,
      cautions: lineHandling({ qty, weightKg: String(r.weight_kg), caseQty, palletQty, family: r.family }).cautions,
    }
  })
}

function history(list: PickList, person: (id: number | null) => Person | null): StatusStep[] {
  const steps: [StatusStep['status'], number | null, Date | null][] = [
    ['draft', list.createdBy, list.createdAt], ['released', list.releasedBy, list.releasedAt], ['picking', list.startedBy, list.startedAt],
    ['picked', list.pickedBy, list.pickedAt], ['cancelled', list.cancelledBy, list.cancelledAt],
  ]
  return steps.filter(([, , at]) => at !== null).map(([status, by, at]) => ({ status, by: person(by), at: at!.toISOString() }))
}

async function people(em: EntityManager, ids: (number | null)[]): Promise<(id: number | null) => Person | null> {
  const wanted = [...new Set(ids.filter((i): i is number => i !== null))]
  const users = wanted.length ? await em.findBy(User, { id: In(wanted) }) : []
  const names = new Map(users.map((u) => [u.id, u.displayName]))
  return (id) => (id === null ? null : { id, name: names.get(id) ?? `#${id}` })
}

export async function pickListDetail(em: EntityManager, id: number): Promise<PickListDetail> {
  const list = await em.findOneBy(PickList, { id })
  if (!list) throw AppError.notFound('pick_list_not_found', 'That pick list was not found.')
  const [summary] = await pickListSummaries(em, { ids: [id], status: 'all' })
  const warehouse = await em.findOneByOrFail(Warehouse, { id: list.warehouseId })
  const confirmations = await em.find(PickConfirmation, { where: { pickListId: id }, order: { id: 'ASC' } })
  const lines = await lineViews(em, id, confirmations)
  const shortages: PickShortage[] = await em.find(PickShortage, { where: { pickListId: id }, order: { id: 'ASC' } })
  const person = await people(em, [list.createdBy, list.releasedBy, list.startedBy, list.pickedBy, list.cancelledBy, ...confirmations.map((c) => c.confirmedBy)])
  const confirmationViews: ConfirmationView[] = confirmations.map((c) => ({
    id: c.id, lineId: c.lineId, qty: c.qty, shortQty: c.shortQty, shortReason: c.shortReason, by: person(c.confirmedBy), at: c.confirmedAt.toISOString(), issued: c.moveId !== null,
  }))
  const config = walkConfigOf(warehouse)
  return {
    ...summary,
    note: list.note,
    lines: walkOrder(lines, config),
    history: history(list, person),
    shortages: await shortageViews(em, shortages),
    transfers: await pickTransferViews(em, id),
    confirmations: confirmationViews,
    walk: { direction: config.direction, aisleOrder: aisleList(warehouse.aisleOrder) },
  }
}
