import { ref } from 'vue';
import { PlanSchema } from '@shared/engine/documents';

/** The name typed in a plan dialog, checked by the plan document's own rule for names. */
export function usePlanName() {
  const name = ref('');
  const error = ref<string | undefined>();

  /** The name as it will be saved (of `value`, the typed name unless given), or null with the message set. */
  function check(value = name.value): string | null {
    const result = PlanSchema.shape.name.safeParse(value);
    error.value = result.success ? undefined : result.error.issues[0]?.message;
    return result.success ? result.data : null;
  }

  function reset(value = '') {
    name.value = value;
    error.value = undefined;
  }

  return { name, error, check, reset };
}
