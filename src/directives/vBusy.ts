// v-busy="flag": a loading mask over the element while `flag` is true, shown only when the wait lasts.
//
// Why not the component library's own v-loading: it makes its mask visible a tick after creating it, so a
// load that ends within that tick (a form with nothing to fetch, an answer from cache) closes the mask
// before it shows, and the mask then appears over data that has already arrived and stays until the
// library's 400 ms fallback timer removes it, covering the list someone is about to click or has focused.
// Here a mask is created only once the wait has lasted SHOW_AFTER_MS; a quick load shows none at all.
// While the flag is true the element says so to assistive technology (aria-busy).
import type { Directive } from 'vue'
import { ElLoadingService, type LoadingInstance } from 'element-plus'
import 'element-plus/theme-chalk/el-loading.css'

/**
 * How long a wait lasts before a mask shows. Under about a third of a second an answer reads as immediate
 * and a flash of spinner is only noise. (common practice: response-time limits of 0.1 s and 1 s)
 */
export const SHOW_AFTER_MS = 300

interface BusyState {
  timer?: ReturnType<typeof setTimeout>
  mask?: LoadingInstance
}
const STATE = new WeakMap<HTMLElement, BusyState>()

function set(el: HTMLElement, on: boolean) {
  const state = STATE.get(el) ?? {}
  STATE.set(el, state)
  if (on) {
    el.setAttribute('aria-busy', 'true')
    if (state.timer === undefined && !state.mask) {
      state.timer = setTimeout(() => {
        state.timer = undefined
        state.mask = ElLoadingService({ target: el })
      }, SHOW_AFTER_MS)
    }
    return
  }
  el.removeAttribute('aria-busy')
  clearTimeout(state.timer)
  state.timer = undefined
  state.mask?.close()
  state.mask = undefined
}

export const vBusy: Directive<HTMLElement, boolean | null | undefined> = {
  mounted: (el, { value }) => set(el, !!value),
  updated: (el, { value, oldValue }) => {
    if (!!value !== !!oldValue) set(el, !!value)
  },
  unmounted: (el) => set(el, false),
}

declare module 'vue' {
  interface GlobalDirectives {
    vBusy: typeof vBusy
  }
}
