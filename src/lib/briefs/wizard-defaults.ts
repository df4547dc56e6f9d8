/**
 * Starting values the wizard offers for each kind of source and load, so a
 * client who is not a power specialist begins from something typical.
 * Typical values only — the client replaces them with their own.
 */
import { noiseClassDefaults, type RailSpecInput, type NoiseClass } from '../engine/rail-spec';

export type SourceKind = RailSpecInput['input']['source'];

export const SOURCE_TYPICAL: Record<SourceKind, { vMin: number; vNom: number; vMax: number; rippleVpp: number; hint: string }> = {
  battery: { vMin: 3.0, vNom: 3.7, vMax: 4.2, rippleVpp: 0, hint: 'One Li-ion cell: 4.2 V full, about 3.0 V empty.' },
  adapter: { vMin: 11.4, vNom: 12, vMax: 12.6, rippleVpp: 0.05, hint: 'A regulated 12 V wall adapter, ±5 %.' },
  rectified: {
    vMin: 14,
    vNom: 16,
    vMax: 18,
    rippleVpp: 1,
    hint: 'A transformer, bridge and reservoir capacitor: the trough sets the headroom.',
  },
  bus: { vMin: 18, vNom: 24, vMax: 30, rippleVpp: 0.5, hint: 'A 24 V industrial bus with sags and clamped surges.' },
};

export const NOISE_CLASS_WORDS: Record<NoiseClass, { label: string; hint: string }> = {
  digital: { label: 'Digital logic', hint: 'Microcontrollers, FPGAs, interfaces: tens of millivolts are fine.' },
  sensor: { label: 'Ratiometric sensor', hint: 'Bridges, potentiometers, ADC references that track the rail.' },
  precision: { label: 'Precision analog or audio', hint: 'Amplifiers, references, audio: a millivolt or less.' },
  rf: { label: 'RF', hint: 'Oscillators, PLLs, receivers: well under a millivolt.' },
};

export function rippleDefault(noiseClass: NoiseClass): number {
  return noiseClassDefaults[noiseClass];
}

export const AIRFLOW_WORDS = {
  enclosed: 'Closed box, no airflow',
  'still-air': 'Open, still air',
  'forced-air': 'A fan moves air over it',
} as const;

export function startingBrief(): RailSpecInput {
  const source = SOURCE_TYPICAL.adapter;
  return {
    input: { vMin: source.vMin, vNom: source.vNom, vMax: source.vMax, rippleVpp: source.rippleVpp, source: 'adapter' },
    output: { v: 5, tolerance: 0.05, iMin: 0.01, iTyp: 0.2, iMax: 0.5 },
    noise: { class: 'digital', maxRippleVpp: rippleDefault('digital') },
    thermal: { ambientMaxC: 40, airflow: 'still-air' },
  };
}
