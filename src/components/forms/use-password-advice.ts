/**
 * The strength estimate's advice on a new password, a moment after typing stops. The estimator and its
 * dictionary (most of a megabyte) load on first use, so pages without a new-password field never fetch them.
 * The server checks the same estimate on submit; this only says it sooner.
 */
import { computed, ref } from 'vue';
import { watchDebounced } from '@vueuse/core';
import { PasswordSchema } from '@shared/schemas';

/** Typing pauses this long before the estimate runs (common practice, no published source). */
const DEBOUNCE_MS = 300;

type StrengthModule = typeof import('@shared/schemas/password-strength');
let strengthModule: Promise<StrengthModule> | undefined;
const loadStrength = () => (strengthModule ??= import('@shared/schemas/password-strength'));

export function usePasswordAdvice(password: () => string) {
  const checked = ref<{ password: string; advice: string } | null>(null);

  watchDebounced(
    password,
    async (value) => {
      // The length rule speaks first (the form shows it); the estimate is for passwords long enough.
      if (!PasswordSchema.safeParse(value).success) return;
      const { passwordStrength } = await loadStrength();
      checked.value = { password: value, advice: passwordStrength(value).advice };
    },
    { debounce: DEBOUNCE_MS },
  );

  /** Advice for the password as it is now; empty while unchecked or strong enough. */
  return computed(() => (checked.value?.password === password() ? checked.value.advice : ''));
}

/** For a form's last check: a password known to be weak keeps the form open, its advice shown as the error. */
export function strongEnough(advice: string, showError: (message: string) => void): boolean {
  if (advice) showError(advice);
  return !advice;
}
