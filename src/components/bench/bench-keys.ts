/**
 * Every key the Bench answers, in one table of groups. The handlers look a key press up here (the page's
 * shortcuts, the drawing, the operating panel) and the help dialog lists these rows, so the help says what the
 * keys do and the keys do what the help says.
 */

/** A key press as the tables read it. */
export type KeyPress = Pick<KeyboardEvent, 'key' | 'ctrlKey' | 'metaKey' | 'shiftKey' | 'altKey'>;

/**
 * One key and the modifiers it wants: true held, false not held, left out either way. Ctrl also stands for
 * the Mac's Command key. Letters match in either case.
 */
export interface Chord {
  key: string;
  ctrl?: boolean;
  shift?: boolean;
  alt?: boolean;
}

export interface KeyRow<C extends string> {
  command: C;
  chords: readonly Chord[];
  does: string;
}

/** The keys of one place on the Bench; `where` heads them in the help. */
export interface KeyGroup<C extends string> {
  where: string;
  rows: readonly KeyRow<C>[];
}

/** Page shortcuts never take Alt, take Ctrl only where they say so, and take Shift either way unless they say. */
function shortcut(key: string, mods: { ctrl?: boolean; shift?: boolean } = {}): Chord {
  return { key, ctrl: mods.ctrl ?? false, shift: mods.shift, alt: false };
}
/** The key with no modifier held. */
function alone(key: string): Chord {
  return { key, ctrl: false, shift: false, alt: false };
}
const ARROWS = ['ArrowUp', 'ArrowDown', 'ArrowLeft', 'ArrowRight'] as const;

export type PageCommand = 'remove' | 'undo' | 'redo' | 'duplicate' | 'rename' | 'fit' | 'clear' | 'help';

/** Anywhere on the page (use-keyboard-shortcuts.ts), except while typing in a field or in a dialog. */
export const PAGE_KEYS: KeyGroup<PageCommand> = {
  where: 'Anywhere on the Bench, except while typing',
  rows: [
    {
      command: 'remove',
      chords: [shortcut('Delete'), shortcut('Backspace')],
      does: 'Delete the selected part or cable',
    },
    { command: 'undo', chords: [shortcut('z', { ctrl: true, shift: false })], does: 'Undo the last edit' },
    {
      command: 'redo',
      chords: [shortcut('z', { ctrl: true, shift: true }), shortcut('y', { ctrl: true })],
      does: 'Redo',
    },
    { command: 'duplicate', chords: [shortcut('d', { ctrl: true })], does: 'Duplicate the selected part' },
    { command: 'rename', chords: [shortcut('F2')], does: 'Rename the selected part' },
    { command: 'fit', chords: [shortcut('f', { shift: false })], does: 'Fit the whole drawing in view' },
    { command: 'clear', chords: [shortcut('Escape')], does: 'Clear the selection' },
    { command: 'help', chords: [shortcut('?')], does: 'Show this list' },
  ],
};

/** A walk along an ordered strip (the drawing's parts, the panel tabs), wrapping round at the ends. */
export type StepCommand = 'next' | 'previous' | 'first' | 'last';

/** Where a step from `index` lands in a strip of `length` items. */
export function stepTo(length: number, index: number, to: StepCommand): number {
  const last = length - 1;
  if (to === 'next') return index === last ? 0 : index + 1;
  if (to === 'previous') return index === 0 ? last : index - 1;
  return to === 'first' ? 0 : last;
}

export type PartCommand = StepCommand | 'open' | 'select' | 'move';

/**
 * On a part of the drawing (BenchDrawing.vue). The drawing is one tab stop; Space and Shift+arrows are
 * vue-flow's own node keys, which BenchDrawing lets through to it.
 */
export const PART_KEYS: KeyGroup<PartCommand> = {
  where: 'On a part of the drawing (Tab reaches the drawing on one part)',
  rows: [
    { command: 'next', chords: [alone('ArrowRight'), alone('ArrowDown')], does: 'Go to the next part' },
    { command: 'previous', chords: [alone('ArrowLeft'), alone('ArrowUp')], does: 'Go to the previous part' },
    { command: 'first', chords: [alone('Home')], does: 'Go to the first part' },
    { command: 'last', chords: [alone('End')], does: 'Go to the last part' },
    {
      command: 'open',
      chords: [alone('Enter')],
      does: "Open a set: zoom to it with its operating panel. On another part: reach the part's own buttons with Tab",
    },
    { command: 'select', chords: [alone(' ')], does: 'Select the part (its Lead card shows it)' },
    {
      command: 'move',
      chords: ARROWS.map((key) => ({ key, shift: true })),
      does: 'Move the selected part (each step can be undone)',
    },
  ],
};

