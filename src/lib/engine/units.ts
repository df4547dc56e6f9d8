// Figures as the engine, the wizard and the PDF write and read them: SI formatting and parsing,
// thermal resistances and shortfalls, and catalog labels inside sentences (browser-safe).

const PREFIXES: ReadonlyArray<readonly [number, string]> = [
  [1e12, 'T'],
  [1e9, 'G'],
  [1e6, 'M'],
  [1e3, 'k'],
  [1, ''],
  [1e-3, 'm'],
  [1e-6, 'µ'],
  [1e-9, 'n'],
  [1e-12, 'p'],
];

// Searches format the same few values (series members, ratings) over and over: each distinct
// question is answered once; the memo is emptied when it grows past FORMATTED_KEPT.
const FORMATTED_KEPT = 4096;
const formatted = new Map<string, Map<number, string>>();
let formattedCount = 0;

/** Formats a value with an SI prefix and `digits` significant figures: formatSi(4700, 'Ω') → "4.7 kΩ". */
export function formatSi(value: number, unit: string, digits = 3): string {
  let byValue = formatted.get(`${digits}${unit}`);
  if (!byValue) {
    byValue = new Map();
    formatted.set(`${digits}${unit}`, byValue);
  }
  let text = byValue.get(value);
  if (text === undefined) {
    if (formattedCount >= FORMATTED_KEPT) {
      for (const m of formatted.values()) m.clear();
      formattedCount = 0;
    }
    text = formatSiUncached(value, unit, digits);
    byValue.set(value, text);
    formattedCount += 1;
  }
  return text;
}

function formatSiUncached(value: number, unit: string, digits: number): string {
  if (!Number.isFinite(value)) return '—';
  if (value === 0) return `0 ${unit}`.trimEnd();
  const magnitude = Math.abs(value);
  // Rounding first keeps 999.7 → "1 k" rather than "1000".
  const rounded = Number(magnitude.toPrecision(digits));
  let chosen: readonly [number, string] = PREFIXES[PREFIXES.length - 1]!;
  for (const entry of PREFIXES) {
    if (rounded >= entry[0] * (1 - 1e-12)) {
      chosen = entry;
      break;
    }
  }
  const scaled = Number((rounded / chosen[0]).toPrecision(digits));
  const sign = value < 0 ? '−' : '';
  return `${sign}${scaled} ${chosen[1]}${unit}`.trimEnd();
}

const PREFIX_FACTOR: Readonly<Record<string, number>> = {
  T: 1e12,
  G: 1e9,
  M: 1e6,
  k: 1e3,
  K: 1e3,
  m: 1e-3,
  u: 1e-6,
  µ: 1e-6,
  μ: 1e-6,
  n: 1e-9,
  p: 1e-12,
  R: 1,
  r: 1,
};
const PREFIX_CLASS = 'TGMkKmuµμnpRr';
/** Unit symbols the trade also writes in place of the decimal point ("3V3"; R, as in "2R2", reads as a prefix of 1). */
const UNIT_MARKS = ['V', 'A', 'W', 'F', 'H', 'Ω'];
const UNIT_SUFFIX = /\s*(?:Ω|ohms?|Hz|°C|%|[VAFHWs]|[vawfh])$/;
const ANY_UNIT = /^(?:Ω|ohms?|Hz|°C|%|[VAFHWs])$/;

/** What the number fields accept, for the message shown when a typed value does not read. */
export function numberFormsHint(unit = ''): string {
  const mark = UNIT_MARKS.includes(unit) ? `, 3${unit}3` : '';
  return `Write a number like 3.3, 3,3${mark}, 4k7 or 100m.`;
}

function exact(value: number): number | null {
  return Number.isFinite(value) ? Number(value.toPrecision(12)) : null;
}

/**
 * Parses what a practitioner types for a value: "0.5", "3,3" (decimal comma), "4.7k", "220u",
 * "220µ", "10M" (mega), "3m" (milli), "1e-3", with an optional unit symbol ("4.7 kΩ", "220uF"),
 * and the code style where a prefix or the unit stands for the decimal point: "4k7", "2R2",
 * "1M5", "0R1", "4u7", "3V3" (common practice). With `unit`, only that unit may be written
 * (in either case where its lower case is no prefix). Returns null when the text is not a number.
 */
