// A long job's progress row (an everything-out export, an import's check or commit), read by any app process.
// While the job works it writes its counts at most every `everyMs`, one write after another (a late write never
// overtakes a later one), and beats a heartbeat; a running row whose heartbeat stopped belongs to a process that
// died, and `failSilentRows` closes it so it no longer blocks or misleads anyone.
import type { DataSource } from 'typeorm'

/** How often a working process beats, and how long a silence means it died. */
const HEARTBEAT_MS = 5_000
export const SILENT_MS = 60_000

export interface ProgressRow {
  /** Writes the counts now if the last write is older than `everyMs` (always when forced). */
  report(force?: boolean): void
  /** Stops the heartbeat and waits for the writes under way, before the job writes its end. */
  stop(): Promise<void>
}

/** `update` is the UPDATE of the row's counts and heartbeat; `params` gives its parameters as they stand at write time. */
export function progressRow(ds: DataSource, update: string, params: () => unknown[], everyMs: number, onError: (err: unknown) => void = () => undefined): ProgressRow {
  let lastWrite = 0
  let writes: Promise<unknown> = Promise.resolve()
  const report = (force = false) => {
    if (!force && Date.now() - lastWrite < everyMs) return
    lastWrite = Date.now()
    writes = writes.then(() => ds.query(update, params())).catch(onError)
  }
  const heartbeat = setInterval(() => report(true), HEARTBEAT_MS)
  heartbeat.unref()
  return {
    report,
    async stop() {
      clearInterval(heartbeat)
      await writes
    },
  }
}

/** Closes every running row of `table` whose heartbeat is older than SILENT_MS, with `set` added to the update. */
export async function failSilentRows(ds: DataSource, table: 'business_export_jobs' | 'data_import_runs', set: string, params: unknown[] = []): Promise<void> {
  await ds.query(
    `UPDATE ${table} SET state = 'failed', ${set}, finished_at = CURRENT_TIMESTAMP(3)
      WHERE state = 'running' AND heartbeat_at < CURRENT_TIMESTAMP(3) - INTERVAL ? MICROSECOND`,
    [...params, SILENT_MS * 1000],
  )
}
