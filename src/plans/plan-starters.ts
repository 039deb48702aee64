/**
 * Starting documents for a new plan: an empty installation (a KSU only) or a copy of the demo.
 * The demo file is written by the engine; until it exists the demo choice is simply not offered.
 */
import { PLAN_VERSION, PlanSchema, type Plan } from '@shared/engine/documents';

export const BLANK_LINE_COUNT = 5;

/** Directory numbers in an invented exchange range, one per line. */
export function blankPlan(name: string, lineCount = BLANK_LINE_COUNT): Plan {
  return PlanSchema.parse({
    version: PLAN_VERSION,
    name,
    description: '',
    ksu: {
      id: 'ksu',
      name: 'Key service unit',
      lines: Array.from({ length: lineCount }, (_, i) => ({
        number: i + 1,
        label: '',
        directoryNumber: `5550${String(i + 1).padStart(3, '0')}`,
      })),
      stations: [],
      ports: 4,
      position: { x: 40, y: 120 },
    },
  });
}

const demoFiles = import.meta.glob<unknown>('/shared/engine/examples/demo-plan.json', { import: 'default' });

export function demoAvailable(): boolean {
  return Object.keys(demoFiles).length > 0;
}

/** The demo installation, renamed; null when the demo file is not present or not valid. */
export async function demoPlan(name?: string): Promise<Plan | null> {
  const load = Object.values(demoFiles)[0];
  if (!load) return null;
  const parsed = PlanSchema.safeParse(await load());
  if (!parsed.success) return null;
  return name ? { ...parsed.data, name } : parsed.data;
}

export async function demoPlanName(): Promise<string | null> {
  return (await demoPlan())?.name ?? null;
}
