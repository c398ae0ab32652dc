import type { ApiAnswer } from '~/utils/api'
import { dataKeys } from '~/utils/dataKeys'

export type JarSizeView = ApiAnswer<'/api/jar-sizes'>[number]

/** The published jar catalogue (the same for every household). */
export function useJarSizes() {
  return useFetch('/api/jar-sizes', { key: dataKeys.jarSizes })
}
