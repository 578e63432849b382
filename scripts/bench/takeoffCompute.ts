// npm run bench, takeoff part: the compute endpoint's work for a 200-wall job (target under 50 ms in Node),
// the lean bill the server answers, and beside it the full layout with drawings that a saved bill keeps.
// Pure computation, no database: the catalog is built in memory. The job is invented: fifty flats of a
// Brightcourse Glass Supply customer, each with a curved shower, a hall partition and two windows.
import { mkdirSync, writeFileSync } from 'node:fs'
import os from 'node:os'
import path from 'node:path'
import { pathToFileURL } from 'node:url'
import { computeCounterBill } from '../../shared/counter/counterBill.js'
import type { BlockOption, CounterCatalog, RoleItemRecord } from '../../shared/schemas/counter.js'
import { takeoffSchema, type MaterialRole, type Takeoff, type Wall } from '../../shared/schemas/takeoff.js'
import { defaultMaterialRules, defaultWastePct } from '../../shared/takeoff/materials.js'
import { DEFAULT_SITE_FIGURES } from '../../shared/takeoff/siteFigures.js'
import { MM_PER_INCH } from '../../shared/units.js'

const IN = MM_PER_INCH
const TARGET_MS = 50
const WARM_UP = 40
const RUNS = 30

function block(itemId: number, sku: string, nominal: string, faceIn: number, weightKg: number): BlockOption {
  return {
    itemId, sku, name: `${nominal} clear block`, nominal,
    faceWidthMm: faceIn * IN, faceHeightMm: faceIn * IN, depthMm: 3.875 * IN, thicknessClass: 'standard', weightKg,
    pattern: 'clear', shape: 'square', item: { sku, name: `${nominal} clear block`, unit: 'each', packSize: 8, sellByPack: true },
  }
}

function supply(id: number, role: MaterialRole, extra: Partial<RoleItemRecord['item']> = {}): RoleItemRecord {
  const sku = `BN-${role.toUpperCase()}`
  return {
    id, role, jointKind: null, blockItemId: null, blockSku: null, itemId: id, pieceLengthMm: null, yieldMl: null, note: null,
    item: { itemId: id, sku, name: sku, unit: 'each', packSize: 1, sellByPack: false, madeToOrder: role === 'showerBase', active: true, ...extra },
  }
}

function catalog(): CounterCatalog {
  const roles: [MaterialRole, Partial<RoleItemRecord['item']>][] = [
    ['endBlock', {}], ['doubleEndBlock', {}], ['cornerBlock', {}], ['spacer', { packSize: 100, sellByPack: true }],
    ['arcSpacer', { packSize: 50, sellByPack: true }], ['spacerBase', { pieceLengthMm: 48 * IN }], ['sealant', { cartridgeMl: 298.69 }],
    ['grout', { groutYieldMl: 3000 }], ['mortar', { mortarYieldMl: 12_000 }], ['screw', { packSize: 100, sellByPack: true }],
    ['panelAnchor', {}], ['jointReinforcement', { pieceLengthMm: 96 * IN }], ['expansionStrip', { pieceLengthMm: 48 * IN }], ['showerBase', {}],
  ]
  return {
    blocks: [block(1, 'BN-0808', '8x8', 7.75, 2.86), block(2, 'BN-0606', '6x6', 5.75, 1.77)],
    roleItems: roles.map(([role, extra], i) => supply(100 + i, role, extra)),
    rules: defaultMaterialRules,
    wastePct: defaultWastePct,
    figures: DEFAULT_SITE_FIGURES,
    looseItems: [],
  }
}

const sku = (s: string) => ({ block: { sku: s, name: s, packSize: 1, sellByPack: false } })
const typed8 = { nominal: '8x8', faceWidthMm: 7.75 * IN, faceHeightMm: 7.75 * IN, depthMm: 3.875 * IN, thicknessClass: 'standard' as const, weightKg: 2.86 }

