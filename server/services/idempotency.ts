// Idempotency-Key (IETF draft "The Idempotency-Key HTTP Header Field"): the key, a hash of the
// request and the answer are stored in the same transaction as the effect. A replay returns the
// stored answer; the same key with another body is refused with 422. The record is inserted first,
// so a concurrent duplicate waits on its unique key and then sees the committed answer.
import { createHash } from 'node:crypto'
import type { DataSource, EntityManager } from 'typeorm'
import { IdempotencyRecord } from '../entities/IdempotencyRecord.js'
import { AppError } from '../errors.js'
import { sqlOn } from '../db/onConnection.js'
import { inTransaction, isDuplicateKey } from '../db/transaction.js'

export interface IdempotentRequest {
  userId: number
  key: string | undefined
  scope: string
  /** The request as its schema parsed it: the fingerprint covers what the operation uses, nothing else. */
  input: unknown
}

export interface StoredAnswer<T> {
  status: number
  body: T
  replayed: boolean
}

function canonical(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(canonical).join(',')}]`
  if (value && typeof value === 'object') {
    const entries = Object.entries(value as Record<string, unknown>).sort(([a], [b]) => (a < b ? -1 : 1))
    return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${canonical(v)}`).join(',')}}`
  }
  return JSON.stringify(value ?? null)
}

export const requestHash = (scope: string, input: unknown) => createHash('sha256').update(scope + '\n' + canonical(input)).digest('hex')

function checkKey(key: string): void {
  if (key.length < 8 || key.length > 100 || !/^[A-Za-z0-9._:-]+$/.test(key)) {
    throw AppError.badRequest('idempotency_key_invalid', 'The Idempotency-Key must be 8–100 letters, digits or . _ : -')
  }
}

async function storedAnswer<T>(ds: DataSource, req: IdempotentRequest & { key: string }, hash: string): Promise<StoredAnswer<T>> {
  const rec = await ds.getRepository(IdempotencyRecord).findOneBy({ userId: req.userId, key: req.key })
  if (!rec) throw AppError.conflict('idempotency_in_progress', 'The earlier request with this key is still running; try again.')
  if (rec.requestHash !== hash) {
    throw AppError.unprocessable('idempotency_key_reused', 'This Idempotency-Key was already used for a different request.')
  }
  return { status: rec.responseStatus, body: JSON.parse(rec.responseBody) as T, replayed: true }
}

/** Runs work once per key, in one transaction with deadlock retry. Without a key it just runs. */
export async function runIdempotent<T>(
  ds: DataSource,
  req: IdempotentRequest,
  work: (em: EntityManager) => Promise<{ status: number; body: T }>,
): Promise<StoredAnswer<T>> {
  if (!req.key) {
    const answer = await inTransaction(ds, work)
    return { ...answer, replayed: false }
  }
  checkKey(req.key)
  const key = req.key
  const hash = requestHash(req.scope, req.input)
  try {
    return await inTransaction(ds, async (em) => {
      // Plain SQL: the ORM's insert reads the row back for its generated columns, a statement per request.
      await sqlOn(
        em,
        "INSERT INTO idempotency_records (user_id, idem_key, scope, request_hash, response_status, response_body) VALUES (?, ?, ?, ?, 0, 'null')",
        [req.userId, key, req.scope, hash],
      )
      const answer = await work(em)
      await sqlOn(em, 'UPDATE idempotency_records SET response_status = ?, response_body = ? WHERE user_id = ? AND idem_key = ?', [
        answer.status, JSON.stringify(answer.body), req.userId, key,
      ])
      return { ...answer, replayed: false }
    })
  } catch (err) {
    if (isDuplicateKey(err) && String((err as Error).message).includes('PRIMARY')) return storedAnswer<T>(ds, { ...req, key }, hash)
    throw err
  }
}
