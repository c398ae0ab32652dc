import { toTypedSchema } from '@vee-validate/zod'
import { useForm } from 'vee-validate'
import type { ZodType, ZodTypeDef } from 'zod'
import type { ApiErrorData, ApiIssue } from '~/utils/schemas/errors'

/**
 * The API's one error envelope (server/utils/errors.ts) as $fetch reports it: the response body
 * is `{ message, data: { field?, issues } }`. Anything else (a network failure) gets a general
 * message.
 */
export function apiError(error: unknown): { message: string, field: string | null, issues: ApiIssue[] } {
  const body = (error as { data?: { message?: unknown, data?: Partial<ApiErrorData> } } | null)?.data
  const message = typeof body?.message === 'string' && body.message
    ? body.message
    : 'Shelfstead could not be reached. Check the connection and try again.'
  return { message, field: body?.data?.field ?? null, issues: body?.data?.issues ?? [] }
}

/** The server names fields "lines.0.jars"; vee-validate keys them "lines[0].jars". */
const formPath = (field: string) => field.replace(/\.(\d+)(?=\.|$)/g, '[$1]')

/**
 * A vee-validate form on the same zod schema the API route uses. `submit(fn)` runs `fn` with
 * valid values; when the server still disagrees, its field issues land beside the fields and
 * anything else in `formError`.
 */
export function useApiForm<TOut extends Record<string, unknown>, TIn = TOut>(
  schema: ZodType<TOut, ZodTypeDef, TIn>,
  initialValues?: Partial<TIn>,
) {
  const form = useForm({ validationSchema: toTypedSchema(schema), initialValues: initialValues as never })
  const formError = ref<string | null>(null)
  const pending = ref(false)

  function submit(action: (values: TOut) => Promise<void>) {
    return form.handleSubmit(async (values) => {
      formError.value = null
      pending.value = true
      try {
        await action(values as TOut)
      }
      catch (error) {
        const { message, issues } = apiError(error)
        const fields = new Set(Object.keys(form.meta.value.initialValues ?? {}).concat(Object.keys(form.values)))
        const known = issues.filter(i => i.field && fields.has(i.field.split('.')[0]!))
        for (const issue of known) form.setFieldError(formPath(issue.field) as never, issue.message)
        if (!known.length) formError.value = message
      }
      finally {
        pending.value = false
      }
    })
  }

  return { ...form, formError, pending, submit }
}
