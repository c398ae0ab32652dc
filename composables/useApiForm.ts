import { toTypedSchema } from '@vee-validate/zod'
import { useForm } from 'vee-validate'
import type { ZodType, ZodTypeDef } from 'zod'

interface ApiErrorData {
  message?: string
  data?: { issues?: Array<{ field: string, message: string }> } & { data?: { issues?: Array<{ field: string, message: string }> } }
}

/** The server's message for a failed $fetch, and per-field issues when it sent them (400). */
export function apiError(error: unknown): { message: string, issues: Array<{ field: string, message: string }> } {
  const data = (error as { data?: ApiErrorData })?.data
  const issues = data?.data?.issues ?? data?.data?.data?.issues ?? []
  const message = data?.message ?? (error instanceof Error ? error.message : 'Something went wrong. Try again.')
  return { message, issues }
}

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
        const known = issues.filter(i => i.field in form.values)
        for (const issue of known) form.setFieldError(issue.field as never, issue.message)
        if (!known.length) formError.value = message
      }
      finally {
        pending.value = false
      }
    })
  }

  return { ...form, formError, pending, submit }
}
