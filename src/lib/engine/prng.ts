// Seeded pseudo-random numbers (mulberry32): small, fast and reproducible across runs and machines.

export type Random = () => number;

/** A generator of uniform numbers in [0, 1) fixed by a 32-bit seed. */
export function mulberry32(seed: number): Random {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}
