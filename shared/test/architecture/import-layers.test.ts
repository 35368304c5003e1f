import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import ts from 'typescript';
import { describe, expect, it } from 'vitest';

// The folders of shared/src form a directed graph through their imports (tests beside the code excluded).
// Two properties hold by design (DEVELOPERS.md, Layout): the graph has no cycle, and `sim`, the
// netlist-level engine, imports nothing but itself and `errors`.

const srcDir = path.resolve(__dirname, '../../src');

function sourceFiles(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((e) => {
    const p = path.join(dir, e.name);
    if (e.isDirectory()) return sourceFiles(p);
    return e.name.endsWith('.ts') && !e.name.endsWith('.test.ts') ? [p] : [];
  });
}

function folderOf(file: string): string {
  return path.relative(srcDir, file).split(path.sep)[0]!;
}

function folderGraph(): Map<string, Set<string>> {
  const graph = new Map<string, Set<string>>();
  for (const file of sourceFiles(srcDir)) {
    const from = folderOf(file);
    const edges = graph.get(from) ?? new Set<string>();
    graph.set(from, edges);
    for (const ref of ts.preProcessFile(readFileSync(file, 'utf8'), true, true).importedFiles) {
      if (!ref.fileName.startsWith('.')) continue;
      const to = folderOf(path.resolve(path.dirname(file), ref.fileName));
      if (to !== from) edges.add(to);
    }
  }
  return graph;
}

/** A cycle of the graph as a list of folders (first repeated last), or null. Depth-first search. */
function findCycle(graph: Map<string, Set<string>>): string[] | null {
  const state = new Map<string, 'open' | 'done'>();
  const stack: string[] = [];
  const visit = (node: string): string[] | null => {
    if (state.get(node) === 'done') return null;
    if (state.get(node) === 'open') return [...stack.slice(stack.indexOf(node)), node];
    state.set(node, 'open');
    stack.push(node);
    for (const next of graph.get(node) ?? []) {
      const cycle = visit(next);
      if (cycle) return cycle;
    }
    stack.pop();
    state.set(node, 'done');
    return null;
  };
  for (const node of graph.keys()) {
    const cycle = visit(node);
    if (cycle) return cycle;
  }
  return null;
}

describe('shared/src import layers', () => {
  const graph = folderGraph();

  it('reads the folders and their imports', () => {
    expect([...graph.keys()]).toEqual(expect.arrayContaining(['sim', 'circuits', 'runs', 'analysis', 'driver']));
    expect([...graph.get('runs')!]).toEqual(expect.arrayContaining(['sim', 'circuits']));
  });

  it('has no cycle between folders', () => {
    expect(findCycle(graph)).toBeNull();
  });

  it('finds a cycle when there is one', () => {
    const looped = new Map(graph);
    looped.set('sim', new Set([...graph.get('sim')!, 'runs']));
    expect(findCycle(looped)).toEqual(expect.arrayContaining(['sim', 'runs']));
  });

  it('keeps the simulator engine free of the domain', () => {
    expect([...graph.get('sim')!].sort()).toEqual(['errors']);
  });
});
