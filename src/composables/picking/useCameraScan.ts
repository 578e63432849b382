// Camera scanning where the browser allows it (a secure page with a camera): ZXing reads the
// video and hands each code to the same handler as the keyboard-wedge scanner. GS1-128 codes keep
// their FNC1 (as ]C1 and GS), so lot and count parse as from a wedge.
import { onBeforeUnmount, onMounted, ref } from 'vue'
import type { IScannerControls } from '@zxing/browser'

export function useCameraScan(onText: (text: string) => void) {
  const available = ref(false)
  const active = ref(false)
  const failed = ref(false)
  let controls: IScannerControls | null = null

  onMounted(async () => {
    try {
      const devices = (await navigator.mediaDevices?.enumerateDevices?.()) ?? []
      available.value = window.isSecureContext && devices.some((d) => d.kind === 'videoinput')
    } catch {
      available.value = false
    }
  })

  function stop() {
    controls?.stop()
    controls = null
    active.value = false
  }

  async function start(video: HTMLVideoElement) {
    failed.value = false
    try {
      const [{ BrowserMultiFormatReader }, { DecodeHintType }] = await Promise.all([import('@zxing/browser'), import('@zxing/library')])
      const reader = new BrowserMultiFormatReader(new Map([[DecodeHintType.ASSUME_GS1, true]]))
      active.value = true
      controls = await reader.decodeFromVideoDevice(undefined, video, (result) => {
        if (!result) return
        stop()
        onText(result.getText())
      })
    } catch {
      failed.value = true
      stop()
    }
  }

  onBeforeUnmount(stop)
  return { available, active, failed, start, stop }
}
