import type { ApiAnswer } from '~/utils/api'
import { dataKeys } from '~/utils/dataKeys'

export type IngredientView = ApiAnswer<'/api/ingredients'>[number]

/** The published dry goods: beans and other legumes with their cup weights and swell. */
export function useIngredients() {
  return useFetch('/api/ingredients', { key: dataKeys.ingredients })
}
