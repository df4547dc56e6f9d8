// Sub-scores 0–100, the weighted score, the ranking of the option list and the words that say why
// the pick won.
import { noiseClassDefaults, type RailSpec } from './rail-spec.ts';
import { topologyIds, type Option, type SubScores, type TopologyId } from './types.ts';

export { effectiveWeights, railSizeW } from './scoring/weights.ts';

const clamp = (v: number) => Math.min(100, Math.max(0, v));

/**
 * The power a rail's losses are weighed against, W: its own output, but never less than this
 * floor. Below about half a watt a loss of tens of milliwatts costs nothing in heat or supply size
 * (common practice); a battery pays for every microwatt in its life, so it has no floor.
 */
export const POWER_FLOOR_W = { battery: 0, other: 0.5 } as const;

/** Scores this close count as a tie, which the simpler topology wins. */
export const TIE_POINTS = 1;

export interface ScoreInputs {
  /** Output power and total loss at the nominal corner, and at the corner that loses most. */
  pOutNominalW: number;
  lossNominalW: number;
  pOutMaxW: number;
  lossMaxW: number;
  source: RailSpec['input']['source'];
  /** Smallest (Tj,max − Tj)/(Tj,max − Ta) over the parts with a junction; 1 when there are none. */
  thermalMargin: number;
  heatsinkRequired: boolean;
  heatsinkImpractical: boolean;
  partCount: number;
  rippleVpp: number;
  rippleLimitVpp: number;
  /** An RF or precision-analog load fed straight from a switching stage (filtered or not). */
  switchingOutputOnQuietRail: boolean;
  costCents: number;
}

/**
 * Noise sub-score of a switching output on an RF or precision rail: at best "at the limit". Its
 * spurs at the switching frequency and harmonics, and a post-filter's dependence on the load, are
 * not in the ripple figure; common practice gives such loads a linear last stage.
 */
export const QUIET_SWITCHING_NOISE_CAP = 50;

/** Share of the power budget that is not lost: the efficiency for a rail above the floor. */
function keptShare(pOutW: number, lossW: number, floorW: number): number {
  const budget = Math.max(pOutW, floorW);
  return budget / (budget + Math.max(0, lossW));
}

