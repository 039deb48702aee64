/**
 * The engine's answers on every example plan must match the committed golden files byte for byte
 * (tests/engine/golden/*.json; written by `npm run -s golden -- --write` only when an answer is meant to change).
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { examplePlanNames, goldenDump, goldenFile, sortedJson } from './golden/golden-dump';

describe('golden dump of the example plans', () => {
  for (const name of examplePlanNames()) {
    it(`${name}: evaluate, sweep and cure answer as committed`, { timeout: 120_000 }, () => {
      const committed = readFileSync(goldenFile(name), 'utf8');
      const now = sortedJson(goldenDump(name));
      // Compare text first (fast, exact); on a difference show the first differing line.
      if (now !== committed) {
        const a = committed.split('\n');
        const b = now.split('\n');
        const at = a.findIndex((line, i) => line !== b[i]);
        expect(b.slice(Math.max(0, at - 3), at + 3).join('\n')).toBe(
          a.slice(Math.max(0, at - 3), at + 3).join('\n'),
        );
      }
      expect(now === committed).toBe(true);
    });
  }
});
