/**
 * Writes the headers for the files the server sends itself (scripts, styles,
 * fonts, public/) into `dist/server/static-headers.json` after the build, so
 * `scripts/start.mjs` sends them without a second copy of the rules.
 */
import type { AstroIntegration } from 'astro';
import { writeFile } from 'node:fs/promises';
import { fileURLToPath } from 'node:url';
import { staticFileHeaders } from '../lib/platform/http/security';

export default function staticHeaders(): AstroIntegration {
  let serverDir: URL | null = null;
  return {
    name: 'railwright:static-headers',
    hooks: {
      'astro:config:done': ({ config }) => {
        serverDir = config.build.server;
      },
      'astro:build:done': async () => {
        if (!serverDir) throw new Error('The server build folder is unknown.');
        await writeFile(fileURLToPath(new URL('static-headers.json', serverDir)), JSON.stringify(staticFileHeaders(true), null, 2));
      },
    },
  };
}
