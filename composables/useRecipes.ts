import type { ApiAnswer } from '~/utils/api'
import { dataKeys } from '~/utils/dataKeys'
import type { HouseRecipeInput } from '~/utils/schemas/catalogue'
import type { SharedRecipeBody } from '~/utils/schemas/curation'

/** A recipe as the Recipe book shows it: its tables, its bean and, for a house recipe, its tested basis. */
export type RecipeView = ApiAnswer<'/api/recipes'>[number]
export type PressureBandView = RecipeView['pressureBands'][number]

/** The Recipe book of the active household: the published recipes and its house recipes. */
export function useRecipes() {
  const { id, options } = useHouseholdRead(dataKeys.recipes)
  const list = useFetch('/api/recipes', { ...options, query: { householdId: id } })

  /** Saves a house recipe (new, or the one with `recipeId`) and rereads the book and that recipe. */
  async function save(body: HouseRecipeInput, recipeId?: string) {
    const saved = recipeId
      ? await $fetch(`/api/households/${id.value}/recipes/${recipeId}`, { method: 'PATCH', body })
      : await $fetch(`/api/households/${id.value}/recipes`, { method: 'POST', body })
    await refreshNuxtData([dataKeys.recipes(id.value), dataKeys.recipe(id.value, saved!.id)])
    return saved!
  }
  async function remove(recipeId: string) {
    await $fetch(`/api/households/${id.value}/recipes/${recipeId}`, { method: 'DELETE' })
    clearNuxtData(dataKeys.recipe(id.value, recipeId))
    await refreshNuxtData(dataKeys.recipes(id.value))
  }
  /** A site admin adds (no `recipeId`) or corrects a shared tested recipe; answers the lines that changed. */
  async function saveShared(body: SharedRecipeBody, recipeId?: string) {
    const saved = recipeId
      ? await $fetch(`/api/recipes/${recipeId}`, { method: 'PUT', body })
      : await $fetch('/api/recipes', { method: 'POST', body })
    await refreshNuxtData([dataKeys.recipes(id.value), dataKeys.recipe(id.value, saved.id)])
    return saved
  }
  /** A site admin takes a shared recipe out of the library, or puts it back, saying why. */
  async function setRetired(recipeId: string, retire: boolean, reason: string) {
    const done = await $fetch(`/api/recipes/${recipeId}/${retire ? 'retire' : 'restore'}`, { method: 'POST', body: { reason } })
    await refreshNuxtData([dataKeys.recipes(id.value), dataKeys.recipe(id.value, recipeId)])
    return done
  }
  return { ...list, save, remove, saveShared, setRetired }
}
