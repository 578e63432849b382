import type { RouteRecordRaw } from 'vue-router'
import { AREA_ROLES } from '@shared/roles'

export const warehouseRoutes: RouteRecordRaw[] = [
  {
    path: '/warehouse',
    name: 'warehouse-home',
    component: () => import('@/views/AreaLandingView.vue'),
    props: { area: 'warehouse' },
    meta: { area: 'warehouse', roles: AREA_ROLES.warehouse, title: 'shell.areas.warehouse' },
  },
]
