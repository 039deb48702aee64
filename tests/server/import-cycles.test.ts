/**
 * Layering check: the folders of server/ and db/ (and the two trees as wholes) import each other
 * without a circle, so each can be read, tested and replaced from the bottom up.
 * Source: the acyclic dependencies principle (R. C. Martin, "Granularity", C++ Report 1996), from memory.
 */
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { dirname, join, relative, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';

const ROOT = resolve(import.meta.dirname, '../..');
const TREES = ['server', 'db'];

function sourceFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const full = join(dir, name);
    if (statSync(full).isDirectory()) return sourceFiles(full);
    return /\.ts$/.test(name) ? [full] : [];
  });
}

/** Relative import targets of one file, static, dynamic and type-only alike. */
function importsOf(file: string): string[] {
  const text = readFileSync(file, 'utf8');
  const targets: string[] = [];
  for (const m of text.matchAll(/(?:from\s+|import\s*\(\s*|import\s+)['"](\.{1,2}\/[^'"]+)['"]/g)) {
    targets.push(resolve(dirname(file), m[1]));
  }
  return targets;
}

/** "server/auth" for server/auth/x.ts, "server" for server/app.ts; null outside the checked trees. */
function folderOf(path: string, depth: 1 | 2): string | null {
  const parts = relative(ROOT, path).split(/[\\/]/);
  if (!TREES.includes(parts[0])) return null;
  if (depth === 1 || parts.length <= 2) return parts[0];
  return `${parts[0]}/${parts[1]}`;
}

export function folderGraph(depth: 1 | 2): Map<string, Set<string>> {
  const graph = new Map<string, Set<string>>();
  for (const tree of TREES) {
    for (const file of sourceFiles(join(ROOT, tree))) {
      const from = folderOf(file, depth)!;
      for (const target of importsOf(file)) {
        const to = folderOf(target, depth);
        if (!to || to === from) continue;
        if (!graph.has(from)) graph.set(from, new Set());
        graph.get(from)!.add(to);
      }
    }
  }
  return graph;
}

/** One circle as a path (a → b → a), or null. */
export function findCycle(graph: Map<string, Set<string>>): string[] | null {
  const state = new Map<string, 'open' | 'done'>();
  const stack: string[] = [];
  const visit = (node: string): string[] | null => {
    state.set(node, 'open');
    stack.push(node);
    for (const next of graph.get(node) ?? []) {
      if (state.get(next) === 'open') return [...stack.slice(stack.indexOf(next)), next];
      if (!state.has(next)) {
        const found = visit(next);
        if (found) return found;
      }
    }
    stack.pop();
    state.set(node, 'done');
    return null;
  };
  for (const node of graph.keys()) {
    if (!state.has(node)) {
      const found = visit(node);
      if (found) return found;
    }
  }
  return null;
}

describe('import layering of server/ and db/', () => {
  it('finds a circle when there is one (the check itself works)', () => {
    const graph = new Map([
      ['server/auth', new Set(['server/plans'])],
      ['server/plans', new Set(['server/http', 'server/auth'])],
    ]);
    expect(findCycle(graph)).toEqual(['server/auth', 'server/plans', 'server/auth']);
  });

  it('has no circle between the folders under server/ and db/', () => {
    const graph = folderGraph(2);
    expect(graph.size).toBeGreaterThan(5); // the scan saw the real folders
    expect(findCycle(graph)).toBeNull();
  });

  it('has no circle between server/ and db/ as wholes', () => {
    expect(findCycle(folderGraph(1))).toBeNull();
  });
});
