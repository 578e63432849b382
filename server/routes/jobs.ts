// Jobs of contractor accounts, their takeoffs and their saved bills of materials.
import { bomSaveSchema, jobCreateSchema, jobQuerySchema, jobUpdateSchema, takeoffImportFieldsSchema, takeoffSaveSchema } from '../../shared/schemas/counter.js'
import { actorOf, type AppContext } from '../context.js'
import { allow, defineRoutes } from '../http/routeTable.js'
import { idParam, parseBody, parseQuery } from '../http/validate.js'
import { parseTakeoffBody, requestUnit } from '../http/takeoffValidate.js'
import { saveBom } from '../services/counter/bomService.js'
import { createJob, getJob, listJobs, updateJob } from '../services/counter/jobService.js'
import { importTakeoff } from '../services/counter/takeoffImport.js'
import { createTakeoff } from '../services/counter/takeoffService.js'
import { receiveUpload } from '../http/upload.js'

/** A takeoff sheet is small: a few hundred rows at most. */
const MAX_UPLOAD_BYTES = 2 * 1024 * 1024

const counter = allow('admin', 'counter')
const id = (raw: string | string[] | undefined) => idParam(raw, 'job_not_found')

export default (ctx: AppContext) =>
  defineRoutes('/jobs', [
    { method: 'get', path: '/', access: counter, handler: (req) => listJobs(ctx.ds, parseQuery(jobQuerySchema, req.query)) },
    { method: 'post', path: '/', access: counter, status: 201, handler: (req) => createJob(ctx.ds, actorOf(req), parseBody(jobCreateSchema, req.body)) },
    { method: 'get', path: '/:id', access: counter, handler: (req) => getJob(ctx.ds, id(req.params.id)) },
    {
      method: 'patch',
      path: '/:id',
      access: counter,
      handler: (req) => updateJob(ctx.ds, actorOf(req), id(req.params.id), parseBody(jobUpdateSchema, req.body)),
    },
    {
      method: 'post',
      path: '/:id/takeoffs',
      access: counter,
      status: 201,
      handler: (req) =>
        createTakeoff(ctx.ds, actorOf(req), id(req.params.id), parseTakeoffBody(takeoffSaveSchema, req.body, requestUnit(req.body, req.user?.unitPreference))),
    },
    {
      method: 'post',
      path: '/:id/takeoffs/import',
      access: counter,
      status: 201,
      handler: async (req, res) => {
        const jobId = id(req.params.id)
        const upload = await receiveUpload(req, res, { maxBytes: MAX_UPLOAD_BYTES })
        const fields = parseBody(takeoffImportFieldsSchema, req.body)
        const name = fields.name ?? upload.filename.replace(/\.(xlsx|csv)$/i, '').slice(0, 120)
        return importTakeoff(ctx.ds, actorOf(req), jobId, upload, { name: name || 'Uploaded takeoff', unit: fields.unit ?? req.user?.unitPreference ?? 'in' })
      },
    },
    {
      method: 'post',
      path: '/:id/boms',
      access: counter,
      status: 201,
      handler: (req) =>
        saveBom(ctx.ds, actorOf(req), id(req.params.id), parseTakeoffBody(bomSaveSchema, req.body, requestUnit(req.body, req.user?.unitPreference)), req.user?.unitPreference ?? 'in'),
    },
  ])
