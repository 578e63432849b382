import type { DataSource } from 'typeorm'
import type { AppContext } from '../context.js'

/**
 * The connection that reports, dashboards and count histories read through (never writes). One place to
 * point them at a read-only DataSource when the app has one; until then the primary.
 */
export const readSource = (ctx: AppContext): DataSource => ctx.ds
