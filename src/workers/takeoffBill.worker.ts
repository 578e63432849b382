// The takeoff editor's computation, off the page's thread: the bill, its drawings and what blocks saving,
// from the same shared code the server runs. The editor sends plain data and keeps only the answer to its
// latest request, so typing never waits for a large takeoff to finish.
import { billBlockers, computeCounterBill, type CounterBill } from '@shared/counter/counterBill'
import type { CounterCatalog } from '@shared/schemas/counter'
import type { LengthUnitName, Takeoff } from '@shared/schemas/takeoff'
import type { Caution } from '@shared/takeoff/cautions'

export interface BillRequest { id: number; takeoff: Takeoff; catalog: CounterCatalog; unit: LengthUnitName }
export type BillReply = { id: number; ok: true; bill: CounterBill; blockers: Caution[] } | { id: number; ok: false; message: string }

self.addEventListener('message', (event: MessageEvent<BillRequest>) => {
  const { id, takeoff, catalog, unit } = event.data
  let reply: BillReply
  try {
    const bill = computeCounterBill(takeoff, catalog, unit)
    reply = { id, ok: true, bill, blockers: billBlockers(bill) }
  } catch (err) {
    reply = { id, ok: false, message: err instanceof Error ? err.message : String(err) }
  }
  self.postMessage(reply)
})
