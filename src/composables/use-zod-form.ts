/**
 * Form state checked with a shared zod schema: field messages for NFormItem feedback,
 * checked on blur, again on every input once a field was touched, and in full on submit.
 */
import { reactive, ref } from 'vue';
import type { z } from 'zod';
import { ApiError } from '@/api/client';

type Fields<T> = { [K in keyof T]: string };

/** What one field's input needs from a form: its value, its message, and the hooks that check it. */
export interface ZodFormField<K extends string> {
  model: Readonly<Record<K, string>>;
  errors: Readonly<Partial<Record<K, string>>>;
  setValue(key: K, value: string): void;
  touch(key: K): void;
  status(key: K): 'error' | undefined;
}

export function useZodForm<S extends z.ZodType<unknown, Record<string, string>>>(
  schema: S,
  initial: Fields<z.input<S>>,
) {
  type Key = keyof z.input<S> & string;
  const keys = Object.keys(initial) as Key[];

  const model = reactive({ ...initial }) as Fields<z.input<S>>;
  // Indexed by plain strings inside; callers see the field names of the schema.
  const errors = reactive<Record<string, string | undefined>>({});
  const touched = reactive<Record<string, boolean | undefined>>({});
  const submitted = ref(false);

  function issuesByField(): Record<string, string> {
    const result = schema.safeParse({ ...model });
    const found: Record<string, string> = {};
    if (result.success) return found;
    for (const issue of result.error.issues) {
      const key = issue.path[0];
      if (typeof key === 'string' && keys.includes(key as Key) && !found[key]) found[key] = issue.message;
    }
    return found;
  }

  function checkField(key: Key): void {
    const message = issuesByField()[key];
    if (message) errors[key] = message;
    else delete errors[key];
  }

  /** Call from the input's blur. */
  function touch(key: Key): void {
    touched[key] = true;
    checkField(key);
  }

  /** Call from the input's update: re-checks once the field has been left or a submit was tried. */
  function onInput(key: Key): void {
    if (touched[key] || submitted.value) checkField(key);
  }

  /** Call from the input's update with the new text: stores it, then re-checks as onInput does. */
  function setValue(key: Key, value: string): void {
    (model as Record<string, string>)[key] = value;
    onInput(key);
  }

  /** Check every field; the parsed values when all pass, otherwise null with messages shown. */
  function validate(): z.output<S> | null {
    submitted.value = true;
    const result = schema.safeParse({ ...model });
    for (const key of keys) delete errors[key];
    if (result.success) return result.data;
    Object.assign(errors, issuesByField());
    return null;
  }

  /** Put the server's field messages beside the fields; unknown paths are ignored. */
  function applyServerErrors(error: unknown, extra: Partial<Record<string, Key>> = {}): boolean {
    if (!(error instanceof ApiError)) return false;
    let placed = false;
    for (const [path, messages] of Object.entries(error.details)) {
      const key = (keys.includes(path as Key) ? path : extra[path]) as Key | undefined;
      if (key && messages[0]) {
        errors[key] = messages[0];
        placed = true;
      }
    }
    return placed;
  }

  function setError(key: Key, message: string): void {
    errors[key] = message;
  }

  function status(key: Key): 'error' | undefined {
    return errors[key] ? 'error' : undefined;
  }

  function reset(): void {
    Object.assign(model, initial);
    for (const key of keys) {
      delete errors[key];
      delete touched[key];
    }
    submitted.value = false;
  }

  return {
    model,
    errors: errors as Readonly<Partial<Record<Key, string>>>,
    touch,
    onInput,
    setValue,
    validate,
    applyServerErrors,
    setError,
    status,
    reset,
  };
}
