// Everything out: the whole business as one zip of spreadsheets (administrators only: it holds every cost,
// account and person), its README in the language of the administrator who downloads it. Streamed straight to
// the answer, or as a job whose progress the screen follows and whose finished file it then downloads.
import { ADMIN_ONLY } from '../../shared/roles.js'
import { actorOf, type AppContext } from '../context.js'
import { sendFileDownload } from '../http/fileResponse.js'
import { defineRoutes } from '../http/routeTable.js'
import { businessExportName, exportBusiness } from '../services/exports/businessExport.js'
import { currentExportJob, exportJobFile, startExportJob } from '../services/exports/exportJobs.js'

export default (ctx: AppContext) =>
  defineRoutes('/business-export', [
    {
      method: 'get', path: '/', access: { roles: ADMIN_ONLY },
      handler: async (req, res) => {
        res.status(200)
        res.set('Content-Type', 'application/zip')
        res.set('Content-Disposition', `attachment; filename="${businessExportName()}"`)
        res.set('Cache-Control', 'no-store')
        await exportBusiness(ctx.ds, actorOf(req), res, req.user!.locale)
        return undefined
      },
    },
    {
      method: 'post', path: '/jobs', access: { roles: ADMIN_ONLY }, status: 202,
      handler: (req) => startExportJob(ctx.ds, actorOf(req), req.user!.locale, (err) => ctx.logger.error({ err }, 'everything out failed')),
    },
    { method: 'get', path: '/jobs/current', access: { roles: ADMIN_ONLY }, handler: async () => ({ job: await currentExportJob(ctx.ds) }) },
    {
      method: 'get', path: '/jobs/:id/file', access: { roles: ADMIN_ONLY },
      handler: async (req, res) => {
        const found = await exportJobFile(ctx.ds, String(req.params.id))
        return sendFileDownload(res, { stream: found.stream, name: found.filename, type: 'application/zip', bytes: found.bytes })
      },
    },
  ])
