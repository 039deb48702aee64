/**
 * Custom matchers for engine results (registered as a vitest setup file).
 *   expect(evaluation).toHaveFinding('LINES_JOINED', { lines: [1, 5] })
 *   expect(evaluation.findings).not.toHaveFinding('BREAK_IN')
 * lines / sets / stations match as sets (order does not matter, all must be equal); severity matches exactly.
 */
import { expect } from 'vitest';
import type { Finding, FindingCode } from '../../shared/engine/observe/evaluation.types';

export interface FindingQuery {
  lines?: number[];
  sets?: string[];
  stations?: string[];
  severity?: Finding['severity'];
}

function sameSet<T>(a: readonly T[], b: readonly T[]): boolean {
  const sa = new Set(a);
  const sb = new Set(b);
  return sa.size === sb.size && [...sa].every((v) => sb.has(v));
}

export function matchesFinding(f: Finding, code: FindingCode, q: FindingQuery = {}): boolean {
  if (f.code !== code) return false;
  if (q.lines && !sameSet(f.lines, q.lines)) return false;
  if (q.sets && !sameSet(f.sets, q.sets)) return false;
  if (q.stations && !sameSet(f.stations, q.stations)) return false;
  if (q.severity && f.severity !== q.severity) return false;
  return true;
}

function findingsOf(received: unknown): Finding[] {
  if (Array.isArray(received)) return received as Finding[];
  if (
    received &&
    typeof received === 'object' &&
    Array.isArray((received as { findings?: unknown }).findings)
  ) {
    return (received as { findings: Finding[] }).findings;
  }
  throw new TypeError('toHaveFinding expects an Evaluation or an array of findings');
}

const brief = (f: Finding) =>
  `${f.code} lines=[${f.lines.join(',')}] sets=[${f.sets.join(',')}] stations=[${f.stations.join(',')}]`;

expect.extend({
  toHaveFinding(received: unknown, code: FindingCode, query?: FindingQuery) {
    const findings = findingsOf(received);
    const pass = findings.some((f) => matchesFinding(f, code, query));
    const want = `${code}${query ? ' ' + JSON.stringify(query) : ''}`;
    return {
      pass,
      message: () =>
        pass
          ? `expected no finding ${want}, but found it among:\n  ${findings.map(brief).join('\n  ')}`
          : `expected finding ${want}; findings were:\n  ${findings.map(brief).join('\n  ') || '(none)'}`,
    };
  },
});

declare module 'vitest' {
  // eslint-disable-next-line @typescript-eslint/no-explicit-any -- must match vitest's own declaration
  interface Matchers<T = any> {
    toHaveFinding(code: FindingCode, query?: FindingQuery): T;
  }
}
