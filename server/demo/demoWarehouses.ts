// Demo step "warehouses": three invented sites, their aisle-bay-level storage bins, one receiving
// bin each and the transit bin transfers arrive in.
import { In, type EntityManager } from 'typeorm'
import { Bin } from '../entities/Bin.js'
import { Warehouse } from '../entities/Warehouse.js'
import { TRANSIT_BIN_CODE } from '../services/stock/stockTransfers.js'

export const RECEIVING_BIN_CODE = 'RCV'

export interface DemoSite {
  code: string
  name: string
  address: string
  aisles: string[]
  bays: number
  levels: number
}

export const DEMO_SITES: DemoSite[] = [
  { code: 'HRY', name: 'Harbor Road Yard', address: '2140 Harbor Road, Port Alder', aisles: ['A', 'B', 'C', 'D'], bays: 6, levels: 3 },
  { code: 'MBS', name: 'Millbrook Showroom', address: '88 Millbrook Avenue, Port Alder', aisles: ['A', 'B'], bays: 8, levels: 3 },
  { code: 'EKD', name: 'East Kiln Depot', address: '5 Kiln Lane, Easton Ridge', aisles: ['A', 'B', 'C'], bays: 5, levels: 3 },
]

/** Storage bin codes such as A-01-1 (aisle, two-digit bay, level), in walking order. */
export function storageBinCodes(site: DemoSite): string[] {
  const codes: string[] = []
  for (const aisle of site.aisles) {
    for (let bay = 1; bay <= site.bays; bay++) {
      for (let level = 1; level <= site.levels; level++) codes.push(`${aisle}-${String(bay).padStart(2, '0')}-${level}`)
    }
  }
  return codes
}

export async function loadDemoWarehouses(em: EntityManager): Promise<void> {
  if (await em.existsBy(Warehouse, { code: DEMO_SITES[0].code })) return
  await em.insert(Warehouse, DEMO_SITES.map((s) => ({ code: s.code, name: s.name, address: s.address, aisleOrder: s.aisles.join(','), walkDirection: 'serpentine' as const, active: true })))
  const saved = await em.findBy(Warehouse, { code: In(DEMO_SITES.map((s) => s.code)) })
  const rows: Partial<Bin>[] = []
  for (const site of DEMO_SITES) {
    const warehouseId = saved.find((w) => w.code === site.code)!.id
    rows.push({ warehouseId, code: RECEIVING_BIN_CODE, kind: 'receiving', active: true })
    rows.push({ warehouseId, code: TRANSIT_BIN_CODE, kind: 'transit', active: true })
    for (const code of storageBinCodes(site)) rows.push({ warehouseId, code, kind: 'storage', active: true })
  }
  await em.insert(Bin, rows)
}
