// The first-run checklist of a new installation and the settings it asks for (units, GS1 company
// prefix, the company logo). Administrators only, but for the logo as printed documents show it, which anyone
// signed in who prints one reads (204 when none is set).
import { ADMIN_ONLY, ANYONE_SIGNED_IN } from '../../shared/roles.js'
import { setupGs1Schema, setupUnitsSchema } from '../../shared/schemas/setup.js'
import { actorOf, type AppContext } from '../context.js'
import { AppError } from '../errors.js'
import { defineRoutes } from '../http/routeTable.js'
import { parseBody } from '../http/validate.js'
import { companyLogo, setCompanyLogo } from '../services/companyProfile.js'
import { receiveImage } from '../http/upload.js'
import { dismissSetup, saveGs1Prefix, saveSetupUnits, setupState } from '../services/setupChecklist.js'

const admin = { roles: ADMIN_ONLY }
const LOGO_MAX_BYTES = 512 * 1024

export default (ctx: AppContext) => {
  const production = ctx.config.env === 'production'
  return defineRoutes('/setup', [
    { method: 'get', path: '/', access: admin, handler: () => setupState(ctx.ds, production) },
    { method: 'put', path: '/units', access: admin, handler: (req) => saveSetupUnits(ctx.ds, actorOf(req), parseBody(setupUnitsSchema, req.body), production) },
    { method: 'put', path: '/gs1-prefix', access: admin, handler: (req) => saveGs1Prefix(ctx.ds, actorOf(req), parseBody(setupGs1Schema, req.body), production) },
    { method: 'post', path: '/dismiss', access: admin, handler: (req) => dismissSetup(ctx.ds, actorOf(req), production) },
    {
      method: 'put', path: '/logo', access: admin,
      handler: async (req, res) => {
        await setCompanyLogo(ctx.ds, actorOf(req), await receiveImage(req, res, LOGO_MAX_BYTES))
        return { ok: true }
      },
    },
    {
      method: 'get', path: '/logo', access: admin,
      handler: async (_req, res) => {
        const logo = await companyLogo(ctx.ds)
        if (!logo) throw AppError.notFound('logo_missing', 'No logo has been uploaded.')
        res.setHeader('Content-Type', logo.type)
        res.setHeader('Cache-Control', 'no-store')
        res.send(logo.data)
        return undefined
      },
    },
    {
      method: 'get', path: '/printed-logo', access: { roles: ANYONE_SIGNED_IN },
      handler: async (_req, res) => {
        const logo = await companyLogo(ctx.ds)
        res.setHeader('Cache-Control', 'private, max-age=300')
        if (!logo) {
          res.status(204).end()
          return undefined
        }
        res.setHeader('Content-Type', logo.type)
        res.send(logo.data)
        return undefined
      },
    },
  ])
}
