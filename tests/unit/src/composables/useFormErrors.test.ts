import { describe, expect, it, vi } from 'vitest'
import { signUpSchema } from '@shared/schemas/auth'
import { ApiError } from '@/api/client'
import { sameAsRule, useFormErrors, zodRule } from '@/composables/useFormErrors'

function runRule(value: unknown): Error | undefined {
  const rule = zodRule(signUpSchema.shape.password)
  const callback = vi.fn()
  rule.validator?.(rule, value, callback, {}, {})
  return callback.mock.calls[0]?.[0] as Error | undefined
}

describe('zodRule', () => {
  it('passes a value the shared schema accepts', () => expect(runRule('long enough')).toBeUndefined())
  it("reports the shared schema's message", () => expect(runRule('short')?.message).toMatch(/at least 8/))
})

describe('sameAsRule', () => {
  function check(first: string, value: string): Error | undefined {
    const rule = sameAsRule(() => first)
    const callback = vi.fn()
    rule.validator?.(rule, value, callback, {}, {})
    return callback.mock.calls[0]?.[0] as Error | undefined
  }
  it('passes a repeat equal to the first entry', () => expect(check('field day 2026!', 'field day 2026!')).toBeUndefined())
  it('says the two differ otherwise', () => expect(check('field day 2026!', 'field day 2026')?.message).toBe('The two passwords are not the same'))
  it('reads the first entry when it checks, not when the rule is made', () => {
    const form = { password: 'old' }
    const rule = sameAsRule(() => form.password)
    form.password = 'new one'
    const callback = vi.fn()
    rule.validator?.(rule, 'new one', callback, {}, {})
    expect(callback.mock.calls[0]?.[0]).toBeUndefined()
  })
})

describe('useFormErrors', () => {
  it('puts each detail on its field and asks for no toast when all landed', () => {
    const { fieldErrors, mapApiError } = useFormErrors(['email', 'password'] as const)
    const e = new ApiError(400, 'VALIDATION_FAILED', 'Invalid data', [
      { path: 'email', message: 'Already registered' },
    ])
    expect(mapApiError(e)).toBeNull()
    expect(fieldErrors).toEqual({ email: 'Already registered', password: '' })
  })

  it('returns the message when a detail names no field of the form', () => {
    const { mapApiError } = useFormErrors(['email'] as const)
    const e = new ApiError(400, 'VALIDATION_FAILED', 'Invalid data', [{ path: 'token', message: 'Expired' }])
    expect(mapApiError(e)).toBe('Invalid data')
  })

  it('returns the message of an error without details and rethrows what is no ApiError', () => {
    const { mapApiError } = useFormErrors(['email'] as const)
    expect(mapApiError(new ApiError(429, 'RATE_LIMITED', 'Too many attempts'))).toBe('Too many attempts')
    expect(() => mapApiError(new TypeError('bug'))).toThrow('bug')
  })
})
