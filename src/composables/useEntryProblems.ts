import { computed, inject, onBeforeUnmount, provide, reactive, ref, type ComputedRef, type InjectionKey, type Ref } from 'vue'

// A field that holds text Lumenyard cannot accept (a length it cannot read, a number out of range, a fraction
// where whole units are counted) keeps its last good value in the model and shows the problem beside itself.
// The form around it must know: it refuses to send while any field has a problem (nothing clamped or stale
// goes to the server), and a form that computes from the model (the takeoff editor) says its figures are
// for values the user no longer sees. The form provides this registry; each field reports itself in it.
interface EntryProblems {
  set(field: symbol, bad: boolean, focus?: () => void): void
  count: ComputedRef<number>
  /** Set when the form tried to send: every field shows its problem, touched or not. */
  revealed: Ref<boolean>
}

const KEY: InjectionKey<EntryProblems> = Symbol('entryProblems')

export interface EntryProblemsGuard {
  /** How many fields hold a problem right now. */
  count: ComputedRef<number>
  /** Before sending: true when every field is good; else shows every problem, focuses the first field with one, and answers false. */
  ready(): boolean
}

/** In the form: the fields' problems, and the guard to call before sending. */
export function provideEntryProblems(): EntryProblemsGuard {
  const bad = reactive(new Map<symbol, (() => void) | undefined>())
  const revealed = ref(false)
  const registry: EntryProblems = {
    set: (field, isBad, focus) => (isBad ? bad.set(field, focus) : bad.delete(field)),
    count: computed(() => bad.size),
    revealed,
  }
  provide(KEY, registry)
  return {
    count: registry.count,
    ready() {
      if (!bad.size) return true
      revealed.value = true
      bad.values().next().value?.()
      return false
    },
  }
}

/** In a field: report whether it holds a problem (a no-op outside such a form), and whether the form asked to show them all. */
export function useEntryProblemReport(focus?: () => void): { report: (bad: boolean) => void; revealed: Ref<boolean> } {
  const registry = inject(KEY, null)
  const field = Symbol('entryField')
  onBeforeUnmount(() => registry?.set(field, false))
  return { report: (bad) => registry?.set(field, bad, focus), revealed: registry?.revealed ?? ref(false) }
}
