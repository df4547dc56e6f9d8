// The rail spec: what a brief asks of the supply. One zod schema shared by the wizard form, the API and the engine (browser-safe).
// Written with zod's tree-shakable build, since the wizard ships it to the browser.
import { z } from 'zod/mini';

export const noiseClasses = ['digital', 'sensor', 'precision', 'rf'] as const;
export type NoiseClass = (typeof noiseClasses)[number];

/** Default ripple+noise limit per load class, V peak-to-peak (common practice for each kind of load). */
export const noiseClassDefaults: Readonly<Record<NoiseClass, number>> = {
  digital: 0.05,
  sensor: 0.01,
  precision: 0.001,
  rf: 0.0005,
};

export const defaultWeights = { efficiency: 3, heat: 2, partCount: 1, noise: 2, cost: 2 } as const;

const finite = (label: string) =>
  z.number({ error: `${label} must be a number.` }).check(z.refine(Number.isFinite, `${label} must be a finite number.`));
const positive = (label: string, max: number) =>
  finite(label).check(z.gt(0, `${label} must be greater than zero.`), z.lte(max, `${label} must not exceed ${max}.`));
const nonNegative = (label: string, max: number) =>
  finite(label).check(z.gte(0, `${label} must not be negative.`), z.lte(max, `${label} must not exceed ${max}.`));
const whole = (label: string, min: number, max: number, messages: { min: string; max: string }) =>
  z
    .number({ error: `${label} must be a number.` })
    .check(z.refine(Number.isInteger, `${label} must be a whole number.`), z.gte(min, messages.min), z.lte(max, messages.max));
const ambient = (label: string) =>
  finite(label).check(z.gte(-40, `${label} must be at least −40 °C.`), z.lte(125, `${label} must not exceed 125 °C.`));

const inputSchema = z.strictObject({
  vMin: positive('The lowest input voltage', 1500),
  vNom: positive('The nominal input voltage', 1500),
  vMax: positive('The highest input voltage', 1500),
  rippleVpp: z._default(nonNegative('The input ripple', 1500), 0),
  source: z.enum(['battery', 'adapter', 'rectified', 'bus'], {
    error: 'The input source must be battery, adapter, rectified or bus.',
  }),
});

const outputSchema = z.strictObject({
  v: positive('The output voltage', 5000),
  tolerance: positive('The output tolerance', 0.5),
  iMin: nonNegative('The lowest load current', 1000),
  iTyp: nonNegative('The typical load current', 1000),
  iMax: positive('The highest load current', 1000),
  /** Load step the rail must ride through, A, and the output deviation it may cause, V. */
  loadStep: z.optional(positive('The load step', 1000)),
  maxStepDeviation: z.optional(positive('The allowed step deviation', 100)),
});

const noiseSchema = z.pipe(
  z.strictObject({
    class: z.enum(noiseClasses, { error: 'The noise class must be digital, sensor, precision or rf.' }),
    maxRippleVpp: z.optional(positive('The ripple limit', 100)),
  }),
  z.transform((n) => ({ class: n.class, maxRippleVpp: n.maxRippleVpp ?? noiseClassDefaults[n.class] })),
);

/** The box the supply sits in: its inside air warms with everything dissipated in it. */
const enclosureSchema = z.strictObject({
  /** Outer surface that sheds heat to the room, cm² (the sides, top and front; not a face on a wall). */
  surfaceCm2: positive('The enclosure surface', 1e6),
  material: z._default(z.enum(['metal', 'plastic'], { error: 'The enclosure material must be metal or plastic.' }), 'metal'),
  /** Other dissipation inside the same box (the load, other boards), W. */
  otherW: z._default(nonNegative('The other dissipation in the enclosure', 1e4), 0),
  /** Air a fan moves through the box, m³/h (with forced air). */
  fanFlowM3h: z.optional(positive('The fan flow', 1e5)),
});

const thermalSchema = z.strictObject({
  ambientMaxC: ambient('The highest ambient temperature'),
  airflow: z.enum(['enclosed', 'still-air', 'forced-air'], {
    error: 'The airflow must be enclosed, still-air or forced-air.',
  }),
  enclosure: z.optional(enclosureSchema),
});