/** One flat's four walls, a little different from flat to flat. */
function flat(n: number): Wall[] {
  const spacer = { kind: 'spacer' as const, jointMm: IN / 8 }
  const mortar = { kind: 'mortar' as const, jointMm: IN / 4 }
  const base = { exposure: 'interior' as const, wetArea: false, block: typed8 }
  return [
    {
      ...base, name: `Flat ${n} shower`, sizing: 'count', courses: 12 + (n % 3), joint: spacer, catalog: sku('BN-0606'), wetArea: true,
      block: { ...typed8, nominal: '6x6', faceWidthMm: 5.75 * IN, faceHeightMm: 5.75 * IN },
      segments: [{ kind: 'straight', blocks: 2 + (n % 3) }, { kind: 'curved', insideRadiusMm: (44 + (n % 9)) * IN, arcAngleDeg: 90, direction: 'left', closing: 'radius' }],
      freeEnds: { start: false, end: true, top: true },
    },
    {
      ...base, name: `Flat ${n} hall partition`, sizing: 'opening', heightMm: (78 + (n % 6)) * IN, joint: spacer, catalog: sku('BN-0808'),
      segments: [{ kind: 'straight', lengthMm: (48 + (n % 24)) * IN }], freeEnds: { start: false, end: true, top: true },
    },
    {
      ...base, name: `Flat ${n} bath window`, sizing: 'opening', heightMm: 24.375 * IN, joint: mortar, catalog: sku('BN-0808'), exposure: 'exterior',
      designWindPressurePsf: 20, segments: [{ kind: 'straight', lengthMm: 32.5 * IN }], freeEnds: { start: false, end: false, top: false },
    },
    {
      ...base, name: `Flat ${n} stair window`, sizing: 'count', courses: 5 + (n % 4), joint: mortar, catalog: sku('BN-0808'), exposure: 'exterior',
      designWindPressurePsf: 20, segments: [{ kind: 'straight', blocks: 4 + (n % 5) }], freeEnds: { start: false, end: false, top: false },
    },
  ]
}

function job(): Takeoff {
  return takeoffSchema.parse({ name: 'Fifty flats', walls: Array.from({ length: 50 }, (_, i) => flat(i + 1)).flat(), looseLines: [] })
}

function measure(run: () => void): ComputeTimes {
  for (let i = 0; i < WARM_UP; i++) run()
  const wall: number[] = []
  const cpu: number[] = []
  for (let i = 0; i < RUNS; i++) {
    const c = process.cpuUsage()
    const t = process.hrtime.bigint()
    run()
    wall.push(Number(process.hrtime.bigint() - t) / 1e6)
    const d = process.cpuUsage(c)
    cpu.push((d.user + d.system) / 1000)
  }
  const at = (list: number[], q: number) => [...list].sort((a, b) => a - b)[Math.min(list.length - 1, Math.floor(q * list.length))]
  return { medianMs: at(wall, 0.5), p95Ms: at(wall, 0.95), cpuMedianMs: at(cpu, 0.5) }
}

export interface ComputeTimes { medianMs: number; p95Ms: number; cpuMedianMs: number }
export interface ComputeMeasure { walls: number; blocks: number; lines: number; lean: ComputeTimes; full: ComputeTimes; targetMs: number }

/** The 200-wall job computed lean (the compute endpoint) and full (a saved bill), in this process. */
export function measureTakeoffCompute(): ComputeMeasure {
  const takeoff = job()
  const cat = catalog()
  const probe = computeCounterBill(takeoff, cat, 'in', 'lean')
  const lean = measure(() => computeCounterBill(takeoff, cat, 'in', 'lean'))
  const full = measure(() => computeCounterBill(takeoff, cat, 'in', 'full'))
  return { walls: takeoff.walls.length, blocks: probe.totals.blocksNeeded, lines: probe.lines.length, lean, full, targetMs: TARGET_MS }
}

// Run by itself (tsx scripts/bench/takeoffCompute.ts): print the figures and keep them beside the other results.
if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  const m = measureTakeoffCompute()
  const fmt = (r: ComputeTimes) => `median ${r.medianMs.toFixed(1)} ms, p95 ${r.p95Ms.toFixed(1)} ms, CPU ${r.cpuMedianMs.toFixed(1)} ms`
  const machine = `${os.cpus()[0]?.model ?? 'cpu'} × ${os.cpus().length}, Node ${process.version}, load average ${os.loadavg().map((l) => l.toFixed(2)).join(' ')}`
  console.log(`takeoff compute, ${m.walls} walls, ${m.blocks} blocks, ${m.lines} bill lines (${RUNS} runs after ${WARM_UP} to warm up)`)
  console.log(`  lean (the compute endpoint): ${fmt(m.lean)} — target under ${TARGET_MS} ms: ${m.lean.medianMs < TARGET_MS ? 'met' : 'NOT met'}`)
  console.log(`  full (a saved bill, with layouts and drawings): ${fmt(m.full)}`)
  console.log(`  ${machine}`)
  const out = path.resolve(import.meta.dirname, '..', '..', '.data', 'bench')
  mkdirSync(out, { recursive: true })
  writeFileSync(path.join(out, 'takeoff-compute.json'), JSON.stringify({ measure: 'takeoff compute, 200-wall job', ...m, machine, at: new Date().toISOString() }, null, 2))
}
