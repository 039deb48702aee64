/** Accounts, roles and sign-in: shared by the API and the forms. */
import { z } from 'zod';

export const ROLES = ['restorer', 'instructor', 'trainee', 'admin'] as const;
export const RoleSchema = z.enum(ROLES);
export type Role = z.infer<typeof RoleSchema>;

export const EmailSchema = z
  .string({ error: 'Enter an e-mail address' })
  .trim()
  .toLowerCase()
  .max(254, 'That e-mail address is too long')
  .pipe(z.email({ error: 'Enter a valid e-mail address' }));

/**
 * OWASP ASVS 2.1.1/2.1.2: at least 12 characters, at most 128: what a form checks on every keystroke.
 * The strength estimate (2.1.7/2.1.8) is `StrongPasswordSchema` in `password-strength.ts`, which the server
 * applies to every new password and the forms load only when a password is typed.
 */
export const PasswordSchema = z
  .string({ error: 'Enter a password' })
  .min(12, 'Use at least 12 characters')
  .max(128, 'Use at most 128 characters');

export const DisplayNameSchema = z
  .string({ error: 'Enter your name' })
  .trim()
  .min(1, 'Enter your name')
  .max(60, 'Keep your name to 60 characters');

export const SignUpSchema = z.object({
  email: EmailSchema,
  displayName: DisplayNameSchema,
  password: PasswordSchema,
});
export type SignUp = z.infer<typeof SignUpSchema>;

export const SignInSchema = z.object({
  email: EmailSchema,
  password: z.string({ error: 'Enter your password' }).min(1, 'Enter your password').max(128),
});
export type SignIn = z.infer<typeof SignInSchema>;

/** The change-password body around a rule for the new password (the server's adds the strength estimate). */
export const changePasswordWith = (newPassword: z.ZodType<string, string>) =>
  z
    .object({
      currentPassword: z
        .string({ error: 'Enter your current password' })
        .min(1, 'Enter your current password'),
      newPassword,
    })
    .refine((v) => v.currentPassword !== v.newPassword, {
      path: ['newPassword'],
      message: 'Choose a password different from the current one',
    });
export const ChangePasswordSchema = changePasswordWith(PasswordSchema);
export type ChangePassword = z.infer<typeof ChangePasswordSchema>;

export const UserSchema = z.object({
  id: z.string(),
  email: z.string(),
  displayName: z.string(),
  role: RoleSchema,
  createdAt: z.string(),
});
export type User = z.infer<typeof UserSchema>;

export const SessionInfoSchema = z.object({
  user: UserSchema.nullable(),
  /** Sign-up with e-mail verification: no session yet, a link went to the address. */
  verificationSent: z.boolean().optional(),
  /** Password accepted; the TOTP code is still owed (POST /api/auth/second-factor). */
  secondFactorRequired: z.boolean().optional(),
  /** The password was set by someone else (admin:create, reset by an admin) and must be changed first. */
  mustChangePassword: z.boolean().optional(),
});
export type SessionInfo = z.infer<typeof SessionInfoSchema>;

export const UserListQuerySchema = z.object({
  search: z.string().trim().max(100).optional(),
  role: RoleSchema.optional(),
  sort: z.enum(['email', 'displayName', 'role', 'createdAt']).default('createdAt'),
  order: z.enum(['asc', 'desc']).default('asc'),
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(100).default(20),
});
export type UserListQuery = z.infer<typeof UserListQuerySchema>;

/** What an admin sees of each account. */
export const AdminUserSchema = UserSchema.extend({
  emailVerified: z.boolean(),
  disabled: z.boolean(),
  totpEnabled: z.boolean(),
  lastSignInAt: z.string().nullable(),
});
export type AdminUser = z.infer<typeof AdminUserSchema>;

export const UserListSchema = z.object({
  items: z.array(AdminUserSchema),
  total: z.number().int(),
  page: z.number().int(),
  pageSize: z.number().int(),
});
export type UserList = z.infer<typeof UserListSchema>;

export const RoleChangeSchema = z.object({ role: RoleSchema });
export type RoleChange = z.infer<typeof RoleChangeSchema>;
