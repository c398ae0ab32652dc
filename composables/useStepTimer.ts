interface RunningTimer {
  stepKey: string
  label: string
  startedAt: number
  minutes: number
}

/**
 * One countdown per plan for the step being worked on. It is kept in localStorage with its
 * start time, so a reload (or a phone that went to sleep) shows the true time left.
 */
export function useStepTimer(planKey: MaybeRefOrGetter<string>) {
  const storageKey = computed(() => `shelfstead-timer:${toValue(planKey)}`)
  const running = ref<RunningTimer | null>(null)
  const now = ref(Date.now())
  let tick: ReturnType<typeof setInterval> | undefined

  function load() {
    if (!import.meta.client) return
    try {
      const raw = localStorage.getItem(storageKey.value)
      running.value = raw ? JSON.parse(raw) as RunningTimer : null
    }
    catch {
      running.value = null
    }
  }

  function start(stepKey: string, label: string, minutes: number) {
    running.value = { stepKey, label, minutes, startedAt: Date.now() }
    localStorage.setItem(storageKey.value, JSON.stringify(running.value))
    now.value = Date.now()
  }

  function stop() {
    running.value = null
    localStorage.removeItem(storageKey.value)
  }

  const remainingMs = computed(() => {
    if (!running.value) return 0
    return Math.max(0, running.value.startedAt + running.value.minutes * 60_000 - now.value)
  })
  const finished = computed(() => Boolean(running.value) && remainingMs.value === 0)
  const display = computed(() => {
    const total = Math.ceil(remainingMs.value / 1000)
    const h = Math.floor(total / 3600)
    const m = Math.floor((total % 3600) / 60)
    const s = total % 60
    const mm = String(m).padStart(h ? 2 : 1, '0')
    return `${h ? `${h}:` : ''}${mm}:${String(s).padStart(2, '0')}`
  })

  onMounted(() => {
    load()
    tick = setInterval(() => { now.value = Date.now() }, 1000)
  })
  onBeforeUnmount(() => clearInterval(tick))
  watch(storageKey, load)

  return { running, remainingMs, finished, display, start, stop }
}
