import type { RouteRecordRaw } from 'vue-router'
import { AREA_ROLES } from '@shared/roles'

export const adminRoutes: RouteRecordRaw[] = [
  {
    path: '/admin',
    name: 'admin-home',
    component: () => import('@/views/admin/AdminHomeView.vue'),
    meta: { area: 'admin', roles: AREA_ROLES.admin, title: 'shell.areas.admin' },
  },
  {
    path: '/admin/users',
    name: 'admin-users',
    component: () => import('@/views/admin/UsersView.vue'),
    meta: { area: 'admin', roles: AREA_ROLES.admin, title: 'admin.usersTitle' },
  },
  {
    path: '/admin/outbox',
    name: 'admin-outbox',
    component: () => import('@/views/admin/OutboxView.vue'),
    meta: { area: 'admin', roles: AREA_ROLES.admin, title: 'purchasing.outboxTitle' },
  },
  {
    path: '/admin/audit',
    name: 'admin-audit',
    component: () => import('@/views/admin/AuditTrailView.vue'),
    meta: { area: 'admin', roles: AREA_ROLES.admin, title: 'audit.title' },
  },
  {
    path: '/admin/company',
    name: 'admin-company',
    component: () => import('@/views/admin/CompanyProfileView.vue'),
    meta: { area: 'admin', roles: AREA_ROLES.admin, title: 'admin.companyTitle' },
  },
  {
    path: '/admin/purchasing-settings',
    name: 'admin-purchasing-settings',
    component: () => import('@/views/admin/PurchasingSettingsView.vue'),
    meta: { area: 'admin', roles: AREA_ROLES.admin, title: 'purchasing.settingsTitle' },
  },
  {
    path: '/admin/imports',
    name: 'admin-imports',
    component: () => import('@/views/golive/DataImportView.vue'),
    meta: { area: 'admin', roles: AREA_ROLES.admin, title: 'golive.imports.title' },
  },
  {
    path: '/admin/selling-prices',
    name: 'admin-selling-prices',
    component: () => import('@/views/admin/SellingPricesView.vue'),
    meta: { area: 'admin', roles: AREA_ROLES.admin, title: 'sales.pricesTitle' },
  },
  {
    path: '/setup',
    name: 'setup-checklist',
    component: () => import('@/views/golive/SetupChecklistView.vue'),
    meta: { area: 'admin', roles: AREA_ROLES.admin, title: 'golive.setup.title' },
  },
]
