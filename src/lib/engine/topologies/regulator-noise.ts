// Ripple rejection against frequency and output noise of a linear regulator class.
import type { LinearRegulatorClass } from '../catalog.ts';

/** Frequency at and above which a class's psrrHfDb applies. */
export const PSRR_HF_HZ = 1e6;
/** Band over which regulator noise is usually stated, Hz (common practice: 10 Hz–100 kHz). */
export const NOISE_BAND_HZ = { lo: 10, hi: 100e3 } as const;
/** Peak-to-peak over RMS for Gaussian noise, exceeded about 0.1 % of the time (common practice). */
export const NOISE_CREST_FACTOR = 6.6;
/**
 * Ripple on a mains-derived input (an adapter or a rectified supply) is at twice the line
 * frequency: 100 Hz on 50 Hz mains, 120 Hz on 60 Hz (common practice). Rejection is read at the
 * higher, where it is lower; a filter is sized at the lower, where it attenuates less.
 */
export const MAINS_RIPPLE_HZ = { lo: 100, hi: 120 } as const;

/** The input ripple's frequency when the source tells it (mains-derived), else undefined. */
export function inputRippleHz(source: 'battery' | 'adapter' | 'rectified' | 'bus'): number | undefined {
  return source === 'adapter' || source === 'rectified' ? MAINS_RIPPLE_HZ.hi : undefined;
}

/**
 * Ripple rejection at fHz: the low-frequency figure (with the adjust-pin bypass when fitted) until
 * the loop gain rolls off, then falling 20 dB/decade to psrrHfDb at 1 MHz, flat beyond (the
 * output capacitor takes over). A single-pole loop is common practice for three-terminal parts.
 */
export function rippleRejectionDb(cls: LinearRegulatorClass, fHz: number, bypassed: boolean): number {
  const low = bypassed ? cls.psrrBypassDb : cls.psrrDb;
  if (!(fHz > 0)) return low;
  const rolled = cls.psrrHfDb + 20 * Math.log10(PSRR_HF_HZ / Math.max(fHz, 1e-3));
  return Math.max(cls.psrrHfDb, Math.min(low, rolled));
}

/**
 * Output noise, V RMS, over the band: the unity-gain density times the divider's gain Vout/Vref
 * (a bypassed adjust pin keeps the gain at one for noise), flat over the band.
 */
export function outputNoiseRms(
  cls: LinearRegulatorClass,
  vOut: number,
  bypassed: boolean,
  band: { lo: number; hi: number } = NOISE_BAND_HZ,
): number {
  const gain = cls.kind === 'fixed' || bypassed ? 1 : Math.max(1, vOut / cls.vRefV);
  return cls.noiseDensityVrtHz * gain * Math.sqrt(Math.max(0, band.hi - band.lo));
}
