// Foldback current limit: a sense transistor across the sense resistor Rs, its base fed from a
// divider (RA from the pass device's side of Rs, RB to ground), so the limit falls with the
// voltage at the sense node (The Art of Electronics, 2nd ed., §6.06, foldback current limiting —
// from memory): I(Vn) = (Vbe·(1 + k) + Vn·k)/Rs with k = RA/RB.

export interface Foldback {
  /** Divider ratio RA/RB. */
  k: number;
  rs: number;
}

/** Limit current at sense-node voltage vn. */
export function foldbackCurrent(fb: Foldback, vbe: number, vn: number): number {
  return (vbe * (1 + fb.k) + Math.max(0, vn) * fb.k) / fb.rs;
}

/**
 * k and Rs that put the limit at iLimit when the sense node sits at vNormal and at iShort when it
 * has fallen to vShort (output shorted). Null where the swing vNormal − vShort is too small for
 * that ratio: the smallest reachable short-circuit current is then minShortCurrent().
 */
export function designFoldback(iLimit: number, iShort: number, vNormal: number, vShort: number, vbe: number): Foldback | null {
  const swing = vNormal - vShort;
  const denominator = (iShort * swing) / (iLimit - iShort) - vbe - vShort;
  if (!(iLimit > iShort) || !(denominator > 0)) return null;
  const k = vbe / denominator;
  return { k, rs: (k * swing) / (iLimit - iShort) };
}

/** The short-circuit current below which designFoldback has no solution (k → ∞). */
export function minShortCurrent(iLimit: number, vNormal: number, vShort: number, vbe: number): number {
  const swing = vNormal - vShort;
  return (iLimit * (vbe + vShort)) / (swing + vbe + vShort);
}
