// The one maker of Idempotency-Key values on the client: every submission that changes stock or a document
// carries one, and a retry of the same submission carries the same one (useIdempotentSubmit, the pick outbox).

/** A key unique enough for Idempotency-Key; randomUUID needs a secure context, so plain-HTTP handhelds get random bytes. */
export function newIdempotencyKey(): string {
  if (typeof crypto.randomUUID === 'function') return crypto.randomUUID()
  const bytes = crypto.getRandomValues(new Uint8Array(16))
  return [...bytes].map((b) => b.toString(16).padStart(2, '0')).join('')
}

/** The request options that carry a submission's key (a fresh one when the call makes its own). */
export const keyed = (key: string = newIdempotencyKey()) => ({ headers: { 'Idempotency-Key': key } })
