// The supply brief: one zod schema shared by the wizard form, the API and the engine (browser-safe).
import { z } from 'zod';

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
  z.number({ error: `${label} must be a number.` }).refine(Number.isFinite, `${label} must be a finite number.`);
const positive = (label: string, max: number) =>
  finite(label)
    .gt(0, `${label} must be greater than zero.`)
    .max(max, `${label} must not exceed ${max}.`);
const nonNegative = (label: string, max: number) =>
  finite(label)
    .min(0, `${label} must not be negative.`)
    .max(max, `${label} must not exceed ${max}.`);

const inputSchema = z
  .object({
    vMin: positive('The lowest input voltage', 1500),
    vNom: positive('The nominal input voltage', 1500),
    vMax: positive('The highest input voltage', 1500),
    rippleVpp: nonNegative('The input ripple', 1500).default(0),
    source: z.enum(['battery', 'adapter', 'rectified', 'bus'], {
      error: 'The input source must be battery, adapter, rectified or bus.',
    }),
  })
  .strict();

const outputSchema = z
  .object({
    v: positive('The output voltage', 5000),
    tolerance: positive('The output tolerance', 0.5),
    iMin: nonNegative('The lowest load current', 1000),
    iTyp: nonNegative('The typical load current', 1000),
    iMax: positive('The highest load current', 1000),
  })
  .strict();

const noiseSchema = z
  .object({
    class: z.enum(noiseClasses, { error: 'The noise class must be digital, sensor, precision or rf.' }),
    maxRippleVpp: positive('The ripple limit', 100).optional(),
  })
  .strict()
  .transform((n) => ({ class: n.class, maxRippleVpp: n.maxRippleVpp ?? noiseClassDefaults[n.class] }));

const thermalSchema = z
  .object({
    ambientMaxC: finite('The highest ambient temperature')
      .min(-40, 'The highest ambient temperature must be at least −40 °C.')
      .max(125, 'The highest ambient temperature must not exceed 125 °C.'),
    airflow: z.enum(['enclosed', 'still-air', 'forced-air'], {
      error: 'The airflow must be enclosed, still-air or forced-air.',
    }),
  })
  .strict();

const weight = (label: string, fallback: number) => nonNegative(label, 100).default(fallback);
const weightsSchema = z
  .object({
    efficiency: weight('The efficiency weight', defaultWeights.efficiency),
    heat: weight('The heat weight', defaultWeights.heat),
    partCount: weight('The part-count weight', defaultWeights.partCount),
    noise: weight('The noise weight', defaultWeights.noise),
    cost: weight('The cost weight', defaultWeights.cost),
  })
  .strict()
  .refine((w) => w.efficiency + w.heat + w.partCount + w.noise + w.cost > 0, {
    message: 'At least one weight must be greater than zero.',
  });

const overridesSchema = z
  .object({
    linearClass: z.string().min(1).max(64).optional(),
    passDevice: z.enum(['npn', 'nmos'], { error: 'The pass device must be npn or nmos.' }).optional(),
    r1Ohm: positive('The chosen R1', 1e7).optional(),
    resistorSeries: z.enum(['E24', 'E96'], { error: 'The resistor series must be E24 or E96.' }).optional(),
    fswHz: positive('The switching frequency', 1e7).optional(),
    heatsinkThetaSaCW: positive('The heatsink thermal resistance', 100).optional(),
    ambientC: finite('The ambient temperature')
      .min(-40, 'The ambient temperature must be at least −40 °C.')
      .max(125, 'The ambient temperature must not exceed 125 °C.')
      .optional(),
    standoffV: positive('The standoff voltage', 200).optional(),
    parts: z.record(z.string().regex(/^[A-Z]{1,3}[0-9]{1,3}$/, 'A part reference looks like R1 or HS1.'), positive('A forced part value', 1e12)).optional(),
    mcDraws: z
      .number({ error: 'The number of Monte Carlo draws must be a number.' })
      .int('The number of Monte Carlo draws must be a whole number.')
      .min(100, 'Use at least 100 Monte Carlo draws.')
      .max(100_000, 'Use at most 100 000 Monte Carlo draws.')
      .optional(),
    seed: z
      .number({ error: 'The seed must be a number.' })
      .int('The seed must be a whole number.')
      .min(0, 'The seed must not be negative.')
      .max(0xffffffff, 'The seed must fit in 32 bits.')
      .optional(),
  })
  .strict();

export const briefSchema = z
  .object({
    input: inputSchema,
    output: outputSchema,
    noise: noiseSchema,
    thermal: thermalSchema,
    weights: weightsSchema.default({ ...defaultWeights }),
    overrides: overridesSchema.default({}),
  })
  .strict()
  .superRefine((b, ctx) => {
    const fail = (path: (string | number)[], message: string) => ctx.addIssue({ code: 'custom', path, message });
    if (b.input.vMin > b.input.vNom) fail(['input', 'vMin'], 'The lowest input voltage must not exceed the nominal one.');
    if (b.input.vNom > b.input.vMax) fail(['input', 'vMax'], 'The highest input voltage must not be below the nominal one.');
    if (b.input.rippleVpp >= 2 * b.input.vMin)
      fail(['input', 'rippleVpp'], 'The input ripple must be smaller than twice the lowest input voltage.');
    if (b.output.iMin > b.output.iTyp) fail(['output', 'iMin'], 'The lowest load current must not exceed the typical one.');
    if (b.output.iTyp > b.output.iMax) fail(['output', 'iMax'], 'The highest load current must not be below the typical one.');
  });

export type Brief = z.infer<typeof briefSchema>;
export type BriefInput = z.input<typeof briefSchema>;

export interface BriefIssue {
  path: string;
  message: string;
}

/** Flattens a zod error into `{ path: 'input.vMin', message }` entries for a 400 answer. */
export function briefIssues(error: z.ZodError): BriefIssue[] {
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
