// The exports of a saved revision. The netlist is checked by an independent circuit simulator
// (eecircuit-engine, ngspice in WebAssembly): it must give the design's output voltage within 2 %.
import { Simulation } from 'eecircuit-engine';
import Papa from 'papaparse';
import { beforeAll, describe, expect, inject, test } from 'vitest';
import { DEMO, Visitor } from '../../support/client';
import { saveRevision, submittedBrief } from './helpers';

const baseUrl = inject('baseUrl');
let sim: Simulation;
let engineer: Visitor;
beforeAll(async () => {
  sim = new Simulation();
  await sim.start();
  engineer = await new Visitor(baseUrl).signIn(DEMO.engineer);
}, 60_000);

interface Chosen {
  topology: string;
  monteCarlo: { mean: number };
  vOutRange: { min: number; max: number };
  components: { ref: string; value: number | null; part: string }[];
}

// One brief per demo rail, shared by the tests: every test brief lengthens the desk other tests read.
const briefs = new Map<string, Promise<string>>();
const TITLES: Record<string, string> = { 'detector-hv': 'Export test: 150 V bias', 'controller-24v': 'Export test: PLC card' };

async function revisionOf(key: string, topology: string) {
  if (!briefs.has(key)) briefs.set(key, submittedBrief(baseUrl, key, TITLES[key]!));
  const briefId = await briefs.get(key)!;
  const revision = await saveRevision(engineer, briefId, { topology, note: `Export check, ${topology}` });
  const chosen: Chosen = revision.result.options.find((o: Chosen) => o.topology === topology);
  return { revision, chosen };
}

async function simulate(netlist: string) {
  sim.setNetList(netlist);
  const result = await sim.runSim();
  expect(sim.getError().filter((m) => /error|no convergence|abort|timestep too small/i.test(m))).toEqual([]);
  if (result.dataType !== 'real') throw new Error('expected real results');
  return (name: string) => result.data.find((d) => d.name === name)!.values;
}

/** Time average over the last part of a transient by the trapezoid rule (steps are not uniform). */
function tailAverage(time: number[], y: number[], fraction: number): number {
  const t0 = time.at(-1)! * (1 - fraction);
  let area = 0;
  for (let k = 1; k < time.length; k += 1) if (time[k]! > t0) area += ((y[k]! + y[k - 1]!) / 2) * (time[k]! - time[k - 1]!);
  return area / (time.at(-1)! - t0);
}

const within2 = (simulated: number, design: number) => expect(Math.abs(simulated - design)).toBeLessThanOrEqual(0.02 * Math.abs(design));

