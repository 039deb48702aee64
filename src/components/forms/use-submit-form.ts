/**
 * A zod-checked form that hands its parsed values to `submit` and puts a server refusal (the `error` prop
 * of the form component) beside the fields it names. `placeError` takes errors a form words itself.
 */
import { watch } from 'vue';
import type { z } from 'zod';
import { ApiError } from '@/api/client';
import { useZodForm } from '@/composables/use-zod-form';

export function useSubmitForm<S extends z.ZodType<unknown, Record<string, string>>>(
  schema: S,
  initial: Parameters<typeof useZodForm<S>>[1],
  options: {
    error: () => unknown;
    submit: (values: z.output<S>) => void;
    placeError?: (error: ApiError, form: ReturnType<typeof useZodForm<S>>) => boolean;
    /** A last check before submitting (e.g. a weak password); false keeps the form open. */
    canSubmit?: () => boolean;
  },
) {
  const form = useZodForm(schema, initial);
  watch(options.error, (error) => {
    if (!(error instanceof ApiError)) return;
    if (!options.placeError?.(error, form)) form.applyServerErrors(error);
  });
  function onSubmit() {
    const values = form.validate();
    if (values && (options.canSubmit?.() ?? true)) options.submit(values);
  }
  return { form, onSubmit };
}
