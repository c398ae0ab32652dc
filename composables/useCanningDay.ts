import { useIntervalFn, useOnline, useStorage } from '@vueuse/core'
import type { ApiAnswer } from '~/utils/api'
import { applyEvent, DayRefusal, type DayEvent, type DayState } from '~/utils/day/state'
import type { DayEventKind } from '~/utils/vocabulary'

export type DayAnswer = ApiAnswer<'/api/households/:id/plans/:planId/day'>
type StartedDay = Extract<DayAnswer, { started: true }>

/** An action pressed on this device and not yet accepted by the server. */
interface QueuedAction {
  clientId: string
  target: string
  kind: DayEventKind
  /** The server's time when it was pressed, by this device's reckoning. */
  at: string
  /** This device's clock when it was pressed: an action sent at once lets the server stamp it. */
  pressedAt: number
}

/** How often the day is read again, so every device shows what the others pressed. */
const POLL_MS = 3000
/** An action sent within this long of being pressed takes the server's own time. */
const FRESH_MS = 5000

/**
 * The Canning day of a saved plan, shared by the household's devices. The day is read every
 * few seconds; an action is checked on the device with the same rules as the server's, shown
 * at once, kept in this browser's storage until the server has it (so it survives a reload and
 * waits out a lost connection), and sent in order when the connection is back. Timers count from
 * the server's clock: every answer carries its "now", and the difference to this device's clock
 * is kept (the same rule as useClock).
 */
export function useCanningDay(planId: Ref<string>) {
  const householdId = useAuth().activeId
  const base = () => `/api/households/${householdId.value}/plans/${planId.value}/day` as const
  const answer = ref<DayAnswer | null>(null)
  const loadError = ref<string | null>(null)
  /** The last action the server (or this device) refused, with why. */
  const refused = ref<string | null>(null)
  const skewMs = ref(0)
  const online = useOnline()
  /**
   * The last send failed for want of a connection. A phone may say it is online with no way
   * through (a page opened again from the service worker, weak Wi-Fi): the day then says so too.
   */
  const sendFailed = ref(false)
  const queue = useStorage<QueuedAction[]>(() => `shelfstead-day-queue:${planId.value}`, [])
  const sending = ref(false)
  const tick = ref(Date.now())

  function receive(a: DayAnswer) {
    answer.value = a
    skewMs.value = Date.parse(a.now) - Date.now()
    loadError.value = null
  }
  async function refresh() {
    try {
      receive(await $fetch<DayAnswer>(base()))
    }
    catch (error) {
      // Offline: keep the last answer and carry on counting; any other failure is said.
      if (isReachable(error)) loadError.value = apiError(error).message
    }
  }
  /** Whether the server answered at all (a refusal), as against a lost connection. */
  const isReachable = (error: unknown) => typeof (error as { statusCode?: number }).statusCode === 'number' && (error as { statusCode: number }).statusCode > 0

  const serverNow = () => Date.now() + skewMs.value
  useIntervalFn(() => { tick.value = Date.now() }, 1000)
  /** The server's time now, ticking every second. */
  const now = computed(() => tick.value + skewMs.value)

  const day = computed<StartedDay | null>(() => (answer.value?.started ? answer.value : null))
  const asEvent = (q: QueuedAction): DayEvent => ({ id: q.clientId, target: q.target, kind: q.kind, at: q.at, by: null })
  /** The server's state with this device's unsent actions applied. */
  const state = computed<DayState | null>(() => {
    const d = day.value
    if (!d) return null
    let s = d.state
    for (const q of queue.value) {
      try {
        s = applyEvent(d.snapshot, s, asEvent(q))
      }
      catch {
        // The server will refuse it too, and say why when it is sent.
      }
    }
    return s
  })

  async function flush() {
    if (sending.value || !online.value) return
    sending.value = true
    try {
      while (queue.value.length) {
        const q = queue.value[0]!
        const fresh = Date.now() - q.pressedAt < FRESH_MS
        try {
          receive(await $fetch<DayAnswer>(`${base()}/events`, { method: 'POST', body: { clientId: q.clientId, target: q.target, kind: q.kind, ...(fresh ? {} : { at: q.at }) } }))
          queue.value = queue.value.slice(1)
          sendFailed.value = false
        }
        catch (error) {
          if (!isReachable(error)) {
            sendFailed.value = true
            break
          }
          sendFailed.value = false
          // Refused (another device moved the load first, or it came too late): drop it and say why.
          refused.value = apiError(error).message
          queue.value = queue.value.slice(1)
          await refresh()
        }
      }
    }
    finally {
      sending.value = false
    }
  }

  /** Press an action: checked here first, shown at once, sent when the connection allows. */
  async function act(target: string, kind: DayEventKind) {
    refused.value = null
    const d = day.value
    if (!d || !state.value) return
    const q: QueuedAction = { clientId: crypto.randomUUID(), target, kind, at: new Date(serverNow()).toISOString(), pressedAt: Date.now() }
    if (kind === 'undo') {
      if (!online.value || queue.value.length) {
        refused.value = 'Undo needs the connection and every earlier action sent; try again in a moment.'
        return
      }
    }
    else {
      try {
        applyEvent(d.snapshot, state.value, asEvent(q))
      }
      catch (error) {
        if (error instanceof DayRefusal) {
          refused.value = error.message
          return
        }
        throw error
      }
    }
    queue.value = [...queue.value, q]
    await flush()
  }

  async function start() {
    receive(await $fetch<DayAnswer>(base(), { method: 'POST' }))
  }

  useIntervalFn(() => {
    if (!online.value || document.visibilityState !== 'visible') return
    void refresh().then(flush)
  }, POLL_MS)
  watch(online, (up) => { if (up) void flush().then(refresh) })
  onMounted(() => { void refresh().then(flush) })

  return {
    answer,
    day,
    state,
    now,
    online: computed(() => online.value && !sendFailed.value),
    pending: computed(() => queue.value.length),
    loadError,
    refused,
    act,
    start,
    refresh,
  }
}