export type InsidePartCommand = 'leave' | 'stay';

/** On a part's own buttons, once Enter reached them (BenchDrawing.vue). */
export const INSIDE_PART_KEYS: KeyGroup<InsidePartCommand> = {
  where: "On a part's own buttons",
  rows: [
    { command: 'leave', chords: [{ key: 'Escape' }], does: 'Go back to the part' },
    { command: 'stay', chords: ARROWS.map((key) => ({ key })), does: 'Nothing: the part does not move' },
  ],
};

export type OperatingPanelCommand = 'close';

/** In the operating panel of an open set (OperatingPanel.vue). */
export const OPERATING_PANEL_KEYS: KeyGroup<OperatingPanelCommand> = {
  where: 'In the operating panel',
  rows: [
    { command: 'close', chords: [{ key: 'Escape' }], does: 'Close it and go back to the set on the drawing' },
  ],
};

/** On the tabs beside the drawing (BenchSidePanels.vue), the usual tab strip keys. */
export const PANEL_TAB_KEYS: KeyGroup<StepCommand> = {
  where: 'On the panel tabs (Findings, Lead card, …)',
  rows: [
    { command: 'next', chords: [{ key: 'ArrowRight' }], does: 'Show the next panel' },
    { command: 'previous', chords: [{ key: 'ArrowLeft' }], does: 'Show the previous panel' },
    { command: 'first', chords: [{ key: 'Home' }], does: 'Show the first panel' },
    { command: 'last', chords: [{ key: 'End' }], does: 'Show the last panel' },
  ],
};

/** Every group, in the order the help lists them. */
export const KEY_GROUPS: readonly KeyGroup<string>[] = [
  PAGE_KEYS,
  PART_KEYS,
  INSIDE_PART_KEYS,
  OPERATING_PANEL_KEYS,
  PANEL_TAB_KEYS,
];

function matches(chord: Chord, press: KeyPress): boolean {
  const either = (wanted: boolean | undefined, held: boolean) => wanted === undefined || wanted === held;
  return (
    chord.key.toLowerCase() === press.key.toLowerCase() &&
    either(chord.ctrl, press.ctrlKey || press.metaKey) &&
    either(chord.shift, press.shiftKey) &&
    either(chord.alt, press.altKey)
  );
}

/** The command of a group that a key press asks for, or null. */
export function commandFor<C extends string>(group: KeyGroup<C>, press: KeyPress): C | null {
  return group.rows.find((row) => row.chords.some((chord) => matches(chord, press)))?.command ?? null;
}

const KEY_NAMES: Record<string, string> = {
  ' ': 'Space',
  ArrowUp: 'Up arrow',
  ArrowDown: 'Down arrow',
  ArrowLeft: 'Left arrow',
  ArrowRight: 'Right arrow',
};

function modifiers(chord: Chord): string {
  return [chord.ctrl && 'Ctrl+', chord.shift && 'Shift+', chord.alt && 'Alt+'].filter(Boolean).join('');
}

function keyName(key: string): string {
  return KEY_NAMES[key] ?? (key.length === 1 ? key.toUpperCase() : key);
}

/** How a row's keys read in the help: "Ctrl+Shift+Z or Ctrl+Y"; the four arrows with the same modifiers as "Arrow keys". */
export function keysLabel(chords: readonly Chord[]): string {
  const arrows = chords.filter((c) => (ARROWS as readonly string[]).includes(c.key));
  const together =
    arrows.length === ARROWS.length && arrows.every((c) => modifiers(c) === modifiers(arrows[0]));
  const names = chords.flatMap((c) => {
    if (!together || !arrows.includes(c)) return [modifiers(c) + keyName(c.key)];
    return c === arrows[0] ? [`${modifiers(c)}Arrow keys`] : [];
  });
  return names.join(' or ');
}

/** The first key of a command, for a button's tooltip: "Undo (Ctrl+Z)". */
export function keyHint<C extends string>(group: KeyGroup<C>, command: C): string {
  const chord = group.rows.find((row) => row.command === command)?.chords[0];
  return chord ? modifiers(chord) + keyName(chord.key) : '';
}
