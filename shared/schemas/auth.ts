import { z } from 'zod'

/** bcrypt reads at most 72 bytes; a longer password is refused rather than silently cut. */
export const PASSWORD_MAX_BYTES = 72
export const PASSWORD_MIN_CHARS = 8

function utf8Length(s: string): number {
  let n = 0
  for (const ch of s) {
    const c = ch.codePointAt(0) ?? 0
    n += c < 0x80 ? 1 : c < 0x800 ? 2 : c < 0x10000 ? 3 : 4
  }
  return n
}

export const passwordSchema = z
  .string()
  .min(PASSWORD_MIN_CHARS, `Use at least ${PASSWORD_MIN_CHARS} characters`)
  .refine((s) => utf8Length(s) <= PASSWORD_MAX_BYTES, {
    message: `Use at most ${PASSWORD_MAX_BYTES} bytes (about 72 plain letters); longer passwords are not cut, they are refused`,
  })

export const emailSchema = z.string().trim().toLowerCase().pipe(z.email('Enter a valid e-mail address')).pipe(z.string().max(254))
export const nameSchema = z.string().trim().min(1, 'Enter a name').max(100)
export const roleSchema = z.enum(['admin', 'instructor', 'pilot', 'viewer'])
export const unitsSchema = z.enum(['metric', 'imperial'])

export const signUpSchema = z.object({
  email: emailSchema,
  name: nameSchema,
  password: passwordSchema,
  teamName: z.string().trim().min(1, 'Name your team').max(100),
})
export type SignUpInput = z.infer<typeof signUpSchema>

export const signInSchema = z.object({
  email: emailSchema,
  password: z.string().min(1, 'Enter your password').max(1024),
})
export type SignInInput = z.infer<typeof signInSchema>

export const forgotPasswordSchema = z.object({ email: emailSchema })
export const resetPasswordSchema = z.object({
  token: z.string().min(20).max(200),
  password: passwordSchema,
})
export const acceptInviteSchema = z.object({
  token: z.string().min(20).max(200),
  name: nameSchema.optional(),
  password: passwordSchema.optional(),
})
export const inviteSchema = z.object({ email: emailSchema, role: roleSchema })
export const changeRoleSchema = z.object({ role: roleSchema })
export const updateAccountSchema = z
  .object({ name: nameSchema.optional(), units: unitsSchema.optional() })
  .strict()
export const changePasswordSchema = z.object({
  currentPassword: z.string().min(1).max(1024),
  newPassword: passwordSchema,
  endOtherSessions: z.boolean().optional(),
})
export const switchTeamSchema = z.object({ teamId: z.number().int().positive() })
