// Demo step "counter": which demo items fill each material role, a handful of invented contractor
// accounts with jobs, two takeoffs (a curved block shower and a straight basement window) and one
// saved bill, so pick lists and purchasing have something to start from.
import { In, type EntityManager } from 'typeorm'
import type { Takeoff as TakeoffInput } from '../../shared/schemas/takeoff.js'
import { MM_PER_FOOT, MM_PER_INCH } from '../../shared/units.js'
import { Customer, Job } from '../entities/Customer.js'
import { Item } from '../entities/Item.js'
import { MaterialRoleItem } from '../entities/TakeoffSettings.js'
import { User } from '../entities/User.js'
import { writeBomRevision } from '../services/counter/bomService.js'
import { insertTakeoff } from '../services/counter/takeoffService.js'

const IN = MM_PER_INCH

/** Role → SKU for any block; thin units get their own spacers and strips below. */
const GENERAL: { role: string; jointKind: 'spacer' | 'mortar' | null; sku: string; pieceLengthMm?: number }[] = [
  { role: 'spacer', jointKind: 'spacer', sku: 'SP-STD-125' },
  { role: 'arcSpacer', jointKind: 'spacer', sku: 'SP-ARC-STD' },
  { role: 'spacerBase', jointKind: 'spacer', sku: 'SP-BASE-STD' },
  { role: 'sealant', jointKind: null, sku: 'SE-SIL-CLR' },
  { role: 'grout', jointKind: 'spacer', sku: 'GR-JNT-WHT10' },
  { role: 'mortar', jointKind: 'mortar', sku: 'GR-MOR-WHT50' },
  { role: 'screw', jointKind: 'spacer', sku: 'FS-SCR-300' },
  { role: 'panelAnchor', jointKind: 'mortar', sku: 'AN-PNL-24' },
  { role: 'jointReinforcement', jointKind: 'mortar', sku: 'AC-LAD-8FT', pieceLengthMm: 8 * MM_PER_FOOT },
  { role: 'expansionStrip', jointKind: null, sku: 'AC-EXP-0375' },
  { role: 'showerBase', jointKind: null, sku: 'SB-3636-CRV' },
]
const THIN: Record<string, string> = { spacer: 'SP-THN-125', arcSpacer: 'SP-ARC-THN', spacerBase: 'SP-BASE-THN', expansionStrip: 'AC-EXP-0375T' }

function blockMappings(blocks: Item[], bySku: Map<string, Item>): Partial<MaterialRoleItem>[] {
  const rows: Partial<MaterialRoleItem>[] = []
  for (const b of blocks) {
    // The demo's SKUs name the shape: GB-0808-WV-SQ has its end-finish twin GB-0808-WV-EF.
    const twin = (code: string) => bySku.get(b.sku.replace(/-(SQ|RC)(?=-|$)/, `-${code}`))
    const end = twin('EF')
    const twoEdges = twin('DE')
    const corner = twin('CR')
    const angle = twin('AN')
    if (end) rows.push({ role: 'endBlock', jointKind: null, blockItemId: b.id, itemId: end.id })
    if (twoEdges) rows.push({ role: 'doubleEndBlock', jointKind: null, blockItemId: b.id, itemId: twoEdges.id })
    if (corner) rows.push({ role: 'cornerBlock', jointKind: null, blockItemId: b.id, itemId: corner.id })
    if (angle) rows.push({ role: 'angleBlock', jointKind: null, blockItemId: b.id, itemId: angle.id })
    if (b.thicknessClass !== 'thin') continue
    for (const [role, sku] of Object.entries(THIN)) {
      const item = bySku.get(sku)
      if (item) rows.push({ role, jointKind: role === 'expansionStrip' ? null : 'spacer', blockItemId: b.id, itemId: item.id })
    }
  }
  return rows
}

async function loadRoleItems(em: EntityManager): Promise<void> {
  const items = await em.find(Item)
  const bySku = new Map(items.map((i) => [i.sku, i]))
  const rows: Partial<MaterialRoleItem>[] = GENERAL.flatMap((g) => {
    const item = bySku.get(g.sku)
    return item ? [{ role: g.role, jointKind: g.jointKind, blockItemId: null, itemId: item.id, pieceLengthMm: g.pieceLengthMm?.toFixed(2) ?? null }] : []
  })
  const blocks = items.filter((i) => i.family === 'glass_block' && (i.shape === 'square' || i.shape === 'rectangle'))
  rows.push(...blockMappings(blocks, bySku))
  if (rows.length) await em.insert(MaterialRoleItem, rows)
}

