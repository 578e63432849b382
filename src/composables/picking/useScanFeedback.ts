// What the picker sees and hears after each scan: a coloured banner and a tone made with Web Audio
// (no sound files): one short high beep when right, two low buzzes when wrong; a vibration where
// the device has one.
import { ref } from 'vue'

export interface Feedback {
  kind: 'ok' | 'error' | 'info'
  text: string
  /** Changes on every message, so the same text twice still flashes. */
  at: number
}

type AudioCtor = typeof AudioContext

export function useScanFeedback() {
  const feedback = ref<Feedback | null>(null)
  let audio: AudioContext | null = null

  function tone(freq: number, ms: number, type: OscillatorType, delayMs = 0) {
    try {
      const Ctor = (window.AudioContext ?? (window as unknown as { webkitAudioContext?: AudioCtor }).webkitAudioContext) as AudioCtor | undefined
      if (!Ctor) return
      audio ??= new Ctor()
      const start = audio.currentTime + delayMs / 1000
      const osc = audio.createOscillator()
      const gain = audio.createGain()
      osc.type = type
      osc.frequency.value = freq
      gain.gain.setValueAtTime(0.25, start)
      gain.gain.exponentialRampToValueAtTime(0.001, start + ms / 1000)
      osc.connect(gain).connect(audio.destination)
      osc.start(start)
      osc.stop(start + ms / 1000)
    } catch {
      // no sound on this device: the banner still shows
    }
  }

  const vibrate = (pattern: number | number[]) => navigator.vibrate?.(pattern)

  function ok(text: string) {
    feedback.value = { kind: 'ok', text, at: Date.now() }
    tone(1320, 90, 'sine')
    vibrate(30)
  }

  function error(text: string) {
    feedback.value = { kind: 'error', text, at: Date.now() }
    tone(220, 180, 'square')
    tone(180, 220, 'square', 240)
    vibrate([90, 60, 90])
  }

  function info(text: string) {
    feedback.value = { kind: 'info', text, at: Date.now() }
  }

  return { feedback, ok, error, info }
}
