/** The signed-in person's own account: sessions, profile, second factor, mail links, export. */
import { z } from 'zod';
import { DisplayNameSchema, EmailSchema, PasswordSchema, RoleSchema, UserSchema } from './auth.schema';
import { PlanRecordSchema } from './plans.schema';

export const AccountSchema = UserSchema.extend({
  emailVerified: z.boolean(),
  totpEnabled: z.boolean(),
  mustChangePassword: z.boolean(),
  lastSignInAt: z.string().nullable(),
});
export type Account = z.infer<typeof AccountSchema>;

export const SessionEntrySchema = z.object({
  /** A handle for this session (the stored hash), never the cookie value. */
  id: z.string(),
  createdAt: z.string(),
  lastUsedAt: z.string(),
  expiresAt: z.string(),
  userAgent: z.string(),
  /** The user agent said shortly: browser, major version and system. */
  device: z.string(),
  current: z.boolean(),
});
export type SessionEntry = z.infer<typeof SessionEntrySchema>;
export const SessionListSchema = z.object({ items: z.array(SessionEntrySchema) });
export type SessionList = z.infer<typeof SessionListSchema>;

export const ProfileUpdateSchema = z
  .object({ displayName: DisplayNameSchema.optional(), email: EmailSchema.optional() })
  .refine((v) => v.displayName !== undefined || v.email !== undefined, {
    message: 'Change the name, the e-mail address or both',
  });
export type ProfileUpdate = z.infer<typeof ProfileUpdateSchema>;

/** Mail links carry 32 random bytes as base64url (43 characters). */
export const TokenSchema = z.string({ error: 'The link is incomplete' }).regex(/^[A-Za-z0-9_-]{43}$/, {
  error: 'The link is incomplete or damaged',
});
export const TokenBodySchema = z.object({ token: TokenSchema });
export type TokenBody = z.infer<typeof TokenBodySchema>;

export const ForgotPasswordSchema = z.object({ email: EmailSchema });
export type ForgotPassword = z.infer<typeof ForgotPasswordSchema>;

export const ResetPasswordSchema = z.object({ token: TokenSchema, password: PasswordSchema });
export type ResetPassword = z.infer<typeof ResetPasswordSchema>;

export const TotpCodeSchema = z.object({
  code: z
    .string({ error: 'Enter the 6-digit code' })
    .trim()
    .regex(/^\d{6}$/, { error: 'Enter the 6-digit code from your authenticator app' }),
});
export type TotpCode = z.infer<typeof TotpCodeSchema>;

export const TotpEnrolmentSchema = z.object({
  /** Base32 secret to type into an authenticator app. */
  secret: z.string(),
  /** The same as an otpauth:// URI, for apps that accept a pasted link. */
  uri: z.string(),
});
export type TotpEnrolment = z.infer<typeof TotpEnrolmentSchema>;

export const DeleteAccountSchema = z.object({
  password: z.string({ error: 'Enter your password' }).min(1, 'Enter your password').max(128),
});
export type DeleteAccount = z.infer<typeof DeleteAccountSchema>;

export const AccountExportSchema = z.object({
  exportedAt: z.string(),
  account: AccountSchema,
  plans: z.array(PlanRecordSchema),
});
export type AccountExport = z.infer<typeof AccountExportSchema>;

// Administration of other accounts.

export const AccountStatusSchema = z.object({ disabled: z.boolean() });
export type AccountStatus = z.infer<typeof AccountStatusSchema>;

export const InviteSchema = z.object({
  email: EmailSchema,
  displayName: DisplayNameSchema,
  role: RoleSchema,
});
export type Invite = z.infer<typeof InviteSchema>;

export const AUDIT_ACTIONS = [
  'role-changed',
  'account-disabled',
  'account-enabled',
  'account-deleted',
  'password-reset-sent',
  'user-invited',
] as const;
export const AuditEntrySchema = z.object({
  id: z.number().int(),
  at: z.string(),
  actorEmail: z.string(),
  action: z.enum(AUDIT_ACTIONS),
  targetEmail: z.string().nullable(),
  detail: z.string(),
});
export type AuditEntry = z.infer<typeof AuditEntrySchema>;
export const AuditListSchema = z.object({ items: z.array(AuditEntrySchema) });
export type AuditList = z.infer<typeof AuditListSchema>;
