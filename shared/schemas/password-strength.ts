/**
 * Password strength, the same on the sign-up form and on the server: zxcvbn's estimate with the
 * common-language dictionaries, score 0–4. Passwords below MIN_PASSWORD_SCORE are refused.
 */
import { ZxcvbnFactory } from '@zxcvbn-ts/core';
import { adjacencyGraphs, dictionary } from '@zxcvbn-ts/language-common';

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
