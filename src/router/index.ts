import { createRouter, createWebHistory, type RouteRecordRaw } from 'vue-router'
import './meta'
import { hasAnyRole } from '@shared/roles'
import { useSessionStore } from '@/stores/session'
import HomeView from '@/views/HomeView.vue'
import { adminRoutes } from './areas/admin'
import { counterRoutes } from './areas/counter'
import { purchasingRoutes } from './areas/purchasing'
import { stockRoutes } from './areas/stock'
import { warehouseRoutes } from './areas/warehouse'

const routes: RouteRecordRaw[] = [
  { path: '/', name: 'home', component: HomeView, meta: { title: 'shell.areas.home' } },
  {
    path: '/sign-in',
    name: 'sign-in',
    component: () => import('@/views/SignInView.vue'),
    meta: { public: true, bare: true, title: 'auth.title' },
  },
  { path: '/profile', name: 'profile', component: () => import('@/views/ProfileView.vue'), meta: { title: 'profile.title' } },
  ...stockRoutes,
  ...counterRoutes,
  ...warehouseRoutes,
  ...purchasingRoutes,
  ...adminRoutes,
  { path: '/:pathMatch(.*)*', name: 'not-found', component: () => import('@/views/NotFoundView.vue') },
]

export const router = createRouter({ history: createWebHistory(), routes })

// Signed-out visitors go to sign-in; a page outside the user's roles is not reachable.
router.beforeEach(async (to) => {
  const session = useSessionStore()
  if (!session.loaded) await session.load().catch(() => undefined)
  if (to.meta.public) {
    return session.signedIn && to.name === 'sign-in' ? { name: 'home' } : true
  }
  if (!session.signedIn) {
    return { name: 'sign-in', query: to.fullPath !== '/' ? { next: to.fullPath } : {} }
  }
  if (to.meta.roles && !hasAnyRole(session.user!.roles, to.meta.roles)) {
    return { name: 'home', query: { refused: '1' } }
  }
  return true
})
