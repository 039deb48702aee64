/**
 * Covers for the wiring findings before the first solve, so that fewer solve-and-sweep rounds are needed.
 * Method: ./README.md ("Cure as an integer program", seeding).
 */
import { findingKey, getNetlist, wiringFindings, type Finding, type Plan } from './engine-port';
import type { Candidate } from './cure-candidates';
import { withChanges } from './cure';

/** Seeding lifts at most this many times over (every pair of a 25-pair cable). */
const MAX_SEED_STEPS = 25;

/**
 * A wiring finding is wrong in every state: it is a matter of which leads meet through the cabling, so it shows
 * while one of its conductor paths is there. Lifting only takes connections away, so a path seen with some leads
 * lifted is there in the plan too, and every cure must change a lead on it. Each step lifts, on the paths of the
 * plan's wiring findings that still show, every pair a lift candidate can take, and asks for the new paths;
 * `cover` adds the cover of a finding in the plan it shows in and returns its candidates. Ends when none of the
 * plan's wiring findings shows any more or none has a lift left to make.
 */
export function seedWiringCovers(plan: Plan, cover: (plan: Plan, finding: Finding) => Candidate[]): void {
  const keys = new Set(wiringFindings(getNetlist(plan), false).map(findingKey));
  if (keys.size === 0) return;
  const lifted = new Set<string>();
  let current = plan;
  for (let step = 0; step < MAX_SEED_STEPS; step++) {
    const showing = wiringFindings(getNetlist(current), true).filter((f) => keys.has(findingKey(f)));
    const more: { part: string; pair: number }[] = [];
    for (const finding of showing) {
      for (const c of cover(current, finding)) {
        const id = `${c.part}|${c.pair}`;
        if (c.kind !== 'lift' || lifted.has(id)) continue;
        lifted.add(id);
        more.push({ part: c.part, pair: c.pair });
      }
    }
    if (more.length === 0) return;
    current = withChanges(
      current,
      more.map(({ part, pair }) => ({ part, change: { kind: 'lift', pair, conductor: 'both' }, cost: '' })),
    );
  }
}
