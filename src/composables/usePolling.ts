import { onBeforeUnmount, onMounted } from 'vue'

/**
 * Calls `tick` every `ms` while the page is open and visible (and once at once), so a status page
 * follows the warehouse's progress without reloading. A tick never overlaps the previous one.
 */
export function usePolling(tick: () => Promise<unknown>, ms = 4000) {
  let timer: ReturnType<typeof setInterval> | undefined
  let running = false
  async function run() {
    if (running || document.visibilityState === 'hidden') return
    running = true
    try {
      await tick()
    } catch {
      // the page shows the loader's own error; polling simply tries again next time
    } finally {
      running = false
    }
  }
  const onVisible = () => { if (document.visibilityState === 'visible') void run() }
  onMounted(() => {
    void run()
    timer = setInterval(run, ms)
    document.addEventListener('visibilitychange', onVisible)
  })
  onBeforeUnmount(() => {
    clearInterval(timer)
    document.removeEventListener('visibilitychange', onVisible)
  })
  return { refreshNow: run }
}
