import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { importCycles, importGraph } from './import-graph';

const root = path.resolve(import.meta.dirname, '../../..');
const FOLDERS = ['src', 'scripts', 'bench', 'stripe-fake', 'mail-catcher'];

describe('the import graph', () => {
  const graph = importGraph(root, FOLDERS);

  it('reads the app: pages reach the domains through the alias', () => {
    expect(graph.get('src/middleware.ts')).toContain('src/lib/platform/config.ts');
    expect(graph.size).toBeGreaterThan(200);
  });

  it('finds a loop when there is one', () => {
    const loop = new Map([
      ['a.ts', ['b.ts']],
      ['b.ts', ['c.ts']],
      ['c.ts', ['a.ts']],
      ['d.ts', ['a.ts']],
    ]);
    expect(importCycles(loop)).toEqual([['a.ts', 'b.ts', 'c.ts']]);
  });

  it('has no import cycle', () => {
    expect(importCycles(graph)).toEqual([]);
  });
});
