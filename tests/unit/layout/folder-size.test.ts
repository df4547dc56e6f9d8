import { readdirSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { SOURCE_FILE } from './import-graph';

const root = path.resolve(import.meta.dirname, '../../..');
const FOLDERS = ['src', 'tests', 'scripts', 'bench', 'stripe-fake', 'mail-catcher'];
/** Past this many files a folder wants sub-folders: a reader should take in a folder at a glance. */
const MOST_FILES_IN_A_FOLDER = 20;

function crowdedFolders(folder: string): string[] {
  const entries = readdirSync(path.join(root, folder), { withFileTypes: true });
  const files = entries.filter((e) => e.isFile() && SOURCE_FILE.test(e.name)).length;
  const below = entries
    .filter((e) => e.isDirectory() && e.name !== 'node_modules')
    .flatMap((e) => crowdedFolders(path.join(folder, e.name)));
  return files > MOST_FILES_IN_A_FOLDER ? [`${folder} (${files})`, ...below] : below;
}

describe('folder sizes', () => {
  it(`no folder holds more than ${MOST_FILES_IN_A_FOLDER} source files directly`, () => {
    expect(FOLDERS.flatMap(crowdedFolders)).toEqual([]);
  });
});
