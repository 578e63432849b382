import type { RouteRecordRaw } from 'vue-router'
import { AREA_ROLES } from '@shared/roles'

export const stockRoutes: RouteRecordRaw[] = [
  {
    path: '/stock',
    name: 'stock-home',
    component: () => import('@/views/AreaLandingView.vue'),
    props: { area: 'stock' },
    meta: { area: 'stock', roles: AREA_ROLES.stock, title: 'shell.areas.stock' },
  },
]
