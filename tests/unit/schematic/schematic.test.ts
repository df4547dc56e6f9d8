// The schematic of every topology and variant the corpus yields: a symbol for each part, every
// reference and value printed, and the drawn wiring equal to the SPICE export's nets.
import { describe, expect, it } from 'vitest';
import { evaluate, formatSi, railSpecSchema, toSpiceNetlist, type Option, type RailSpec } from '~/lib/engine/index.ts';
import { drawSchematic, railFiguresOf } from '~/lib/schematic/index.ts';
import { CORPUS } from '../engine/corpus/briefs.ts';
import { normalise, spiceNets } from './spice-nets.ts';

/** What tells one drawing apart: the topology, each part's role, and the part kinds the drawing shows differently. */
function variantOf(o: Option): string {
  const kinds = o.components.map(
    (c) =>
      `${c.role}${c.quantity > 1 ? '×' : ''}${/depletion|NPN|electrolytic|Schottky|synchronous|four-switch|boost/i.exec(c.part)?.[0] ?? ''}`,
  );
  return `${o.topology}: ${kinds.join(', ')}`;
}

const cases = new Map<string, { id: string; spec: RailSpec; option: Option }>();
for (const brief of CORPUS) {
  const spec = railSpecSchema.parse(brief.spec);
  for (const option of evaluate(spec).options) {
    const variant = variantOf(option);
    if (!cases.has(variant)) cases.set(variant, { id: brief.id, spec, option });
  }
}
const all = [...cases.values()];

/** The drawing's nets by owner: signal pins and parts the netlist does not carry left out. */
function drawnNets(option: Option, spec: RailSpec, inNetlist: Set<string>): string[][] {
  const s = drawSchematic(option, railFiguresOf(spec));
  const signal = new Set(s.signalPins);
  return normalise(
    s.nets.map((net) =>
      net
        .filter((pin) => !signal.has(pin))
        .map((pin) => pin.split('.')[0]!)
        .filter((owner) => owner === 'GND' || inNetlist.has(owner)),
    ),
  );
}

describe('schematic coverage', () => {
  it('the corpus yields every topology and the variants the drawing lays out differently', () => {
    const has = (test: (o: Option) => boolean) => all.some(({ option }) => test(option));
    const part = (o: Option, pattern: RegExp) => o.components.some((c) => pattern.test(`${c.role} ${c.part}`));
    for (const t of ['shunt', 'linear', 'linear-predrop', 'buck', 'boost', 'buck-boost', 'buck+linear'])
      expect(
        has((o) => o.topology === t),
        t,
      ).toBe(true);
    expect(
      has((o) => o.topology === 'linear-predrop' && o.components.filter((c) => c.role === 'bias-resistor').length >= 3),
      'pre-drop with foldback',
    ).toBe(true);
    expect(
      has((o) => o.topology === 'linear-predrop' && part(o, /depletion/i)),
      'standoff Zener fed by a current source',
    ).toBe(true);
    for (const converter of [/^switch .*buck converter/i, /^switch .*boost (converter|controller)/i, /^switch .*buck-boost/i])
      expect(
        has((o) => o.topology === 'buck+linear' && part(o, converter)),
        `hybrid with ${converter}`,
      ).toBe(true);
    expect(
      has((o) => o.components.some((c) => c.unit === 'Ω' && c.quantity > 1)),
      'resistor string',
    ).toBe(true);
    expect(
      has((o) => o.topology === 'shunt' && part(o, /shunt reference/i)),
      'shunt reference',
    ).toBe(true);
    expect(
      has((o) => part(o, /protection-diode .*adjust/i)),
      'adjust-pin protection',
    ).toBe(true);
  });
});

describe.each(all.map((c) => [`${c.option.topology} (${c.id})`, c] as const))('schematic of %s', (_name, { spec, option }) => {
  const s = drawSchematic(option, railFiguresOf(spec));

  it('has a symbol group with a title for every part, and prints every reference and value', () => {
    for (const c of option.components) {
      expect(s.svg).toMatch(new RegExp(`<g data-ref="${c.ref}"><title>${c.ref}: `));
      if (c.value !== null && c.unit !== null) expect(s.svg).toContain(`>${formatSi(c.value, c.unit)}<`);
    }
    expect(s.svg).toMatch(/^<svg [^>]*role="img" aria-labelledby="schematic-title schematic-desc"/);
  });

  it('marks dangerous voltage exactly when a net can pass 60 V', () => {
    const highest = Math.max(spec.input.vMax, option.vOutRange.max);
    expect(s.hazardous).toBe(highest > 60);
    expect(s.svg.includes('dangerous voltage')).toBe(highest > 60);
  });

  it('wires what the SPICE export connects', () => {
    const netlist = toSpiceNetlist(option, { vIn: spec.input.vNom, iOut: spec.output.iTyp });
    const fromSpice = spiceNets(netlist, option);
    const owners = new Set(fromSpice.flat());
    expect(drawnNets(option, spec, owners)).toEqual(fromSpice);
  });
});
