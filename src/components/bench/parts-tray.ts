/** What the Parts tray asks the Bench to place, by click or by drag and drop. */
export const PART_DRAG_TYPE = 'application/x-leadbench-part';

export type PartRequest =
  | { kind: 'set'; template: string }
  | { kind: 'adapter'; template: string }
  | { kind: 'add-on'; template: string; serves: string };
