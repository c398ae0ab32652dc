/**
 * A page for one record (a plan, a load, a recipe, a lot) whose record does not exist, or is
 * another household's, answers HTTP 404 when it is rendered on the server; the page itself
 * still says what went wrong in its own words. Give it the record's read: its `error` and the
 * promise of the first read (`settled`, or the `useFetch` answer itself).
 */
export function useNotFoundStatus(read: { error: Ref<{ statusCode?: number } | null | undefined>, settled?: PromiseLike<unknown> }) {
  if (!import.meta.server) return
  const event = useRequestEvent()
  onServerPrefetch(async () => {
    await (read.settled ?? (read as unknown as PromiseLike<unknown>))
    if (event && read.error.value?.statusCode === 404) setResponseStatus(event, 404)
  })
}
