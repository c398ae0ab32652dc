import type { IngredientRow, JarSizeRow, PriceItemRow, RecipeRow, recipePressureBands } from '~/server/database/schema'
import type { Canner, Recipe, UnitSystem } from '~/utils/planning'
import type { HouseholdRole } from '~/utils/schemas/household'

/** Rows as the API sends them: the database row types, less what the API leaves out. */
export type IngredientView = IngredientRow
export type JarSizeView = Omit<JarSizeRow, 'sortOrder'>

type RecipePressureBandRow = typeof recipePressureBands.$inferSelect
export type PressureBandView = Omit<RecipePressureBandRow, 'recipeId'>

export type RecipeView = Omit<RecipeRow, 'caution' | 'createdBy' | 'createdAt' | 'updatedAt'>
  & Pick<Recipe, 'caution' | 'perJar' | 'processMinutes'>
  & {
    pressureBands: PressureBandView[]
    ingredient: IngredientView | null
    /** A house recipe's tested basis, whose process table it copies. */
    basedOn: { id: string, name: string, source: string } | null
  }

/** A canner as the planner sees it, plus whether its dial gauge is due for its yearly test. */
export type CannerView = Canner & { gaugeTestDue: boolean }

export type PriceItemView = Omit<PriceItemRow, 'householdId' | 'createdAt' | 'updatedAt'>

export interface JarStockView { jarSizeId: string, name: string, sizeKey: string, mouth: 'regular' | 'wide', count: number }

export interface HouseholdView {
  id: string
  name: string
  altitudeFt: number
  unitSystem: UnitSystem
  storeCanPriceCents: number
  role: HouseholdRole
}

/** Reads for the Recipe book and the Household page, keyed per household so pages share them. */
export function useActiveHousehold() {
  const auth = useAuth()
  const id = computed(() => auth.activeId.value)
  const household = useFetch<HouseholdView>(() => `/api/households/${id.value}`, {
    key: computed(() => `household-${id.value}`),
    immediate: Boolean(id.value),
    watch: [id],
  })
  const units = computed<UnitSystem>(() => household.data.value?.unitSystem ?? 'us')
  return { id, household, units }
}

export function useRecipes(householdId: Ref<string | null>) {
  return useFetch<RecipeView[]>('/api/recipes', {
    key: computed(() => `recipes-${householdId.value}`),
    query: { householdId },
    immediate: Boolean(householdId.value),
    watch: [householdId],
  })
}

export function useRecipe(householdId: Ref<string | null>, recipeId: Ref<string>) {
  return useFetch<RecipeView>(() => `/api/recipes/${recipeId.value}`, {
    key: computed(() => `recipe-${householdId.value}-${recipeId.value}`),
    query: { householdId },
    immediate: Boolean(householdId.value),
    watch: [householdId, recipeId],
  })
}

export function useJarSizes() {
  return useFetch<JarSizeView[]>('/api/jar-sizes', { key: 'jar-sizes' })
}

export function useIngredients() {
  return useFetch<IngredientView[]>('/api/ingredients', { key: 'ingredients' })
}

/** "Pint", "Half-pint": the size family's name from the jar catalogue ("Pint, regular mouth"). */
export function sizeName(jarSizes: readonly JarSizeView[] | null | undefined, sizeKey: string): string {
  const jar = jarSizes?.find(j => j.sizeKey === sizeKey)
  return jar ? jar.name.split(',')[0]! : sizeKey
}

/** Money entered and shown in currency units; stored in cents. */
export const centsToUnits = (cents: number): number => cents / 100
export const unitsToCents = (units: number): number => Math.round(units * 100)
export const formatMoney = (cents: number): string =>
  (cents / 100).toLocaleString('en-US', { minimumFractionDigits: 2, maximumFractionDigits: 2 })

export const packStyleLabels = { dry: 'Dry pack (no soak)', hot: 'Hot pack', raw: 'Raw pack' } as const

/** The caution text without its leading "Untested — your own risk." (shown as the title instead). */
export function cautionBody(caution: string | undefined): string {
  return (caution ?? '').replace(/^Untested — your own risk\.\s*/, '')
}

const SHARES: Array<[number, string]> = [[1 / 4, '¼'], [1 / 3, '⅓'], [1 / 2, '½'], [2 / 3, '⅔'], [3 / 4, '¾']]

/** "¾ of the jar", "the whole jar", or a percentage for an unusual share. */
export function fillShareText(fraction: number): string {
  if (Math.abs(fraction - 1) < 1e-6) return 'the whole jar'
  const named = SHARES.find(([value]) => Math.abs(value - fraction) < 1e-6)
  return `${named ? named[1] : `${Math.round(fraction * 100)} %`} of the jar`
}
