import { createRouter, createWebHistory, type RouteLocationNormalized, type RouteRecordRaw } from 'vue-router'
import './meta'
import { openingData } from '@shared/pageData'
import { hasAnyRole } from '@shared/roles'
import { prefetchGet } from '@/api/client'
import { BOOT_AREAS, currentLocale, lastLocale, loadMessages, setLocale } from '@/i18n'
import { useSessionStore } from '@/stores/session'
import { adminRoutes } from './areas/admin'
import { counterRoutes } from './areas/counter'
import { purchasingRoutes } from './areas/purchasing'
import { stockRoutes } from './areas/stock'
import { warehouseRoutes } from './areas/warehouse'

const routes: RouteRecordRaw[] = [
  { path: '/', name: 'home', component: () => import('@/views/HomeView.vue'), meta: { title: 'shell.areas.home' } },
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

type Lazy = () => Promise<unknown>
/** A route's component given as `() => import(…)` (what vue-router itself resolves after the guards). */
const isLazy = (c: unknown): c is Lazy => typeof c === 'function' && !('displayName' in c) && !('props' in c) && !('__vccOpts' in c)

/**
 * Starts what a page needs side by side, before the session has even answered: its code (with the
 * chunks it imports, such as the grid), the data it opens with (shared/pageData.ts; on a cold load the
 * server's HTML has already asked for the same addresses), and its messages.
 * vue-router asks for the same code after the guard and gets the module already loading or loaded.
 */
function startPageLoads(to: RouteLocationNormalized, locale: Parameters<typeof loadMessages>[1]): Promise<void> {
  for (const record of to.matched) {
    for (const c of Object.values(record.components ?? {})) if (isLazy(c)) c().catch(() => undefined)
  }
  for (const path of openingData(to.path, to.query)) prefetchGet(path)
  return messagesFor(to, locale)
}

/** The sign-in page needs the boot areas; any signed-in page every area of the user's language. */
const messagesFor = (to: RouteLocationNormalized, locale: Parameters<typeof loadMessages>[1]) =>
  loadMessages(to.meta.public ? BOOT_AREAS : 'all', locale).catch(() => undefined)

// Signed-out visitors go to sign-in; a page outside the user's roles is not reachable.
router.beforeEach(async (to) => {
  const session = useSessionStore()
  // Before the session answers, a signed-in page starts with English (every language's fallback, named in its HTML
  // too) and loads the person's own language once the session names it, below; only a public page guesses from the
  // language this browser last used (reading it opens the browser's storage, which holds up a cold load).
  const early = startPageLoads(to, session.user?.locale ?? (to.meta.public ? lastLocale() : 'en'))
  if (!session.loaded) await session.load().catch(() => undefined)
  if (to.meta.public) {
    if (session.signedIn && to.name === 'sign-in') return { name: 'home' }
  } else if (!session.signedIn) {
    return { name: 'sign-in', query: to.fullPath !== '/' ? { next: to.fullPath } : {} }
  } else if (to.meta.roles && !hasAnyRole(session.user!.roles, to.meta.roles)) {
    return { name: 'home', query: { refused: '1' } }
  }
  await Promise.all([early, messagesFor(to, session.user?.locale ?? 'en')])
  // The page is set up in the user's language: words it computes once (grid columns, the grid's own
  // words) would otherwise stay in the language the page started in.
  if (session.user && session.user.locale !== currentLocale()) await setLocale(session.user.locale)
  return true
})
