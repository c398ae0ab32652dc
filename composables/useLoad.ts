import { dataKeys } from '~/utils/dataKeys'
import { afterLoadKeys, type LoadDetail } from '~/composables/useLoads'
import type { LoadUpdateInput, SealCheckInput } from '~/utils/schemas/logbook'

/** One logged load: its details, recording a reprocessing run or a correction, deleting it, its seal check and its photos. */
export function useLoad(loadId: Ref<string>) {
  const id = useAuth().activeId
  const key = computed(() => dataKeys.load(id.value, loadId.value))
  const load = useFetch<LoadDetail>(() => `/api/households/${id.value}/loads/${loadId.value}`, {
    key,
    immediate: Boolean(id.value),
    watch: [id],
  })
  const others = () => afterLoadKeys(id.value)

  async function update(body: LoadUpdateInput) {
    // A bare string: the template type also matches loads/export.csv, which only answers GET.
    const url: string = `/api/households/${id.value}/loads/${loadId.value}`
    await $fetch(url, { method: 'PATCH', body })
    await refreshNuxtData([key.value, ...others()])
  }
  /** Delete a load logged by mistake; the Logbook, Shelf, stock and plans are reread. */
  async function remove() {
    const url: string = `/api/households/${id.value}/loads/${loadId.value}`
    await $fetch(url, { method: 'DELETE' })
    clearNuxtData(key.value)
    await refreshNuxtData([...others(), dataKeys.jarStock(id.value), dataKeys.dryGoods(id.value), dataKeys.plans(id.value)])
  }
  async function recordSealCheck(body: SealCheckInput) {
    await $fetch(`/api/households/${id.value}/seal-checks`, { method: 'POST', body })
    await refreshNuxtData([key.value, ...others()])
  }
  async function addPhoto(file: File) {
    const form = new FormData()
    form.append('photo', file)
    await $fetch(`/api/households/${id.value}/loads/${loadId.value}/photos`, { method: 'POST', body: form })
    await refreshNuxtData(key.value)
  }
  async function removePhoto(photoId: string) {
    await $fetch(`/api/households/${id.value}/photos/${photoId}`, { method: 'DELETE' })
    await refreshNuxtData(key.value)
  }
  // `settled`: the first read's end, for a page that answers 404 when the record is not there.
  return { ...load, settled: load.then(() => undefined), update, remove, recordSealCheck, addPhoto, removePhoto }
}
