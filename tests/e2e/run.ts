/**
 * Runs the browser tests in Debian's Chromium. Without Chromium they are
 * skipped loudly on a developer's machine, and fail on a CI server.
 */
import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import ci from 'ci-info';
import { CHROMIUM_PATH } from './browser';

if (!existsSync(CHROMIUM_PATH)) {
  const banner = [
    '',
    '!'.repeat(72),
    `!! Browser tests NOT RUN: ${CHROMIUM_PATH} is missing.`,
    '!! Install it with: sudo apt-get install -y chromium',
    '!'.repeat(72),
    '',
  ].join('\n');
  console.error(banner);
  process.exit(ci.isCI ? 1 : 0);
}

const result = spawnSync(process.execPath, ['node_modules/vitest/vitest.mjs', 'run', '--project', 'e2e', ...process.argv.slice(2)], {
  stdio: 'inherit',
});
process.exit(result.status ?? 1);
