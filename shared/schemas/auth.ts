import { z } from 'zod'
import { issueCode, issueOf } from '../errors/zodProblems.js'
import { ROLES } from '../roles.js'

export const roleSchema = z.enum(ROLES)
export const unitPreferenceSchema = z.enum(['in', 'mm'])
export const weightUnitSchema = z.enum(['lb', 'kg'])
export const localeSchema = z.enum(['en', 'es'])

export const usernameSchema = z
  .string()
  .trim()
  .min(3)
  .max(40)
  .regex(/^[a-z0-9._-]+$/, issueCode('username_chars'))

// ASVS 6.2.1/6.2.9: at least 12 characters, long passphrases allowed, no composition rules.
export const passwordSchema = z
  .string()
  .min(12)
  .max(128)

export const signInSchema = z.object({
  username: z.string().trim().min(1).max(40),
  password: z.string().min(1).max(128),
})

export const sessionUserSchema = z.object({
  id: z.number().int(),
  username: z.string(),
  displayName: z.string(),
  roles: z.array(roleSchema),
  unitPreference: unitPreferenceSchema,
  weightUnit: weightUnitSchema,
  locale: localeSchema,
})
export type SessionUser = z.infer<typeof sessionUserSchema>

export const userCreateSchema = z.object({
  username: usernameSchema,
  displayName: z.string().trim().min(1).max(80),
  email: z.email().max(120).optional().or(z.literal('')),
  roles: z.array(roleSchema).min(1),
  password: passwordSchema,
})
export type UserCreateInput = z.infer<typeof userCreateSchema>

export const userUpdateSchema = z.object({
  displayName: z.string().trim().min(1).max(80).optional(),
  email: z.email().max(120).optional().or(z.literal('')),
  roles: z.array(roleSchema).min(1).optional(),
  active: z.boolean().optional(),
})
export type UserUpdateInput = z.infer<typeof userUpdateSchema>

export const passwordResetSchema = z.object({ password: passwordSchema })

export const profileUpdateSchema = z.object({
  displayName: z.string().trim().min(1).max(80).optional(),
  unitPreference: unitPreferenceSchema.optional(),
  weightUnit: weightUnitSchema.optional(),
  locale: localeSchema.optional(),
})
export type ProfileUpdateInput = z.infer<typeof profileUpdateSchema>

export const passwordChangeSchema = z
  .object({
    currentPassword: z.string().min(1),
    newPassword: passwordSchema,
  })
  .refine((v) => v.currentPassword !== v.newPassword, {
    path: ['newPassword'],
    ...issueOf('password_unchanged'),
  })

export const userSummarySchema = z.object({
  id: z.number().int(),
  username: z.string(),
  displayName: z.string(),
  email: z.string().nullable(),
  roles: z.array(roleSchema),
  active: z.boolean(),
  lastSignInAt: z.string().nullable(),
  createdAt: z.string(),
})
export type UserSummary = z.infer<typeof userSummarySchema>

// ---- answers (checked by the client in development and tests) ----
export const sessionAnswerSchema = z.object({ user: sessionUserSchema.nullable(), demo: z.boolean() })
export type SessionAnswer = z.infer<typeof sessionAnswerSchema>
export const signedInAnswerSchema = z.object({ user: sessionUserSchema })
export const okAnswerSchema = z.object({ ok: z.literal(true) })
/** A 204 answer has no body. */
export const nothingShape = z.undefined()
