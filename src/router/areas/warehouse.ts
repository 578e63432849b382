import type { RouteRecordRaw } from 'vue-router'
import { AREA_ROLES } from '@shared/roles'

export const warehouseRoutes: RouteRecordRaw[] = [
  {
    path: '/warehouse',
    name: 'warehouse-home',
    component: () => import('@/views/warehouse/WarehouseHomeView.vue'),
    meta: { area: 'warehouse', touch: true, roles: AREA_ROLES.warehouse, title: 'shell.areas.warehouse' },
  },
  // Handover tickets at dispatch (the counter and viewers see them too).
  {
    path: '/warehouse/tickets',
    name: 'handover-tickets',
    component: () => import('@/views/sales/HandoverTicketsView.vue'),
    meta: { area: 'warehouse', touch: true, roles: ['admin', 'counter', 'warehouse', 'viewer'], title: 'handover.tickets.title' },
  },
  // The handheld pick screen, full screen for phones and tablets.
  {
    path: '/warehouse/pick/:id(\\d+)',
    name: 'warehouse-pick',
    component: () => import('@/views/warehouse/PickHandheldView.vue'),
    meta: { area: 'warehouse', touch: true, roles: AREA_ROLES.warehouse, title: 'picking.title', bare: true },
  },
  // What this device holds for the server: confirmations waiting or refused.
  {
    path: '/warehouse/outbox',
    name: 'warehouse-outbox',
    component: () => import('@/views/warehouse/WarehouseOutboxView.vue'),
    meta: { area: 'warehouse', touch: true, roles: AREA_ROLES.warehouse, title: 'picking.outbox.title', bare: true },
  },
  // Receiving against purchase orders, with scans.
  {
    path: '/warehouse/receiving',
    name: 'warehouse-receiving',
    component: () => import('@/views/warehouse/ReceivingView.vue'),
    meta: { area: 'warehouse', touch: true, roles: AREA_ROLES.warehouse, title: 'receiving.listTitle' },
  },
  {
    path: '/warehouse/receiving/:id(\\d+)',
    name: 'warehouse-receive',
    component: () => import('@/views/warehouse/ReceiveOrderView.vue'),
    props: true,
    meta: { area: 'warehouse', touch: true, roles: AREA_ROLES.warehouse, title: 'receiving.listTitle' },
  },
  // The printable pick sheet: the counter prints it too.
  {
    path: '/warehouse/pick-lists/:id(\\d+)/sheet',
    name: 'warehouse-pick-sheet',
    component: () => import('@/views/warehouse/PickSheetView.vue'),
    meta: { area: 'warehouse', touch: true, roles: ['admin', 'counter', 'warehouse'], title: 'picking.sheet.title', bare: true },
  },
  // Cycle counts: the list and review open to reviewers too (the buyer, when the admin chose them); the
  // handheld count is the crew's.
  {
    path: '/warehouse/counts',
    name: 'warehouse-counts',
    component: () => import('@/views/warehouse/CountsView.vue'),
    meta: { area: 'warehouse', touch: true, roles: ['admin', 'warehouse', 'buyer'], title: 'counts.title' },
  },
  {
    path: '/warehouse/counts/history',
    name: 'warehouse-count-history',
    component: () => import('@/views/warehouse/CountHistoryView.vue'),
    meta: { area: 'warehouse', touch: true, roles: ['admin', 'warehouse', 'buyer'], title: 'counts.history.title' },
  },
  {
    path: '/warehouse/counts/:id(\\d+)',
    name: 'warehouse-count-review',
    component: () => import('@/views/warehouse/CountReviewView.vue'),
    meta: { area: 'warehouse', touch: true, roles: ['admin', 'warehouse', 'buyer'], title: 'counts.title' },
  },
  {
    path: '/warehouse/counts/:id(\\d+)/count',
    name: 'warehouse-count',
    component: () => import('@/views/warehouse/CountHandheldView.vue'),
    meta: { area: 'warehouse', touch: true, roles: AREA_ROLES.warehouse, title: 'counts.handheld.title', bare: true },
  },
]
