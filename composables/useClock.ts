import { localTimeZone } from '~/utils/time'

/**
 * The household's clock: its time zone and the server's "now" (which the test clock moves),
 * both from the household answer. `now()` carries the server's time forward by the time the
 * page has been open, so a form's default "started" is the server's now, not the device's.
 */
export function useClock() {
  const { household } = useHousehold()
  const zone = computed(() => household.data.value?.timeZone ?? localTimeZone())
  const skewMs = computed(() => {
    const served = household.data.value?.now
    return served ? Date.parse(served) - Date.now() : 0
  })
  const now = () => new Date(Date.now() + skewMs.value)
  return { zone, now }
}
