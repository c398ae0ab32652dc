import type { InternalApi } from 'nitropack/types'

/**
 * What a route answers, as the page receives it (JSON, so dates are strings), inferred by
 * Nitro from the route handler itself: `ApiAnswer<'/api/households/:id/canners'>`. Type-only,
 * so this module stays free of runtime imports.
 */
export type ApiAnswer<
  Route extends keyof InternalApi,
  Method extends keyof InternalApi[Route] = 'get' & keyof InternalApi[Route],
> = InternalApi[Route][Method]
