/**
 * The key figures of a designed option, read the same way by the option cards,
 * the revision comparison and the calculation sheet (browser-safe, pure).
 */
import type { Component, Fix, Option } from '../engine/types';
import { formatKPerW, formatSi } from '../engine/units';
import { formatMoney } from '../platform/format';
import { percent } from './option-words';

export interface Figure {
  key: string;
  label: string;
  text: string;
  /** Rests on typical device parameters. */
  typical: boolean;
}

/**
 * The part that dissipates most, or null when there is none or its figure is larger than the
 * option's whole dissipation: one part cannot lose more than all of them, so such a figure is not shown.
 */
export function hottestPart(option: Pick<Option, 'dissipation'>): { ref: string; maxW: number } | null {
  let best: { ref: string; maxW: number } | null = null;
  for (const p of option.dissipation.parts) if (!best || p.maxW > best.maxW) best = { ref: p.ref, maxW: p.maxW };
  return best && best.maxW <= option.dissipation.totalMaxW ? best : null;
}

export type HeatsinkNeed = { kind: 'none' } | { kind: 'needed' } | { kind: 'theta'; thetaSaCW: number } | { kind: 'impossible' };

/**
 * What the option asks of a heatsink. A part past its junction limit, or a θSA budget already
 * spent (≤ 0 K/W), means no heatsink is good enough — never "not needed".
 */
export function heatsinkNeed(option: Pick<Option, 'heatsink' | 'junctions'>): HeatsinkNeed {
  const theta = option.heatsink.maxThetaSaCW;
  if (option.junctions.some((j) => j.beyondLimit)) return { kind: 'impossible' };
  if (!option.heatsink.required) return { kind: 'none' };
  if (theta === null) return { kind: 'needed' };
  return theta <= 0 ? { kind: 'impossible' } : { kind: 'theta', thetaSaCW: theta };
}

/** θSA in plain kelvin per watt (a heatsink's datasheet figure is never given in mK/W). */
export const thetaText = (thetaSaCW: number) => `θSA ≤ ${formatKPerW(thetaSaCW)}`;

export function heatsinkText(option: Pick<Option, 'heatsink' | 'junctions'>): string {
  const need = heatsinkNeed(option);
  if (need.kind === 'none') return 'Not needed';
  if (need.kind === 'needed') return 'Needed';
  return need.kind === 'impossible' ? 'No heatsink is good enough' : thetaText(need.thetaSaCW);
}

/** Whether the output band is met, and by which view of the spread. */
export function toleranceText(option: Pick<Option, 'issues' | 'tolerance'>): string {
  if (option.issues.some((i) => i.severity === 'blocker' && i.code === 'tolerance')) return 'not met';
  return option.tolerance.rule === 'worst-case' ? 'met in the worst case' : 'met statistically (±3σ) only';
}

/** A fix as one sentence: the change, and its cost where the engine knows it. */
export function fixText(fix: Fix, currency: string): string {
  if (fix.costCents === undefined) return fix.message;
  const sign = fix.costCents < 0 ? '−' : '+';
  return `${fix.message} (${sign}${formatMoney(Math.abs(fix.costCents), currency)})`;
}

export function componentValue(c: Pick<Component, 'value' | 'unit' | 'quantity'>): string {
  if (c.value === null || c.unit === null) return '—';
  const each = c.quantity > 1 ? ` (${c.quantity} × ${formatSi(c.value / c.quantity, c.unit)})` : '';
  return `${formatSi(c.value, c.unit)}${each}`;
}

export function keyFigures(option: Option, rippleLimitVpp: number, currency: string): Figure[] {
  const hot = hottestPart(option);
  const f = (key: string, label: string, text: string, typical = true): Figure => ({ key, label, text, typical });
  return [
    f('score', 'Score', option.score === null ? 'not ranked (infeasible)' : option.score.toFixed(1), false),
    f('efficiencyNominal', 'Efficiency, nominal', percent(option.efficiency.nominal, 1)),
    f('efficiencyWorst', 'Efficiency, worst', percent(option.efficiency.worst, 1)),
    f('dissipationMaxW', 'Worst dissipation', formatSi(option.dissipation.totalMaxW, 'W')),
    f('hottestW', 'Hottest part', hot ? `${hot.ref}, ${formatSi(hot.maxW, 'W')}` : '—'),
    f('heatsinkThetaSa', 'Heatsink', heatsinkText(option)),
    f('partCount', 'Part count', String(option.partCount), false),
    f(
      'rippleVpp',
      'Ripple vs limit',
      `${formatSi(option.outputRippleVpp, 'Vpp')} of ${formatSi(rippleLimitVpp, 'Vpp')}${option.outputRippleVpp > rippleLimitVpp ? ' — over the limit' : ''}`,
    ),
    f('vOutMin', 'Output, lowest', formatSi(option.vOutRange.min, 'V', 4)),
    f('vOutMax', 'Output, highest', formatSi(option.vOutRange.max, 'V', 4)),
    f('inTolerance', 'Monte Carlo within tolerance', percent(option.monteCarlo.fractionInTolerance, 1)),
    f('toleranceRule', 'Tolerance', toleranceText(option), false),
    f('costCents', 'Parts cost', formatMoney(option.costCents, currency)),
  ];
}
