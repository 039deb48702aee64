/**
 * The Bench's one key table: what each press asks for, and how the help dialog words it. The key choices are the
 * Bench's own, after common desktop practice (no published source): Ctrl+Z undo, arrows and Home/End to walk a
 * composite widget, Enter to open, Escape to leave.
 */
import { describe, expect, it } from 'vitest';
import { mount } from '@vue/test-utils';
import {
  commandFor,
  INSIDE_PART_KEYS,
  KEY_GROUPS,
  keyHint,
  keysLabel,
  OPERATING_PANEL_KEYS,
  PAGE_KEYS,
  PANEL_TAB_KEYS,
  PART_KEYS,
  stepTo,
  type KeyPress,
} from '@/components/bench/bench-keys';
import { nextStop, type PartStop } from '@/components/bench/canvas-view';
import ShortcutHelp from '@/components/bench/ShortcutHelp.vue';
import { shortcutFor } from '@/composables/bench/use-keyboard-shortcuts';

const press = (key: string, mods: Partial<Omit<KeyPress, 'key'>> = {}): KeyPress => ({
  key,
  ctrlKey: false,
  metaKey: false,
  shiftKey: false,
  altKey: false,
  ...mods,
});

describe('page shortcuts', () => {
  it('maps the documented keys', () => {
    expect(shortcutFor(press('z', { ctrlKey: true }))).toBe('undo');
    expect(shortcutFor(press('Z', { ctrlKey: true, shiftKey: true }))).toBe('redo');
    expect(shortcutFor(press('y', { ctrlKey: true }))).toBe('redo');
    expect(shortcutFor(press('d', { metaKey: true }))).toBe('duplicate');
    expect(shortcutFor(press('Delete'))).toBe('remove');
    expect(shortcutFor(press('f'))).toBe('fit');
    expect(shortcutFor(press('F2'))).toBe('rename');
    expect(shortcutFor(press('Escape'))).toBe('clear');
    expect(shortcutFor(press('?', { shiftKey: true }))).toBe('help');
    expect(shortcutFor(press('a'))).toBeNull();
    expect(shortcutFor(press('f', { altKey: true }))).toBeNull();
  });

  it('take Shift either way unless a chord names it, and never Alt', () => {
    expect(commandFor(PAGE_KEYS, press('Delete', { shiftKey: true }))).toBe('remove');
    expect(commandFor(PAGE_KEYS, press('Delete', { ctrlKey: true }))).toBeNull();
    expect(commandFor(PAGE_KEYS, press('z', { ctrlKey: true, altKey: true }))).toBeNull();
    expect(commandFor(PAGE_KEYS, press('y', { ctrlKey: true, shiftKey: true }))).toBe('redo');
    expect(commandFor(PAGE_KEYS, press('D', { metaKey: true, shiftKey: true }))).toBe('duplicate');
    // F with Caps Lock on still fits; Shift+F does not.
    expect(commandFor(PAGE_KEYS, press('F'))).toBe('fit');
    expect(commandFor(PAGE_KEYS, press('F', { shiftKey: true }))).toBeNull();
    expect(commandFor(PAGE_KEYS, press('f', { ctrlKey: true }))).toBeNull();
    expect(commandFor(PAGE_KEYS, press('z'))).toBeNull();
  });
});

