// The compute endpoint: a takeoff against the live catalog, computed off the main thread, answered lean
// (lines, cautions, totals and each wall's counts; the browser lays out and draws the walls itself), with
// stock per warehouse for each stocked line.
import type { DataSource } from 'typeorm'
import { saveBlockers, summariseWall, type ComputeAnswer } from '../../../shared/counter/counterBill.js'
import type { LengthUnitName, Takeoff } from '../../../shared/schemas/takeoff.js'
import { availabilityFor } from './availability.js'
import { computeOffThread } from './computeRunner.js'
import { loadCounterCatalog } from './counterCatalog.js'

export async function computeBill(ds: DataSource, takeoff: Takeoff, unit: LengthUnitName): Promise<ComputeAnswer> {
  const catalog = await loadCounterCatalog(ds.manager)
  const bill = await computeOffThread(takeoff, catalog, unit, 'lean')
  const stocked = bill.lines.filter((l) => l.itemId !== null && !l.madeToOrder).map((l) => l.itemId as number)
  const availability = await availabilityFor(ds.manager, stocked)
  const { bound: _bound, walls, showerBase, ...rest } = bill
  return {
    ...rest,
    walls: walls.map(summariseWall),
    ...(showerBase ? { showerBase: { label: showerBase.label, fit: showerBase.fit, wall: showerBase.wall, mismatches: showerBase.mismatches.map((m) => ({ field: m.field })) } } : {}),
    availability: [...availability.values()],
    blockers: saveBlockers(bill),
  }
}
