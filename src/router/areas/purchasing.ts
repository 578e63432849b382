import type { RouteRecordRaw } from 'vue-router'
import { AREA_ROLES } from '@shared/roles'

export const purchasingRoutes: RouteRecordRaw[] = [
  {
    path: '/purchasing',
    name: 'purchasing-home',
    component: () => import('@/views/purchasing/PurchasingHomeView.vue'),
    meta: { area: 'purchasing', roles: AREA_ROLES.purchasing, title: 'shell.areas.purchasing' },
  },
  {
    path: '/purchasing/orders',
    name: 'purchasing-orders',
    component: () => import('@/views/purchasing/PurchaseOrdersView.vue'),
    meta: { area: 'purchasing', roles: AREA_ROLES.purchasing, title: 'purchasing.ordersTitle' },
  },
  {
    path: '/purchasing/orders/:id(\\d+)',
    name: 'purchasing-order',
    component: () => import('@/views/purchasing/PurchaseOrderView.vue'),
    props: true,
    meta: { area: 'purchasing', roles: AREA_ROLES.purchasing, title: 'purchasing.ordersTitle' },
  },
  {
    path: '/purchasing/ready-to-order',
    name: 'purchasing-suggestions',
    component: () => import('@/views/purchasing/PurchaseSuggestionsView.vue'),
    meta: { area: 'purchasing', roles: AREA_ROLES.purchasing, title: 'purchasing.suggestionsTitle' },
  },
  {
    path: '/purchasing/special-orders',
    name: 'purchasing-special-orders',
    component: () => import('@/views/purchasing/SpecialOrdersView.vue'),
    meta: { area: 'purchasing', roles: AREA_ROLES.purchasing, title: 'purchasing.specialTitle' },
  },
  {
    path: '/purchasing/vendors',
    name: 'purchasing-vendors',
    component: () => import('@/views/purchasing/VendorsView.vue'),
    meta: { area: 'purchasing', roles: AREA_ROLES.purchasing, title: 'purchasing.vendorsTitle' },
  },
  {
    path: '/purchasing/vendors/:id(\\d+)',
    name: 'purchasing-vendor',
    component: () => import('@/views/purchasing/VendorView.vue'),
    props: true,
    meta: { area: 'purchasing', roles: AREA_ROLES.purchasing, title: 'purchasing.vendorsTitle' },
  },
  {
    path: '/purchasing/reorder',
    name: 'purchasing-reorder',
    component: () => import('@/views/purchasing/ReorderView.vue'),
    meta: { area: 'purchasing', roles: AREA_ROLES.purchasing, title: 'reorder.title' },
  },
  {
    path: '/purchasing/reorder/policies',
    name: 'purchasing-reorder-policies',
    component: () => import('@/views/purchasing/ReorderPoliciesView.vue'),
    meta: { area: 'purchasing', roles: AREA_ROLES.purchasing, title: 'reorder.policiesTitle' },
  },
  {
    path: '/purchasing/reorder/abc',
    name: 'purchasing-reorder-abc',
    component: () => import('@/views/purchasing/ReorderAbcView.vue'),
    meta: { area: 'purchasing', roles: AREA_ROLES.purchasing, title: 'reorder.abcTitle' },
  },
  {
    path: '/purchasing/reports',
    name: 'purchasing-reports',
    component: () => import('@/views/purchasing/ReportsView.vue'),
    meta: { area: 'purchasing', roles: AREA_ROLES.purchasing, title: 'reports.title' },
  },
  {
    path: '/purchasing/stock-value',
    name: 'purchasing-stock-value',
    component: () => import('@/views/purchasing/StockValueView.vue'),
    meta: { area: 'purchasing', roles: AREA_ROLES.purchasing, title: 'reports.valuation.title' },
  },
]
