import type { RouteRecordRaw } from 'vue-router'
import { AREA_ROLES } from '@shared/roles'

export const purchasingRoutes: RouteRecordRaw[] = [
  {
    path: '/purchasing',
    name: 'purchasing-home',
    component: () => import('@/views/AreaLandingView.vue'),
    props: { area: 'purchasing' },
    meta: { area: 'purchasing', roles: AREA_ROLES.purchasing, title: 'shell.areas.purchasing' },
  },
]
