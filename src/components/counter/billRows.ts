// One shape for bill lines on screen, whether just computed in the browser or read from a saved bill.
import type { CounterBillLine } from '@shared/counter/counterBill'
import type { BomLineRecord, LineAvailability, StoredExplanation, WarehouseAvailability } from '@shared/schemas/counter'

export interface BillRow {
  key: string
  lineNo: number
  role: string | null
  sku: string | null
  name: string
  qty: number
  unit: string
  packs?: number
  packSize?: number
  madeToOrder: boolean
  itemId: number | null
  issue?: string
  explanation: StoredExplanation | null
}

export function rowsFromBill(lines: CounterBillLine[]): BillRow[] {
  return lines.map((l, i) => ({
    key: `${l.role}|${l.sku ?? i}`,
    lineNo: i + 1,
    role: l.role,
    sku: l.sku,
    name: l.name,
    qty: l.quantity,
    unit: l.unit,
    packs: l.packs,
    packSize: l.packSize,
    madeToOrder: l.madeToOrder,
    itemId: l.itemId,
    issue: l.issue,
    explanation: { ...l.explanation, needed: l.needed, walls: l.walls, packs: l.packs, packSize: l.packSize },
  }))
}

export function rowsFromBom(lines: BomLineRecord[]): BillRow[] {
  return lines.map((l) => ({
    key: String(l.id),
    lineNo: l.lineNo,
    role: l.role,
    sku: l.sku,
    name: l.description,
    qty: l.qty,
    unit: l.unit,
    packs: l.explanation?.packs,
    packSize: l.explanation?.packSize,
    madeToOrder: l.madeToOrder,
    itemId: l.itemId,
    explanation: l.explanation,
  }))
}

/** Every warehouse that appears in the availability answers, in code order. */
export function warehousesOf(availability: Iterable<LineAvailability>): Pick<WarehouseAvailability, 'warehouseId' | 'code' | 'name'>[] {
  const seen = new Map<number, Pick<WarehouseAvailability, 'warehouseId' | 'code' | 'name'>>()
  for (const a of availability) for (const w of a.warehouses) seen.set(w.warehouseId, { warehouseId: w.warehouseId, code: w.code, name: w.name })
  return [...seen.values()].sort((a, b) => a.code.localeCompare(b.code))
}
