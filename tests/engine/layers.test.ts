/**
 * The engine's folders are layers that only point down: document < templates < model < sim < observe < search.
 * A file may import its own folder and the folders below it; nothing inside a folder imports the entry files
 * (index.ts, documents.ts). The import lines are read from the source text, so a new upward import fails here.
 */
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { dirname, join, relative, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';

const ENGINE = resolve(__dirname, '../../shared/engine');
const LAYERS = ['document', 'templates', 'model', 'sim', 'observe', 'search'] as const;

function sourceFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    if (statSync(path).isDirectory()) return sourceFiles(path);
    return path.endsWith('.ts') ? [path] : [];
  });
}

/** Relative module specifiers in import and export-from statements (type-only ones included). */
function importsOf(file: string): string[] {
  const text = readFileSync(file, 'utf8');
  const specs = [...text.matchAll(/(?:^|\n)\s*(?:import|export)\b[^'"]*?from\s+['"]([^'"]+)['"]/g)].map(
    (m) => m[1],
  );
  const bare = [...text.matchAll(/(?:^|\n)\s*import\s+['"]([^'"]+)['"]/g)].map((m) => m[1]);
  return [...specs, ...bare].filter((s) => s.startsWith('.'));
}

/** The top-level folder of a file inside the engine, or 'entry' for files directly in shared/engine. */
function folderOf(file: string): string {
  const rel = relative(ENGINE, file).split(/[\\/]/);
  return rel.length === 1 ? 'entry' : rel[0];
}

const edges = sourceFiles(ENGINE).flatMap((file) =>
  importsOf(file).map((spec) => ({
    file: relative(ENGINE, file),
    spec,
    from: folderOf(file),
    to: folderOf(resolve(dirname(file), spec)),
  })),
);

describe('engine layers', () => {
  it('finds the engine files and their imports', () => {
    // Guard against a parser that silently reads nothing: the model imports the templates, search the core.
    expect(edges.some((e) => e.from === 'model' && e.to === 'templates')).toBe(true);
    expect(edges.some((e) => e.from === 'search' && e.to === 'observe')).toBe(true);
  });

  it('puts every source file in a known layer or the entry', () => {
    const folders = new Set(sourceFiles(ENGINE).map(folderOf));
    for (const f of folders) expect(['entry', ...LAYERS]).toContain(f);
  });

  it('imports only downwards (or within a folder)', () => {
    const rank = (f: string) => LAYERS.indexOf(f as (typeof LAYERS)[number]);
    const upward = edges
      .filter((e) => e.from !== 'entry' && (e.to === 'entry' || rank(e.to) > rank(e.from)))
      .map((e) => `${e.file} → ${e.spec}`);
    expect(upward).toEqual([]);
  });

  it('has no cycle between folders', () => {
    const graph = new Map<string, Set<string>>();
    for (const e of edges) {
      if (e.from === e.to) continue;
      graph.set(e.from, (graph.get(e.from) ?? new Set()).add(e.to));
    }
    const cycles: string[] = [];
    const walk = (node: string, trail: string[]) => {
      if (trail.includes(node)) {
        cycles.push([...trail.slice(trail.indexOf(node)), node].join(' → '));
        return;
      }
      for (const next of graph.get(node) ?? []) walk(next, [...trail, node]);
    };
    for (const start of graph.keys()) walk(start, []);
    expect(cycles).toEqual([]);
  });
});
