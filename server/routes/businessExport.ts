// Everything out: the whole business as one zip of spreadsheets (administrators only: it holds every cost,
// account and person), its README in the language of the administrator who downloads it.
import { ADMIN_ONLY } from '../../shared/roles.js'
import { actorOf, type AppContext } from '../context.js'
import { defineRoutes } from '../http/routeTable.js'
import { businessExportName, exportBusiness } from '../services/exports/businessExport.js'

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
  ])
