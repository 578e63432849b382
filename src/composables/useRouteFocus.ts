// After a page change inside the app, focus goes to the new page's heading, so a screen reader announces
// the new page and the keyboard starts from its top (WCAG 2.2 SC 2.4.3 Focus Order). A page that put focus
// in one of its own fields (a scan box) keeps it. Pages that load their data first show the heading late:
// focus waits on the main region until it appears, unless the user has moved on meanwhile.
import { nextTick, type Ref } from 'vue'
import { useRouter } from 'vue-router'

const HEADING_WAIT_MS = 5000

export function useRouteFocus(main: Ref<HTMLElement | null>) {
  const router = useRouter()
  router.afterEach((to, from, failure) => {
    if (failure || !from.matched.length || to.path === from.path) return
    void nextTick(() => requestAnimationFrame(() => focusHeading(main.value)))
  })
}

function focusOn(el: HTMLElement) {
  if (!el.hasAttribute('tabindex')) el.setAttribute('tabindex', '-1')
  el.focus({ preventScroll: true })
}

function focusHeading(main: HTMLElement | null) {
  if (!main) return
  const active = document.activeElement
  if (active && active !== document.body && main.contains(active)) return
  const heading = main.querySelector<HTMLElement>('h1')
  if (heading) return focusOn(heading)
  focusOn(main)
  const watcher = new MutationObserver(() => {
    const late = main.querySelector<HTMLElement>('h1')
    if (!late) return
    watcher.disconnect()
    if (document.activeElement === main) focusOn(late)
  })
  watcher.observe(main, { childList: true, subtree: true })
  setTimeout(() => watcher.disconnect(), HEADING_WAIT_MS)
}
