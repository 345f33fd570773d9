import { reactive } from 'vue'
import type { ZodType } from 'zod'
import type { FormItemRule } from 'element-plus'
import { ApiError } from '@/api/client'

/**
 * An Element Plus form rule backed by a shared zod schema, so the form checks exactly what
 * the server will check and shows the same message.
 */
export function zodRule(schema: ZodType, trigger: 'blur' | 'change' = 'blur'): FormItemRule {
  return {
    trigger,
    validator: (_rule, value, callback) => {
      const result = schema.safeParse(value)
      if (result.success) callback()
      else callback(new Error(result.error.issues[0]?.message ?? 'Invalid value'))
    },
  }
}

/** A "type it again" rule: the field must equal what `first()` holds (checked on blur). */
export function sameAsRule(first: () => string, message = 'The two passwords are not the same'): FormItemRule {
  return {
    trigger: 'blur',
    validator: (_rule, value, callback) => (value === first() ? callback() : callback(new Error(message))),
  }
}

/**
 * Server-side field errors for an ElForm: bind `:error="fieldErrors.email"` on each item.
 * `showApiError(e)` maps `details` onto those fields and returns the message to show when
 * no field took it (or rethrows what is not an ApiError).
 */
export function useFormErrors<K extends string>(fields: readonly K[]) {
  const fieldErrors = reactive<Record<string, string>>({}) as Record<K, string>
  function clearErrors(): void {
    for (const f of fields) fieldErrors[f] = ''
  }
  clearErrors()
  /** Returns the message for a toast, or null when every detail landed on a field. */
  function mapApiError(e: unknown): string | null {
    if (!(e instanceof ApiError)) throw e
    clearErrors()
    let unmapped = e.details.length === 0
    for (const d of e.details) {
      const key = d.path.split('.')[0] as K
      if ((fields as readonly string[]).includes(key)) fieldErrors[key] = d.message
      else unmapped = true
    }
    return unmapped ? e.message : null
  }
  return { fieldErrors, clearErrors, mapApiError }
}
