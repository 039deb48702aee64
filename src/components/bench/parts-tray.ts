/** What the Parts tray asks the Bench to place, by click or by drag and drop. */
export const PART_DRAG_TYPE = 'application/x-leadbench-part';

export type PartRequest =
  | { kind: 'set'; template: string }
  | { kind: 'adapter'; template: string }
  | { kind: 'add-on'; template: string; serves: string };

/** The set a new add-on serves: the one chosen in the tray while it exists, else the selected set, else the first. */
export function servedSet(
  choice: string | null,
  sets: readonly { value: string }[],
  selected: string | null,
): string | null {
  if (choice && sets.some((o) => o.value === choice)) return choice;
  return selected ?? sets[0]?.value ?? null;
}
