// Feature: binding a takeoff to the yard's catalog (shared/counter/counterBill.ts): which item fills each
// role for a wall, block sizes from the catalog, and what keeps a bill from being saved.
import { describe, expect, it } from 'vitest'
import { computeCounterBill, resolveWallCatalog, saveBlockers } from '../../shared/counter/counterBill.js'
import type { BlockOption, CounterCatalog, RoleItemRecord } from '../../shared/schemas/counter.js'
import type { Takeoff } from '../../shared/schemas/takeoff.js'
import { DEFAULT_SITE_FIGURES } from '../../shared/takeoff/siteFigures.js'

const IN = 25.4 // NIST SP 811: 1 in = 25.4 mm exactly

const block: BlockOption = {
  itemId: 1, sku: 'B8', name: '8x8 block', nominal: '8x8',
  // face 7 3/4 in = nominal − 1/4 in (common practice); depth 3 7/8 in (IRC 2021 R607.3 standard unit)
  faceWidthMm: 7.75 * IN, faceHeightMm: 7.75 * IN, depthMm: 3.875 * IN, thicknessClass: 'standard', weightKg: 2.9,
  pattern: 'clear', shape: 'square', item: { sku: 'B8', name: '8x8 block', unit: 'each', packSize: 8, sellByPack: true },
}

let nextId = 100
function row(role: RoleItemRecord['role'], sku: string, over: Partial<RoleItemRecord> = {}): RoleItemRecord {
  const id = nextId++
  return {
    id, role, jointKind: null, blockItemId: null, blockSku: null, itemId: id, pieceLengthMm: null, yieldMl: null, note: null,
    item: { itemId: id, sku, name: sku, unit: 'each', packSize: 1, sellByPack: false, madeToOrder: false, active: true },
    ...over,
  }
}

describe('resolveWallCatalog: the most specific mapping wins', () => {
  const rows = [
    row('sealant', 'SEAL-ANY'),
    row('sealant', 'SEAL-SPACER', { jointKind: 'spacer' }),
    row('sealant', 'SEAL-B8', { blockItemId: 1 }),
    row('spacer', 'SP-ANY'),
    row('spacer', 'SP-OFF', { blockItemId: 1, jointKind: 'spacer', item: { ...row('spacer', 'x').item, sku: 'SP-OFF', active: false } }),
    row('grout', 'GR-MORTAR-ONLY', { jointKind: 'mortar' }),
  ]

  it('one block beats one joint system beats any; an inactive item never fills a role', () => {
    const map = resolveWallCatalog(rows, block, 'spacer')
    expect(map.sealant?.sku).toBe('SEAL-B8')
    expect(map.spacer?.sku).toBe('SP-ANY')
    expect(map.grout).toBeUndefined()
    expect(map.block?.sku).toBe('B8')
    expect(resolveWallCatalog(rows, undefined, 'spacer').sealant?.sku).toBe('SEAL-SPACER')
    expect(resolveWallCatalog(rows, undefined, 'mortar').sealant?.sku).toBe('SEAL-ANY')
  })
})

describe('computeCounterBill', () => {
  const catalog: CounterCatalog = {
    blocks: [block],
    roleItems: [row('expansionStrip', 'STRIP', { pieceLengthMm: 48 * IN, item: { ...row('expansionStrip', 'x').item, sku: 'STRIP', pieceLengthMm: 48 * IN } })],
    rules: [
      { id: 'blocks', role: 'block', family: 'block', method: 'count', systems: ['spacer', 'mortar'], terms: [{ measure: 'standardBlocks', rate: 1 }], note: 'test', source: 'test' },
    ],
    wastePct: { block: 0 },
    figures: DEFAULT_SITE_FIGURES,
    looseItems: [{ itemId: 9, sku: 'GLOVES', name: 'Gloves', unit: 'each', family: 'accessory', madeToOrder: false }],
  }
  const takeoff = (extra: Partial<Takeoff> = {}): Takeoff => ({
    walls: [{
      name: 'W', sizing: 'count', courses: 4,
      block: { nominal: 'typed', faceWidthMm: 100, faceHeightMm: 100, depthMm: 100, thicknessClass: 'standard', weightKg: 1 },
      joint: { kind: 'spacer', jointMm: IN / 8 }, segments: [{ kind: 'straight', blocks: 5 }],
      freeEnds: { start: false, end: false, top: false }, exposure: 'interior', wetArea: false,
      catalog: { block: { sku: 'B8', name: 'x', packSize: 1, sellByPack: false } },
    }],
    looseLines: [],
    ...extra,
  })

  it('lays the wall out in the catalog block and uses the admin’s rules and waste', () => {
    const bill = computeCounterBill(takeoff(), catalog, 'in')
    const wall = bill.walls[0]
    expect(wall.status).toBe('ok')
    // 5 × (7 3/4 + 1/8) − 1/8 = 39.25 in: the catalog face, not the typed 100 mm (common practice panel rule).
    if (wall.status === 'ok') expect(wall.geometry.panelWidthMm).toBeCloseTo(39.25 * IN, 6)
    // Only the admin's one rule runs: 20 blocks, 0 % waste, packs of 8 → 3 packs = 24.
    expect(bill.lines.map((l) => [l.role, l.quantity, l.itemId])).toEqual([['block', 24, 1]])
    expect(saveBlockers(bill)).toEqual([])
  })

  it('a loose line with an unknown SKU is flagged, shown as a caution and blocks saving', () => {
    const bill = computeCounterBill(takeoff({ looseLines: [{ sku: 'NOPE', name: 'Nope', quantity: 1, unit: 'each' }, { sku: 'GLOVES', name: 'Gloves', quantity: 2, unit: 'pair' }] }), catalog, 'in')
    const [nope, gloves] = bill.lines.filter((l) => l.role === 'loose')
    expect(nope.issue).toMatch(/NOPE/)
    expect(gloves).toMatchObject({ itemId: 9, unit: 'each' })
    expect(bill.cautions.some((c) => c.message.includes('NOPE'))).toBe(true)
    expect(bill.cautions[bill.cautions.length - 1].message).toMatch(/local building codes/)
    expect(saveBlockers(bill).join(' ')).toMatch(/NOPE/)
  })

  it('an unknown block SKU is a caution and leaves the block role unmapped', () => {
    const t = takeoff()
    t.walls[0].catalog = { block: { sku: 'GONE', name: 'x', packSize: 1, sellByPack: false } }
    const bill = computeCounterBill(t, catalog, 'in')
    expect(bill.cautions[0].message).toMatch(/GONE/)
    expect(bill.lines[0].issue).toMatch(/No catalog item/)
  })
})
