/**
 * The finding rule registry: one rule per finding code, each in its own module named after the code, and every
 * module of the rules folder a rule of the registry (the layout DEVELOPERS.md's "add a finding code" describes).
 */
import { existsSync, readdirSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { FINDING_CODES, FINDING_TITLES } from '../../shared/engine/index';
import { RULES } from '../../shared/engine/observe/rules/index';

const RULES_DIR = resolve(__dirname, '../../shared/engine/observe/rules');
const kebab = (code: string) => code.toLowerCase().replaceAll('_', '-');

describe('finding rule registry', () => {
  it('has exactly one rule per finding code, filed under its own code', () => {
    expect(Object.keys(RULES).sort()).toEqual([...FINDING_CODES].sort());
    for (const [code, rule] of Object.entries(RULES)) expect(rule.code).toBe(code);
    // Two codes sharing one rule object would let one finding kind stand in for another.
    expect(new Set(Object.values(RULES)).size).toBe(FINDING_CODES.length);
  });

  it('keeps each rule in its own module, named after the code in kebab case, exporting that rule', async () => {
    for (const code of FINDING_CODES) {
      const file = join(RULES_DIR, `${kebab(code)}.ts`);
      expect(existsSync(file), `${code}: ${file}`).toBe(true);
      const mod = (await import(file)) as Record<string, unknown>;
      expect(Object.values(mod), code).toContain(RULES[code]);
    }
  });

  it('has no module in the rules folder that is not a registered rule', () => {
    const files = readdirSync(RULES_DIR).filter((f) => f.endsWith('.ts') && f !== 'index.ts');
    expect(files.sort()).toEqual(FINDING_CODES.map((c) => `${kebab(c)}.ts`).sort());
  });

  it('says when each state rule can fire, and how the sweep can skip an event that cannot raise it', () => {
    for (const rule of Object.values(RULES)) {
      if (rule.kind !== 'state') continue;
      expect(rule.fires.position || rule.fires.event, rule.code).toBe(true);
      // An event rule without eventMayAdd would make the sweep ask it about every KSU event.
      if (rule.fires.event) expect(typeof rule.eventMayAdd, rule.code).toBe('function');
      // A state rule without possibleIn makes every clean proof fail (search/README.md, "Clean proof").
      expect(typeof rule.possibleIn, rule.code).toBe('function');
    }
  });

  it('gives every code a title', () => {
    for (const code of FINDING_CODES) expect(FINDING_TITLES[code].length).toBeGreaterThan(3);
  });
});
