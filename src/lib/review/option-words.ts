/**
 * How an option reads to someone who is not a power specialist: its name, its
 * feasibility state, and the one reason that matters most.
 */
import { HOT_SURFACE_C } from '../engine/cautions';
import type { Caution, Option, TopologyId } from '../engine/types';

export const TOPOLOGY_NAMES: Record<TopologyId, string> = {
  shunt: 'Zener shunt',
  linear: 'Linear regulator',
  'linear-predrop': 'Linear with high-voltage pre-drop',
  buck: 'Buck (step-down) switcher',
  boost: 'Boost (step-up) switcher',
  'buck-boost': 'Buck-boost switcher',
  'buck+linear': 'Switcher with linear post-regulator',
};

export type Feasibility = 'feasible' | 'caution' | 'blocked';

export function feasibilityOf(option: Pick<Option, 'feasible' | 'issues'>): Feasibility {
  if (!option.feasible) return 'blocked';
  return option.issues.some((i) => i.severity === 'caution') ? 'caution' : 'feasible';
}

/** Whether a saved revision's chosen design meets the brief, as a mark and words (never colour alone). */
export function feasibilityWords(feasible: boolean): { mark: string; text: string } {
  return feasible ? { mark: '✓', text: 'Feasible' } : { mark: '✕', text: 'Not feasible' };
}

/** The first blocker, or else the first caution: the sentence a client should read. */
export function headlineReason(option: Pick<Option, 'issues'>): string | null {
  const blocker = option.issues.find((i) => i.severity === 'blocker');
  if (blocker) return blocker.message;
  return option.issues.find((i) => i.severity === 'caution')?.message ?? null;
}

export function percent(fraction: number, digits = 0): string {
  return `${(fraction * 100).toFixed(digits)} %`;
}

/**
 * What stops an option, in a client's words, by blocker code: a phrase that follows "it" or "3 of
 * 7 ways" ("would run too hot"). The engineer's sentence stays on the review page.
 */
const CLIENT_BLOCKERS: Readonly<Record<string, string>> = {
  tolerance: 'cannot hold the output within the allowed deviation',
  headroom: 'would need more input voltage than the lowest input gives',
  'input-min': 'would need more input voltage than the lowest input gives',
  standoff: 'would need more input voltage than the lowest input gives',
  'step-up-only': 'can only raise a voltage, and the input reaches the output',
  thermal: 'would run too hot',
  heatsink: 'would run too hot even on a practical heatsink',
  'input-max': 'cannot take the highest input voltage with the parts available',
  'switch-voltage': 'cannot take the highest input voltage with the parts available',
  differential: 'cannot take the voltage it would have to drop',
  'differential-short': 'cannot take the voltage it would have to drop',
  'pass-voltage': 'cannot take the voltage it would have to drop',
  rating: 'would stress its parts beyond their ratings',
  soa: 'would not survive a shorted output',
  ripple: 'would leave more ripple than this load tolerates',
  current: 'cannot deliver the load current',
  'current-limit': 'cannot deliver the load current',
  'output-max': 'cannot make this output voltage',
  'output-min': 'cannot make this output voltage',
  'below-reference': 'cannot make this output voltage',
  'zener-range': 'cannot hold the output steady over this input and load range',
  'zener-feed': 'cannot hold the output steady over this input and load range',
  'zener-starved': 'cannot hold the output steady over this input and load range',
  'reference-starved': 'cannot hold the output steady over this input and load range',
  'reference-current': 'cannot hold the output steady over this input and load range',
  capacitor: 'would need larger capacitors or coils than are practical',
  inductor: 'would need larger capacitors or coils than are practical',
  'min-on-time': 'cannot switch fast enough for so large a step down',
  corner: 'does not hold the output at every input and load',
};
const CLIENT_BLOCKER_FALLBACK = 'does not meet the brief as described';

/** Why an option cannot be built, as a client reads it; null when it can. */
export function clientBlocker(option: Pick<Option, 'feasible' | 'issues'>): string | null {
  if (option.feasible) return null;
  const code = option.issues.find((i) => i.severity === 'blocker')?.code ?? '';
  return CLIENT_BLOCKERS[code] ?? CLIENT_BLOCKER_FALLBACK;
}

/**
 * When no option can be built: the reason most of them share, or else the reason of the closest
 * (the options come best first), said plainly.
 */
export function nothingBuildable(options: readonly Pick<Option, 'feasible' | 'issues'>[]): string {
  const reasons = options.map((o) => clientBlocker(o) ?? CLIENT_BLOCKER_FALLBACK);
  const counts = new Map<string, number>();
  for (const r of reasons) counts.set(r, (counts.get(r) ?? 0) + 1);
  const [shared = '', count = 0] = [...counts].reduce((best, entry) => (entry[1] > best[1] ? entry : best), ['', 0]);
  const why =
    count === options.length
      ? `every one ${shared}`
      : count * 2 > options.length
        ? `${count} of them ${shared}`
        : `the closest of them ${reasons[0] ?? CLIENT_BLOCKER_FALLBACK}`;
  return `None of the ${options.length} ways can be built as the brief stands: the main reason is that ${why}.`;
}

/** Safety cautions the client reads; a hot part or a charged capacitor in plain words, without part references. */
const CLIENT_CAUTIONS: Readonly<Record<string, string>> = {
  'hot-surface': `Some parts run hotter than about ${HOT_SURFACE_C} °C, hot enough to burn: they must be guarded against touch.`,
  'stored-energy':
    'Capacitors keep a dangerous charge after power is removed: they must be discharged, and checked, before anyone touches the circuit.',
};

/**
 * The safety cautions for the options that can be built (a blocked option's figures describe a
 * design nobody will build). The hazardous-voltage and mains cautions come from the brief itself,
 * so they stay even when nothing can be built.
 */
export function clientCautions(options: readonly Pick<Option, 'feasible' | 'cautions'>[]): Caution[] {
  const fromBrief = new Set(['hazardous-voltage', 'mains-scope']);
  const kept = options.flatMap((o) => o.cautions.filter((c) => o.feasible || fromBrief.has(c.code)));
  return [...new Map(kept.map((c) => [c.code, { code: c.code, message: CLIENT_CAUTIONS[c.code] ?? c.message }])).values()];
}
