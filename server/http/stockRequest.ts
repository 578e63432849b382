import type { Request, Response } from 'express'
import type { EntityManager } from 'typeorm'
import type { z } from 'zod'
import type { AppContext } from '../context.js'
import { AppError } from '../errors.js'
import { runIdempotent } from '../services/idempotency.js'
import type { Access, Method, RouteSpec } from './routeTable.js'
import { parseBody } from './validate.js'

/**
 * Runs a stock-changing request: one transaction (deadlock retried), honouring Idempotency-Key.
 * `input` is the request as the route's schema parsed it (never the raw body): the key's fingerprint is
 * taken of it, so fields the schema strips neither count nor cost anything to hash.
 * A replay answers with the stored status and body and the header Idempotent-Replayed: true.
 * `status` may depend on the answer (201 when something was made, else 200).
 */
export async function runStockRequest<T>(
  ctx: AppContext,
  req: Request,
  res: Response,
  input: unknown,
  work: (em: EntityManager) => Promise<T>,
  status: number | ((body: T) => number) = 200,
  after?: (body: T) => Promise<void>,
): Promise<void> {
  if (!req.user) throw AppError.unauthenticated()
  const answer = await runIdempotent(
    ctx.ds,
    { userId: req.user.id, key: req.get('idempotency-key') ?? undefined, scope: `${req.method} ${req.baseUrl}${req.path}`, input },
    async (em) => {
      const body = await work(em)
      return { status: typeof status === 'function' ? status(body) : status, body }
    },
  )
  if (after && answer.status < 300) await after(answer.body as T)
  if (answer.replayed) res.set('Idempotent-Replayed', 'true')
  res.status(answer.status).json(answer.body)
}

/** One request that changes stock or a document, as a route declares it (see stockStep). */
export interface StockStep<S extends z.ZodType, T> {
  /** Default 'post'. */
  method?: Method
  path: string
  access: Access
  /** The record's id from the path, read first, so a wrong id answers its own not-found before the body is read. */
  id?: (req: Request) => number
  /** The body's schema; without one the request carries no body (input null). */
  body?: S
  /** Default 200; may depend on the answer. */
  status?: number | ((body: T) => number)
  /** The caller must send its own Idempotency-Key (a handheld's queued confirmation): refused without one. */
  keyRequired?: boolean
  /** A scanner's step with a short answer, sent without compression (RouteSpec.smallAnswer). */
  smallAnswer?: boolean
  /** The change, inside the request's one transaction; `key` is the request's Idempotency-Key, if any. */
  run: (em: EntityManager, step: { req: Request; input: z.infer<S>; id: number; key: string | null }) => Promise<T>
  /** Work after the transaction committed (and on a replay), before the answer goes out: e-mail, never stock. */
  after?: (body: T, step: { req: Request; id: number }) => Promise<void>
}

/**
 * The route for a stock-changing request: the route table checks access, then the path id and the body are
 * parsed, then `run` goes through runStockRequest (one transaction, Idempotency-Key). Routes declare what
 * they change; none repeats the sequence or sees the transaction's type.
 */
export function stockStep<S extends z.ZodType = z.ZodNull, T = unknown>(ctx: AppContext, spec: StockStep<S, T>): RouteSpec {
  return {
    method: spec.method ?? 'post',
    path: spec.path,
    access: spec.access,
    smallAnswer: spec.smallAnswer,
    handler: (req, res) => {
      const id = spec.id ? spec.id(req) : 0
      const key = req.get('idempotency-key') ?? null
      if (spec.keyRequired && !key) throw AppError.badRequest('idempotency_key_required', 'This request needs an Idempotency-Key header.')
      const input = (spec.body ? parseBody(spec.body, req.body) : null) as z.infer<S>
      const after = spec.after
      return runStockRequest(ctx, req, res, input, (em) => spec.run(em, { req, input, id, key }), spec.status, after && ((body) => after(body, { req, id })))
    },
  }
}
