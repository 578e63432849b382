// Area stores hold one user's data (catalog, warehouses): each registers how to empty itself here, and the
// session store runs them all when the user signs out, the session ends, or someone else signs in, so the
// next person on the same browser never sees the previous one's data.
import { forgetPrefetched } from '@/api/client'

const resets = new Set<() => void>()

export function resetOnSignOut(reset: () => void): void {
  resets.add(reset)
}

export function resetAreaStores(): void {
  forgetPrefetched()
  for (const reset of resets) reset()
}
