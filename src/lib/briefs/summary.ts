import type { Evaluation } from '../engine/types';

/**
 * The headline figures the desk shows for a brief: of the engine's recommendation, or of the
 * option an engineer chose (`topology`). A design that cannot be built carries the reason why.
 */
export function summarise(result: Evaluation, topology: string | null = result.recommended) {
  const best = result.options.find((o) => o.topology === topology) ?? result.options[0];
  if (!best) return null;
  const feasibleCount = result.options.filter((o) => o.feasible).length;
  const blocker = best.issues.find((i) => i.severity === 'blocker')?.message;
  return {
    topology: best.topology,
    feasible: best.feasible,
    score: best.score,
    efficiencyNominal: best.efficiency.nominal,
    dissipationMaxW: best.dissipation.totalMaxW,
    partCount: best.partCount,
    costCents: best.costCents,
    feasibleCount,
    /** Why the design cannot be built; absent from summaries stored before it existed. */
    reason: best.feasible ? null : (blocker ?? result.reason ?? null),
  };
}

export type BriefSummary = NonNullable<ReturnType<typeof summarise>>;
