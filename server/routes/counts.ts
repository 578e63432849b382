// Cycle counts: open, count on the handheld (blind), review, history and accuracy. Every step that
// changes a count runs in one transaction and honours Idempotency-Key (a scanner's double send applies once).
import type { Request } from 'express'
import { z } from 'zod'
import {
  countAccuracyQuerySchema, countCancelSchema, countDueQuerySchema, countEntrySchema, countHistoryQuerySchema, countOpenSchema,
  countReviewSchema, countSettingsSchema, countsQuerySchema, countStartBinSchema,
} from '../../shared/schemas/counts.js'
import type { AppContext } from '../context.js'
import { actorOf } from '../context.js'
import { AppError } from '../errors.js'
import { allow, defineRoutes } from '../http/routeTable.js'
import { readSource } from '../http/readSource.js'
import { stockStep } from '../http/stockRequest.js'
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
    // Every step that changes a count: one transaction, Idempotency-Key honoured (stockStep).
    stockStep(ctx, { path: '/:id/bins/start', access: counters, body: countStartBinSchema, run: (em, { req, input }) => startBinVisit(em, actorOf(req), countId(req), input) }),
    stockStep(ctx, { path: '/:id/entries', access: counters, body: countEntrySchema, run: (em, { req, input }) => enterCount(em, actorOf(req), countId(req), input) }),
    stockStep(ctx, {
      path: '/:id/bins/:binId/finish', access: counters, body: z.object({}),
      run: (em, { req }) => finishBinVisit(em, actorOf(req), countId(req), idParam(req.params.binId, 'bin_not_found')),
    }),
    stockStep(ctx, { path: '/:id/review', access: readers, body: countReviewSchema, run: (em, { req, input }) => reviewCount(em, { ...actorOf(req), roles: req.user!.roles }, countId(req), input) }),
    stockStep(ctx, { path: '/:id/cancel', access: allow('admin'), body: countCancelSchema, run: (em, { req, input }) => cancelCount(em, actorOf(req), countId(req), input.reason) }),
  ])