const weight = (label: string, fallback: number) => z._default(nonNegative(label, 100), fallback);
const weightsSchema = z
  .strictObject({
    efficiency: weight('The efficiency weight', defaultWeights.efficiency),
    heat: weight('The heat weight', defaultWeights.heat),
    partCount: weight('The part-count weight', defaultWeights.partCount),
    noise: weight('The noise weight', defaultWeights.noise),
    cost: weight('The cost weight', defaultWeights.cost),
  })
  .check(
    z.refine((w) => w.efficiency + w.heat + w.partCount + w.noise + w.cost > 0, {
      message: 'At least one weight must be greater than zero.',
    }),
  );

const overridesSchema = z.strictObject({
  linearClass: z.optional(z.string().check(z.minLength(1), z.maxLength(64))),
  passDevice: z.optional(z.enum(['npn', 'nmos'], { error: 'The pass device must be npn or nmos.' })),
  r1Ohm: z.optional(positive('The chosen R1', 1e7)),
  resistorSeries: z.optional(z.enum(['E24', 'E96'], { error: 'The resistor series must be E24 or E96.' })),
  fswHz: z.optional(positive('The switching frequency', 1e7)),
  heatsinkThetaSaCW: z.optional(positive('The heatsink thermal resistance', 100)),
  ambientC: z.optional(ambient('The ambient temperature')),
  standoffV: z.optional(positive('The standoff voltage', 200)),
  /** statistical: the ±3σ output may decide feasibility (with a caution); worst-case: only the extreme values may. */
  toleranceRule: z.optional(z.enum(['statistical', 'worst-case'], { error: 'The tolerance rule must be statistical or worst-case.' })),
  parts: z.optional(
    z.record(
      z.string().check(z.regex(/^[A-Z]{1,3}[0-9]{1,3}$/, 'A part reference looks like R1 or HS1.')),
      positive('A forced part value', 1e12),
    ),
  ),
  mcDraws: z.optional(
    whole('The number of Monte Carlo draws', 100, 100_000, {
      min: 'Use at least 100 Monte Carlo draws.',
      max: 'Use at most 100 000 Monte Carlo draws.',
    }),
  ),
  seed: z.optional(whole('The seed', 0, 0xffffffff, { min: 'The seed must not be negative.', max: 'The seed must fit in 32 bits.' })),
});

export const railSpecSchema = z
  .strictObject({
    input: inputSchema,
    output: outputSchema,
    noise: noiseSchema,
    thermal: thermalSchema,
    weights: z._default(weightsSchema, { ...defaultWeights }),
    overrides: z._default(overridesSchema, {}),
  })
  .check(
    z.superRefine((b, ctx) => {
      const fail = (path: (string | number)[], message: string) => ctx.addIssue({ code: 'custom', path, message, input: b });
      if (b.input.vMin > b.input.vNom) fail(['input', 'vMin'], 'The lowest input voltage must not exceed the nominal one.');
      if (b.input.vNom > b.input.vMax) fail(['input', 'vMax'], 'The highest input voltage must not be below the nominal one.');
      if (b.input.rippleVpp >= 2 * b.input.vMin)
        fail(['input', 'rippleVpp'], 'The input ripple must be smaller than twice the lowest input voltage.');
      if (b.output.iMin > b.output.iTyp) fail(['output', 'iMin'], 'The lowest load current must not exceed the typical one.');
      if (b.output.iTyp > b.output.iMax) fail(['output', 'iMax'], 'The highest load current must not be below the typical one.');
    }),
  );

export type RailSpec = z.infer<typeof railSpecSchema>;
export type RailSpecInput = z.input<typeof railSpecSchema>;

export interface RailSpecIssue {
  path: string;
  message: string;
}

/** Flattens a zod error into `{ path: 'input.vMin', message }` entries for a 400 answer. */
export function railSpecIssues(error: z.core.$ZodError): RailSpecIssue[] {
  return error.issues.flatMap((issue) => {
    const base = issue.path.map(String);
    if (issue.code === 'unrecognized_keys') {
      return issue.keys.map((key) => ({
        path: [...base, key].join('.'),
        message: 'This field is not part of a supply brief.',
      }));
    }
    return [{ path: base.join('.'), message: issue.message }];
  });
}
