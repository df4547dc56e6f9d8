/**
 * The key figures of a designed option, read the same way by the option cards,
 * the revision comparison and the calculation sheet (browser-safe, pure).
 */
import type { Component, Option } from './engine/types';
import { formatSi } from './engine/units';
import { formatMoney } from './format';
import { percent } from './option-words';

export interface Figure {
  key: string;
  label: string;
  /** The number compared between revisions; null where the option has none. */
  value: number | null;
  text: string;
  /** Rests on typical device parameters. */
  typical: boolean;
}

export function hottestPart(option: Pick<Option, 'dissipation'>): { ref: string; maxW: number } | null {
  let best: { ref: string; maxW: number } | null = null;
  for (const p of option.dissipation.parts) if (!best || p.maxW > best.maxW) best = { ref: p.ref, maxW: p.maxW };
  return best;
}

/** θSA the engine asks for: none, a figure, or not achievable when the budget is already spent. */
export function heatsinkText(option: Pick<Option, 'heatsink'>): string {
  if (!option.heatsink.required) return 'Not needed';
  const theta = option.heatsink.maxThetaSaCW;
  if (theta === null) return 'Needed';
  if (theta <= 0) return 'Needed, not achievable (θSA ≤ 0)';
  return `θSA ≤ ${formatSi(theta, 'K/W')}`;
}

export function componentValue(c: Pick<Component, 'value' | 'unit' | 'quantity'>): string {
  if (c.value === null || c.unit === null) return '—';
  const each = c.quantity > 1 ? ` (${c.quantity} × ${formatSi(c.value / c.quantity, c.unit)})` : '';
  return `${formatSi(c.value, c.unit)}${each}`;
}

export function keyFigures(option: Option, rippleLimitVpp: number, currency: string): Figure[] {
  const hot = hottestPart(option);
  const f = (key: string, label: string, value: number | null, text: string, typical = true): Figure => ({ key, label, value, text, typical });
  return [
    f('score', 'Score', option.score, option.score.toFixed(1), false),
    f('efficiencyNominal', 'Efficiency, nominal', option.efficiency.nominal, percent(option.efficiency.nominal, 1)),
    f('efficiencyWorst', 'Efficiency, worst', option.efficiency.worst, percent(option.efficiency.worst, 1)),
    f('dissipationMaxW', 'Worst dissipation', option.dissipation.totalMaxW, formatSi(option.dissipation.totalMaxW, 'W')),
    f('hottestW', 'Hottest part', hot?.maxW ?? null, hot ? `${hot.ref}, ${formatSi(hot.maxW, 'W')}` : '—'),
    f('heatsinkThetaSa', 'Heatsink', option.heatsink.required ? option.heatsink.maxThetaSaCW : null, heatsinkText(option)),
    f('partCount', 'Part count', option.partCount, String(option.partCount), false),
    f(
      'rippleVpp',
      'Ripple vs limit',
      option.outputRippleVpp,
      `${formatSi(option.outputRippleVpp, 'Vpp')} of ${formatSi(rippleLimitVpp, 'Vpp')}${option.outputRippleVpp > rippleLimitVpp ? ' — over the limit' : ''}`,
    ),
    f('vOutMin', 'Output, lowest', option.vOutRange.min, formatSi(option.vOutRange.min, 'V', 4)),
    f('vOutMax', 'Output, highest', option.vOutRange.max, formatSi(option.vOutRange.max, 'V', 4)),
    f('inTolerance', 'Monte Carlo within tolerance', option.monteCarlo.fractionInTolerance, percent(option.monteCarlo.fractionInTolerance, 1)),
    f('costCents', 'Parts cost', option.costCents, formatMoney(option.costCents, currency)),
  ];
}
