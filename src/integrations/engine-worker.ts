/**
 * Builds the engine thread (`src/lib/platform/engine-pool/worker.ts`) into
 * `dist/server/engine-worker.mjs` after Astro's server build. The worker is its
 * own entry point, which Astro's server bundle has no place for; the engine is
 * pure, so one esbuild bundle of it is all the thread needs.
 */
import type { AstroIntegration } from 'astro';
import { build, type BuildOptions } from 'esbuild';
import { fileURLToPath } from 'node:url';

export const ENGINE_WORKER_SOURCE = fileURLToPath(new URL('../lib/platform/engine-pool/worker.ts', import.meta.url));

/** How the engine is bundled for the server; the benchmark bundles its measurements the same way. */
export const ENGINE_BUNDLE_OPTIONS = {
  bundle: true,
  platform: 'node',
  format: 'esm',
  target: 'node20',
  logLevel: 'warning',
} as const satisfies BuildOptions;

/** One self-contained ES module with the engine thread and everything it imports. */
export async function buildEngineWorker(outfile: string): Promise<void> {
  await build({ ...ENGINE_BUNDLE_OPTIONS, entryPoints: [ENGINE_WORKER_SOURCE], outfile });
}

export default function engineWorker(): AstroIntegration {
  let serverDir: URL | null = null;
  return {
    name: 'railwright:engine-worker',
    hooks: {
      'astro:config:done': ({ config }) => {
        serverDir = config.build.server;
      },
      'astro:build:done': async ({ logger }) => {
        if (!serverDir) throw new Error('The server build folder is unknown.');
        const outfile = fileURLToPath(new URL('engine-worker.mjs', serverDir));
        await buildEngineWorker(outfile);
        logger.info(`engine thread built: ${outfile}`);
      },
    },
  };
}
