import type { RouteRecordRaw } from 'vue-router'
import { AREA_ROLES } from '@shared/roles'

export const adminRoutes: RouteRecordRaw[] = [
  {
    path: '/admin',
    redirect: { name: 'admin-users' },
  },
  {
    path: '/admin/users',
    name: 'admin-users',
    component: () => import('@/views/admin/UsersView.vue'),
    meta: { area: 'admin', roles: AREA_ROLES.admin, title: 'admin.usersTitle' },
  },
]
