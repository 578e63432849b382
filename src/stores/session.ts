import { defineStore } from 'pinia'
import { computed, ref } from 'vue'
import type { SessionUser } from '@shared/schemas/auth'
import { areasFor, hasAnyRole, type Role } from '@shared/roles'
import { sessionApi } from '@/api/session'
import { resetAreaStores } from './areaReset'

/**
 * The signed-in user, shared by the shell, the guard and every page. Signing out, a session that ended, and
 * signing in as someone else empty the area stores (src/stores/areaReset.ts).
 */
export const useSessionStore = defineStore('session', () => {
  const user = ref<SessionUser | null>(null)
  const loaded = ref(false)
  /** The server runs the demo scenario: the sign-in page shows the demo sign-ins. */
  const demo = ref(false)

  const signedIn = computed(() => user.value !== null)
  const areas = computed(() => (user.value ? areasFor(user.value.roles) : []))
  const can = (roles: readonly Role[]) => !!user.value && hasAnyRole(user.value.roles, roles)

  async function load(): Promise<void> {
    try {
      const res = await sessionApi.current()
      if (user.value && res.user?.id !== user.value.id) resetAreaStores()
      user.value = res.user
      demo.value = res.demo
    } finally {
      loaded.value = true
    }
  }

  async function signIn(username: string, password: string): Promise<void> {
    const res = await sessionApi.signIn(username, password)
    resetAreaStores()
    user.value = res.user
    loaded.value = true
  }

  async function signOut(): Promise<void> {
    try {
      await sessionApi.signOut()
    } finally {
      forget()
    }
  }

  function forget(): void {
    user.value = null
    resetAreaStores()
  }

  function replaceUser(next: SessionUser): void {
    user.value = next
  }

  /** How many times the same person signed in again over a page after the session ended (src/components/shell/SessionResume.vue). */
  const resumes = ref(0)
  function resume(next: SessionUser): void {
    user.value = next
    resumes.value++
  }

  return { user, loaded, demo, signedIn, areas, can, load, signIn, signOut, forget, replaceUser, resumes, resume }
})
