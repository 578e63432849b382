// Cycle counts: open, count on the handheld (blind), review, history and accuracy. Every step that
// changes a count runs in one transaction and honours Idempotency-Key (a scanner's double send applies once).
import type { Request } from 'express'
import type { EntityManager } from 'typeorm'
import { z } from 'zod'
import {
  countAccuracyQuerySchema, countCancelSchema, countDueQuerySchema, countEntrySchema, countHistoryQuerySchema, countOpenSchema,
  countReviewSchema, countSettingsSchema, countsQuerySchema, countStartBinSchema,
} from '../../shared/schemas/counts.js'
import type { AppContext } from '../context.js'
import { actorOf } from '../context.js'
import { AppError } from '../errors.js'
import { allow, defineRoutes, type Access, type RouteSpec } from '../http/routeTable.js'
import { readSource } from '../http/readSource.js'
import { runStockRequest } from '../http/stockRequest.js'
import { idParam, parseBody, parseQuery } from '../http/validate.js'
import { countAccuracy } from '../services/counts/countAccuracy.js'
import { countDuePlan, openCount } from '../services/counts/countOpen.js'
import { countDetail, countHistory, handheldCount, listCounts } from '../services/counts/countRead.js'
import { cancelCount, reviewCount } from '../services/counts/countReview.js'
import { countSettings, updateCountSettings } from '../services/counts/countSettings.js'
import { enterCount, finishBinVisit, startBinVisit } from '../services/counts/countVisits.js'

/** Counters: the warehouse crew (and admin). Readers add the buyer, whom the admin may choose as a reviewer. */
const counters = allow('admin', 'warehouse')
const readers = allow('admin', 'warehouse', 'buyer')

function viewer(req: Request) {
  if (!req.user) throw AppError.unauthenticated()
  return { userId: req.user.id, roles: req.user.roles }
}

const countId = (req: Request) => idParam(req.params.id, 'count_not_found')

/** A POST that changes a count: parsed with its schema, one transaction, Idempotency-Key honoured. */
function countStep<S extends z.ZodType>(
  ctx: AppContext, path: string, access: Access, schema: S,
  step: (em: EntityManager, req: Request, input: z.infer<S>) => Promise<unknown>,
): RouteSpec {
  return {
    method: 'post', path, access,
    handler: (req, res) => {
      const input = parseBody(schema, req.body)
      return runStockRequest(ctx, req, res, input, (em) => step(em, req, input))
    },
  }
}

export default (ctx: AppContext) =>
  defineRoutes('/counts', [
    { method: 'get', path: '/', access: readers, handler: (req) => listCounts(readSource(ctx), parseQuery(countsQuerySchema, req.query)) },
    { method: 'post', path: '/', access: counters, status: 201, handler: (req) => openCount(ctx.ds, actorOf(req), parseBody(countOpenSchema, req.body)) },
    { method: 'get', path: '/due', access: counters, handler: (req) => countDuePlan(readSource(ctx), parseQuery(countDueQuerySchema, req.query).warehouseId) },
    { method: 'get', path: '/settings', access: readers, handler: () => countSettings(ctx.ds) },
    { method: 'put', path: '/settings', access: allow('admin'), handler: (req) => updateCountSettings(ctx.ds, actorOf(req), parseBody(countSettingsSchema, req.body)) },
    { method: 'get', path: '/history', access: readers, handler: (req) => countHistory(readSource(ctx), viewer(req), parseQuery(countHistoryQuerySchema, req.query)) },
    { method: 'get', path: '/accuracy', access: readers, handler: (req) => countAccuracy(readSource(ctx), parseQuery(countAccuracyQuerySchema, req.query)) },
    { method: 'get', path: '/:id', access: readers, handler: (req) => countDetail(ctx.ds, viewer(req), countId(req)) },
    { method: 'get', path: '/:id/handheld', access: counters, handler: (req) => handheldCount(ctx.ds, viewer(req), countId(req)) },
    countStep(ctx, '/:id/bins/start', counters, countStartBinSchema, (em, req, input) => startBinVisit(em, actorOf(req), countId(req), input)),
    countStep(ctx, '/:id/entries', counters, countEntrySchema, (em, req, input) => enterCount(em, actorOf(req), countId(req), input)),
    countStep(ctx, '/:id/bins/:binId/finish', counters, z.object({}), (em, req) => finishBinVisit(em, actorOf(req), countId(req), idParam(req.params.binId, 'bin_not_found'))),
    countStep(ctx, '/:id/review', readers, countReviewSchema, (em, req, input) => reviewCount(em, { ...actorOf(req), roles: req.user!.roles }, countId(req), input)),
    countStep(ctx, '/:id/cancel', allow('admin'), countCancelSchema, (em, req, input) => cancelCount(em, actorOf(req), countId(req), input.reason)),
  ])
