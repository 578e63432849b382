import type { Request, Response } from 'express'
import type { EntityManager } from 'typeorm'
import type { AppContext } from '../context.js'
import { AppError } from '../errors.js'
import { runIdempotent } from '../services/idempotency.js'

/**
 * Runs a stock-changing request: one transaction (deadlock retried), honouring Idempotency-Key.
 * `input` is the request as the route's schema parsed it (never the raw body): the key's fingerprint is
 * taken of it, so fields the schema strips neither count nor cost anything to hash.
 * A replay answers with the stored status and body and the header Idempotent-Replayed: true.
 */
export async function runStockRequest<T>(
  ctx: AppContext,
  req: Request,
  res: Response,
  input: unknown,
  work: (em: EntityManager) => Promise<T>,
  status = 200,
): Promise<void> {
  if (!req.user) throw AppError.unauthenticated()
  const answer = await runIdempotent(
    ctx.ds,
    { userId: req.user.id, key: req.get('idempotency-key') ?? undefined, scope: `${req.method} ${req.baseUrl}${req.path}`, input },
    async (em) => ({ status, body: await work(em) }),
  )
  if (answer.replayed) res.set('Idempotent-Replayed', 'true')
  res.status(answer.status).json(answer.body)
}
