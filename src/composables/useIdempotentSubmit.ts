import { useApiAction } from './useApiAction'

/** A key for Idempotency-Key. randomUUID needs a secure context, so plain-HTTP tablets get random bytes instead. */
export function newIdempotencyKey(): string {
  if (typeof crypto.randomUUID === 'function') return crypto.randomUUID()
  const bytes = crypto.getRandomValues(new Uint8Array(16))
  return [...bytes].map((b) => b.toString(16).padStart(2, '0')).join('')
}

/**
 * Submits a stock form with one Idempotency-Key per submission: the same body sent again (a double
 * click, a retry after a lost answer) carries the same key and applies once; a changed body gets a
 * new key. Field errors and messages come from useApiAction.
 */
export function useIdempotentSubmit() {
  const action = useApiAction()
  let pending: { key: string; body: string } | null = null

  function keyFor(body: unknown): string {
    const text = JSON.stringify(body)
    if (!pending || pending.body !== text) pending = { key: newIdempotencyKey(), body: text }
    return pending.key
  }

  async function submit<B, T>(body: B, send: (body: B, key: string) => Promise<T>): Promise<T | undefined> {
    const key = keyFor(body)
    const result = await action.run(() => send(body, key))
    if (result !== undefined) pending = null
    return result
  }

  return { ...action, submit, keyFor }
}
