// The reorder figures of every stock line, or of a few. The heavy part is ONE usage aggregate in MariaDB. Beside
// it run the small per-row queries; the ABC classes are worked out from the aggregate's window sums (a few
// lines: from a cheaper per-line total of every line, read beside it), then the per-line math.
import type { DataSource, EntityManager } from 'typeorm'
import type { AbcClass, AbcCutoffs, AbcResult } from '../../../shared/inventory/abc.js'
import type { Money } from '../../../shared/money.js'
import type { LeadTimeFigures } from '../../../shared/schemas/reorder.js'
import { classifyItems, lineAnnualValue, type LineValue } from './abcClasses.js'
import { leadTimeFor, observedLeadTimes } from './leadTimes.js'
import { loadLineFacts, type LineFacts } from './lineFacts.js'
import { computeLine, lineUnitCost, type ComputedLine, type PreparedLine } from './lineComputation.js'
import { effectivePolicy, globalSettings, loadPolicyLayers, type EffectivePolicy, type PolicyLayers } from './policyLayers.js'
import { assertPackable, idleBeforeWindow, lineKey, usageSums, usageTotals, type UsageSums } from './usageQueries.js'
import { usageWindow, type WindowBounds } from './usageWindow.js'

export interface ReorderLinesOptions {
  windowDays?: number
  /** Only these lines (the ABC classes still come from every line). */
  only?: ReadonlyArray<{ itemId: number; warehouseId: number }>
  /** Write out the demand step and extra inputs (one line's drawer, accepting); the list leaves them out. */
  explain?: boolean
}

export interface ComputedLines {
  window: WindowBounds
  cutoffs: AbcCutoffs
  abc: AbcResult
  lines: Array<ComputedLine & { effective: EffectivePolicy; leadTime: LeadTimeFigures }>
}

interface Valued { abc: AbcResult; values: Map<string, Money> }

// 'item:warehouse' → its ids without the two arrays split + map make for every line.
const itemOfKey = (key: string) => Number(key.slice(0, key.indexOf(':')))
const warehouseOfKey = (key: string) => Number(key.slice(key.indexOf(':') + 1))

/** A line counts only for an active, stocked item in an active warehouse. */
function isLive(facts: LineFacts, key: string): boolean {
  return facts.items.has(itemOfKey(key)) && facts.warehouses.has(warehouseOfKey(key))
}

/** Every line worth a look: anything with stock, usage, a cost record or something on order or pending. */
function lineKeys(facts: LineFacts, usage: Map<string, unknown>): string[] {
  const keys = new Set<string>()
  for (const source of [facts.stock, facts.avgCost, usage, facts.onOrder, facts.pending]) for (const k of source.keys()) keys.add(k)
  return [...keys].filter((k) => isLive(facts, k))
}

function unitCostOf(facts: LineFacts, key: string, itemId: number) {
  return lineUnitCost(facts.avgCost.get(key), facts.vendorOf.get(itemId), facts.items.get(itemId)!)
}

/** Each line's annual usage value (kept for the lines) and the items' ABC classes from them. */
function valueLines(facts: LineFacts, windowQty: Map<string, number>, window: WindowBounds, cutoffs: AbcCutoffs): Valued {
  const lines: LineValue[] = []
  const values = new Map<string, Money>()
  for (const key of lineKeys(facts, windowQty)) {
    const itemId = itemOfKey(key)
    const qty = windowQty.get(key) ?? 0
    const annualValue = qty > 0 ? lineAnnualValue(qty, window.days, unitCostOf(facts, key, itemId)) : '0.00'
    values.set(key, annualValue)
    lines.push({ itemId, annualValue })
  }
  return { abc: classifyItems(lines, cutoffs), values }
}

/**
 * Each line's net use over the window, from the usage aggregate: the same figure usageTotals reads. A line
 * used only before the window comes in the aggregate with nothing in the window and is left out, as there.
 */
function windowTotals(usage: Map<string, UsageSums>): Map<string, number> {
  const totals = new Map<string, number>()
  for (const [key, u] of usage) if (u.sum !== 0 || u.daysWithUse > 0) totals.set(key, u.sum)
  return totals
}

/** A line with no use in the window (its last use, if any, comes from before it). */
const noUse = (key: string): UsageSums => ({
  itemId: itemOfKey(key), warehouseId: warehouseOfKey(key), sum: 0, sumSquares: 0, daysWithUse: 0, firstHalfSum: 0, secondHalfSum: 0, idleDays: null,
})

function settingsAndWindow(layers: PolicyLayers, windowDays?: number) {
  const settings = globalSettings(layers, windowDays)
  return { settings, window: usageWindow(settings.windowDays) }
}

