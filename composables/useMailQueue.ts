import { dataKeys } from '~/utils/dataKeys'

/** The outgoing mail queue: what waits for the mail server, with its attempts and last error. */
export function useMailQueue() {
  return useFetch('/api/dev/mail-queue', { key: dataKeys.mailQueue })
}
