import type { RouteRecordRaw } from 'vue-router'
import { AREA_ROLES } from '@shared/roles'

const counter = { area: 'counter' as const, roles: AREA_ROLES.counter }

export const counterRoutes: RouteRecordRaw[] = [
  {
    path: '/counter',
    name: 'counter-home',
    component: () => import('@/views/counter/CounterHomeView.vue'),
    meta: { ...counter, title: 'shell.areas.counter' },
  },
  {
    path: '/counter/customers',
    name: 'counter-customers',
    component: () => import('@/views/counter/CustomersView.vue'),
    meta: { ...counter, title: 'counter.customersTitle' },
  },
  {
    path: '/counter/jobs',
    name: 'counter-jobs',
    component: () => import('@/views/counter/JobsView.vue'),
    meta: { ...counter, title: 'counter.jobsTitle' },
  },
  {
    path: '/counter/jobs/:id(\\d+)',
    name: 'counter-job',
    component: () => import('@/views/counter/JobView.vue'),
    meta: { ...counter, title: 'counter.job' },
  },
  {
    path: '/counter/takeoffs/:id(\\d+)',
    name: 'counter-takeoff',
    component: () => import('@/views/counter/TakeoffEditorView.vue'),
    meta: { ...counter, title: 'counter.takeoff' },
  },
  {
    path: '/counter/boms/:id(\\d+)',
    name: 'counter-bom',
    component: () => import('@/views/counter/BomView.vue'),
    meta: { ...counter, title: 'counter.billTitle' },
  },
  {
    path: '/counter/settings',
    name: 'counter-settings',
    component: () => import('@/views/counter/TakeoffSettingsView.vue'),
    meta: { area: 'counter', roles: ['admin'], title: 'counter.settingsTitle' },
  },
  // Pick lists (made from a saved bill of materials; progress follows the warehouse by polling).
  {
    path: '/counter/picking',
    name: 'counter-picking',
    component: () => import('@/views/counter/PickingView.vue'),
    meta: { ...counter, title: 'picking.title' },
  },
  {
    path: '/counter/picking/new/:bomId(\\d+)',
    name: 'counter-pick-new',
    component: () => import('@/views/counter/PickListNewView.vue'),
    meta: { ...counter, title: 'picking.plan.title' },
  },
  {
    path: '/counter/pick-lists/:id(\\d+)',
    name: 'counter-pick-list',
    component: () => import('@/views/counter/PickListStatusView.vue'),
    meta: { ...counter, title: 'picking.title' },
  },
  // Counter sales: quotes (from a bill or by hand) and the sales orders taken from them.
  {
    path: '/counter/sales',
    name: 'counter-sales',
    component: () => import('@/views/counter/SalesView.vue'),
    meta: { ...counter, title: 'sales.quotes.title' },
  },
  {
    path: '/counter/quotes/new',
    name: 'counter-quote-new',
    component: () => import('@/views/counter/QuoteNewView.vue'),
    meta: { ...counter, title: 'sales.quote.newTitle' },
  },
  {
    path: '/counter/quotes/:id(\\d+)',
    name: 'counter-quote',
    component: () => import('@/views/counter/QuoteView.vue'),
    meta: { ...counter, title: 'sales.quotes.number' },
  },
  {
    path: '/counter/sales-orders/:id(\\d+)',
    name: 'counter-sales-order',
    component: () => import('@/views/counter/SalesOrderView.vue'),
    meta: { ...counter, title: 'sales.quotes.orderNumber' },
  },
  // Handover tickets: made at the counter, checked and signed at the counter or at dispatch, read by viewers.
  {
    path: '/counter/tickets/:id(\\d+)',
    name: 'handover-ticket',
    component: () => import('@/views/sales/HandoverTicketView.vue'),
    meta: { area: 'counter', touch: true, roles: ['admin', 'counter', 'warehouse', 'viewer'], title: 'handover.ticket.title' },
  },
]
