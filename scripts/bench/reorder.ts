// The reorder suggestion list over 1,000,000 moves (15,000 item × warehouse lines), the service the API
// calls, against a hand-written aggregate of the same per-line Σ and Σ² of daily use, in two forms: as one
// would first write it (its floor in the table) and in the service's own keyed formulation.
import type { DataSource } from 'typeorm'
import { suggestionList } from '../../server/services/reorder/suggestionList.js'
import { AGGREGATE_MEMORY } from '../../server/services/reorder/usageQueries.js'
import { dayAfter, usageWindow } from '../../server/services/reorder/usageWindow.js'
import { timed } from './stats.js'

// The straightforward form, grouping by the columns and DATE(at).
const HAND_WRITTEN = `
  SELECT item_id, warehouse_id, SUM(q) AS s, SUM(q * q) AS s2
    FROM (SELECT item_id, warehouse_id, DATE(at) AS day, -SUM(qty) AS q
            FROM stock_moves
           WHERE move_type IN ('issue', 'pick') AND at >= ? AND at < ?
           GROUP BY item_id, warehouse_id, DATE(at)) d
   GROUP BY item_id, warehouse_id`

// The same two sums in the service's formulation (one packed integer key per level, see usageQueries.ts).
const HAND_WRITTEN_KEYED = `${AGGREGATE_MEMORY}
  SELECT k DIV 2048 AS line, SUM(q) AS s, SUM(q * q) AS s2
    FROM (SELECT (item_id * 65536 + warehouse_id) * 2048 + DATEDIFF(at, ?) AS k, -SUM(qty) AS q
            FROM stock_moves
           WHERE move_type IN ('issue', 'pick') AND at >= ? AND at < ?
           GROUP BY k) d
   GROUP BY line`

export interface ReorderTimes { handWritten: number[]; keyed: number[]; service: number[]; lines: number }

/** Alternates the three, `runs` times, after one warm-up that brings the index into the buffer pool. */
export async function measureReorder(ds: DataSource, runs: number, log: (line: string) => void): Promise<ReorderTimes> {
  const window = usageWindow(180)
  const params = [window.start, dayAfter(window.end)]
  const plain = () => ds.query(HAND_WRITTEN, params) as Promise<unknown[]>
  const keyed = () => ds.query(HAND_WRITTEN_KEYED, [window.start, ...params]) as Promise<unknown[]>
  await plain()
  await suggestionList(ds, {})
  const out: ReorderTimes = { handWritten: [], keyed: [], service: [], lines: 0 }
  for (let run = 0; run < runs; run++) {
    const p = await timed(plain)
    const k = await timed(keyed)
    const s = await timed(() => suggestionList(ds, {}))
    out.handWritten.push(p.ms)
    out.keyed.push(k.ms)
    out.service.push(s.ms)
    out.lines = s.result.lines.length
    log(`  run ${run + 1}: suggestion list ${s.ms.toFixed(0)} ms (${out.lines} lines), hand-written ${p.ms.toFixed(0)} ms, keyed ${k.ms.toFixed(0)} ms`)
  }
  return out
}
