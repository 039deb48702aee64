/**
 * The Bench's page-wide keyboard shortcuts (the table is PAGE_KEYS in bench-keys.ts, which the help dialog
 * lists too). They are ignored while typing in a field, so names and digits can be entered freely.
 */
import { onBeforeUnmount, onMounted } from 'vue';
import { commandFor, PAGE_KEYS, type KeyPress, type PageCommand } from '@/components/bench/bench-keys';

export type ShortcutHandlers = Record<PageCommand, () => void>;

export function isTypingTarget(target: EventTarget | null): boolean {
  if (!(target instanceof HTMLElement)) return false;
  if (target.isContentEditable) return true;
  const tag = target.tagName;
  return tag === 'INPUT' || tag === 'TEXTAREA' || tag === 'SELECT';
}

/** Which handler a key press asks for, or null. Kept apart from the DOM so it can be tested directly. */
export function shortcutFor(e: KeyPress): PageCommand | null {
  return commandFor(PAGE_KEYS, e);
}

export function useKeyboardShortcuts(handlers: ShortcutHandlers) {
  function onKeyDown(event: KeyboardEvent) {
    if (event.defaultPrevented || isTypingTarget(event.target)) return;
    // Keys typed inside open dialogs belong to the dialog.
    if (event.target instanceof HTMLElement && event.target.closest('[role="dialog"]')) return;
    const which = shortcutFor(event);
    if (!which) return;
    event.preventDefault();
    handlers[which]();
  }
  onMounted(() => window.addEventListener('keydown', onKeyDown));
  onBeforeUnmount(() => window.removeEventListener('keydown', onKeyDown));
}
