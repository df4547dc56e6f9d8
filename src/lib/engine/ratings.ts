// Standard rating ladders and the derating rule used to pick a part's rating.

/** Common practice: a passive part's rating is at least twice the worst stress it sees (normal corner or fault). */
export const RATING_FACTOR = 2;

/** Common practice: semiconductors are used at no more than 80 % of their voltage rating. */
export const SEMICONDUCTOR_VOLTAGE_FACTOR = 1.25;

/** Resistor power ratings, W (common practice). */
export const RESISTOR_POWER_W = [0.125, 0.25, 0.5, 1, 2, 3, 5, 10, 25, 50, 100] as const;

/**
 * Limiting element voltage per resistor power rating, V — typical of the package sizes that carry
 * each rating; typical — confirm against the chosen part's data.
 */
export const RESISTOR_LIMIT_V: Readonly<Record<number, number>> = {
  0.125: 150,
  0.25: 250,
  0.5: 350,
  1: 500,
  2: 500,
  3: 750,
  5: 750,
  10: 1000,
  25: 1000,
  50: 1000,
  100: 1000,
};

/** Capacitor voltage ratings, V (common practice ladder). */
export const CAPACITOR_V = [6.3, 10, 16, 25, 35, 50, 63, 100, 160, 250, 400, 450, 630, 1000, 1500, 2000, 3000, 6000] as const;

/** Zener power ratings, W (common practice). */
export const ZENER_POWER_W = [0.5, 1, 1.3, 3, 5] as const;

/** Transistor Vce / Vds ratings, V (common practice ladder). */
export const TRANSISTOR_V = [30, 60, 100, 150, 200, 250, 300, 400, 500, 600, 700, 800, 900, 1000, 1200, 1500] as const;

/** The smallest ladder step ≥ need, or null when the ladder ends first. */
export function pickFromLadder(ladder: readonly number[], need: number): number | null {
  for (const step of ladder) if (step >= need) return step;
  return null;
}

/** The smallest rating that is at least twice the worst stress (common practice). */
export function ratingFor(ladder: readonly number[], worstStress: number): number | null {
  return pickFromLadder(ladder, RATING_FACTOR * Math.max(0, worstStress));
}

export interface ResistorRating {
  /** Resistors in series sharing the voltage and power. */
  count: number;
  /** Power rating of each resistor, W. */
  ratingW: number;
  /** Limiting voltage of each resistor, V. */
  ratingV: number;
}

/**
 * Picks the power rating and, when one resistor's limiting voltage would be exceeded, splits the
 * resistor into a series string of equal parts; each part keeps the twice-the-stress rule for
 * power and voltage. Null when even a long string cannot carry the stress.
 */
export function rateResistor(worstW: number, worstV: number, maxCount = 24): ResistorRating | null {
  for (let count = 1; count <= maxCount; count += 1) {
    const ratingW = ratingFor(RESISTOR_POWER_W, worstW / count);
    if (ratingW === null) continue;
    for (const step of RESISTOR_POWER_W) {
      if (step < ratingW) continue;
      // Beyond 1 W a larger body for voltage alone costs more than splitting into a string.
      if (step > Math.max(ratingW, 1)) break;
      const ratingV = RESISTOR_LIMIT_V[step] ?? 0;
      if (ratingV >= RATING_FACTOR * (worstV / count)) return { count, ratingW: step, ratingV };
    }
  }
  return null;
}
