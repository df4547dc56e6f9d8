// How catalog labels and figures read inside the engine's sentences (browser-safe, pure).

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