const CUSTOMERS: Partial<Customer>[] = [
  { code: 'COPPERLINE', name: 'Copperline Bath & Tile', contactName: 'Dana Whitlock', email: 'dana@copperline.example', phone: '555-0142', address: '410 Foundry Street, Port Alder' },
  { code: 'BROOKMOOR', name: 'Brookmoor Contracting', contactName: 'Luis Ferreira', email: 'office@brookmoor.example', phone: '555-0178', address: '77 Quarry Road, Easton Ridge' },
  { code: 'ALDERCREEK', name: 'Alder Creek Remodeling', contactName: 'Priya Vance', email: 'priya@aldercreek.example', phone: '555-0119', address: '1180 Larkspur Avenue, Port Alder' },
  { code: 'QUILLFEATHER', name: 'Quillfeather Builders', contactName: 'Tomasz Okoro', email: 'jobs@quillfeather.example', phone: '555-0163', address: '9 Saltmarsh Lane, Port Alder' },
]

function showerTakeoff(): TakeoffInput {
  return {
    name: 'Curved shower, primary bath',
    walls: [{
      name: 'Shower wall',
      sizing: 'count',
      courses: 13,
      // Sizes are filled from the catalog by the block SKU when the bill is computed.
      block: { nominal: '6x6', faceWidthMm: 5.75 * IN, faceHeightMm: 5.75 * IN, depthMm: 3.875 * IN, thicknessClass: 'standard', weightKg: 1.77 },
      joint: { kind: 'spacer', jointMm: IN / 8 },
      segments: [{ kind: 'straight', blocks: 3 }, { kind: 'curved', insideRadiusMm: 48 * IN, arcAngleDeg: 90, direction: 'left', closing: 'radius' }],
      freeEnds: { start: false, end: true, top: true },
      exposure: 'interior',
      wetArea: true,
      catalog: { block: { sku: 'GB-0606-WV-SQ', name: 'block', packSize: 1, sellByPack: false } },
    }],
    // The base follows the wall as built: its footprint, curb radius and arc come from the wall's plan.
    showerBase: {
      widthMm: 42 * IN, depthMm: 48 * IN, curb: { radiusMm: 48 * IN, arcDeg: 90 }, drain: { fromLeftMm: 21 * IN, fromBackMm: 24 * IN },
      entry: 'right', curbless: false, wall: 'Shower wall', fit: 'follow',
    },
    looseLines: [{ sku: 'AC-GLV-CUT', name: 'Cut-resistant gloves, pair', quantity: 2, unit: 'each' }],
  }
}

function windowTakeoff(): TakeoffInput {
  return {
    name: 'Basement window',
    walls: [{
      name: 'North window',
      sizing: 'opening',
      // 4 × 3 blocks of 8 in modules with 3/8 in expansion at jambs and head: 32 1/2 × 24 3/8 in
      heightMm: 24.375 * IN,
      block: { nominal: '8x8', faceWidthMm: 7.75 * IN, faceHeightMm: 7.75 * IN, depthMm: 3.875 * IN, thicknessClass: 'standard', weightKg: 2.86 },
      joint: { kind: 'mortar', jointMm: IN / 4 },
      segments: [{ kind: 'straight', lengthMm: 32.5 * IN }],
      freeEnds: { start: false, end: false, top: false },
      exposure: 'exterior',
      wetArea: false,
      designWindPressurePsf: 20,
      catalog: { block: { sku: 'GB-0808-CL-SQ', name: 'block', packSize: 1, sellByPack: false } },
    }],
    looseLines: [],
  }
}

const inDays = (days: number) => new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10)

async function loadAccounts(em: EntityManager): Promise<void> {
  await em.insert(Customer, CUSTOMERS.map((c) => ({ ...c, active: true })))
  const saved = await em.findBy(Customer, { code: In(CUSTOMERS.map((c) => c.code!)) })
  const id = (code: string) => saved.find((c) => c.code === code)!.id
  const counter = await em.findOneBy(User, { username: 'counter' })
  const actor = { userId: counter?.id ?? null }
  const job = async (code: string, name: string, siteAddress: string, status: Job['status'], due: number | null) => {
    const j = em.create(Job, { customerId: id(code), name, siteAddress, status, dueDate: due === null ? null : inDays(due), createdBy: actor.userId })
    return (await em.save(j)).id
  }
  const shower = await job('COPPERLINE', 'Whitlock primary bath, curved shower', '23 Heron Court, Port Alder', 'open', 12)
  const window = await job('ALDERCREEK', 'Vance basement windows', '1180 Larkspur Avenue, Port Alder', 'open', 20)
  await job('BROOKMOOR', 'Brookmoor office partition', '77 Quarry Road, Easton Ridge', 'open', 35)
  await job('QUILLFEATHER', 'Saltmarsh stair light', '9 Saltmarsh Lane, Port Alder', 'complete', null)
  const showerTakeoffRow = await insertTakeoff(em, actor, shower, 'Curved shower, primary bath', showerTakeoff())
  await insertTakeoff(em, actor, window, 'Basement window', windowTakeoff())
  await writeBomRevision(em, actor, shower, { takeoffId: showerTakeoffRow.id }, 'in')
}

export async function loadDemoCounter(em: EntityManager): Promise<void> {
  if (await em.existsBy(Customer, { code: CUSTOMERS[0].code! })) return
  if (!(await em.existsBy(MaterialRoleItem, {}))) await loadRoleItems(em)
  await loadAccounts(em)
}
