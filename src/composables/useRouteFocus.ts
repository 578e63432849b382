// After a page change inside the app, focus goes to the new page's heading, so a screen reader announces
// the new page and the keyboard starts from its top (WCAG 2.4.3 focus order). A page that put focus in
// one of its own fields (a scan box) keeps it.
import { nextTick, type Ref } from 'vue'
import { useRouter } from 'vue-router'

export function useRouteFocus(main: Ref<HTMLElement | null>) {
  const router = useRouter()
  router.afterEach((to, from, failure) => {
    if (failure || !from.matched.length || to.path === from.path) return
    void nextTick(() => requestAnimationFrame(() => focusHeading(main.value)))
  })
}

function focusHeading(main: HTMLElement | null) {
  if (!main) return
  const active = document.activeElement
  if (active && active !== document.body && main.contains(active)) return
  const target = main.querySelector<HTMLElement>('h1') ?? main
  if (!target.hasAttribute('tabindex')) target.setAttribute('tabindex', '-1')
  target.focus({ preventScroll: true })
}
