// One stock line's figures: demand statistics from the SQL sums, the merged policy, and the shared reorder
// math (reorderSuggestion) with its working, plus the demand step written out with the line's own numbers.
import type { AbcClass } from '../../../shared/inventory/abc.js'
import { Working } from '../../../shared/inventory/reorderWords.js'
import { dateOfDayNumber, statsFromSums } from '../../../shared/inventory/demand.js'
import { reorderSuggestion, type Explanation, type ReorderResult } from '../../../shared/inventory/reorder.js'
import type { Money } from '../../../shared/money.js'
import type { LeadTimeFigures, ReorderLine, UsageFigures } from '../../../shared/schemas/reorder.js'
import { annualQuantity } from './abcClasses.js'
import type { ItemFacts, PendingFacts, VendorTermsRow, WarehouseFacts } from './lineFacts.js'
import type { EffectivePolicy } from './policyLayers.js'
import type { UsageSums } from './usageQueries.js'
import type { WindowBounds } from './usageWindow.js'

/** Everything about a line but its usage: prepared while the usage aggregate still runs. */
export interface PreparedLine {
  key: string
  item: ItemFacts
  warehouse: WarehouseFacts
  stock: { onHand: number; reserved: number }
  onOrder: number
  pending: PendingFacts | undefined
  vendor: VendorTermsRow | undefined
  unitCost: Money
  /** Annual usage value, worked out once with the ABC classes. */
  annualValue: Money
  abcClass: AbcClass
  leadTime: LeadTimeFigures
  effective: EffectivePolicy
}

export interface ComputedLine {
  line: ReorderLine
  usage: UsageFigures
  explanation: Explanation
}

const fmt = (x: number) => (Number.isInteger(x) ? String(x) : x.toFixed(2))
const round = (x: number, places = 4) => Math.round(x * 10 ** places) / 10 ** places

/** Unit cost C: the warehouse's moving average, else the vendor's price, else the item's standard cost. */
export function lineUnitCost(avgCost: string | undefined, vendor: VendorTermsRow | undefined, item: ItemFacts): Money {
  if (avgCost !== undefined && Number(avgCost) > 0) return avgCost
  if (vendor && Number(vendor.unitCost) > 0) return vendor.unitCost
  return item.cost
}

function demandSteps(u: UsageFigures, days: number, mean: number, sd: number): Working {
  const working = new Working()
  working.add('demandMean', { sum: fmt(u.sum), days, mean: fmt(mean), withUse: u.daysWithUse })
  working.add('demandSd', { sumSquares: fmt(u.sumSquares), sum: fmt(u.sum), days, daysLess: days - 1, sd: fmt(sd) })
  return working
}

export function computeLine(
  input: PreparedLine,
  usage: UsageSums | undefined,
  window: WindowBounds,
  lookbackDays: number,
  explain: boolean,
): ComputedLine {
  const { stock, vendor, effective } = input
  const sums = { sum: usage?.sum ?? 0, sumSquares: usage?.sumSquares ?? 0 }
  const stats = statsFromSums({ days: window.days, ...sums })
  const idle = usage?.idleDays ?? null
  const figures: UsageFigures = {
    ...sums,
    daysWithUse: usage?.daysWithUse ?? 0,
    firstHalfMean: (usage?.firstHalfSum ?? 0) / window.half,
    secondHalfMean: (usage?.secondHalfSum ?? 0) / window.half,
    lookbackDays,
  }
  const result = reorderSuggestion({
    demand: { meanDaily: Math.max(0, stats.mean), sdDaily: stats.sdSample, daysSinceLastUse: idle },
    // Accepted suggestions and draft lines are already coming: they count in the position, so the
    // line never suggests ordering them a second time.
    stock: { onHand: stock.onHand, onOrder: input.onOrder, reserved: stock.reserved, pending: input.pending?.qty ?? 0 },
    unitCost: input.unitCost,
    policy: effective.policy,
    vendor: vendor ? { packSize: vendor.packSize, minimumOrder: vendor.minimumOrder } : undefined,
  }, { explain })
  const line = toLine(input, usage, result, stats.mean, stats.sdSample, window)
  // The list never reads the working: it stays unwritten there unless something asks for it.
  if (!explain) return { line, usage: figures, get explanation() { return result.explanation } }
  const demand = demandSteps(figures, window.days, stats.mean, stats.sdSample)
  const explanation: Explanation = {
    inputs: {
      // where the lead time came from is the answer's own field (leadTime.source), worded by screens: no raw code here
      windowDays: window.days, sumUnits: sums.sum, sumSquares: sums.sumSquares, lookbackDays,
      ...result.explanation.inputs,
    },
    steps: [...demand.steps, ...result.explanation.steps],
    words: [...demand.words, ...result.explanation.words],
  }
  return { line, usage: figures, explanation }
}

function blockedBy(input: PreparedLine, result: ReorderResult): ReorderLine['blockedBy'] {
  if (!input.vendor) return 'noVendor'
  if (input.pending?.openSuggestionId) return 'alreadyAccepted'
  return result.suggestedOrder > 0 ? null : 'nothingToOrder'
}

function toLine(input: PreparedLine, usage: UsageSums | undefined, r: ReorderResult, mean: number, sd: number, window: WindowBounds): ReorderLine {
  const { item, warehouse, vendor, leadTime } = input
  const windowQty = usage?.sum ?? 0
  const idle = usage?.idleDays ?? null
  return {
    key: input.key, itemId: item.id, sku: item.sku, name: item.name, family: item.family,
    warehouseId: warehouse.id, warehouseCode: warehouse.code,
    vendorId: vendor?.vendorId ?? null, vendorCode: vendor?.vendorCode ?? null,
    packSize: vendor?.packSize ?? 1, minimumOrder: vendor?.minimumOrder ?? 0,
    abcClass: input.abcClass,
    onHand: input.stock.onHand, onOrder: input.onOrder, reserved: input.stock.reserved, position: r.position,
    meanDaily: round(mean), sdDaily: round(sd), annualUsage: round(annualQuantity(windowQty, window.days), 2),
    unitCost: input.unitCost, annualValue: input.annualValue,
    lastUsedDate: idle === null ? null : dateOfDayNumber(window.endDay - idle), daysSinceLastUse: idle,
    trendRatio: usage && usage.firstHalfSum > 0 ? round(usage.secondHalfSum / usage.firstHalfSum, 3) : null,
    leadTimeDays: round(leadTime.meanDays, 2), leadTimeSdDays: round(leadTime.sdDays, 2), leadTimeSource: leadTime.source,
    safetyStock: round(r.safetyStock, 2), reorderPoint: r.reorderPoint, eoq: r.eoq === null ? null : round(r.eoq, 2),
    lotSize: r.lotSize, orderUpToLevel: r.orderUpToLevel, suggestedOrder: r.suggestedOrder,
    daysOfSupply: r.daysOfSupply === null ? null : round(r.daysOfSupply, 1), status: r.status,
    pendingQty: input.pending?.qty ?? 0, openSuggestionId: input.pending?.openSuggestionId ?? null,
    overridden: Boolean(input.effective.policy.overrides), blockedBy: blockedBy(input, r),
  }
}