export function subScores(s: ScoreInputs): SubScores {
  const floor = s.source === 'battery' ? POWER_FLOOR_W.battery : POWER_FLOOR_W.other;
  const ratio = s.rippleLimitVpp / Math.max(s.rippleVpp, s.rippleLimitVpp * 1e-3);
  return {
    efficiency: clamp(100 * (0.6 * keptShare(s.pOutNominalW, s.lossNominalW, floor) + 0.4 * keptShare(s.pOutMaxW, s.lossMaxW, floor))),
    heat: clamp(
      100 * (0.5 * Math.min(1, Math.max(0, s.thermalMargin)) + 0.5 / (1 + s.lossMaxW)) -
        (s.heatsinkRequired ? 15 : 0) -
        (s.heatsinkImpractical ? 25 : 0),
    ),
    partCount: clamp(100 * (1 - (s.partCount - 2) / 20)),
    // Ripple at the limit scores 50, ten times below it 75, a hundred times below 100.
    noise: Math.min(clamp(50 + 25 * Math.log10(ratio)), s.switchingOutputOnQuietRail ? QUIET_SWITCHING_NOISE_CAP : 100),
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
const simplicity = (t: TopologyId) => topologyIds.indexOf(t);

/** Infeasible options after every feasible one, fewest blockers first, then the simpler topology. */
function compareInfeasible(a: Option, b: Option): number {
  return blockers(a) - blockers(b) || simplicity(a.topology) - simplicity(b.topology);
}

/**
 * Points a topology must win by before an engineer takes it over a simpler feasible one that fits
 * the job. Four switches and a mode-changing controller earn their place only where the input
 * straddles the output; where a plain buck or boost regulates over the whole range it is the
 * usual answer (common practice).
 */
export const STRADDLE_MARGIN_POINTS = 8;
/**
 * On an RF or precision-analog rail a linear output stage (alone or after a switcher) is the usual
 * answer: a filtered switching output also carries switching spikes and radiated noise that its
 * ripple figure leaves out (common practice). A bare switcher must win by this much to be picked.
 */
export const QUIET_RAIL_MARGIN_POINTS = 10;

/**
 * A switcher followed by a linear post-regulator is the answer where one stage alone falls short:
 * a plain linear regulator whose loss is bearable, or on a rail that is not quiet a bare switcher
 * that meets the limit, is the usual answer — fewer parts, and on a quiet load no switcher on the
 * board (common practice). The hybrid must win by this much over such a single stage.
 */
export const HYBRID_MARGIN_POINTS = 5;

const LINEAR_OUTPUT = new Set<TopologyId>(['shunt', 'linear', 'linear-predrop', 'buck+linear']);
const BARE_SWITCHER = new Set<TopologyId>(['buck', 'boost', 'buck-boost']);

/** An RF or precision-analog load, or any load that asks for no more ripple than a precision one does. */
function quietRail(spec: Pick<RailSpec, 'noise'>): boolean {
  return spec.noise.class === 'rf' || spec.noise.class === 'precision' || spec.noise.maxRippleVpp <= noiseClassDefaults.precision;
}

const railWords = (spec: Pick<RailSpec, 'noise'>) =>
  spec.noise.class === 'rf' ? 'an RF' : spec.noise.class === 'precision' ? 'a precision-analog' : 'a quiet';

/** Why an option is handicapped in the ranking (points and the sentence that says so), if it is. */
export function rankingHandicap(
  option: Option,
  feasible: readonly Option[],
  spec?: Pick<RailSpec, 'noise'>,
): { points: number; why: string } | null {
  const has = (t: TopologyId) => feasible.some((o) => o.topology === t);
  if (spec && quietRail(spec) && BARE_SWITCHER.has(option.topology) && feasible.some((o) => LINEAR_OUTPUT.has(o.topology))) {
    return {
      points: QUIET_RAIL_MARGIN_POINTS,
      why: `on ${railWords(spec)} rail a linear output stage is preferred to a filtered switching output unless the switcher wins by more than ${QUIET_RAIL_MARGIN_POINTS} points (common practice)`,
    };
  }
  if (option.topology === 'buck+linear' && spec) {
    const quiet = quietRail(spec);
    const single: readonly TopologyId[] = quiet ? ['linear', 'linear-predrop'] : ['linear', 'linear-predrop', ...BARE_SWITCHER];
    // Only a single stage within the margin is one the hybrid must beat by it; against one far
    // behind (a linear regulator burning watts) the hybrid stands on its own score.
    const near = (t: TopologyId) => feasible.some((o) => o.topology === t && (o.score ?? 0) + HYBRID_MARGIN_POINTS >= (option.score ?? 0));
    const plain = single.find(near);
    if (plain) {
      return {
        points: HYBRID_MARGIN_POINTS,
        why: `a single ${plain} stage meets this rail${quiet ? ' and keeps a switcher off the board of a quiet load' : ''}, and a switcher with a linear post-regulator is taken over it only when it wins by more than ${HYBRID_MARGIN_POINTS} points (common practice)`,
      };
    }
  }
  if (option.topology === 'buck-boost' && (has('buck') || has('boost'))) {
    return {
      points: STRADDLE_MARGIN_POINTS,
      why: `a plain ${has('buck') ? 'buck' : 'boost'} regulates over the whole input range, and a buck-boost is taken over it only when it wins by more than ${STRADDLE_MARGIN_POINTS} points (common practice)`,
    };
  }
  return null;
}

/**
 * Feasible options best first by score less any handicap (see rankingHandicap), where a result
 * within TIE_POINTS of the best still unranked counts as a tie that the simpler topology (the
 * fixed order runs from simplest to most complex) wins; then every infeasible option, which
 * carries no score.
 */
export function rankOptions(options: readonly Option[], spec?: Pick<RailSpec, 'noise'>): Option[] {
  const feasible = options.filter((o) => o.feasible);
  const standing = new Map(feasible.map((o) => [o, (o.score ?? 0) - (rankingHandicap(o, feasible, spec)?.points ?? 0)]));
  const at = (o: Option) => standing.get(o) ?? 0;
  const pending = [...feasible].sort((a, b) => at(b) - at(a) || simplicity(a.topology) - simplicity(b.topology));
  // On a quiet rail a bare switcher is the handicapped one: it never wins a tie against a linear output stage.
  const quiet = spec !== undefined && quietRail(spec);
  const winsTie = (o: Option, than: Option) =>
    simplicity(o.topology) < simplicity(than.topology) && !(quiet && BARE_SWITCHER.has(o.topology) && LINEAR_OUTPUT.has(than.topology));
  const ranked: Option[] = [];
  while (pending.length > 0) {
    const top = at(pending[0]!);
    let pick = 0;
    pending.forEach((o, k) => {
      if (top - at(o) <= TIE_POINTS && winsTie(o, pending[pick]!)) pick = k;
    });
    ranked.push(...pending.splice(pick, 1));
  }
  return [...ranked, ...options.filter((o) => !o.feasible).sort(compareInfeasible)];
}

const SUB_SCORE_WORDS: Record<keyof SubScores, string> = {
  efficiency: 'loses less power for the rail it supplies',
  heat: 'runs cooler',
  partCount: 'needs fewer parts',
  noise: 'has more margin on the ripple limit',
  cost: 'costs less',
};

/** In words, why the first option of a ranked list is the pick. */
export function pickReason(ranked: readonly Option[], weights: RailSpec['weights'], spec?: Pick<RailSpec, 'noise'>): string {
  const [pick, next] = ranked;
  if (!pick || !pick.feasible)
    return 'No option meets every requirement; each one lists its blockers and, where a change clears them, what it costs.';
  const blocked = ranked.filter((o) => !o.feasible).map((o) => o.topology);
  const blockedText = blocked.length > 0 ? ` Not feasible: ${blocked.join(', ')}.` : '';
  if (!next || !next.feasible) return `${pick.label} is the only option that meets every requirement.${blockedText}`;
  const a = pick.score ?? 0;
  const b = next.score ?? 0;
  const passedOver = ranked.find((o) => o.feasible && (o.score ?? 0) > a + TIE_POINTS);
  const handicap = passedOver
    ? rankingHandicap(
        passedOver,
        ranked.filter((o) => o.feasible),
        spec,
      )
    : null;
  if (passedOver && handicap) {
    return `${pick.label} (score ${a.toFixed(1)}) is preferred to ${passedOver.label} (${(passedOver.score ?? 0).toFixed(1)}): ${handicap.why}.${blockedText}`;
  }
  if (b >= a) {
    return `${pick.label} (score ${a.toFixed(1)}) and ${next.label} (${b.toFixed(1)}) are within ${TIE_POINTS} point: a tie, which the simpler topology wins.${blockedText}`;
  }
  const total = weights.efficiency + weights.heat + weights.partCount + weights.noise + weights.cost;
  const keys = Object.keys(SUB_SCORE_WORDS) as (keyof SubScores)[];
  const gains = keys
    .map((k) => ({ k, points: (weights[k] * (pick.subScores[k] - next.subScores[k])) / total }))
    .filter((g) => g.points >= 0.05)
    .sort((x, y) => y.points - x.points)
    .slice(0, 2)
    .map((g) => `${SUB_SCORE_WORDS[g.k]} (+${g.points.toFixed(1)} points)`);
  const because = gains.length > 0 ? `it ${gains.join(' and ')}` : 'it is a little better on balance';
  return `${pick.label} scores ${a.toFixed(1)} against ${b.toFixed(1)} for ${next.label}: ${because}.${blockedText}`;
}
