import { dataKeys } from '~/utils/dataKeys'

/** Development only: the mail the local fake mail server received. */
export function useOutbox() {
  return useFetch('/api/dev/outbox', { key: dataKeys.outbox })
}
