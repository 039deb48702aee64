/** Read-only shares of a plan: with a person by e-mail address, or by a link the owner can revoke. */
import { z } from 'zod';
import { EmailSchema } from './auth.schema';

export const PlanShareSchema = z.object({
  id: z.string(),
  kind: z.enum(['user', 'link']),
  /** The person's address (kind user). */
  email: z.string().nullable(),
  createdAt: z.string(),
  /** How many people opened the plan through this link (kind link). */
  visitors: z.number().int(),
});
export type PlanShare = z.infer<typeof PlanShareSchema>;

export const PlanShareListSchema = z.object({ items: z.array(PlanShareSchema) });
export type PlanShareList = z.infer<typeof PlanShareListSchema>;

export const ShareCreateSchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('user'), email: EmailSchema }),
  z.object({ kind: z.literal('link') }),
]);
export type ShareCreate = z.infer<typeof ShareCreateSchema>;

/** A new share; a link share carries its address this once (only its hash is kept). */
export const ShareCreatedSchema = z.object({
  share: PlanShareSchema,
  url: z.string().nullable(),
  /** Whether the e-mail to the person went out (kind user); the share holds either way. */
  mailed: z.boolean(),
});
export type ShareCreated = z.infer<typeof ShareCreatedSchema>;

/** Link secrets are 32 random bytes in base64url: 43 characters. */
export const LinkTokenParamsSchema = z.object({ token: z.string().regex(/^[A-Za-z0-9_-]{43}$/) });

export const LinkOpenedSchema = z.object({ planId: z.string() });
export type LinkOpened = z.infer<typeof LinkOpenedSchema>;
