// Preferred-number series of IEC 60063, stored as the standard's tables rather than computed:
// several E24 members (2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 8.2) differ from the rounded
// geometric sequence, so a formula would give the wrong parts.

export type SeriesName = 'E6' | 'E12' | 'E24' | 'E48' | 'E96';

export const E_SERIES: Readonly<Record<SeriesName, readonly number[]>> = {
  E6: [1.0, 1.5, 2.2, 3.3, 4.7, 6.8],
  E12: [1.0, 1.2, 1.5, 1.8, 2.2, 2.7, 3.3, 3.9, 4.7, 5.6, 6.8, 8.2],
  E24: [
    1.0, 1.1, 1.2, 1.3, 1.5, 1.6, 1.8, 2.0, 2.2, 2.4, 2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 5.1, 5.6,
    6.2, 6.8, 7.5, 8.2, 9.1,
  ],
  E48: [
    1.0, 1.05, 1.1, 1.15, 1.21, 1.27, 1.33, 1.4, 1.47, 1.54, 1.62, 1.69, 1.78, 1.87, 1.96, 2.05,
    2.15, 2.26, 2.37, 2.49, 2.61, 2.74, 2.87, 3.01, 3.16, 3.32, 3.48, 3.65, 3.83, 4.02, 4.22, 4.42,
    4.64, 4.87, 5.11, 5.36, 5.62, 5.9, 6.19, 6.49, 6.81, 7.15, 7.5, 7.87, 8.25, 8.66, 9.09, 9.53,
  ],
  E96: [
    1.0, 1.02, 1.05, 1.07, 1.1, 1.13, 1.15, 1.18, 1.21, 1.24, 1.27, 1.3, 1.33, 1.37, 1.4, 1.43,
    1.47, 1.5, 1.54, 1.58, 1.62, 1.65, 1.69, 1.74, 1.78, 1.82, 1.87, 1.91, 1.96, 2.0, 2.05, 2.1,
    2.15, 2.21, 2.26, 2.32, 2.37, 2.43, 2.49, 2.55, 2.61, 2.67, 2.74, 2.8, 2.87, 2.94, 3.01, 3.09,
    3.16, 3.24, 3.32, 3.4, 3.48, 3.57, 3.65, 3.74, 3.83, 3.92, 4.02, 4.12, 4.22, 4.32, 4.42, 4.53,
    4.64, 4.75, 4.87, 4.99, 5.11, 5.23, 5.36, 5.49, 5.62, 5.76, 5.9, 6.04, 6.19, 6.34, 6.49, 6.65,
    6.81, 6.98, 7.15, 7.32, 7.5, 7.68, 7.87, 8.06, 8.25, 8.45, 8.66, 8.87, 9.09, 9.31, 9.53, 9.76,
  ],
};

export type SnapMode = 'nearest' | 'down' | 'up';

// Relative slack so that a value already in the series (e.g. 4700 computed as 4699.999…) snaps to itself.
const SLACK = 1e-9;

function scaled(mantissa: number, decade: number): number {
  return Number((mantissa * 10 ** decade).toPrecision(12));
}

/** Snaps a positive value to the series across decades; nearest is measured as a ratio. */
export function snap(value: number, series: SeriesName, mode: SnapMode = 'nearest'): number {
  if (!(value > 0) || !Number.isFinite(value)) return Number.NaN;
  const table = E_SERIES[series];
  const decade = Math.floor(Math.log10(value));
  // Candidates from the decade below to the decade above cover every edge case of rounding.
  let bestM = 1;
  let bestD = decade;
  let bestScore = Number.POSITIVE_INFINITY;
  for (let d = decade - 1; d <= decade + 1; d += 1) {
    const scale = 10 ** d;
    for (const m of table) {
      const candidate = m * scale;
      if (mode === 'down' && candidate > value * (1 + SLACK)) continue;
      if (mode === 'up' && candidate < value * (1 - SLACK)) continue;
      const ratio = candidate > value ? candidate / value : value / candidate;
      if (ratio < bestScore) {
        bestScore = ratio;
        bestM = m;
        bestD = d;
      }
    }
  }
  return scaled(bestM, bestD);
}

/** The series members between lo and hi (inclusive), in ascending order. */
export function seriesRange(series: SeriesName, lo: number, hi: number): number[] {
  const out: number[] = [];
  if (!(lo > 0) || !(hi >= lo)) return out;
  const first = Math.floor(Math.log10(lo));
  const last = Math.floor(Math.log10(hi));
  for (let d = first; d <= last; d += 1) {
    for (const m of E_SERIES[series]) {
      const v = scaled(m, d);
      if (v >= lo * (1 - SLACK) && v <= hi * (1 + SLACK)) out.push(v);
    }
  }
  return out;
}
