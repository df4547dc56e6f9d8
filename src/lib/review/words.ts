/**
 * Words the review screens share with the calculation sheet and the exports,
 * so a figure is described the same way wherever it appears.
 */
import type { ComponentRole } from '../engine/types';

/** Said beside every figure that rests on a typical device parameter (docs/engine.md §1). */
export const TYPICAL_NOTE = 'typical — confirm against the chosen part’s data';

/** Said with every set of cautions: the engine proposes, qualified people decide. */
export const CAUTION_DEFERRAL =
  'These designs are engineering proposals. Build, measure and test them only under qualified supervision, and defer to local electrical codes and licensed practice.';

export const ROLE_NAMES: Record<ComponentRole, string> = {
  'series-resistor': 'Series resistor',
  zener: 'Zener diode',
  regulator: 'Regulator',
  'feedback-lower': 'Feedback resistor, lower',
  'feedback-upper': 'Feedback resistor, upper',
  'pass-transistor': 'Pass transistor',
  'standoff-zener': 'Standoff Zener',
  'bias-resistor': 'Bias resistor',
  'sense-resistor': 'Current-sense resistor',
  'limit-transistor': 'Current-limit transistor',
  inductor: 'Inductor',
  switch: 'Switching stage',
  diode: 'Diode',
  'input-capacitor': 'Input capacitor',
  'output-capacitor': 'Output capacitor',
  'bypass-capacitor': 'Bypass capacitor',
  'protection-diode': 'Protection diode',
  heatsink: 'Heatsink',
};

export const WEIGHT_NAMES = {
  efficiency: 'Efficiency',
  heat: 'Heat',
  partCount: 'Part count',
  noise: 'Quietness',
  cost: 'Parts cost',
} as const;

export type WeightKey = keyof typeof WEIGHT_NAMES;
export const WEIGHT_KEYS = Object.keys(WEIGHT_NAMES) as WeightKey[];
