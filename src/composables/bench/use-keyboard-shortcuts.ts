/**
 * Bench keyboard shortcuts. They are ignored while typing in a field, so names and digits can be
 * entered freely; the list doubles as the help dialog's content.
 */
import { onBeforeUnmount, onMounted } from 'vue';

export interface Shortcut {
  keys: string;
  does: string;
}

export const BENCH_SHORTCUTS: readonly Shortcut[] = [
  { keys: 'Delete / Backspace', does: 'Delete the selected part or cable' },
  { keys: 'Ctrl+Z', does: 'Undo the last edit' },
  { keys: 'Ctrl+Shift+Z or Ctrl+Y', does: 'Redo' },
  { keys: 'Ctrl+D', does: 'Duplicate the selected part' },
  { keys: 'F2', does: 'Rename the selected part' },
  { keys: 'F', does: 'Fit the whole drawing in view' },
  { keys: 'Escape', does: 'Clear the selection' },
  { keys: '?', does: 'Show this list' },
  { keys: 'Tab, then Enter', does: 'Focus a part on the drawing and select it' },
  { keys: 'Arrow keys', does: 'Move the focused part (each step can be undone)' },
];

export interface ShortcutHandlers {
  remove: () => void;
  undo: () => void;
  redo: () => void;
  duplicate: () => void;
  rename: () => void;
  fit: () => void;
  clear: () => void;
  help: () => void;
}

export function isTypingTarget(target: EventTarget | null): boolean {
  if (!(target instanceof HTMLElement)) return false;
  if (target.isContentEditable) return true;
  const tag = target.tagName;
  return tag === 'INPUT' || tag === 'TEXTAREA' || tag === 'SELECT';
}

/** Which handler a key press asks for, or null. Kept apart from the DOM so it can be tested directly. */
export function shortcutFor(
  e: Pick<KeyboardEvent, 'key' | 'ctrlKey' | 'metaKey' | 'shiftKey' | 'altKey'>,
): keyof ShortcutHandlers | null {
  const mod = e.ctrlKey || e.metaKey;
  const key = e.key.toLowerCase();
  if (mod && !e.altKey) {
    if (key === 'z') return e.shiftKey ? 'redo' : 'undo';
    if (key === 'y') return 'redo';
    if (key === 'd') return 'duplicate';
    return null;
  }
  if (e.altKey) return null;
  if (e.key === 'Delete' || e.key === 'Backspace') return 'remove';
  if (e.key === 'Escape') return 'clear';
  if (e.key === 'F2') return 'rename';
  if (e.key === '?') return 'help';
  if (key === 'f' && !e.shiftKey) return 'fit';
  return null;
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
