import type { Evaluation } from '../engine/types';

/** The headline figures the desk shows for a brief, from the engine's recommendation. */
export function summarise(result: Evaluation) {
  const best = result.options.find((o) => o.topology === result.recommended) ?? result.options[0];
  if (!best) return null;
  return {
    topology: best.topology,
    feasible: best.feasible,
    score: best.score,
    efficiencyNominal: best.efficiency.nominal,
    dissipationMaxW: best.dissipation.totalMaxW,
    partCount: best.partCount,
    costCents: best.costCents,
    feasibleCount: result.options.filter((o) => o.feasible).length,
  };
}

export type BriefSummary = NonNullable<ReturnType<typeof summarise>>;
