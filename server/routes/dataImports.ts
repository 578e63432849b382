// A business's own data coming in (opening stock and the kinds that follow): templates, a check that
// writes nothing, the commit, the list of what was imported, and reversing an import as a whole.
// Administrators only: these write the whole business's stock and records at once.
import { z } from 'zod'
import { ADMIN_ONLY } from '../../shared/roles.js'
import { isDataImportKind, type DataImportKind } from '../../shared/schemas/dataImports.js'
import { actorOf, type AppContext } from '../context.js'
import { AppError } from '../errors.js'
import { sendXlsx } from '../http/fileResponse.js'
import { defineRoutes } from '../http/routeTable.js'
import { receiveUpload } from '../http/upload.js'
import { idParam, parseQuery } from '../http/validate.js'
import { commitImport, listImports, previewImport, reverseImport } from '../services/imports/dataImports.js'
import { problemPage } from '../services/imports/importProblems.js'
import { checkedUpload, currentImportRun, runImportStep } from '../services/imports/importRuns.js'
import { DATA_IMPORTS, dataImportTemplate } from '../services/imports/dataImportKinds.js'

const admin = { roles: ADMIN_ONLY }

/** A page of a check's problems: from `offset`, of one `column` when given ('' for the row as a whole). */
const problemPageQuery = z.object({ offset: z.coerce.number().int().min(0).max(10_000_000).default(0), column: z.string().max(80).optional() })

function kindOf(value: string | string[] | undefined): DataImportKind {
  const kind = Array.isArray(value) ? value[0] : value
  if (!kind || !isDataImportKind(kind)) throw AppError.notFound('import_kind_unknown', `There is no import called ${String(kind).slice(0, 40)}.`)
  return kind
}

export default (ctx: AppContext) =>
  defineRoutes('/imports', [
    { method: 'get', path: '/', access: admin, handler: () => listImports(ctx.ds) },
    // The signed-in person's latest check or commit: how far it has got, and its answer once done (after a reload too).
    { method: 'get', path: '/runs/current', access: admin, handler: async (req) => ({ run: await currentImportRun(ctx.ds, req.user!.id) }) },
    {
      method: 'get', path: '/runs/:id/problems', access: admin,
      handler: (req) => {
        const q = parseQuery(problemPageQuery, req.query)
        return problemPage(ctx.ds, req.user!.id, String(req.params.id), q.offset, q.column)
      },
    },
    {
      method: 'get', path: '/:kind/template.xlsx', access: admin,
      handler: async (req, res) => {
        const kind = kindOf(req.params.kind)
        sendXlsx(res, `lumenyard-${kind.replace(/_/g, '-')}-template.xlsx`, await dataImportTemplate(kind, req.user!.locale))
      },
    },
    {
      method: 'post', path: '/:kind/preview', access: admin,
      handler: async (req, res) => {
        const kind = kindOf(req.params.kind)
        const upload = await receiveUpload(req, res, { maxBytes: ctx.config.uploadMaxBytes })
        return runImportStep(ctx.ds, actorOf(req), kind, 'preview', upload, (progress) => previewImport(ctx.ds, DATA_IMPORTS[kind], upload, progress))
      },
    },
    {
      method: 'post', path: '/:kind/commit', access: admin,
      handler: async (req, res) => {
        const kind = kindOf(req.params.kind)
        const upload = await receiveUpload(req, res, { maxBytes: ctx.config.uploadMaxBytes })
        return runImportStep(ctx.ds, actorOf(req), kind, 'commit', upload, (progress) => commitImport(ctx.ds, actorOf(req), DATA_IMPORTS[kind], upload, progress))
      },
    },
    {
      // The file a finished check kept, committed without sending it again (from any app process; after a reload too).
      method: 'post', path: '/runs/:id/commit', access: admin,
      handler: async (req) => {
        const runId = String(req.params.id)
        const { kind, upload } = await checkedUpload(ctx.ds, req.user!.id, runId)
        return runImportStep(ctx.ds, actorOf(req), kind, 'commit', upload, (progress) => commitImport(ctx.ds, actorOf(req), DATA_IMPORTS[kind], upload, progress), runId)
      },
    },
    { method: 'post', path: '/:id/reverse', access: admin, handler: (req) => reverseImport(ctx.ds, actorOf(req), DATA_IMPORTS, idParam(req.params.id, 'import_not_found')) },
  ])
