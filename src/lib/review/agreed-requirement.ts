/**
 * The requirement as agreed with the client where it departs from the brief: the engineer may
 * relax the tolerance or the ripple limit, or move the output voltage, once the client agrees.
 * The design ambient is the engine's `ambientC` override. Browser-safe and free of zod: the
 * review island merges with it before a re-run, the server before it saves a revision.
 */
export interface AgreedRequirement {
  outputV?: number | undefined;
  tolerance?: number | undefined;
  maxRippleVpp?: number | undefined;
}

const objectOf = (v: unknown) => (v && typeof v === 'object' ? (v as Record<string, unknown>) : {});

/** The brief's spec with the agreed figures in place (the result is still checked as a whole spec). */
export function withAgreedRequirement(spec: unknown, agreed: AgreedRequirement): Record<string, unknown> {
  const base = objectOf(spec);
  const { outputV, tolerance, maxRippleVpp } = agreed;
  return {
    ...base,
    output: {
      ...objectOf(base.output),
      ...(outputV !== undefined ? { v: outputV } : {}),
      ...(tolerance !== undefined ? { tolerance } : {}),
    },
    noise: { ...objectOf(base.noise), ...(maxRippleVpp !== undefined ? { maxRippleVpp } : {}) },
  };
}

/** Where a design's spec departs from the brief's requirement: what a saved revision was designed to. */
export function agreedRequirementOf(brief: unknown, designed: unknown): AgreedRequirement {
  const pick = (group: string, key: string) => {
    const want = objectOf(objectOf(brief)[group])[key];
    const got = objectOf(objectOf(designed)[group])[key];
    return typeof got === 'number' && got !== want ? got : undefined;
  };
  const out: AgreedRequirement = {};
  const outputV = pick('output', 'v');
  const tolerance = pick('output', 'tolerance');
  const maxRippleVpp = pick('noise', 'maxRippleVpp');
  if (outputV !== undefined) out.outputV = outputV;
  if (tolerance !== undefined) out.tolerance = tolerance;
  if (maxRippleVpp !== undefined) out.maxRippleVpp = maxRippleVpp;
  return out;
}

/** Paths of the spec's checks, as the review form names the same fields. */
export const AGREED_FIELD_PATHS: Record<string, string> = {
  'output.v': 'requirement.outputV',
  'output.tolerance': 'requirement.tolerancePct',
  'noise.maxRippleVpp': 'requirement.maxRippleVpp',
};
