/**
 * The engine measured as the server runs it: bundled by esbuild with the engine thread's options,
 * not as the TypeScript loader serves it to `tsx` (which wraps every function to keep its name).
 */
import { build } from 'esbuild';
import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { ENGINE_BUNDLE_OPTIONS } from '../src/integrations/engine-worker';

type EngineBench = typeof import('./engine');

export async function loadBundledEngineBench(): Promise<EngineBench> {
  const dir = await mkdtemp(join(tmpdir(), 'railwright-bench-'));
  const outfile = join(dir, 'engine-bench.mjs');
  try {
    await build({ ...ENGINE_BUNDLE_OPTIONS, entryPoints: [fileURLToPath(new URL('./engine.ts', import.meta.url))], outfile });
    return (await import(pathToFileURL(outfile).href)) as EngineBench;
  } finally {
    await rm(dir, { recursive: true, force: true });
  }
}
