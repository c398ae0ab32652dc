/**
 * The active household's id and the `useFetch` options for reading one of its resources under
 * that resource's one cache key (utils/dataKeys.ts): nothing is fetched until a household is
 * active, and switching household refetches.
 */
export function useHouseholdRead(key: (householdId: string | null) => string) {
  const id = useAuth().activeId
  return {
    id,
    options: { key: computed(() => key(id.value)), immediate: Boolean(id.value), watch: [id] },
  }
}