describe('netlist export', () => {
  test('the high-voltage pre-drop design simulates to its output voltage, and the file carries the cautions', async () => {
    const { revision, chosen } = await revisionOf('detector-hv', 'linear-predrop');
    const response = await engineer.request(`/api/v1/revisions/${revision.id}/netlist.cir`);
    expect(response.status).toBe(200);
    expect(response.headers.get('content-type')).toBe('text/plain; charset=utf-8');
    expect(response.headers.get('content-disposition')).toBe(`attachment; filename="export-test-150-v-bias-rev${revision.number}.cir"`);
    const text = await response.text();
    expect(text).toMatch(/^\* Railwright - Export test: 150 V bias, revision \d+: Linear with high-voltage pre-drop\n/);
    // The simulator parses its deck as bytes: anything but printable ASCII changes what it reads.
    expect(text).toMatch(/^[\x20-\x7e\n]*$/);
    expect(text).toContain('* CAUTION: This supply works at up to 350 V DC');
    expect(text).toContain('V1 in 0 DC 325');
    expect(text.trimEnd().endsWith('.end')).toBe(true);

    const wave = await simulate(text);
    within2(wave('v(out)')[0]!, chosen.monteCarlo.mean);
    expect(wave('v(out)')[0]!).toBeGreaterThan(chosen.vOutRange.min);
    expect(wave('v(out)')[0]!).toBeLessThan(chosen.vOutRange.max);
  });

  test('the buck design of the 24 V card averages to its output voltage in a switching transient', async () => {
    const { revision, chosen } = await revisionOf('controller-24v', 'buck');
    const text = await (await engineer.request(`/api/v1/revisions/${revision.id}/netlist.cir`)).text();
    expect(text).toContain('.tran');
    const wave = await simulate(text);
    within2(tailAverage(wave('time'), wave('v(out)'), 0.15), chosen.monteCarlo.mean);
  });

  test('the four-switch buck-boost design of the 24 V card downloads and averages to its output voltage', async () => {
    const { revision, chosen } = await revisionOf('controller-24v', 'buck-boost');
    const response = await engineer.request(`/api/v1/revisions/${revision.id}/netlist.cir`);
    expect(response.status).toBe(200);
    const text = await response.text();
    expect(text).toMatch(/^\* Railwright - Export test: PLC card, revision \d+: Buck-boost switcher\n/);
    // 24 V in is above the 5 V output: the buck leg switches and the boost leg's top switch is held on.
    expect(text).toMatch(/^S1 in sw1 g 0 SWHI$/m);
    expect(text).toMatch(/^S4 sw2 out on 0 SWHI$/m);
    const wave = await simulate(text);
    within2(tailAverage(wave('time'), wave('v(out)'), 0.15), chosen.monteCarlo.mean);
  });

  test('a revision that does not exist is a 404', async () => {
    expect((await engineer.request('/api/v1/revisions/no-such-revision/netlist.cir')).status).toBe(404);
  });
});

describe('part list export', () => {
  test('one CSV row per part of the chosen design, with values in SI units and costs in minor units', async () => {
    const { revision, chosen } = await revisionOf('detector-hv', 'linear-predrop');
    const response = await engineer.request(`/api/v1/revisions/${revision.id}/parts.csv`);
    expect(response.status).toBe(200);
    expect(response.headers.get('content-type')).toBe('text/csv; charset=utf-8');
    expect(response.headers.get('content-disposition')).toContain(`-rev${revision.number}.csv"`);
    const bytes = new Uint8Array(await response.arrayBuffer());
    // A UTF-8 byte-order mark first, so spreadsheet programs read Ω and µ right.
    expect([...bytes.subarray(0, 3)]).toEqual([0xef, 0xbb, 0xbf]);
    const text = new TextDecoder('utf-8', { ignoreBOM: true }).decode(bytes).slice(1);
    // No binary float noise (0.00006400000000000001): at most four significant figures.
    for (const figure of text.match(/\d+\.\d+(?:e[+-]?\d+)?/g) ?? [])
      expect(figure.replace(/^0\.0*|\.|e.*$/g, '').replace(/^0+/, '').length).toBeLessThanOrEqual(4);
    const parsed = Papa.parse<Record<string, string>>(text, { header: true, skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    expect(parsed.meta.fields).toEqual([
      'ref',
      'role',
      'part',
      'value',
      'unit',
      'value_text',
      'quantity',
      'rating_w',
      'rating_v',
      'tolerance',
      'worst_w',
      'fault_w',
      'cost_minor',
      'currency',
    ]);
    expect(parsed.data.map((r) => r.ref)).toEqual(chosen.components.map((c) => c.ref));
    // Beside the numeric column, the value as a person reads it, prefix and unit included.
    expect(parsed.data.filter((r) => /^\d+(?:\.\d+)? [kMmµnp]?Ω/.test(r.value_text ?? '')).length).toBeGreaterThan(0);
    for (const [k, row] of parsed.data.entries()) {
      const part = chosen.components[k]!;
      expect(row.part).toBe(part.part);
      if (part.value === null) expect(row.value).toBe('');
      else expect(Number(row.value)).toBeCloseTo(part.value, -Math.floor(Math.log10(Math.abs(part.value))) + 2);
      expect(row.currency).toBe('EUR');
    }
  });
});
