/** A fixed, varied set of briefs for every benchmark: the demo rails plus a few corners of the range. */
import { railSpecSchema, type RailSpec, type RailSpecInput } from '../src/lib/engine/rail-spec';
import { DEMO_BRIEFS } from '../src/lib/demo/scenario';

const EXTRA: RailSpecInput[] = [
  {
    input: { vMin: 4.5, vNom: 5, vMax: 5.5, rippleVpp: 0.05, source: 'adapter' },
    output: { v: 3.3, tolerance: 0.05, iMin: 0.001, iTyp: 0.05, iMax: 0.25 },
    noise: { class: 'rf' },
    thermal: { ambientMaxC: 60, airflow: 'enclosed' },
  },
  {
    input: { vMin: 9, vNom: 12, vMax: 16, rippleVpp: 0.2, source: 'bus' },
    output: { v: 24, tolerance: 0.05, iMin: 0.01, iTyp: 0.2, iMax: 0.5 },
    noise: { class: 'digital' },
    thermal: { ambientMaxC: 50, airflow: 'forced-air' },
  },
  {
    input: { vMin: 600, vNom: 650, vMax: 700, rippleVpp: 10, source: 'rectified' },
    output: { v: 400, tolerance: 0.1, iMin: 0.001, iTyp: 0.003, iMax: 0.005 },
    noise: { class: 'sensor' },
    thermal: { ambientMaxC: 30, airflow: 'still-air' },
  },
];

export const BENCH_BRIEF_INPUTS: RailSpecInput[] = [...DEMO_BRIEFS.map((b) => b.spec), ...EXTRA];
export const BENCH_BRIEFS: RailSpec[] = BENCH_BRIEF_INPUTS.map((b) => railSpecSchema.parse(b));
