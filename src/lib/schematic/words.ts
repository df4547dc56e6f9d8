// The words a drawing prints beside each symbol: reference, value with its SI prefix, and the
// ratings that decide whether the part survives (resistor watts, capacitor and Zener volts).
import { formatSi } from '../engine/units.ts';
import type { Component } from '../engine/types.ts';

/** The value as the part list prints it: "4.7 kΩ", "47 µF". */
export function valueText(c: Component): string | null {
  return c.value === null || c.unit === null ? null : formatSi(c.value, c.unit);
}

/** Resistors at or above this rating have it printed: below it the rating is the ordinary small part's. */
const PRINTED_RESISTOR_W = 0.25;

/** The line under the value: how a string or a parallel bank is made up, and the ratings that matter. */
export function detailText(c: Component): string | null {
  const bits: string[] = [];
  if (c.quantity > 1 && c.value !== null && c.unit !== null) {
    // The value is the string's or the bank's total; each member carries an equal share.
    bits.push(`${c.quantity} × ${formatSi(c.value / c.quantity, c.unit)}`);
  }
  const resistor = c.unit === 'Ω';
  if (c.ratingW !== null && (!resistor || c.ratingW >= PRINTED_RESISTOR_W))
    bits.push(`${formatSi(c.ratingW, 'W', 2)}${c.quantity > 1 ? ' each' : ''}`);
  if (c.ratingV !== null && c.unit === 'F') bits.push(formatSi(c.ratingV, 'V', 3));
  return bits.length ? bits.join(', ') : null;
}

/** A device's short name: the part text up to its first comma, kept to two short lines. */
export function deviceName(c: Component): string[] {
  const head = c.part.split(',')[0]!.trim();
  const words = head.split(/\s+/);
  const lines: string[] = [];
  let current = '';
  for (const w of words) {
    if (current && (current + ' ' + w).length > 24) {
      lines.push(current);
      current = w;
    } else current = current ? `${current} ${w}` : w;
  }
  if (current) lines.push(current);
  const kept = lines.slice(0, 2);
  if (lines.length > 2) kept[1] = `${kept[1]}…`;
  if (c.ratingV !== null && !head.includes(`${c.ratingV} V`)) kept.push(`rated ${formatSi(c.ratingV, 'V', 3)}`);
  return kept;
}

/** Text width in drawing units at the label size (Manrope's average advance, a little generous). */
export function textWidth(text: string, size = LABEL_SIZE): number {
  return text.length * size * 0.6;
}

export const LABEL_SIZE = 12;
export const LINE = 14;

/** The hover title of a part: reference, what it is, its value. */
export function titleOf(c: Component): string {
  const value = valueText(c);
  return `${c.ref}: ${c.part}${value && !c.part.includes(value) ? `, ${value}` : ''}`;
}