export function parseSi(text: string, unit?: string): number | null {
  let trimmed = text.trim();
  // A decimal comma: one comma and no point ("3,3"); a comma beside a point is ambiguous.
  if (trimmed.includes(',')) {
    if (trimmed.includes('.') || trimmed.indexOf(',') !== trimmed.lastIndexOf(',')) return null;
    trimmed = trimmed.replace(',', '.');
  }
  const marks = unit === undefined ? UNIT_MARKS.join('') : UNIT_MARKS.includes(unit) ? unit + unit.toLowerCase() : '';
  const code = new RegExp(`^(\\d+)([${PREFIX_CLASS}${marks}])(\\d+)(.*)$`).exec(trimmed);
  if (code) {
    const [, whole, marker = '', fraction, rest = ''] = code;
    const isPrefix = PREFIX_CLASS.includes(marker);
    // "4k7Ω" names its unit once; "3V3V" twice.
    if (rest !== '' && (!isPrefix || !unitMatches(rest, unit))) return null;
    return exact(Number(`${whole}.${fraction}`) * (isPrefix ? (PREFIX_FACTOR[marker] ?? 1) : 1));
  }
  const suffix = UNIT_SUFFIX.exec(trimmed);
  if (suffix && unitMatches(suffix[0], unit)) trimmed = trimmed.slice(0, suffix.index);
  const plain = new RegExp(`^([+-]?(?:\\d+\\.?\\d*|\\.\\d+)(?:e[+-]?\\d+)?)\\s*([${PREFIX_CLASS}]?)$`).exec(trimmed);
  if (!plain) return null;
  return exact(Number(plain[1]) * (PREFIX_FACTOR[plain[2] ?? ''] ?? 1));
}

function unitMatches(written: string, unit: string | undefined): boolean {
  const symbol = written.trim();
  if (unit === undefined || unit === '') return ANY_UNIT.test(symbol);
  if (unit === 'Ω') return /^(?:Ω|ohms?)$/.test(symbol);
  return symbol === unit || (UNIT_MARKS.includes(unit) && symbol === unit.toLowerCase());
}

// Catalog labels and figures inside the engine's sentences.

/** Names that keep their capital inside a sentence. */
const PROPER_NOUNS = new Set(['Zener']);

/** "Aluminium electrolytic, low ESR" → "aluminium electrolytic, low ESR": a label read mid-sentence. */
export function lowerFirst(label: string): string {
  const first = label.split(/[\s,-]/, 1)[0] ?? '';
  // An acronym ("NPN", "LDO") or a name keeps its capitals.
  if (PROPER_NOUNS.has(first) || /^[A-Z]{2,}/.test(first)) return label;
  return label.charAt(0).toLowerCase() + label.slice(1);
}

/**
 * A catalog class label as a noun phrase in a sentence: "Buck converter with catch diode, 100 V,
 * 1.5 A" → "the buck converter with catch diode rated 100 V, 1.5 A" ("The …" to start one). Parts
 * of the label without a figure ("high-voltage variant") and a "from 1.5 V" stay with the noun.
 */
export function classPhrase(label: string, start = false): string {
  // Every candidate of a search words its findings with a class label: each label is worded once.
  const key = `${start ? 'T' : 't'}${label}`;
  let phrase = phrases.get(key);
  if (phrase === undefined) {
    if (phrases.size >= PHRASES_KEPT) phrases.clear();
    phrase = wordClass(label, start);
    phrases.set(key, phrase);
  }
  return phrase;
}

const PHRASES_KEPT = 256;
const phrases = new Map<string, string>();

function wordClass(label: string, start: boolean): string {
  const [first = '', ...rest] = label.split(', ');
  let noun = lowerFirst(first);
  while (rest.length > 0 && (rest[0]?.startsWith('from ') || !/\d/.test(rest[0] ?? ''))) {
    const part = rest.shift() ?? '';
    noun += part.startsWith('from ') ? ` ${part}` : `, ${part},`;
  }
  const phrase = rest.length === 0 ? `the ${noun.replace(/,$/, '')}` : `the ${noun} rated ${rest.join(', ')}`;
  return start ? `T${phrase.slice(1)}` : phrase;
}

/** A thermal resistance always in K/W, never with an SI prefix: 0.36 → "0.36 K/W", 12.34 → "12.3 K/W". */
export function formatKPerW(value: number): string {
  if (!Number.isFinite(value)) return '—';
  const digits = Math.abs(value) >= 10 ? 3 : 2;
  const text = String(Number(value.toPrecision(digits)));
  return `${value < 0 ? text.replace('-', '−') : text} K/W`;
}

/** A voltage that falls short said as a shortfall, never as a negative margin: 0.3 → "0.30 V short". */
export function shortBy(volts: number): string {
  return `${Math.abs(volts).toFixed(2)} V short`;
}
