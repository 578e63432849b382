// The server's database (or the proxy in front of it) is not answering: 503 db_unavailable, or 502/504
// from a proxy. Reads are tried again by the API client on their own, with growing pauses; writes are
// never repeated behind the user's back. The outage banner shows this state until a request gets through.
import { reactive, readonly } from 'vue'

const state = reactive({ active: false, retrying: 0 })
export const outage = readonly(state)

export const OUTAGE_STATUSES: ReadonlySet<number> = new Set([502, 503, 504])

/** Pauses before each new try of a read: about a minute and a half in all, then the error is shown. */
export const READ_RETRY_DELAYS_MS = [1000, 2000, 3000, 5000, 8000, 10_000, 15_000, 20_000, 30_000]

export function outageSeen(retryingRead: boolean): void {
  state.active = true
  if (retryingRead) state.retrying++
}

export function readRetryDone(): void {
  state.retrying = Math.max(0, state.retrying - 1)
}

export function answered(): void {
  state.active = false
}

export function pause(ms: number, signal?: AbortSignal): Promise<void> {
  return new Promise((resolve, reject) => {
    const timer = setTimeout(resolve, ms)
    signal?.addEventListener('abort', () => { clearTimeout(timer); reject(new DOMException('Aborted', 'AbortError')) }, { once: true })
  })
}
