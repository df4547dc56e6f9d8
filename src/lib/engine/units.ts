// SI formatting and parsing shared by the engine, the wizard and the PDF (browser-safe).

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

/**
 * Parses "4k7", "4.7k", "220u", "220µ", "0.5", "10M" (mega), "3m3" (milli), with an optional
 * trailing unit symbol ("4.7 kΩ", "220uF"). Returns null when the text is not a number.
 */
export function parseSi(text: string): number | null {
  const trimmed = text
    .trim()
    .replace(/[ΩVAFHWs]$|Hz$|ohm$/i, '')
    .trim();
  // Either "<number><prefix>?" or the resistor-code form "<digits><prefix><digits>".
  const plain = /^([+-]?(?:\d+\.?\d*|\.\d+)(?:e[+-]?\d+)?)\s*([TGMkKmuµμnpRr]?)$/.exec(trimmed);
  if (plain) {
    const factor = PREFIX_FACTOR[plain[2] ?? ''] ?? 1;
    const value = Number(plain[1]) * factor;
    return Number.isFinite(value) ? Number(value.toPrecision(12)) : null;
  }
  const code = /^(\d+)([TGMkKmuµμnpRr])(\d+)$/.exec(trimmed);
  if (code) {
    const factor = PREFIX_FACTOR[code[2] ?? ''] ?? 1;
    const value = Number(`${code[1]}.${code[3]}`) * factor;
    return Number.isFinite(value) ? Number(value.toPrecision(12)) : null;
  }
  return null;
}
