import type { PlanRequestBody } from '~/utils/schemas/plan'

/**
 * What the Batch planner works from, read once for both the new-plan and the saved-plan page:
 * the Recipe book, the jar catalogue, the beans, the household's canners, settings and
 * members, the dry goods in its pantry and what it eats, and the preview computation. `props` is what PlannerWorkspace takes.
 */
export function usePlanner(planId?: Ref<string | null | undefined>) {
  const { data: recipes } = useRecipes()
  const { data: jarSizes } = useJarSizes()
  const { data: ingredients } = useIngredients()
  const { data: canners } = useCanners()
  const { data: members } = useMembers()
  const { household: { data: household }, units } = useHousehold()
  const { preview } = usePlans()
  const { data: pantry } = useDryGoods()
  const { data: board } = useBoard()

  const ready = computed(() => Boolean(recipes.value && jarSizes.value && ingredients.value))
  const props = computed(() => ({
    recipes: recipes.value ?? [],
    jarSizes: jarSizes.value ?? [],
    ingredients: ingredients.value ?? [],
    canners: canners.value ?? null,
    members: members.value ?? [],
    household: household.value ?? null,
    units: units.value,
    onPreview: (body: PlanRequestBody) => preview(body, planId?.value),
    pantry: pantry.value ?? [],
    supply: board.value?.supply ?? [],
  }))
  return { recipes, jarSizes, ready, props }
}
