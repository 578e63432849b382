// Every router, mounted under /api. A new resource's router is added to this list.
import type { AppContext } from '../context.js'
import auth from './auth.js'
import health from './health.js'
import profile from './profile.js'
import stockOperations from './stockOperations.js'
import stockViews from './stockViews.js'
import users from './users.js'
import items from './items.js'
import warehouses from './warehouses.js'
import reorder from './reorder.js'
import customers from './customers.js'
import jobs from './jobs.js'
import takeoffs from './takeoffs.js'
import boms from './boms.js'
import takeoffSettings from './takeoffSettings.js'
import pickLists from './pickLists.js'
import pickingSetup from './pickingSetup.js'
import vendors from './vendors.js'
import purchaseOrders from './purchaseOrders.js'
import purchaseOrderDelivery from './purchaseOrderDelivery.js'
import purchasing, { jobPurchasingRoutes } from './purchasing.js'
import devices from './devices.js'
import counts from './counts.js'
import reports from './reports.js'
import dataImports from './dataImports.js'
import pricing from './pricing.js'
import setup from './setup.js'
import quotes from './quotes.js'
import salesOrders, { salesSettingsRoutes } from './salesOrders.js'
import audit from './audit.js'
import today from './today.js'
import payments from './payments.js'

export const routers = [health, auth, profile, users, stockOperations, stockViews, items, warehouses, customers, jobs, takeoffs, boms, takeoffSettings, reorder, pickLists, pickingSetup, vendors, purchaseOrders, purchaseOrderDelivery, purchasing, jobPurchasingRoutes, devices, counts, reports, dataImports, pricing, setup, quotes, salesOrders, salesSettingsRoutes, audit, today, payments]

export function buildRouters(ctx: AppContext) {
  return routers.map((make) => make(ctx))
}
