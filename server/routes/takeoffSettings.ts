// The admin's takeoff settings: material rules, waste allowances, site figures, and the role → item mapping.
// The counter may read them (the explanations quote them); only an admin changes them.
import { z } from 'zod'
import { roleItemInputSchema, ruleOverrideSchema, siteFiguresUpdateSchema, wasteUpdateSchema } from '../../shared/schemas/counter.js'
import { actorOf, type AppContext } from '../context.js'
import { AppError } from '../errors.js'
import { allow, defineRoutes } from '../http/routeTable.js'
import { idParam, parseBody } from '../http/validate.js'
import {
  createRoleItem,
  deleteRoleItem,
  getSiteFigures,
  getWaste,
  listRoleItems,
  listRules,
  resetRule,
  saveRule,
  updateRoleItem,
  updateSiteFigures,
  updateWaste,
} from '../services/counter/takeoffSettingsService.js'

const readers = allow('admin', 'counter')
const admin = allow('admin')
const ruleKey = (raw: string | string[] | undefined): string => {
  const key = z.string().regex(/^[A-Za-z0-9._-]{1,60}$/).safeParse(Array.isArray(raw) ? raw[0] : raw)
  if (!key.success) throw AppError.notFound('rule_not_found', 'That rule was not found.')
  return key.data
}
const mappingId = (raw: string | string[] | undefined) => idParam(raw, 'role_mapping_not_found')

export default (ctx: AppContext) =>
  defineRoutes('/takeoff-settings', [
    { method: 'get', path: '/rules', access: readers, handler: () => listRules(ctx.ds) },
    {
      method: 'put',
      path: '/rules/:key',
      access: admin,
      handler: (req) => saveRule(ctx.ds, actorOf(req), ruleKey(req.params.key), parseBody(ruleOverrideSchema, req.body)),
    },
    { method: 'delete', path: '/rules/:key', access: admin, handler: (req) => resetRule(ctx.ds, actorOf(req), ruleKey(req.params.key)) },
    { method: 'get', path: '/waste', access: readers, handler: () => getWaste(ctx.ds) },
    { method: 'patch', path: '/waste', access: admin, handler: (req) => updateWaste(ctx.ds, actorOf(req), parseBody(wasteUpdateSchema, req.body)) },
    { method: 'get', path: '/figures', access: readers, handler: () => getSiteFigures(ctx.ds) },
    {
      method: 'patch',
      path: '/figures',
      access: admin,
      handler: (req) => updateSiteFigures(ctx.ds, actorOf(req), parseBody(siteFiguresUpdateSchema, req.body)),
    },
    { method: 'get', path: '/role-items', access: readers, handler: () => listRoleItems(ctx.ds) },
    {
      method: 'post',
      path: '/role-items',
      access: admin,
      status: 201,
      handler: (req) => createRoleItem(ctx.ds, actorOf(req), parseBody(roleItemInputSchema, req.body)),
    },
    {
      method: 'put',
      path: '/role-items/:id',
      access: admin,
      handler: (req) => updateRoleItem(ctx.ds, actorOf(req), mappingId(req.params.id), parseBody(roleItemInputSchema, req.body)),
    },
    { method: 'delete', path: '/role-items/:id', access: admin, handler: (req) => deleteRoleItem(ctx.ds, actorOf(req), mappingId(req.params.id)) },
  ])
