// Sub-scores 0–100 and the weighted score; the ordering rule of the option list.
import type { RailSpec } from './rail-spec.ts';
import { topologyIds, type Option, type SubScores } from './types.ts';

const clamp = (v: number) => Math.min(100, Math.max(0, v));

export interface ScoreInputs {
  efficiencyNominal: number;
  efficiencyWorst: number;
  totalMaxW: number;
  /** Smallest (Tj,max − Tj)/(Tj,max − Ta) over the parts with a junction; 1 when there are none. */
  thermalMargin: number;
  heatsinkRequired: boolean;
  heatsinkImpractical: boolean;
  partCount: number;
  rippleVpp: number;
  rippleLimitVpp: number;
  costCents: number;
}

export function subScores(s: ScoreInputs): SubScores {
  const ratio = s.rippleLimitVpp / Math.max(s.rippleVpp, s.rippleLimitVpp * 1e-3);
  return {
    efficiency: clamp(100 * (0.6 * s.efficiencyNominal + 0.4 * s.efficiencyWorst)),
    heat: clamp(
      100 * (0.5 * Math.min(1, Math.max(0, s.thermalMargin)) + 0.5 / (1 + s.totalMaxW)) -
        (s.heatsinkRequired ? 15 : 0) -
        (s.heatsinkImpractical ? 25 : 0),
    ),
    partCount: clamp(100 * (1 - (s.partCount - 2) / 20)),
    // Ripple at the limit scores 50, ten times below it 75, a hundred times below 100.
    noise: clamp(50 + 25 * Math.log10(ratio)),
    cost: clamp(100 / (1 + s.costCents / 300)),
  };
}

export function weightedScore(sub: SubScores, weights: RailSpec['weights']): number {
  const total = weights.efficiency + weights.heat + weights.partCount + weights.noise + weights.cost;
  const sum =
    sub.efficiency * weights.efficiency +
    sub.heat * weights.heat +
    sub.partCount * weights.partCount +
    sub.noise * weights.noise +
    sub.cost * weights.cost;
  // One decimal: enough to rank, and stable to print.
  return Math.round((sum / total) * 10) / 10;
}

const blockers = (o: Option) => o.issues.filter((i) => i.severity === 'blocker').length;

/**
 * Feasible options by score, then every infeasible one (fewest blockers first); ties go to the
 * simpler topology (the fixed order runs from simplest to most complex).
 */
export function compareOptions(a: Option, b: Option): number {
  if (a.feasible !== b.feasible) return a.feasible ? -1 : 1;
  if (a.score !== null && b.score !== null && a.score !== b.score) return b.score - a.score;
  if (!a.feasible && blockers(a) !== blockers(b)) return blockers(a) - blockers(b);
  return topologyIds.indexOf(a.topology) - topologyIds.indexOf(b.topology);
}