describe('drawing keys', () => {
  it('walk the parts and open one with the key alone, and leave modified arrows and Space to vue-flow', () => {
    expect(commandFor(PART_KEYS, press('ArrowRight'))).toBe('next');
    expect(commandFor(PART_KEYS, press('ArrowDown'))).toBe('next');
    expect(commandFor(PART_KEYS, press('ArrowUp'))).toBe('previous');
    expect(commandFor(PART_KEYS, press('Home'))).toBe('first');
    expect(commandFor(PART_KEYS, press('End'))).toBe('last');
    expect(commandFor(PART_KEYS, press('Enter'))).toBe('open');
    expect(commandFor(PART_KEYS, press('Enter', { shiftKey: true }))).toBeNull();
    expect(commandFor(PART_KEYS, press(' '))).toBe('select');
    expect(commandFor(PART_KEYS, press('ArrowLeft', { shiftKey: true }))).toBe('move');
    expect(commandFor(PART_KEYS, press('ArrowLeft', { ctrlKey: true }))).toBeNull();
    expect(commandFor(PART_KEYS, press('Escape'))).toBeNull();
  });

  it("on a part's own buttons take Escape and the arrows with any modifier", () => {
    expect(commandFor(INSIDE_PART_KEYS, press('Escape', { shiftKey: true }))).toBe('leave');
    expect(commandFor(INSIDE_PART_KEYS, press('ArrowUp', { ctrlKey: true, altKey: true }))).toBe('stay');
    expect(commandFor(INSIDE_PART_KEYS, press('Enter'))).toBeNull();
    expect(commandFor(OPERATING_PANEL_KEYS, press('Escape', { ctrlKey: true }))).toBe('close');
  });

  it('walk the panel tabs with the left and right arrows, Home and End, wrapping round', () => {
    expect(commandFor(PANEL_TAB_KEYS, press('ArrowRight'))).toBe('next');
    expect(commandFor(PANEL_TAB_KEYS, press('ArrowLeft', { shiftKey: true }))).toBe('previous');
    expect(commandFor(PANEL_TAB_KEYS, press('ArrowDown'))).toBeNull();
    expect(stepTo(5, 4, 'next')).toBe(0);
    expect(stepTo(5, 0, 'previous')).toBe(4);
    expect(stepTo(5, 2, 'first')).toBe(0);
    expect(stepTo(5, 2, 'last')).toBe(4);
  });

  it('move the tab stop round the reading order', () => {
    const order: PartStop[] = [
      { id: 'ksu', kind: 'ksu' },
      { id: 'a', kind: 'set' },
      { id: 'b', kind: 'set' },
    ];
    expect(nextStop(order, 'b', 'next')).toBe('ksu');
    expect(nextStop(order, 'ksu', 'previous')).toBe('b');
    expect(nextStop(order, 'a', 'first')).toBe('ksu');
    expect(nextStop(order, 'a', 'last')).toBe('b');
    expect(nextStop(order, 'gone', 'next')).toBeNull();
  });
});

describe('key words in the help', () => {
  it('names each chord with its modifiers and the four arrows together', () => {
    const row = (group: typeof PART_KEYS | typeof INSIDE_PART_KEYS, command: string) =>
      keysLabel(group.rows.find((r) => r.command === command)!.chords);
    expect(keysLabel(PAGE_KEYS.rows.find((r) => r.command === 'redo')!.chords)).toBe(
      'Ctrl+Shift+Z or Ctrl+Y',
    );
    expect(keysLabel(PAGE_KEYS.rows.find((r) => r.command === 'remove')!.chords)).toBe('Delete or Backspace');
    expect(row(PART_KEYS, 'next')).toBe('Right arrow or Down arrow');
    expect(row(PART_KEYS, 'select')).toBe('Space');
    expect(row(PART_KEYS, 'move')).toBe('Shift+Arrow keys');
    expect(row(INSIDE_PART_KEYS, 'stay')).toBe('Arrow keys');
    expect(keyHint(PAGE_KEYS, 'undo')).toBe('Ctrl+Z');
    expect(keyHint(OPERATING_PANEL_KEYS, 'close')).toBe('Escape');
  });

  it('lists every row of every group in the help dialog', () => {
    const wrapper = mount(ShortcutHelp, { props: { show: true }, attachTo: document.body });
    const rows = [...document.querySelectorAll('[data-testid="shortcut-help"] tbody tr')].map((tr) =>
      [...tr.children].map((cell) => cell.textContent?.trim()).join(' | '),
    );
    const expected = KEY_GROUPS.flatMap((g) => [
      g.where,
      ...g.rows.map((r) => `${keysLabel(r.chords)} | ${r.does}`),
    ]);
    expect(rows).toEqual(expected);
    expect(rows).toContain(`Enter | ${PART_KEYS.rows.find((r) => r.command === 'open')!.does}`);
    wrapper.unmount();
  });
});
