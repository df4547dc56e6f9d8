// Figures no physical supply can show, found anywhere in an evaluation: non-finite numbers,
// negative powers, ratings, thermal resistances or temperature rises, junctions past their limit,
// negative voltages on a positive rail, efficiencies outside 0–1, a part dissipating more than its
// whole option, and the same in message text.
import type { Evaluation, Option } from '~/lib/engine/types.ts';
import type { RailSpec } from '~/lib/engine/rail-spec.ts';

/** Keys whose numbers are physically never negative wherever they appear. */
const NON_NEGATIVE_KEYS = new Set([
  'maxW',
  'faultW',
  'totalMaxW',
  'ratingW',
  'ratingV',
  'costCents',
  'partCount',
  'quantity',
  'outputRippleVpp',
  'maxThetaSaCW',
  'sigma',
  'yield',
  'fractionInTolerance',
  'draws',
]);

/** Units whose figures are never negative in a trace or an assumption (thermal resistance, rises, powers). */
const NON_NEGATIVE_UNITS = new Set(['K/W', 'K', 'W', 'Ω', 'F', 'H', 'A']);

/** Hotter than any part's rated junction the catalog knows: no message may print it. */
const HOTTEST_LIMIT_C = 200;

function walk(value: unknown, path: string, out: string[]): void {
  if (typeof value === 'number') {
    if (!Number.isFinite(value)) out.push(`${path}: non-finite ${value}`);
    else {
      const key = path.slice(path.lastIndexOf('.') + 1);
      if (NON_NEGATIVE_KEYS.has(key) && value < 0) out.push(`${path}: negative ${value}`);
    }
    return;
  }
  if (Array.isArray(value)) {
    value.forEach((v, k) => walk(v, `${path}[${k}]`, out));
    return;
  }
  if (value !== null && typeof value === 'object') {
    for (const [k, v] of Object.entries(value)) walk(v, `${path}.${k}`, out);
  }
}

const NUMBER = String.raw`(\d+(?:[.,]\d+)?)`;
const NEGATIVE = String.raw`(?:^|[\s(=≈≤≥<>])[−-]\s?\d`;

/** What a message may not say: a temperature beyond any part, a negative θ, a negative voltage. */
export function impossibleInText(text: string, where: string): string[] {
  const out: string[] = [];
  for (const m of text.matchAll(new RegExp(`${NUMBER}\\s?°C`, 'g'))) {
    const c = Number(m[1]!.replace(',', '.'));
    if (c > HOTTEST_LIMIT_C) out.push(`${where}: prints ${m[0]} (beyond any part's limit)`);
  }
  if (new RegExp(`${NEGATIVE}[\\d.,]*\\s?K/W`).test(text)) out.push(`${where}: prints a negative thermal resistance`);
  if (new RegExp(`${NEGATIVE}[\\d.,]*\\s?[mkµ]?V\\b`).test(text)) out.push(`${where}: prints a negative voltage on a positive rail`);
  if (/NaN|Infinity/.test(text)) out.push(`${where}: prints NaN or Infinity`);
  return out;
}

function optionFigures(o: Option, spec: RailSpec): string[] {
  const out: string[] = [];
  const at = (what: string) => `${o.topology}.${what}`;
  for (const [k, v] of [
    ['nominal', o.efficiency.nominal],
    ['worst', o.efficiency.worst],
  ] as const) {
    if (v < 0 || v > 1) out.push(`${at(`efficiency.${k}`)}: ${v} outside 0–1`);
  }
  o.curves.efficiency.forEach((e, k) => {
    if (e !== null && (e < 0 || e > 1)) out.push(`${at(`curves.efficiency[${k}]`)}: ${e} outside 0–1`);
  });
  o.curves.dissipationW.forEach((d, k) => {
    if (d !== null && d < 0) out.push(`${at(`curves.dissipationW[${k}]`)}: negative ${d}`);
  });
  for (const [k, v] of [
    ['vOutRange.min', o.vOutRange.min],
    ['tolerance.worstCase.min', o.tolerance.worstCase.min],
    ['monteCarlo.mean', o.monteCarlo.mean],
  ] as const) {
    if (v < 0) out.push(`${at(k)}: ${v} V on a positive rail`);
  }
  const ambient = spec.overrides.ambientC ?? spec.thermal.ambientMaxC;
  for (const j of o.junctions) {
    if (j.tjC > j.tjMaxC + 1e-9) out.push(`${at(`junction ${j.ref}`)}: ${j.tjC} °C beyond its ${j.tjMaxC} °C limit`);
    if (j.tjC < ambient - 1e-9) out.push(`${at(`junction ${j.ref}`)}: ${j.tjC} °C below the ${ambient} °C ambient (negative rise)`);
  }
  // One part cannot turn more power into heat than the whole option does (energy balance).
  for (const d of o.dissipation.parts) {
    if (d.maxW > o.dissipation.totalMaxW * (1 + 1e-6) + 1e-9)
      out.push(`${at(`dissipation ${d.ref}`)}: ${d.maxW} W, more than the option's whole ${o.dissipation.totalMaxW} W`);
  }
  for (const c of o.components) {
    if (c.value !== null && !(c.value > 0)) out.push(`${at(`component ${c.ref}`)}: value ${c.value} ${c.unit ?? ''}`);
  }
  for (const e of o.trace) {
    const quantities = [['result', e.result], ...Object.entries(e.inputs)] as const;
    for (const [name, q] of quantities) {
      if (NON_NEGATIVE_UNITS.has(q.unit) && q.value < 0) out.push(`${at(`trace ${e.id}.${name}`)}: negative ${q.value} ${q.unit}`);
      if (q.unit === '°C' && q.value > HOTTEST_LIMIT_C) out.push(`${at(`trace ${e.id}.${name}`)}: ${q.value} °C`);
    }
  }
  // Device parameters (a Zener knee, a reference, a dropout) are magnitudes: never negative.
  for (const [name, q] of Object.entries(o.assumptions)) {
    if ((NON_NEGATIVE_UNITS.has(q.unit) || q.unit === 'V') && q.value < 0)
      out.push(`${at(`assumption ${name}`)}: negative ${q.value} ${q.unit}`);
  }
  for (const i of o.issues) out.push(...impossibleInText(i.message, at(`issue ${i.code}`)));
  for (const f of o.fixes) out.push(...impossibleInText(f.message, at(`fix ${f.code}`)));
  for (const c of o.cautions) out.push(...impossibleInText(c.message, at(`caution ${c.code}`)));
  return out;
}

/** Every impossible figure in an evaluation of a positive rail, each with where it is. */
export function impossibleFigures(result: Evaluation, spec: RailSpec): string[] {
  const out: string[] = [];
  walk(result, 'result', out);
  for (const o of result.options) out.push(...optionFigures(o, spec));
  return out;
}
