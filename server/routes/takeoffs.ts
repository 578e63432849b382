// Saved takeoffs, the editor's catalog and the compute endpoint (the bill with stock per warehouse).
import { computeRequestSchema, takeoffUpdateSchema } from '../../shared/schemas/counter.js'
import { actorOf, type AppContext } from '../context.js'
import { allow, defineRoutes } from '../http/routeTable.js'
import { idParam } from '../http/validate.js'
import { parseTakeoffBody, requestUnit } from '../http/takeoffValidate.js'
import { loadCounterCatalog } from '../services/counter/counterCatalog.js'
import { computeBill } from '../services/counter/takeoffCompute.js'
import { takeoffTemplate, takeoffTemplateCsv } from '../services/counter/takeoffImport.js'
import { XLSX_TYPE } from '../services/exports/xlsxWriter.js'
import { sendDownload } from '../http/fileResponse.js'
import { deleteTakeoff, getTakeoff, updateTakeoff } from '../services/counter/takeoffService.js'

const counter = allow('admin', 'counter')
const id = (raw: string | string[] | undefined) => idParam(raw, 'takeoff_not_found')

export default (ctx: AppContext) =>
  defineRoutes('/takeoffs', [
    { method: 'get', path: '/catalog', access: counter, handler: () => loadCounterCatalog(ctx.ds.manager) },
    {
      method: 'post',
      path: '/compute',
      access: counter,
      handler: (req) => {
        const fallback = req.user?.unitPreference ?? 'in'
        const { takeoff, unit } = parseTakeoffBody(computeRequestSchema, req.body, requestUnit(req.body, fallback))
        return computeBill(ctx.ds, takeoff, unit ?? fallback)
      },
    },
    {
      method: 'get',
      path: '/import-template',
      access: counter,
      handler: async (req, res) =>
        req.query.format === 'csv'
          ? sendDownload(res, { name: 'lumenyard-takeoff-template.csv', type: 'text/csv; charset=utf-8', bytes: takeoffTemplateCsv() })
          : sendDownload(res, { name: 'lumenyard-takeoff-template.xlsx', type: XLSX_TYPE, bytes: await takeoffTemplate() }),
    },
    { method: 'get', path: '/:id', access: counter, handler: (req) => getTakeoff(ctx.ds, id(req.params.id)) },
    {
      method: 'put',
      path: '/:id',
      access: counter,
      handler: (req) =>
        updateTakeoff(ctx.ds, actorOf(req), id(req.params.id), parseTakeoffBody(takeoffUpdateSchema, req.body, requestUnit(req.body, req.user?.unitPreference))),
    },
    { method: 'delete', path: '/:id', access: counter, handler: (req) => deleteTakeoff(ctx.ds, actorOf(req), id(req.params.id)) },
  ])
