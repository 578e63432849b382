// The audit trail, for admins only: read and export. No route changes or deletes an entry (the role
// matrix and tests/api/auditTrail.test.ts check that PUT, PATCH and DELETE find nothing to call).
import { auditExportQuerySchema, auditTrailQuerySchema } from '../../shared/schemas/audit.js'
import { ADMIN_ONLY } from '../../shared/roles.js'
import type { AppContext } from '../context.js'
import { readSource } from '../http/readSource.js'
import { defineRoutes } from '../http/routeTable.js'
import { parseQuery } from '../http/validate.js'
import { prepareAuditExport } from '../services/audit/auditExport.js'
import { auditTrailPage } from '../services/audit/auditTrail.js'
import { XLSX_TYPE } from '../services/exports/xlsxWriter.js'

const admin = { roles: ADMIN_ONLY }

export default (ctx: AppContext) =>
  defineRoutes('/audit', [
    { method: 'get', path: '/', access: admin, handler: (req) => auditTrailPage(readSource(ctx), parseQuery(auditTrailQuerySchema, req.query)) },
    {
      method: 'get',
      path: '/export',
      access: admin,
      handler: async (req, res) => {
        const plan = await prepareAuditExport(readSource(ctx), parseQuery(auditExportQuerySchema, req.query))
        res.status(200)
        res.set('Content-Type', XLSX_TYPE)
        res.set('Content-Disposition', `attachment; filename="${plan.filename}"`)
        await plan.write(res)
        return undefined
      },
    },
  ])
