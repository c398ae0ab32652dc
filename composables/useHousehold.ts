import type { UnitSystem } from '~/utils/planning'
import type { ApiAnswer } from '~/utils/api'
import { dataKeys } from '~/utils/dataKeys'
import type { HouseholdSettingsInput } from '~/utils/schemas/household'

export type HouseholdView = ApiAnswer<'/api/households/:id'>

/** The active household's settings (name, altitude, units, store price), saving them, and its backup file. */
export function useHousehold() {
  const auth = useAuth()
  const { id, options } = useHouseholdRead(dataKeys.household)
  const household = useFetch(() => `/api/households/${id.value}` as const, options)
  const units = computed<UnitSystem>(() => household.data.value?.unitSystem ?? 'us')

  async function save(values: HouseholdSettingsInput) {
    await $fetch(`/api/households/${id.value}`, { method: 'PATCH', body: values })
    await Promise.all([refreshNuxtData(dataKeys.household(id.value)), auth.refresh()])
  }
  /** The household's backup file (owners); a plain download link, since the browser saves the answer. */
  const backupHref = computed(() => `/api/households/${id.value}/backup`)
  return { id, household, units, save, backupHref }
}
