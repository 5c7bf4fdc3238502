// The pipeline reads top to bottom: every import points down the list of
// layers below, or stays inside its own folder, and no file imports itself
// back through others. The trade library does no I/O. (Type-only imports
// count: a cycle of types is still a cycle for the reader.)
import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';

const SERVER = path.resolve('server');
/** Lowest first. A file may import from its own layer or any layer above it in this list. */
const LAYERS = ['units', 'diagnostics.ts', 'core', 'read', 'parse', 'evaluate', 'render', 'pipeline', 'sandbox', 'serve', 'cli', 'index.ts'];

function files(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((d) => {
    const p = path.join(dir, d.name);
    return d.isDirectory() ? files(p) : d.name.endsWith('.ts') ? [p] : [];
  });
}

function layerOf(file: string): string {
  return path.relative(SERVER, file).split(path.sep)[0]!;
}

/** Relative imports (static, re-exports and dynamic) and package imports of a file. */
function importsOf(file: string): { local: string[]; packages: string[] } {
  const text = readFileSync(file, 'utf8');
  const specs = [...text.matchAll(/(?:^|\n)\s*(?:import|export)\b[^'"`;]*?from\s*'([^']+)'|import\(\s*'([^']+)'\s*\)/g)].map((m) => m[1] ?? m[2]!);
  const local = specs.filter((s) => s.startsWith('.')).map((s) => path.resolve(path.dirname(file), s.replace(/\.js$/, '.ts')));
  return { local, packages: specs.filter((s) => !s.startsWith('.')) };
}

const graph = new Map(files(SERVER).map((f) => [f, importsOf(f)]));

describe('the import graph of server/', () => {
  it('points every import down the layers', () => {
    const wrong: string[] = [];
    for (const [file, { local }] of graph) {
      const from = LAYERS.indexOf(layerOf(file));
      for (const target of local) {
        const to = LAYERS.indexOf(layerOf(target));
        if (to > from) wrong.push(`${path.relative(SERVER, file)} → ${path.relative(SERVER, target)}`);
      }
    }
    expect(LAYERS.filter((l) => !l.endsWith('.ts')).every((l) => [...graph.keys()].some((f) => layerOf(f) === l))).toBe(true);
    expect([...graph.keys()].filter((f) => LAYERS.indexOf(layerOf(f)) < 0).map((f) => path.relative(SERVER, f)), 'files outside every layer').toEqual([]);
    expect(wrong).toEqual([]);
  });

  it('has no cycle between files', () => {
    const cycles: string[] = [];
    const state = new Map<string, 'active' | 'done'>();
    const stack: string[] = [];
    const visit = (file: string) => {
      if (state.get(file) === 'done') return;
      if (state.get(file) === 'active') {
        cycles.push(stack.slice(stack.indexOf(file)).concat(file).map((f) => path.relative(SERVER, f)).join(' → '));
        return;
      }
      state.set(file, 'active');
      stack.push(file);
      for (const target of graph.get(file)?.local ?? []) if (graph.has(target)) visit(target);
      stack.pop();
      state.set(file, 'done');
    };
    for (const file of graph.keys()) visit(file);
    expect(cycles).toEqual([]);
  });

  it('resolves every relative import to a file of server/', () => {
    const missing = [...graph].flatMap(([file, { local }]) => local.filter((t) => !graph.has(t)).map((t) => `${path.relative(SERVER, file)} → ${t}`));
    expect(missing).toEqual([]);
  });

  it('keeps the trade library free of I/O: server/core imports no Node built-in', () => {
    const io = [...graph].filter(([file]) => layerOf(file) === 'core').flatMap(([file, { packages }]) => packages.filter((p) => p.startsWith('node:') || ['fs', 'path', 'child_process', 'net', 'http'].includes(p)).map((p) => `${path.relative(SERVER, file)}: ${p}`));
    expect(io).toEqual([]);
  });
});
