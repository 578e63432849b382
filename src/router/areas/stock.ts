import type { RouteRecordRaw } from 'vue-router'
import { AREA_ROLES } from '@shared/roles'

export const stockRoutes: RouteRecordRaw[] = [
  {
    path: '/stock',
    name: 'stock-home',
    component: () => import('@/views/stock/StockHomeView.vue'),
    meta: { area: 'stock', roles: AREA_ROLES.stock, title: 'shell.areas.stock' },
  },
  // Stock levels, bins, ledger, transfers and the stock forms (stock views).
  {
    path: '/stock/overview',
    name: 'stock-overview',
    component: () => import('@/views/stock/StockOverviewView.vue'),
    meta: { area: 'stock', roles: AREA_ROLES.stock, title: 'stock.overview.title' },
  },
  {
    path: '/stock/bins',
    name: 'stock-bins',
    component: () => import('@/views/stock/StockBinsView.vue'),
    meta: { area: 'stock', roles: AREA_ROLES.stock, title: 'stock.bins.title' },
  },
  {
    path: '/stock/movements',
    alias: '/stock/ledger',
    name: 'stock-ledger',
    component: () => import('@/views/stock/StockLedgerView.vue'),
    meta: { area: 'stock', roles: AREA_ROLES.stock, title: 'stock.ledger.title' },
  },
  {
    path: '/stock/transfers',
    name: 'stock-transfers',
    component: () => import('@/views/stock/StockTransfersView.vue'),
    meta: { area: 'stock', roles: AREA_ROLES.stock, title: 'stock.transfers.title' },
  },
  {
    path: '/stock/adjust',
    name: 'stock-adjust',
    component: () => import('@/views/stock/StockAdjustView.vue'),
    meta: { touch: true, area: 'stock', roles: ['admin', 'warehouse'], title: 'stock.adjust.title' },
  },
  {
    path: '/stock/move',
    name: 'stock-move',
    component: () => import('@/views/stock/StockMoveView.vue'),
    meta: { touch: true, area: 'stock', roles: ['admin', 'warehouse'], title: 'stock.move.title' },
  },
  // Catalog, warehouses and labels (catalog screens).
  {
    path: '/stock/items',
    name: 'stock-catalog',
    component: () => import('@/views/stock/CatalogView.vue'),
    meta: { area: 'stock', roles: AREA_ROLES.stock, title: 'catalog.title' },
  },
  {
    path: '/stock/items/new',
    name: 'stock-item-new',
    component: () => import('@/views/stock/ItemFormView.vue'),
    meta: { area: 'stock', roles: ['admin'], title: 'catalog.form.newTitle' },
  },
  {
    path: '/stock/items/import',
    name: 'stock-item-import',
    component: () => import('@/views/stock/ItemImportView.vue'),
    meta: { area: 'stock', roles: ['admin'], title: 'catalog.import.title' },
  },
  {
    path: '/stock/items/:id(\\d+)',
    name: 'stock-item',
    component: () => import('@/views/stock/ItemView.vue'),
    props: (route) => ({ id: Number(route.params.id) }),
    meta: { touch: true, area: 'stock', roles: AREA_ROLES.stock, title: 'catalog.item.title' },
  },
  {
    path: '/stock/items/:id(\\d+)/edit',
    name: 'stock-item-edit',
    component: () => import('@/views/stock/ItemFormView.vue'),
    props: (route) => ({ id: Number(route.params.id) }),
    meta: { area: 'stock', roles: ['admin'], title: 'catalog.form.editTitle' },
  },
  {
    path: '/stock/warehouses',
    name: 'stock-warehouses',
    component: () => import('@/views/stock/WarehousesView.vue'),
    meta: { area: 'stock', roles: AREA_ROLES.stock, title: 'catalog.warehouses.title' },
  },
  {
    path: '/stock/labels',
    name: 'stock-labels',
    component: () => import('@/views/stock/LabelsView.vue'),
    meta: { area: 'stock', roles: AREA_ROLES.stock, title: 'catalog.labels.title', bare: true },
  },
]
