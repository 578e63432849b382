import { newIdempotencyKey } from '@/api/idempotencyKey'
import { useApiAction } from './useApiAction'

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
