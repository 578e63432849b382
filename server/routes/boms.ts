// Saved bills of materials: read one (with stock per warehouse) and export it as a workbook.
import type { AppContext } from '../context.js'
import { allow, defineRoutes } from '../http/routeTable.js'
import { sendDownload } from '../http/fileResponse.js'
import { idParam, parseQuery } from '../http/validate.js'
import { exportQuerySchema } from '../../shared/schemas/exportQuery.js'
import { bomFileName, bomWorkbook } from '../services/counter/bomExport.js'
import { getBom } from '../services/counter/bomService.js'
import { XLSX_TYPE } from '../services/exports/xlsxWriter.js'

const counter = allow('admin', 'counter')
const id = (raw: string | string[] | undefined) => idParam(raw, 'bom_not_found')

export default (ctx: AppContext) =>
  defineRoutes('/boms', [
    { method: 'get', path: '/:id', access: counter, handler: (req) => getBom(ctx.ds, id(req.params.id)) },
    {
      method: 'get',
      path: '/:id/export',
      access: counter,
      handler: async (req, res) => {
        const { tz } = parseQuery(exportQuerySchema, req.query)
        const bom = await getBom(ctx.ds, id(req.params.id))
        const bytes = await bomWorkbook(bom, tz)
        return sendDownload(res, { name: bomFileName(bom), type: XLSX_TYPE, bytes })
      },
    },
  ])
