import { computed, inject, onBeforeUnmount, provide, reactive, type ComputedRef, type InjectionKey } from 'vue'

// Length fields that hold text Lumenyard cannot read keep their last good value in the model; a form
// that computes from the model (the takeoff editor) must know, or it would show figures for a value the
// user no longer sees. The form provides this registry; each length field reports itself in it.
interface LengthProblems {
  set(field: symbol, bad: boolean): void
  count: ComputedRef<number>
}

const KEY: InjectionKey<LengthProblems> = Symbol('lengthProblems')

/** In the form: how many length fields hold unreadable text right now. */
export function provideLengthProblems(): ComputedRef<number> {
  const bad = reactive(new Set<symbol>())
  const registry: LengthProblems = {
    set: (field, isBad) => (isBad ? bad.add(field) : bad.delete(field)),
    count: computed(() => bad.size),
  }
  provide(KEY, registry)
  return registry.count
}

/** In a length field: report whether its text is unreadable (no-op outside such a form). */
export function useLengthProblemReport(): (bad: boolean) => void {
  const registry = inject(KEY, null)
  const field = Symbol('lengthField')
  onBeforeUnmount(() => registry?.set(field, false))
  return (bad) => registry?.set(field, bad)
}
