import type { RouteRecordRaw } from 'vue-router'
import { AREA_ROLES } from '@shared/roles'

export const counterRoutes: RouteRecordRaw[] = [
  {
    path: '/counter',
    name: 'counter-home',
    component: () => import('@/views/AreaLandingView.vue'),
    props: { area: 'counter' },
    meta: { area: 'counter', roles: AREA_ROLES.counter, title: 'shell.areas.counter' },
  },
]