/** The ABC classes alone (for the Pareto chart): the per-line totals, no daily split. */
export async function computeAbc(ds: DataSource, windowDays?: number): Promise<{ window: WindowBounds; cutoffs: AbcCutoffs; abc: AbcResult }> {
  const { settings, window } = settingsAndWindow(await loadPolicyLayers(ds.manager), windowDays)
  const [totals, facts] = await Promise.all([usageTotals(ds.manager, window), loadLineFacts(ds.manager)])
  return { window, cutoffs: settings.cutoffs, abc: valueLines(facts, totals, window, settings.cutoffs).abc }
}

interface Context {
  layers: PolicyLayers
  facts: LineFacts
  valued: Valued
  classOf: Map<number, AbcClass>
  observed: Map<string, number[]>
  baseCache: Map<string, EffectivePolicy>
}

function prepareLine(key: string, c: Context): PreparedLine {
  const itemId = itemOfKey(key)
  const warehouseId = warehouseOfKey(key)
  const { facts } = c
  const item = facts.items.get(itemId)!
  const vendor = facts.vendorOf.get(itemId)
  const abcClass: AbcClass = c.classOf.get(itemId) ?? 'C'
  const leadTime = leadTimeFor(vendor, c.observed)
  return {
    key, item, warehouse: facts.warehouses.get(warehouseId)!, vendor, abcClass, leadTime,
    stock: facts.stock.get(key) ?? { onHand: 0, reserved: 0 }, onOrder: facts.onOrder.get(key) ?? 0,
    pending: facts.pending.get(key), unitCost: unitCostOf(facts, key, itemId), annualValue: c.valued.values.get(key) ?? '0.00',
    effective: effectivePolicy(c.layers, { family: item.family, abcClass, key }, leadTime, c.baseCache),
  }
}

/**
 * Starts the usage aggregate and, while it runs, loads everything else, works out the ABC classes and prepares
 * every line it can; once the aggregate is in, only lines seen in it alone are prepared.
 */
async function gather(em: EntityManager, layers: PolicyLayers, opts: ReorderLinesOptions) {
  const { settings, window } = settingsAndWindow(layers, opts.windowDays)
  const itemIds = opts.only ? [...new Set(opts.only.map((l) => l.itemId))] : undefined
  const wanted = opts.only ? new Set(opts.only.map((l) => lineKey(l.itemId, l.warehouseId))) : null
  // The aggregate reads the window alone, as the statistics do; the last use of a line quiet in the window is
  // looked for further back on its own (idleBeforeWindow), once the window's quiet lines are known.
  const aggregate = usageSums(em, window, itemIds)
  const factsLoaded = loadLineFacts(em)
  // The whole list takes each line's window use from the usage aggregate itself: a second scan of the window's
  // moves beside it (to start the ABC classes early) cost more on a two-core machine than it saved, 3× the
  // hand-written aggregate on the demo data (npm run bench -- --only=reorder). A few lines still need the
  // classes from every line, so they read the cheap per-line totals of the whole window.
  const totalsLoaded = opts.only ? usageTotals(em, window) : aggregate.then(windowTotals)
  const [facts, totals, observed] = await Promise.all([factsLoaded, totalsLoaded, observedLeadTimes(em, itemIds)])
  assertPackable(facts.warehouses.keys())
  const valued = valueLines(facts, totals, window, settings.cutoffs)
  const context: Context = {
    layers, facts, valued, observed, baseCache: new Map(), classOf: new Map(valued.abc.items.map((i) => [Number(i.id), i.abcClass])),
  }
  const prepared = new Map<string, PreparedLine>()
  const take = (k: string) => (!wanted || wanted.has(k)) && !prepared.has(k)
  const keys = lineKeys(facts, totals)
  for (const key of keys) if (take(key)) prepared.set(key, prepareLine(key, context))
  const usage = await aggregate
  const quiet = [...new Set([...keys, ...usage.keys()])]
    .filter((k) => (!wanted || wanted.has(k)) && isLive(facts, k) && (usage.get(k)?.idleDays ?? null) === null)
  for (const [key, idleDays] of await idleBeforeWindow(em, window, settings.lookbackDays, quiet)) {
    const u = usage.get(key)
    if (u) u.idleDays = idleDays
    else usage.set(key, { ...noUse(key), idleDays })
  }
  for (const key of usage.keys()) if (take(key) && isLive(facts, key)) prepared.set(key, prepareLine(key, context))
  return { settings, window, usage, prepared, abc: valued.abc }
}

export async function computeReorderLines(ds: DataSource, opts: ReorderLinesOptions = {}): Promise<ComputedLines> {
  const layers = await loadPolicyLayers(ds.manager)
  const { settings, window, usage, prepared, abc } = await gather(ds.manager, layers, opts)
  const lines: ComputedLines['lines'] = []
  for (const p of prepared.values()) {
    // Extended in place, not spread: a spread would read (and so write out) a lazy explanation.
    const computed = computeLine(p, usage.get(p.key), window, settings.lookbackDays, opts.explain ?? false)
    lines.push(Object.assign(computed, { effective: p.effective, leadTime: p.leadTime }))
  }
  return { window, cutoffs: settings.cutoffs, abc, lines }
}
