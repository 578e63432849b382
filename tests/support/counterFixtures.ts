// Counter test fixtures: a test glass block and its supplies written straight into the items table
// (the catalog APIs are another feature's), each role mapped to them for that block only, so a test's
// numbers never depend on the demo catalog.
import bcrypt from 'bcryptjs'
import type { DataSource } from 'typeorm'
import { User } from '../../server/entities/User.js'
import type { Takeoff } from '../../shared/schemas/takeoff.js'
import { MM_PER_INCH } from '../../shared/units.js'
import { TEST_PASSWORD } from './apiHarness.js'
import { insertId, tagOf } from './fixtureRows.js'
import { TEST_HASH_COST } from './testHashCost.js'

export const IN = MM_PER_INCH // NIST SP 811: 1 in = 25.4 mm exactly

export interface CounterFixture {
  tag: string
  blockId: number
  blockSku: string
  items: Record<string, { id: number; sku: string }>
}

interface ItemSpec { role: string; family: string; unit: string; caseQty?: number; sellByPack?: boolean; extra?: Record<string, string | number | boolean> }

// 8x8 nominal block: face 7 3/4 in (nominal − 1/4 in, common practice), depth 3 7/8 in (IRC 2021 R607.3
// standard unit); 2.86 kg is a test weight. 10.1 fl oz tube = 298.69 mL (NIST SP 811 factor).
const SUPPLIES: ItemSpec[] = [
  { role: 'endBlock', family: 'glass_block', unit: 'each', extra: { shape: 'end_finish' } },
  { role: 'cornerBlock', family: 'glass_block', unit: 'each', extra: { shape: 'corner' } },
  { role: 'spacer', family: 'spacer', unit: 'each', caseQty: 100, sellByPack: true },
  { role: 'arcSpacer', family: 'arc_spacer', unit: 'each', caseQty: 50, sellByPack: true },
  { role: 'spacerBase', family: 'spacer', unit: 'foot' },
  { role: 'sealant', family: 'sealant', unit: 'tube', extra: { cartridge_ml: 298.69 } },
  { role: 'grout', family: 'grout', unit: 'bag', extra: { grout_yield_ml: 3000 } },
  { role: 'mortar', family: 'grout', unit: 'bag', extra: { grout_yield_ml: 12000 } },
  { role: 'screw', family: 'fastener', unit: 'each', caseQty: 100, sellByPack: true },
  { role: 'panelAnchor', family: 'anchor', unit: 'each' },
  { role: 'jointReinforcement', family: 'accessory', unit: 'piece' },
  { role: 'expansionStrip', family: 'accessory', unit: 'foot' },
  { role: 'showerBase', family: 'shower_base', unit: 'each', extra: { made_to_order: true } },
  { role: 'doubleEndBlock', family: 'glass_block', unit: 'each', extra: { shape: 'double_end_finish' } },
  { role: 'angleBlock', family: 'glass_block', unit: 'each', extra: { shape: 'angle_45' } },
]

async function insertItem(ds: DataSource, sku: string, spec: ItemSpec): Promise<number> {
  const cols: Record<string, unknown> = {
    sku, name: `Test ${spec.role} ${sku}`, family: spec.family, stock_unit: spec.unit, case_qty: spec.caseQty ?? null,
    sell_by_pack: spec.sellByPack ?? false, cost: 1, ...spec.extra,
  }
  const keys = Object.keys(cols)
  const id = await insertId(ds, `INSERT INTO items (${keys.join(', ')}) VALUES (${keys.map(() => '?').join(', ')})`, Object.values(cols))
  // Blocks come in production lots; two each keep the demo scenario's "several lots per block" check true.
  if (spec.family === 'glass_block') {
    for (const code of ['L1', 'L2']) await ds.query('INSERT INTO lots (item_id, code, received_at) VALUES (?, ?, CURRENT_DATE)', [id, code])
  }
  return id
}

export async function createCounterFixture(ds: DataSource): Promise<CounterFixture> {
  const tag = tagOf()
  const blockSku = `CTB-${tag}`
  const blockId = await insertItem(ds, blockSku, {
    role: 'block', family: 'glass_block', unit: 'each', caseQty: 8, sellByPack: true,
    extra: { nominal_size: '8x8', face_width_mm: 7.75 * IN, face_height_mm: 7.75 * IN, depth_mm: 3.875 * IN, thickness_class: 'standard', weight_kg: 2.86, shape: 'square' },
  })
  const items: CounterFixture['items'] = { block: { id: blockId, sku: blockSku } }
  for (const [i, spec] of SUPPLIES.entries()) {
    const sku = `CT${i}${spec.role.slice(0, 4).toUpperCase()}-${tag}`
    const id = await insertItem(ds, sku, spec)
    items[spec.role] = { id, sku }
    const pieceLength = spec.role === 'jointReinforcement' ? 120 * IN : null // a 10 ft ladder piece
    await ds.query('INSERT INTO material_role_items (role, joint_kind, block_item_id, item_id, piece_length_mm) VALUES (?, NULL, ?, ?, ?)', [spec.role, blockId, id, pieceLength])
  }
  return { tag, blockId, blockSku, items }
}

/** A straight spacer wall in a 6 ft × 7 ft opening, tied to the fixture's block by SKU. */
export function openingTakeoff(fx: CounterFixture, over: Partial<Takeoff['walls'][number]> = {}): Takeoff {
  return {
    name: `Test ${fx.tag}`,
    walls: [{
      name: 'Hall window',
      sizing: 'opening',
      heightMm: 84 * IN,
      block: { nominal: '8x8', faceWidthMm: 190, faceHeightMm: 190, depthMm: 98, thicknessClass: 'standard', weightKg: 2 },
      joint: { kind: 'spacer', jointMm: IN / 8 },
      segments: [{ kind: 'straight', lengthMm: 72 * IN }],
      freeEnds: { start: false, end: false, top: false },
      exposure: 'interior',
      wetArea: false,
      catalog: { block: { sku: fx.blockSku, name: 'block', packSize: 1, sellByPack: false } },
      ...over,
    }],
    looseLines: [],
  }
}

export async function createCustomerAndJob(ds: DataSource, tag: string): Promise<{ customerId: number; jobId: number }> {
  const customerId = await insertId(ds, 'INSERT INTO customers (code, name) VALUES (?, ?)', [`CT${tag}`, `Test account ${tag}`])
  const jobId = await insertId(ds, 'INSERT INTO jobs (customer_id, name) VALUES (?, ?)', [customerId, `Test job ${tag}`])
  return { customerId, jobId }
}

/** The Spanish-speaking counter clerk a browser test signs in as (password TEST_PASSWORD), made once per database. */
export async function spanishCounterClerk(ds: DataSource): Promise<string> {
  const username = 't-counter-es'
  const users = ds.getRepository(User)
  if (!(await users.existsBy({ username }))) {
    await users.save(users.create({ username, displayName: 'Test mostrador', roles: ['counter'], locale: 'es', active: true, passwordHash: await bcrypt.hash(TEST_PASSWORD, TEST_HASH_COST) }))
  }
  return username
}
