/**
 * The import graph has no loop: no source file reaches itself through its relative imports (type-only imports
 * count, since a loop of types is a loop of ideas too), and `project/` and `handlers/` do not import each other both
 * ways. A loop makes the load order decide what a module sees, and two modules in a loop are one idea in two files.
 */
import { existsSync, readdirSync, readFileSync, statSync } from 'node:fs';
import { dirname, join, relative, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

const ROOT = fileURLToPath(new URL('../..', import.meta.url));
const SOURCE_FOLDERS = ['electron', 'shared-types', 'renderer'];

function sourceFiles(dir: string, out: string[] = []): string[] {
  for (const name of readdirSync(dir)) {
    const path = join(dir, name);
    if (statSync(path).isDirectory()) sourceFiles(path, out);
    else if (/\.(ts|vue)$/.test(name) && !name.endsWith('.d.ts')) out.push(path);
  }
  return out;
}

/** The file a relative specifier names, or null (a package, or a file this guard does not follow). */
function resolveImport(from: string, spec: string): string | null {
  const base = resolve(dirname(from), spec);
  for (const candidate of [base, `${base}.ts`, join(base, 'index.ts')]) if (existsSync(candidate) && statSync(candidate).isFile()) return candidate;
  return null;
}

/** Each source file (relative to the repository) with the source files it imports or re-exports. */
export function importGraph(): Map<string, string[]> {
  const graph = new Map<string, string[]>();
  for (const folder of SOURCE_FOLDERS) {
    for (const file of sourceFiles(join(ROOT, folder))) {
      const text = readFileSync(file, 'utf8');
      const deps: string[] = [];
      for (const m of text.matchAll(/(?:^|\n)\s*(?:import|export)\s[^'"]*?from\s+['"](\.{1,2}\/[^'"]+)['"]/g)) {
        const target = resolveImport(file, m[1]!);
        if (target) deps.push(relative(ROOT, target));
      }
      graph.set(relative(ROOT, file), deps);
    }
  }
  return graph;
}

/** The strongly connected components of more than one file (Tarjan), i.e. the import loops. */
export function importLoops(graph: Map<string, string[]>): string[][] {
  let next = 0;
  const index = new Map<string, number>();
  const low = new Map<string, number>();
  const stack: string[] = [];
  const onStack = new Set<string>();
  const loops: string[][] = [];
  const visit = (v: string): void => {
    index.set(v, next);
    low.set(v, next);
    next++;
    stack.push(v);
    onStack.add(v);
    for (const w of graph.get(v) ?? []) {
      if (!index.has(w)) {
        visit(w);
        low.set(v, Math.min(low.get(v)!, low.get(w)!));
      } else if (onStack.has(w)) low.set(v, Math.min(low.get(v)!, index.get(w)!));
    }
    if (low.get(v) === index.get(v)) {
      const component: string[] = [];
      let w: string;
      do {
        w = stack.pop()!;
        onStack.delete(w);
        component.push(w);
      } while (w !== v);
      if (component.length > 1 || (graph.get(v) ?? []).includes(v)) loops.push(component.sort());
    }
  };
  for (const v of graph.keys()) if (!index.has(v)) visit(v);
  return loops;
}

describe('import graph', () => {
  const graph = importGraph();

  it('reads the source tree (the guard is looking at real files)', () => {
    expect(graph.size).toBeGreaterThan(100);
    expect(graph.get('electron/engine/simulation/plant-dynamics.ts')).toContain('electron/engine/simulation/controls.ts');
  });

  it('finds a loop when there is one (the guard can fail)', () => {
    const looped = new Map([
      ['a.ts', ['b.ts']],
      ['b.ts', ['c.ts']],
      ['c.ts', ['a.ts']],
      ['d.ts', ['a.ts']],
    ]);
    expect(importLoops(looped)).toEqual([['a.ts', 'b.ts', 'c.ts']]);
  });

  it('has no loop between source files', () => {
    expect(importLoops(graph)).toEqual([]);
  });

  it('has project/ and handlers/ importing each other at most one way (the schemas both read live in schemas/)', () => {
    const folderOf = (f: string) => (f.startsWith('electron/project/') ? 'project' : f.startsWith('electron/handlers/') ? 'handlers' : null);
    const ways = new Set<string>();
    for (const [file, deps] of graph) {
      const from = folderOf(file);
      for (const d of deps) {
        const to = folderOf(d);
        if (from && to && from !== to) ways.add(`${from} → ${to}`);
      }
    }
    expect([...ways]).toEqual(['handlers → project']);
  });

  it('has each layer importing only downward: the engine and shared-types never import the report renderer, the handlers or the hosts; the report renderer never imports the handlers; the schemas never import the handlers or the project reader', () => {
    const layerOf = (f: string) =>
      f.startsWith('shared-types/')
        ? 'shared-types'
        : f.startsWith('electron/engine/')
          ? 'engine'
          : f.startsWith('electron/report/')
            ? 'report'
            : f.startsWith('electron/schemas/')
              ? 'schemas'
              : f.startsWith('electron/')
                ? 'electron'
                : 'renderer';
    const allowed: Record<string, string[]> = {
      'shared-types': ['shared-types'],
      engine: ['engine', 'shared-types'],
      report: ['report', 'engine', 'shared-types'],
      schemas: ['schemas', 'engine', 'shared-types'],
    };
    const upward: string[] = [];
    for (const [file, deps] of graph) {
      const ok = allowed[layerOf(file)];
      if (!ok) continue;
      for (const d of deps) if (!ok.includes(layerOf(d))) upward.push(`${file} → ${d}`);
    }
    expect(upward).toEqual([]);
  });
});
