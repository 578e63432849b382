// The compute endpoint: a takeoff against the live catalog, with stock per warehouse for each line.
import type { DataSource } from 'typeorm'
import { computeCounterBill, saveBlockers, type ComputeAnswer } from '../../../shared/counter/counterBill.js'
import type { LengthUnitName, Takeoff } from '../../../shared/schemas/takeoff.js'
import { availabilityFor } from './availability.js'
import { loadCounterCatalog } from './counterCatalog.js'

export async function computeBill(ds: DataSource, takeoff: Takeoff, unit: LengthUnitName): Promise<ComputeAnswer> {
  const catalog = await loadCounterCatalog(ds.manager)
  const { bound: _bound, ...bill } = computeCounterBill(takeoff, catalog, unit)
  const stocked = bill.lines.filter((l) => l.itemId !== null && !l.madeToOrder).map((l) => l.itemId as number)
  const availability = await availabilityFor(ds.manager, stocked)
  return { ...bill, availability: [...availability.values()], blockers: saveBlockers({ ...bill, bound: takeoff }) }
}
