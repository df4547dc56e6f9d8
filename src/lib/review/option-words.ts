/**
 * How an option reads to someone who is not a power specialist: its name, its
 * feasibility state, and the one reason that matters most.
 */
import type { Option, TopologyId } from '../engine/types';

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

/** The first blocker, or else the first caution: the sentence a client should read. */
export function headlineReason(option: Pick<Option, 'issues'>): string | null {
  const blocker = option.issues.find((i) => i.severity === 'blocker');
  if (blocker) return blocker.message;
  return option.issues.find((i) => i.severity === 'caution')?.message ?? null;
}

export function percent(fraction: number, digits = 0): string {
  return `${(fraction * 100).toFixed(digits)} %`;
}
