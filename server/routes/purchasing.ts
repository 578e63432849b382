// Purchasing lookups (items, warehouses), its admin settings, the mail outbox, and a job's purchase
// lines for the counter.
import { companyProfileSchema, purchasingSettingsSchema } from '../../shared/schemas/purchasing.js'
import { z } from 'zod'
import type { AppContext } from '../context.js'
import { actorOf } from '../context.js'
import { sendDownload } from '../http/fileResponse.js'
import { allow, defineRoutes } from '../http/routeTable.js'
import { idParam, parseBody, parseQuery } from '../http/validate.js'
import { purchasingSettings, updatePurchasingSettings } from '../services/appSettings.js'
import { companyProfile, updateCompanyProfile } from '../services/companyProfile.js'
import { jobPurchaseLines } from '../services/purchasing/jobPurchasing.js'
import { listOutbox, outboxAttachment } from '../services/purchasing/outboxRead.js'
import { sendAgain } from '../services/purchasing/poMail.js'
import { itemChoices, warehouseChoices } from '../services/purchasing/vendorService.js'

const buyers = allow('admin', 'buyer')
const admin = allow('admin')
const searchSchema = z.object({ q: z.string().trim().max(60).optional() })

const purchasing = (ctx: AppContext) =>
  defineRoutes('/purchasing', [
    { method: 'get', path: '/items', access: buyers, handler: (req) => itemChoices(ctx.ds, parseQuery(searchSchema, req.query).q) },
    { method: 'get', path: '/warehouses', access: buyers, handler: () => warehouseChoices(ctx.ds) },
    { method: 'get', path: '/settings', access: admin, handler: () => purchasingSettings(ctx.ds) },
    {
      method: 'patch', path: '/settings', access: admin,
      handler: (req) => updatePurchasingSettings(ctx.ds, actorOf(req), parseBody(purchasingSettingsSchema, req.body)),
    },
    // Who orders: buyers read it (their documents print it), admins keep it.
    { method: 'get', path: '/company', access: buyers, handler: () => companyProfile(ctx.ds) },
    {
      method: 'put', path: '/company', access: admin,
      handler: (req) => updateCompanyProfile(ctx.ds, actorOf(req), parseBody(companyProfileSchema, req.body)),
    },
    { method: 'get', path: '/outbox', access: admin, handler: () => listOutbox(ctx.ds) },
    {
      method: 'get', path: '/outbox/:id/attachments/:attachmentId', access: admin,
      handler: async (req, res) =>
        sendDownload(res, await outboxAttachment(ctx.ds, idParam(req.params.id, 'message_not_found'), idParam(req.params.attachmentId, 'attachment_not_found'))),
    },
    {
      method: 'post', path: '/outbox/:id/send-again', access: admin,
      handler: (req) => sendAgain(ctx.ds, ctx.config, actorOf(req), idParam(req.params.id, 'message_not_found')),
    },
  ])

const jobs = (ctx: AppContext) =>
  defineRoutes('/jobs', [
    {
      method: 'get', path: '/:id/purchase-lines', access: allow('admin', 'counter', 'buyer'),
      handler: (req) => jobPurchaseLines(ctx.ds, idParam(req.params.id, 'job_not_found')),
    },
  ])

export default purchasing
export { jobs as jobPurchasingRoutes }
