import { describe, expect, it } from 'vitest';
import ELK from 'elkjs/lib/elk.bundled.js';
import { PlanSchema, type Plan } from '@shared/engine';
import demo from '@shared/engine/examples/demo-plan.json';
import intercom from '@shared/engine/examples/intercom.json';
import sixAndTen from '@shared/engine/examples/six-and-ten.json';
import twoSet from '@shared/engine/examples/two-set.json';
import { DEFAULT_PART_SIZE, overlaps } from '@/bench/placement';
import { tidyLayout } from '@/bench/tidy-layout';
import { twoSetPlan } from './bench-fixture';

const elk = new ELK();
// Node sizes about those the canvas draws (measured in the browser; common practice, no published source).
const sizeOf = (plan: Plan) => (id: string) =>
  id === plan.ksu.id ? { width: 260, height: 320 } : DEFAULT_PART_SIZE;

const PLANS: [string, Plan][] = [
  ['fixture', twoSetPlan()],
  ...[demo, intercom, sixAndTen, twoSet].map((doc): [string, Plan] => {
    const plan = PlanSchema.parse(doc);
    return [plan.name, plan];
  }),
];

describe('tidyLayout', () => {
  it.each(PLANS)('places every part of the %s once, none on another', async (_name, plan) => {
    const { positions } = await tidyLayout(elk, plan, sizeOf(plan));
    const ids = [plan.ksu.id, ...plan.adapters, ...plan.addOns, ...plan.sets].map((p) =>
      typeof p === 'string' ? p : p.id,
    );
    expect(positions.map((p) => p.id).sort()).toEqual([...ids].sort());
    const boxes = positions.map((p) => ({ ...p.position, ...sizeOf(plan)(p.id) }));
    for (let i = 0; i < boxes.length; i += 1)
      for (let j = i + 1; j < boxes.length; j += 1) expect(overlaps(boxes[i], boxes[j])).toBe(false);
  });

  it('runs from the KSU towards the sets: every cable’s jack end lies left of its plug end', async () => {
    const plan = PlanSchema.parse(demo);
    const { positions } = await tidyLayout(elk, plan, sizeOf(plan));
    const x = new Map(positions.map((p) => [p.id, p.position.x]));
    for (const c of plan.cables) expect(x.get(c.to.part)!).toBeLessThan(x.get(c.from.part)!);
  });

  it('routes every cable orthogonally from its plug handle to its jack handle', async () => {
    const plan = twoSetPlan();
    const { positions, routes } = await tidyLayout(elk, plan, sizeOf(plan));
    const at = new Map(positions.map((p) => [p.id, p.position]));
    for (const c of plan.cables) {
      const route = routes[c.id];
      expect(route.length).toBeGreaterThanOrEqual(2);
      // The plug end starts on the left edge of the plugged part (plugs are drawn on the left edge).
      expect(route[0].x).toBe(at.get(c.from.part)!.x);
      for (let i = 1; i < route.length; i += 1) {
        const [a, b] = [route[i - 1], route[i]];
        expect(a.x === b.x || a.y === b.y).toBe(true);
      }
    }
  });

  it('keeps the drawing’s top-left corner where it was', async () => {
    const plan = twoSetPlan();
    const { positions } = await tidyLayout(elk, plan, sizeOf(plan));
    // The fixture's parts start at (0, 0): the KSU's position.
    expect(Math.min(...positions.map((p) => p.position.x))).toBe(0);
    expect(Math.min(...positions.map((p) => p.position.y))).toBe(0);
  });
});
