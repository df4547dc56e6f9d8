/**
 * Why a way cannot be built, as a client reads it: the engine's blocker codes in plain words, with
 * no device figures (θ, SOA, duty) — an engineer reads the full reason on the review.
 */
import type { Option } from '../engine/types';

const NO_PART = 'no part in our catalog suits it';
const OUT_OF_RANGE = 'your voltages are outside what its parts allow';
const TOO_FAR_APART = 'the input and output are too far apart for it';

const BLOCKER_WORDS: Record<string, string> = {
  thermal: 'a part would run too hot',
  heatsink: 'it would need more cooling than a heatsink can give',
  soa: 'a part would be stressed past its safe limits',
  rating: 'a part would be stressed past its rating',
  current: 'it cannot deliver the load current',
  headroom: 'the input is not far enough above the output',
  'step-up-only': 'it only raises a voltage, and your input reaches above the output',
  duty: TOO_FAR_APART,
  'min-on-time': TOO_FAR_APART,
  'input-max': OUT_OF_RANGE,
  'input-min': OUT_OF_RANGE,
  'switch-voltage': OUT_OF_RANGE,
  'output-max': OUT_OF_RANGE,
  'output-min': OUT_OF_RANGE,
  'below-reference': OUT_OF_RANGE,
  tolerance: 'it cannot hold the output within your tolerance',
  ripple: 'its output would be noisier than your limit',
  'load-step': 'it cannot hold the output through your load step',
  'zener-range': NO_PART,
  'no-class': NO_PART,
  class: NO_PART,
  standoff: NO_PART,
  'zener-feed': NO_PART,
};

/** The first blocker in a client's words; a code without words reads as not meeting the brief. */
export function clientBlocker(option: Pick<Option, 'issues'>): string {
  const code = option.issues.find((i) => i.severity === 'blocker')?.code;
  const words = (code && BLOCKER_WORDS[code]) ?? 'it does not meet the brief as described';
  return `${words.charAt(0).toUpperCase()}${words.slice(1)}.`;
}
