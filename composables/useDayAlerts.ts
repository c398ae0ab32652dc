import { useVibrate, useWakeLock, useWebNotification } from '@vueuse/core'

export interface RunningTimer {
  key: string
  label: string
  endsAt: string
}

/**
 * The Canning day's alerts: when a timer ends — a sound, a vibration where the device has one,
 * a system notification if the person allowed it — once per timer; the nearest countdown in the
 * tab title; and the screen kept on (Screen Wake Lock) where the browser has it. Browsers play
 * sound and ask for notifications only after a tap, so `enable()` is called from a button.
 */
export function useDayAlerts(timers: Ref<readonly RunningTimer[]>, now: Ref<number>) {
  const wakeLock = useWakeLock()
  const notification = useWebNotification({ tag: 'shelfstead-day', renotify: true })
  const { vibrate, isSupported: canVibrate } = useVibrate({ pattern: [400, 150, 400, 150, 400] })
  const enabled = ref(false)
  const rung = new Set<string>()
  let audio: AudioContext | null = null

  /** Three short tones; a plain oscillator, so no sound file has to load. */
  function beep() {
    if (!audio) return
    const start = audio.currentTime
    for (let i = 0; i < 3; i++) {
      const tone = audio.createOscillator()
      const gain = audio.createGain()
      tone.frequency.value = 880
      gain.gain.setValueAtTime(0.25, start + i * 0.35)
      gain.gain.exponentialRampToValueAtTime(0.001, start + i * 0.35 + 0.3)
      tone.connect(gain).connect(audio.destination)
      tone.start(start + i * 0.35)
      tone.stop(start + i * 0.35 + 0.3)
    }
  }

  async function enable() {
    enabled.value = true
    audio ??= new AudioContext()
    await audio.resume()
    if (notification.isSupported.value && Notification.permission === 'default') await notification.ensurePermissions()
    if (wakeLock.isSupported.value) await wakeLock.request('screen').catch(() => undefined)
  }

  function ring(timer: RunningTimer) {
    beep()
    if (canVibrate.value) vibrate()
    if (notification.isSupported.value && notification.permissionGranted.value) {
      void notification.show({ title: 'Time is up', body: timer.label })
    }
  }

  // A timer that reaches its end while the page is open rings once.
  watch(now, (t) => {
    for (const timer of timers.value) {
      const id = `${timer.key}@${timer.endsAt}`
      if (t >= Date.parse(timer.endsAt) && !rung.has(id)) {
        rung.add(id)
        // One already over when the page opened does not ring again.
        if (t - Date.parse(timer.endsAt) < 5000) ring(timer)
      }
    }
  })

  const nearest = computed(() => [...timers.value].filter(x => Date.parse(x.endsAt) > now.value).sort((a, b) => Date.parse(a.endsAt) - Date.parse(b.endsAt))[0] ?? null)

  onMounted(() => {
    // Keep the screen on from the start where the browser allows it without a tap.
    if (wakeLock.isSupported.value) void wakeLock.request('screen').catch(() => undefined)
  })

  return {
    enable,
    enabled,
    nearest,
    screenKeptOn: computed(() => wakeLock.isActive.value),
    wakeLockSupported: wakeLock.isSupported,
  }
}
