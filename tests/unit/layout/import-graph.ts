/**
 * The project's import graph as TypeScript resolves it (the `~` alias included),
 * read from every source file under the given folders; `.astro` files count by
 * their frontmatter and scripts. Type-only imports count too: a loop of types
 * is still two modules that cannot be understood one without the other.
 */
import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import ts from 'typescript';

export const SOURCE_FILE = /\.(ts|tsx|mts|mjs|astro)$/;

export function sourceFiles(root: string, folder: string): string[] {
  const found: string[] = [];
  for (const entry of readdirSync(path.join(root, folder), { withFileTypes: true })) {
    const relative = path.join(folder, entry.name);
    if (entry.isDirectory()) found.push(...sourceFiles(root, relative));
    else if (SOURCE_FILE.test(entry.name) && !entry.name.endsWith('.d.ts')) found.push(relative);
  }
  return found;
}

function scriptOf(file: string, text: string): string {
  if (!file.endsWith('.astro')) return text;
  const frontmatter = /^---\n([\s\S]*?)\n---/.exec(text)?.[1] ?? '';
  const scripts = [...text.matchAll(/<script[^>]*>([\s\S]*?)<\/script>/g)].map((m) => m[1]);
  return [frontmatter, ...scripts].join('\n');
}

function compilerOptions(root: string): ts.CompilerOptions {
  const read = ts.readConfigFile(path.join(root, 'tsconfig.json'), (p) => ts.sys.readFile(p));
  return ts.parseJsonConfigFileContent(read.config, ts.sys, root).options;
}

/** file → the project files it imports (paths relative to root). */
export function importGraph(root: string, folders: readonly string[]): Map<string, string[]> {
  const options = compilerOptions(root);
  const files = folders.flatMap((folder) => sourceFiles(root, folder));
  const known = new Set(files);
  const graph = new Map<string, string[]>();
  for (const file of files) {
    const absolute = path.join(root, file);
    const { importedFiles } = ts.preProcessFile(scriptOf(file, readFileSync(absolute, 'utf8')), true, true);
    const targets = new Set<string>();
    for (const { fileName } of importedFiles) {
      const resolved = ts.resolveModuleName(fileName, absolute, options, ts.sys).resolvedModule?.resolvedFileName;
      // TypeScript does not resolve `.astro` files; their paths are taken as written.
      const direct =
        resolved ??
        (fileName.startsWith('.')
          ? path.resolve(path.dirname(absolute), fileName)
          : fileName.startsWith('~/')
            ? path.join(root, 'src', fileName.slice(2))
            : undefined);
      if (!direct) continue;
      const target = path.relative(root, direct);
      if (known.has(target)) targets.add(target);
    }
    graph.set(file, [...targets]);
  }
  return graph;
}

/** Every loop in the graph, once each, as the files it passes through (Tarjan's strongly connected components). */
export function importCycles(graph: Map<string, string[]>): string[][] {
  let counter = 0;
  const index = new Map<string, number>();
  const low = new Map<string, number>();
  const stack: string[] = [];
  const onStack = new Set<string>();
  const cycles: string[][] = [];
  const visit = (node: string): void => {
    index.set(node, counter);
    low.set(node, counter);
    counter++;
    stack.push(node);
    onStack.add(node);
    for (const next of graph.get(node) ?? []) {
      if (!index.has(next)) {
        visit(next);
        low.set(node, Math.min(low.get(node) ?? 0, low.get(next) ?? 0));
      } else if (onStack.has(next)) {
        low.set(node, Math.min(low.get(node) ?? 0, index.get(next) ?? 0));
      }
    }
    if (low.get(node) !== index.get(node)) return;
    const component: string[] = [];
    let member: string | undefined;
    do {
      member = stack.pop();
      if (member === undefined) break;
      onStack.delete(member);
      component.push(member);
    } while (member !== node);
    if (component.length > 1 || (graph.get(node) ?? []).includes(node)) cycles.push(component.sort());
  };
  for (const node of graph.keys()) if (!index.has(node)) visit(node);
  return cycles;
}
