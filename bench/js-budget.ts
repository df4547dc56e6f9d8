/**
 * JavaScript each page makes the browser load, counted from the built files:
 * the scripts and island components a page names, plus everything they import
 * statically (dynamic imports load later, on demand, and are not counted).
 */
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { gzipSync } from 'node:zlib';

const CLIENT_DIR = path.resolve('dist/client');

function staticImports(file: string): string[] {
  const code = readFileSync(file, 'utf8');
  const found = new Set<string>();
  // `import"./x.js"`, `import{a}from"./x.js"`, `export*from"./x.js"` — not `import("./x.js")`.
  for (const m of code.matchAll(/(?:^|[;}\s])(?:import|export)\s*(?:[\w*{}\s,$]*?from\s*)?["']([^"']+\.js)["']/g)) {
    found.add(path.resolve(path.dirname(file), m[1]!));
  }
  return [...found];
}

function closure(entries: string[]): Set<string> {
  const seen = new Set<string>();
  const stack = [...entries];
  while (stack.length) {
    const file = stack.pop()!;
    if (seen.has(file)) continue;
    seen.add(file);
    stack.push(...staticImports(file));
  }
  return seen;
}

/** Script URLs a page's HTML names: module scripts and island component/renderer URLs. */
export function scriptUrls(html: string): string[] {
  const urls = new Set<string>();
  for (const m of html.matchAll(/<script[^>]*\ssrc="([^"]+)"/g)) urls.add(m[1]!);
  for (const m of html.matchAll(/(?:component-url|renderer-url)="([^"]+)"/g)) urls.add(m[1]!);
  return [...urls].filter((u) => u.startsWith('/_astro/') && u.endsWith('.js'));
}

export function inlineScriptBytes(html: string): number {
  let total = 0;
  for (const m of html.matchAll(/<script(?![^>]*\ssrc=)[^>]*>([\s\S]*?)<\/script>/g)) total += gzipSync(m[1]!).length;
  return total;
}

export function pageJsGzipBytes(html: string): number {
  const files = closure(scriptUrls(html).map((u) => path.join(CLIENT_DIR, u)));
  let total = inlineScriptBytes(html);
  for (const file of files) total += gzipSync(readFileSync(file)).length;
  return total;
}
