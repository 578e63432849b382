import { computed } from 'vue'
import type { LengthUnit } from '@shared/units'
import { sessionApi } from '@/api/session'
import { useSessionStore } from '@/stores/session'

/** The signed-in user's length unit (in or mm); changing it here saves it to their profile. */
export function useLengthUnit() {
  const session = useSessionStore()
  const unit = computed<LengthUnit>({
    get: () => session.user?.unitPreference ?? 'in',
    set: (next) => {
      if (!session.user || session.user.unitPreference === next) return
      session.replaceUser({ ...session.user, unitPreference: next })
      // Best effort: the screen follows at once, the profile catches up.
      sessionApi.saveProfile({ unitPreference: next }).catch(() => undefined)
    },
  })
  return { unit }
}
