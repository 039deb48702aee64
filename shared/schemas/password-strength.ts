/**
 * Password strength, the same on the forms and on the server: zxcvbn's estimate with the common-language
 * dictionaries, score 0–4. Passwords below MIN_PASSWORD_SCORE are refused (OWASP ASVS 4.0.3 V2.1.7, V2.1.8).
 *
 * Not exported from `index.ts`: the dictionary is most of a megabyte. The server imports this file directly;
 * the client loads it with `import()` only on the forms that set a password.
 */
import { ZxcvbnFactory } from '@zxcvbn-ts/core';
import { adjacencyGraphs, dictionary } from '@zxcvbn-ts/language-common';
import { ResetPasswordSchema } from './account.schema';
import { changePasswordWith, PasswordSchema, SignUpSchema } from './auth.schema';

/** 3 = "safely unguessable: moderate protection from offline slow-hash scenario" (zxcvbn's scale). */
export const MIN_PASSWORD_SCORE = 3;

let checker: ZxcvbnFactory | undefined;

export interface PasswordStrength {
  score: number;
  /** A sentence for the form, empty when the password is strong enough. */
  advice: string;
}

export function passwordStrength(password: string, userInputs: string[] = []): PasswordStrength {
  checker ??= new ZxcvbnFactory({ dictionary, graphs: adjacencyGraphs });
  const result = checker.check(password, userInputs);
  if (result.score >= MIN_PASSWORD_SCORE) return { score: result.score, advice: '' };
  const hint = result.feedback.warning ?? result.feedback.suggestions[0] ?? '';
  const advice = ['This password is easy to guess.', hint, 'Add more unrelated words or characters.']
    .filter(Boolean)
    .join(' ');
  return { score: result.score, advice };
}

/** The length rules and the strength estimate: every new password the server accepts passes it. */
export const StrongPasswordSchema = PasswordSchema.superRefine((value, ctx) => {
  const { advice } = passwordStrength(value);
  if (advice) ctx.addIssue({ code: 'custom', message: advice });
});

/** The bodies that set a password, as the server checks them. */
export const StrongSignUpSchema = SignUpSchema.extend({ password: StrongPasswordSchema });
export const StrongChangePasswordSchema = changePasswordWith(StrongPasswordSchema);
export const StrongResetPasswordSchema = ResetPasswordSchema.extend({ password: StrongPasswordSchema });
