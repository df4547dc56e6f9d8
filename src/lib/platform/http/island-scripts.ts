/**
 * The inline scripts a page may carry: Astro's island loader and its hydration
 * directives, fixed strings of the installed Astro. Their hashes are the only
 * inline scripts the page policy allows, so a script injected into a page
 * never runs. A test renders the pages and fails if one carries another.
 */
import { createHash } from 'node:crypto';
import { readdir } from 'node:fs/promises';
import { createRequire } from 'node:module';
import path from 'node:path';
import { pathToFileURL } from 'node:url';

export const scriptHash = (text: string) => `sha256-${createHash('sha256').update(text, 'utf8').digest('base64')}`;

let known: Promise<string[]> | null = null;

export function islandScriptHashes(): Promise<string[]> {
  known ??= (async () => {
    const astroRoot = path.dirname(createRequire(import.meta.url).resolve('astro/package.json'));
    const directives = path.join(astroRoot, 'dist/runtime/client');
    const files = [
      ...(await readdir(directives)).filter((name) => name.endsWith('.prebuilt.js')).map((name) => path.join(directives, name)),
      path.join(astroRoot, 'dist/runtime/server/astro-island.prebuilt.js'),
    ];
    const texts = await Promise.all(
      files.map(async (file) => ((await import(/* @vite-ignore */ pathToFileURL(file).href)) as { default: string }).default),
    );
    return texts.map(scriptHash).sort();
  })();
  return known;
}
