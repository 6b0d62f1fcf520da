import { z } from 'zod'
import { ROLES } from './roles'
import { idSchema, pageSchema, pageSizeSchema } from './input-schemas'

// Zod pieces shared by server routes and client forms, so a field error reads the same on both sides.
export const idParamSchema = z.object({ id: idSchema() })

export const emailSchema = z.string({ required_error: 'E-mail is required' }).trim().toLowerCase()
  .email('Enter a valid e-mail address').max(254)

export const newPasswordSchema = z.string({ required_error: 'Password is required' })
  .min(10, 'Use at least 10 characters').max(200, 'Use at most 200 characters')

export const signInSchema = z.object({
  email: emailSchema,
  password: z.string({ required_error: 'Password is required' }).min(1, 'Password is required').max(200),
})

export const roleSchema = z.enum(ROLES, { errorMap: () => ({ message: `Role must be one of ${ROLES.join(', ')}` }) })

export const createUserSchema = z.object({
  email: emailSchema,
  name: z.string().trim().min(1, 'Name is required').max(120),
  role: roleSchema,
  password: newPasswordSchema,
})

export const updateUserSchema = z.object({
  name: z.string().trim().min(1, 'Name is required').max(120).optional(),
  role: roleSchema.optional(),
  disabled: z.boolean().optional(),
}).refine(v => Object.keys(v).length > 0, { message: 'Nothing to change' })

export const paginationSchema = z.object({
  page: pageSchema,
  pageSize: pageSizeSchema(200, 25),
})
