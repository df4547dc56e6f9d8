/**
 * Manrope for the PDF, from @fontsource/manrope's `.woff` files (pdfmake's
 * font reader breaks on `.woff2`). The files are read once per process and
 * written, unwrapped, to a private temporary folder. Fontsource splits the face into
 * per-script subsets, so each character is set in the subset that has it
 * (Ω for resistor values is Greek, Ł in a client's name is Latin Extended).
 */

/**
 * Unwraps a WOFF 1.0 file into the plain font it compresses, once at start:
 * left as WOFF, the font reader inflates every table again for every
 * document in pure JavaScript, which costs most of a render.
 */
export function woffToSfnt(woff: Buffer): Buffer {
  if (woff.toString('latin1', 0, 4) !== 'wOFF') throw new Error('Not a WOFF 1.0 font');
  const numTables = woff.readUInt16BE(12);
  const tables = Array.from({ length: numTables }, (_, i) => {
    const at = 44 + i * 20;
    const offset = woff.readUInt32BE(at + 4);
    const compLength = woff.readUInt32BE(at + 8);
    const origLength = woff.readUInt32BE(at + 12);
    const packed = woff.subarray(offset, offset + compLength);
    return {
      tag: woff.readUInt32BE(at),
      checksum: woff.readUInt32BE(at + 16),
      data: compLength < origLength ? inflateSync(packed) : packed,
    };
  });
  const pad = (n: number) => (n + 3) & ~3;
  const headerSize = 12 + 16 * numTables;
  const out = Buffer.alloc(headerSize + tables.reduce((sum, t) => sum + pad(t.data.length), 0));
  out.writeUInt32BE(woff.readUInt32BE(4), 0);
  const searchRange = 2 ** Math.floor(Math.log2(numTables)) * 16;
  out.writeUInt16BE(numTables, 4);
  out.writeUInt16BE(searchRange, 6);
  out.writeUInt16BE(Math.floor(Math.log2(numTables)), 8);
  out.writeUInt16BE(numTables * 16 - searchRange, 10);
  let offset = headerSize;
  tables.forEach((t, i) => {
    const at = 12 + i * 16;
    out.writeUInt32BE(t.tag, at);
    out.writeUInt32BE(t.checksum, at + 4);
    out.writeUInt32BE(offset, at + 8);
    out.writeUInt32BE(t.data.length, at + 12);
    t.data.copy(out, offset);
    offset += pad(t.data.length);
  });
  return out;
}
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { inflateSync } from 'node:zlib';
import pdfmake from 'pdfmake';

interface Subset {
  family: string;
  file: string;
  /** Inclusive code point ranges from the package's unicode.json. */
  ranges: [number, number][];
}

const SUBSETS: Subset[] = [
  {
    family: 'Manrope',
    file: 'latin',
    ranges: [
      [0x0000, 0x00ff],
      [0x0131, 0x0131],
      [0x0152, 0x0153],
      [0x02bb, 0x02bc],
      [0x02c6, 0x02c6],
      [0x02da, 0x02da],
      [0x02dc, 0x02dc],
      [0x2000, 0x206f],
      [0x20ac, 0x20ac],
      [0x2122, 0x2122],
      [0x2191, 0x2191],
      [0x2193, 0x2193],
      [0x2212, 0x2212],
      [0x2215, 0x2215],
    ],
  },
  {
    family: 'ManropeLatinExt',
    file: 'latin-ext',
    ranges: [
      [0x0100, 0x02ba],
      [0x02bd, 0x02c5],
      [0x02c7, 0x02cc],
      [0x02ce, 0x02d7],
      [0x02dd, 0x02ff],
      [0x1e00, 0x1e9f],
      [0x20a0, 0x20ab],
      [0x20ad, 0x20c0],
      [0x2113, 0x2113],
    ],
  },
  { family: 'ManropeGreek', file: 'greek', ranges: [[0x0370, 0x03ff]] },
  {
    family: 'ManropeCyrillic',
    file: 'cyrillic',
    ranges: [
      [0x0400, 0x045f],
      [0x0490, 0x0491],
      [0x04b0, 0x04b1],
    ],
  },
];

export const BASE_FAMILY = 'Manrope';

const require = createRequire(import.meta.url);
const fonts: Record<string, { normal: string; bold: string; italics: string; bolditalics: string }> = {};
// The faces go to files in a private folder rather than pdfmake's in-memory file system: the SVG
// renderer (schematic drawings) hands the font's path straight to PDFKit, which reads from disk.
const fontFolder = mkdtempSync(path.join(tmpdir(), 'railwright-fonts-'));
const fontFiles = new Set<string>();
for (const subset of SUBSETS) {
  const name = (weight: number) => path.join(fontFolder, `manrope-${subset.file}-${weight}.ttf`);
  for (const weight of [400, 700]) {
    const woff = readFileSync(require.resolve(`@fontsource/manrope/files/manrope-${subset.file}-${weight}-normal.woff`));
    writeFileSync(name(weight), woffToSfnt(woff));
    fontFiles.add(name(weight));
  }
  // Manrope has no italic; emphasis in the quote is by weight, so italics map to upright.
  fonts[subset.family] = { normal: name(400), bold: name(700), italics: name(400), bolditalics: name(700) };
}
pdfmake.setFonts(fonts);
// Documents are built from our own data only: no URLs are fetched, and no local path but the fonts'.
pdfmake.setUrlAccessPolicy(() => false);
pdfmake.setLocalAccessPolicy((file) => fontFiles.has(file));

export { pdfmake };

function familyOf(codePoint: number): string {
  for (const subset of SUBSETS) {
    if (subset.ranges.some(([from, to]) => codePoint >= from && codePoint <= to)) return subset.family;
  }
  return BASE_FAMILY;
}

export type Run = string | { text: string; font: string };

/** Splits text into runs by the subset that draws each character; plain latin stays a plain string. */
export function runs(text: string): Run[] {
  const out: Run[] = [];
  let current = '';
  let family = BASE_FAMILY;
  const flush = () => {
    if (!current) return;
    out.push(family === BASE_FAMILY ? current : { text: current, font: family });
    current = '';
  };
  for (const char of text) {
    const next = familyOf(char.codePointAt(0) ?? 0);
    if (next !== family) {
      flush();
      family = next;
    }
    current += char;
  }
  flush();
  return out;
}
