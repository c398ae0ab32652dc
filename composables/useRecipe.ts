import { dataKeys } from '~/utils/dataKeys'

/** One recipe of the Recipe book, as the active household sees it. */
export function useRecipe(recipeId: Ref<string>) {
  const id = useAuth().activeId
  return useFetch(() => `/api/recipes/${recipeId.value}` as const, {
    key: computed(() => dataKeys.recipe(id.value, recipeId.value)),
    query: { householdId: id },
    immediate: Boolean(id.value),
    watch: [id],
  })
}
