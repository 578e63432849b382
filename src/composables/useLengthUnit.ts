import { computed } from 'vue'
import type { LengthUnit } from '@shared/units'
import { api } from '@/api/client'
import { useSessionStore } from '@/stores/session'
import type { SessionUser } from '@shared/schemas/auth'

/** The signed-in user's length unit (in or mm); changing it here saves it to their profile. */
export function useLengthUnit() {
  const session = useSessionStore()
  const unit = computed<LengthUnit>({
    get: () => session.user?.unitPreference ?? 'in',
    set: (next) => {
      if (!session.user || session.user.unitPreference === next) return
      session.replaceUser({ ...session.user, unitPreference: next })
      // Best effort: the screen follows at once, the profile catches up.
      api.patch<{ user: SessionUser }>('/profile', { unitPreference: next }).catch(() => undefined)
    },
  })
  return { unit }
}
