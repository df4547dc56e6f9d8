// The board as one SVG document: presentation attributes only (no stylesheet), so the same text
// draws in the browser, in the PDF (pdfmake's SVG support) and as a download. Railwright's look:
// graphite ink on white, references in copper, labels in Manrope.
import type { Board } from './board.ts';
import type { Label, Tag } from './sheet.ts';
import { groundMarkup, hazardMarkup } from './symbols.ts';
import { LABEL_SIZE, textWidth } from './words.ts';

export const INK = '#1e2329';
const SOFT = '#4a525c';
const COPPER = '#86421b';
const MARGIN = 16;

export const escapeXml = (s: string) => s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');

function text(l: Label): string {
  const size = l.small ? 10 : LABEL_SIZE;
  const colour = l.weight === 'bold' ? COPPER : l.small ? SOFT : INK;
  return `<text x="${l.x}" y="${l.y}" font-size="${size}"${l.weight ? ' font-weight="bold"' : ''} text-anchor="${l.anchor}" fill="${colour}" stroke="none">${escapeXml(l.text)}</text>`;
}

/** A net tag: a pointed flag with the net's name, its point at the wire's end. */
function tag(t: Tag): string {
  const w = textWidth(t.name, 10) + 12;
  const h = 14;
  const { x, y } = t;
  const [path, tx, ty] =
    t.side === 'right'
      ? [`M${x} ${y} l6 ${-h / 2} h${w} v${h} h${-w} Z`, x + 6 + w / 2, y + 3.5]
      : t.side === 'left'
        ? [`M${x} ${y} l-6 ${-h / 2} h${-w} v${h} h${w} Z`, x - 6 - w / 2, y + 3.5]
        : t.side === 'down'
          ? [`M${x} ${y} l${w / 2} 6 v${h} h${-w} v${-h} Z`, x, y + 6 + h / 2 + 3.5]
          : [`M${x} ${y} l${w / 2} -6 v${-h} h${-w} v${h} Z`, x, y - 6 - h / 2 + 3.5];
  return `<path d="${path}" fill="#fbf1ea" stroke="${COPPER}" stroke-width="1.2"/><text x="${tx}" y="${ty}" font-size="10" font-weight="bold" text-anchor="middle" fill="${COPPER}" stroke="none">${escapeXml(t.name)}</text>`;
}

export interface SvgText {
  id: string;
  title: string;
  desc: string;
  /** Lines printed under the drawing (the dangerous-voltage caution). */
  notes: string[];
}

export function boardSvg(board: Board, words: SvgText): string {
  const { sheet, box } = board;
  const noteTop = box.maxY + 28;
  const width = Math.ceil(box.maxX - box.minX + 2 * MARGIN);
  const height = Math.ceil(noteTop - box.minY + words.notes.length * 16 + MARGIN);
  const [x0, y0] = [Math.floor(box.minX - MARGIN), Math.floor(box.minY - MARGIN)];
  const parts = sheet.parts.map((p) => {
    const attr = p.terminal ? `data-terminal="${escapeXml(p.ref)}"` : `data-ref="${escapeXml(p.ref)}"`;
    return `<g ${attr}><title>${escapeXml(p.title)}</title>${p.markup.join('')}${p.labels.map(text).join('')}</g>`;
  });
  const notes = words.notes.map((n, i) => {
    const y = noteTop + i * 16;
    return `<g>${hazardMarkup({ x: box.minX + 10, y: y - 4 })}<text x="${box.minX + 28}" y="${y}" font-size="${LABEL_SIZE}" fill="${INK}" stroke="none">${escapeXml(n)}</text></g>`;
  });
  return [
    `<svg xmlns="http://www.w3.org/2000/svg" viewBox="${x0} ${y0} ${width} ${height}" width="${width}" height="${height}" role="img" aria-labelledby="${words.id}-title ${words.id}-desc" font-family="Manrope, sans-serif">`,
    `<title id="${words.id}-title">${escapeXml(words.title)}</title>`,
    `<desc id="${words.id}-desc">${escapeXml(words.desc)}</desc>`,
    `<rect x="${x0}" y="${y0}" width="${width}" height="${height}" fill="#ffffff"/>`,
    `<g fill="none" stroke="${INK}" stroke-width="1.8" stroke-linecap="round" stroke-linejoin="round">`,
    ...sheet.wires.map((w) => `<path d="M${w.map((p) => `${p.x} ${p.y}`).join(' L')}"/>`),
    ...sheet.junctions().map((p) => `<circle cx="${p.x}" cy="${p.y}" r="3" fill="${INK}"/>`),
    ...sheet.grounds.map(groundMarkup),
    ...sheet.tags.filter((t) => !t.hidden).map(tag),
    ...parts,
    ...sheet.hazards.map(hazardMarkup),
    ...notes,
    `</g>`,
    `</svg>`,
  ].join('\n');
}
