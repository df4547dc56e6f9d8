// One layout routine per topology family, each reading the design's part list by role and placing
// it on the power path (board.ts). The nets follow the SPICE export's (engine/spice/): what is
// wired here is what the simulator is given, and a unit test compares the two.
import type { Component, Option } from '../engine/types.ts';
import { formatSi } from '../engine/units.ts';
import { Board, GAP, GROUND_Y, partLines } from './board.ts';
import { byRole, transistorEntry, twoPinEntry } from './parts.ts';
import type { Point } from './sheet.ts';
import { SPAN, frame, shuntReference, type Direction } from './symbols.ts';
import { deviceName, textWidth, titleOf } from './words.ts';

export interface RailFigures {
  /** The brief's input range, V. */
  vIn: { min: number; max: number };
  /** The brief's output set point, V, and its largest load, A. */
  vOut: number;
  iMax: number;
}

const volts = (v: number) => formatSi(v, 'V', 3);
const widest = (texts: string[]) => Math.max(0, ...texts.map((t) => textWidth(t)));

/** The parts listed from `start` up to the next block (regulator or switch). */
function section(components: readonly Component[], start: Component): Component[] {
  const from = components.indexOf(start);
  const next = components.findIndex((c, i) => i > from && (c.role === 'regulator' || c.role === 'switch'));
  return components.slice(from, next === -1 ? undefined : next);
}

/** A three-pin transistor from `first` along `dir`; its control pin on the side `flip` picks. Returns [first, second, control]. */
function transistor(
  b: Board,
  c: Component,
  first: Point,
  dir: Direction,
  flip: boolean,
  labelAt: Point,
  anchor: 'start' | 'middle',
): Point[] {
  const { draw, pins } = transistorEntry(c);
  const t = frame(first, dir, flip);
  const points = [first, t(SPAN, 0), t(30, 30)];
  const lines = [c.ref, ...deviceName(c)];
  const { labels } = b.lines(lines, labelAt, anchor);
  b.heatsinkAt.set(c.ref, { x: labelAt.x - (anchor === 'middle' ? 12 : 0), y: labelAt.y + lines.length * 14 + 6 });
  b.sheet.part(
    { ref: c.ref, markup: draw(t), labels, title: titleOf(c) },
    points.map((p, i) => ({ ref: c.ref, name: pins[i]!, ...p })),
  );
  for (const p of points) b.reach(p.x, p.y);
  return points;
}

/** The Zener shunt, or the shunt reference with its divider, fed through the series resistor. */
function shunt(b: Board, option: Option, vOutMax: number): void {
  const rs = byRole(option.components, 'series-resistor')[0];
  if (rs) b.series(twoPinEntry(rs), vOutMax, 'OUT');
  const dz = byRole(option.components, 'zener')[0];
  if (dz) {
    b.chain([twoPinEntry(dz, true)]);
    return;
  }
  const ref = byRole(option.components, 'regulator')[0];
  if (!ref) return;
  const upper = byRole(option.components, 'feedback-upper')[0];
  const lower = byRole(option.components, 'feedback-lower')[0];
  const lines = [ref.ref, ...deviceName(ref)];
  const x = b.x + GAP + widest(lines) + 14;
  const centre = divided(upper, lower) ? midOfTwo() : GROUND_Y / 2;
  const anode = { x, y: centre + 30 };
  const t = frame(anode, 'up');
  const [k, r] = [t(SPAN, 0), t(30, 26)];
  const { labels } = b.lines(lines, { x: x - 14, y: centre - 10 }, 'end');
  b.sheet.part({ ref: ref.ref, markup: shuntReference(t), labels, title: titleOf(ref) }, [
    { ref: ref.ref, name: 'K', ...k },
    { ref: ref.ref, name: 'A', ...anode },
    { ref: ref.ref, name: 'REF', ...r },
  ]);
  b.sheet.wire({ x, y: 0 }, k);
  b.sheet.wire(anode, { x, y: GROUND_Y });
  b.x = r.x;
  if (upper && lower) {
    const d = b.chain([twoPinEntry(upper), twoPinEntry(lower)]);
    b.sheet.wire(r, { x: d.x, y: r.y });
  }
}

const divided = (upper: Component | undefined, lower: Component | undefined) => upper !== undefined && lower !== undefined;
/** Where a two-part chain's middle wire sits (board.chainAt's spacing). */
const midOfTwo = () => Math.round(((GROUND_Y - 2 * SPAN) / 3) * 1.5 + SPAN);

/**
 * A linear regulator and the parts listed with it: its input capacitor, the block, the
 * protection diode across it, the divider (or the fixed part's ground pin), the adjust-pin bypass
 * and its diode, the output capacitor with the series resistor that adds ESR.
 */
function linearSection(b: Board, option: Option, reg: Component, parts: Component[], vOutMax: number): void {
  const inputs = byRole(parts, 'input-capacitor');
  for (const c of inputs.slice(0, 1)) b.chain([twoPinEntry(c)]);
  const upper = byRole(parts, 'feedback-upper')[0];
  const lower = byRole(parts, 'feedback-lower')[0];
  const hasDivider = divided(upper, lower);
  // A regulator that draws no ground current returns it through its output: it has no ground pin.
  const floating = hasDivider && (option.assumptions[`${reg.ref}.iq`]?.value ?? 1) === 0;
  const [outToIn, adjToOut] = [
    byRole(parts, 'protection-diode').find((d) => !/adjust/i.test(d.part)),
    byRole(parts, 'protection-diode').find((d) => /adjust/i.test(d.part)),
  ];
  const names = [reg.ref, ...deviceName(reg)];
  const w = outToIn ? Math.max(120, widest(names) + 20) : 120;
  const bx = b.x + GAP + (outToIn ? 16 : 0);
  const pins = floating
    ? [{ name: 'ADJ', side: 'bottom' as const, at: w / 2 }]
    : hasDivider
      ? [
          { name: 'GND', side: 'bottom' as const, at: 30 },
          { name: 'FB', side: 'bottom' as const, at: w - 30 },
        ]
      : [{ name: 'GND', side: 'bottom' as const, at: w / 2 }];
  const p = b.ic(reg, { x: bx, y: -30 }, w, 70, [{ name: 'IN', side: 'left', at: 30 }, { name: 'OUT', side: 'right', at: 30 }, ...pins]);
  b.railTo(p.IN!);
  b.open = p.OUT!;
  b.x = bx + w;
  b.enter('OUT', vOutMax);
  if (p.GND) {
    b.sheet.wire(p.GND, { x: p.GND.x, y: p.GND.y + 12 });
    b.ground({ x: p.GND.x, y: p.GND.y + 12 });
  }
  if (outToIn) {
    const cooled = option.components.some((c) => c.role === 'heatsink' && c.part.endsWith(` for ${reg.ref}`));
    const y = -30 - 8 - names.length * 14 - 22 - (cooled ? 30 : 0);
    const [k, a] = [
      { x: bx - 16, y },
      { x: bx + w + 16, y },
    ];
    const d = twoPinEntry(outToIn);
    const left = (k.x + a.x) / 2 - SPAN / 2;
    const { labels } = b.lines(partLines(outToIn), { x: (k.x + a.x) / 2, y: y - 14 - 14 * (partLines(outToIn).length - 1) }, 'middle');
    const [pa, pk] = b.twoPin(d, { x: left + SPAN, y }, 'left', labels);
    b.sheet.wire({ x: k.x, y: 0 }, k, pk);
    b.sheet.wire(pa, a, { x: a.x, y: 0 });
    b.x = Math.max(b.x, a.x);
  }
  const adj = p.ADJ ?? p.FB;
  if (adj && upper && lower) {
    const mid = midOfTwo();
    const bypass = byRole(parts, 'bypass-capacitor')[0];
    if (bypass) b.chainAt(adj.x, [twoPinEntry(bypass)], 'right', undefined, undefined, mid);
    // The floating regulator's divider: the resistor across the reference (listed as the lower leg)
    // from OUT to ADJ; a grounded regulator's upper leg from OUT to FB.
    const [top, bottom] = floating ? [lower, upper] : [upper, lower];
    const d = b.chain([twoPinEntry(top), twoPinEntry(bottom)]);
    b.sheet.wire(adj, { x: adj.x, y: mid }, { x: d.x, y: mid });
    if (adjToOut) {
      const x = b.x + GAP;
      const anode = { x, y: mid - 16 };
      const lines = partLines(adjToOut);
      const { labels } = b.lines(lines, { x: x + 14, y: anode.y - 30 - ((lines.length - 1) * 14) / 2 + 4 }, 'start');
      const [, k] = b.twoPin(twoPinEntry(adjToOut), anode, 'up', labels);
      b.sheet.wire({ x, y: 0 }, k);
      b.sheet.wire(anode, { x, y: mid }, { x: d.x, y: mid });
      b.x = x + 14 + widest(lines);
    }
  }
  const cout = byRole(parts, 'output-capacitor')[0];
  const esr = byRole(parts, 'series-resistor')[0];
  if (cout) b.chain(esr ? [twoPinEntry(cout), twoPinEntry(esr)] : [twoPinEntry(cout)]);
}

type Converter = 'buck' | 'boost' | 'buck-boost';
const converterOf = (sw: Component): Converter => (/buck-boost/i.test(sw.part) ? 'buck-boost' : /boost/i.test(sw.part) ? 'boost' : 'buck');

/** The switching stage from the input to net `net`: block, inductor, rectifier, output capacitors, divider, post-filter. */
function switcherSection(b: Board, sw: Component, parts: Component[], net: string, vStage: number, vInMax: number): void {
  for (const c of byRole(parts, 'input-capacitor')) b.chain([twoPinEntry(c)]);
  const [l1, l2] = byRole(parts, 'inductor');
  const rectifier = byRole(parts, 'diode')[0];
  const kind = converterOf(sw);
  const w = 120;
  if (kind === 'buck') {
    const bx = b.x + GAP;
    const p = b.ic(sw, { x: bx, y: -30 }, w, 70, [
      { name: 'VIN', side: 'left', at: 30 },
      { name: 'SW', side: 'right', at: 30 },
      { name: 'GND', side: 'bottom', at: 30 },
      { name: 'FB', side: 'bottom', at: w - 30, signal: true },
    ]);
    b.railTo(p.VIN!);
    b.open = p.SW!;
    b.x = bx + w;
    b.enter('SW', vInMax);
    groundPin(b, p.GND!);
    b.tagged(p.FB!, 'FB', 'down');
    if (rectifier) b.chain([twoPinEntry(rectifier, true)]);
    if (l1) b.series(twoPinEntry(l1), vStage, net);
  } else if (kind === 'boost' && rectifier) {
    if (l1) b.series(twoPinEntry(l1), vStage, 'SW');
    const bx = b.x + GAP + 40;
    const p = b.ic(
      sw,
      { x: bx, y: 60 },
      w,
      70,
      [
        { name: 'SW', side: 'top', at: 30 },
        { name: 'VIN', side: 'left', at: 35, signal: true },
        { name: 'FB', side: 'right', at: 35, signal: true },
        { name: 'GND', side: 'bottom', at: 30 },
      ],
      bx + 30 + 8,
    );
    b.sheet.wire(p.SW!, { x: p.SW!.x, y: 0 });
    b.tagged(p.VIN!, 'IN', 'left');
    b.tagged(p.FB!, 'FB', 'right');
    groundPin(b, p.GND!);
    b.x = Math.max(bx + w + 50, bx + 38 + widest([sw.ref, ...deviceName(sw)]));
    b.series(twoPinEntry(rectifier), vStage, net);
  } else {
    // Synchronous boost and four-switch buck-boost: the switches are inside, from input (or the
    // inductor) to the output pin.
    const boost = kind === 'boost';
    if (boost && l1) b.series(twoPinEntry(l1), vStage, 'SW');
    const bx = b.x + GAP;
    const width = boost ? w : 110;
    const height = 90;
    const p = b.ic(sw, { x: bx, y: -30 }, width, height, [
      { name: boost ? 'SW' : 'VIN', side: 'left', at: 30 },
      { name: 'VOUT', side: 'right', at: 30 },
      { name: 'GND', side: 'left', at: 58 },
      { name: 'FB', side: 'right', at: 58, signal: true },
      ...(boost
        ? [{ name: 'VIN', side: 'top' as const, at: width / 2, signal: true }]
        : [
            { name: 'SW1', side: 'bottom' as const, at: 25 },
            { name: 'SW2', side: 'bottom' as const, at: 85 },
          ]),
    ]);
    b.railTo(boost ? p.SW! : p.VIN!);
    b.open = p.VOUT!;
    b.x = bx + width + 30;
    b.enter(net, vStage);
    b.sheet.wire(p.GND!, { x: p.GND!.x - 14, y: p.GND!.y });
    b.ground({ x: p.GND!.x - 14, y: p.GND!.y });
    b.tagged(p.FB!, 'FB', 'right');
    if (boost) b.tagged(p.VIN!, 'IN', 'up');
    else if (l1) {
      const y = -30 + height + 30;
      const lines = partLines(l1);
      const { labels } = b.lines(lines, { x: bx + 55, y: y + 26 }, 'middle');
      const [a, z] = b.twoPin(twoPinEntry(l1), { x: p.SW1!.x, y }, 'right', labels);
      b.sheet.wire(p.SW1!, a);
      b.sheet.wire(z, p.SW2!);
    }
  }
  const couts = byRole(parts, 'output-capacitor');
  if (couts[0]) b.chain([twoPinEntry(couts[0])]);
  const upper = byRole(parts, 'feedback-upper')[0];
  const lower = byRole(parts, 'feedback-lower')[0];
  if (upper && lower) {
    const d = b.chain([twoPinEntry(upper), twoPinEntry(lower)]);
    const mid = d.mids[0]!;
    b.tagged(mid, 'FB', 'right');
    b.x += 40;
  }
  if (l2) {
    b.series(twoPinEntry(l2), vStage, `${net}F`);
    for (const c of couts.slice(1)) b.chain([twoPinEntry(c)]);
  }
}

function groundPin(b: Board, pin: Point): void {
  const end = { x: pin.x, y: pin.y + 12 };
  b.sheet.wire(pin, end);
  b.ground(end);
}

/**
 * The high-voltage pre-drop: the pass device on the rail, its gate or base on net B above the rail
 * fed by the bias resistor (or the depletion current source with its set resistor), held by the
 * standoff Zener above the output (tagged OUT); the sense resistor, and the limiter transistor
 * pulling B down, its base on the sense resistor's input or on the foldback divider.
 */
function predropFront(b: Board, option: Option, vInMax: number, vFront: number): void {
  const parts = option.components;
  const q1 = byRole(parts, 'pass-transistor')[0];
  const dz = byRole(parts, 'standoff-zener')[0];
  const rs = byRole(parts, 'sense-resistor')[0];
  const [limiter, source] = byRole(parts, 'limit-transistor');
  if (!q1 || !dz || !rs) return;
  const after = limiter ? parts.slice(parts.indexOf(limiter)).filter((c) => c.role === 'bias-resistor') : [];
  const foldback = after.length >= 2 ? { ra: after[0]!, rb: after[1]! } : null;
  const bias = byRole(parts, 'bias-resistor').find((c) => c !== foldback?.ra && c !== foldback?.rb);
  const yb = source && foldback ? -190 : source || foldback ? -160 : -110;
  const bPoints: Point[] = [];

  if (bias) {
    const biasLines = [...(source ? [source.ref, ...deviceName(source)] : []), ...partLines(bias)];
    const x = b.x + GAP + (source ? 30 : 0);
    let feed: Point = { x, y: 0 };
    if (source) {
      const [drain, sourcePin, gate] = transistor(b, source, { x, y: -20 }, 'up', true, { x: x + 14, y: -60 }, 'start');
      b.sheet.wire(feed, drain!);
      b.sheet.wire(gate!, { x: gate!.x, y: yb });
      bPoints.push({ x: gate!.x, y: yb });
      feed = sourcePin!;
    }
    const start = { x, y: feed.y - 10 };
    const { labels } = b.lines(partLines(bias), { x: x + 14, y: start.y - 34 }, 'start');
    const [a, z] = b.twoPin(twoPinEntry(bias), start, 'up', labels);
    b.sheet.wire(feed, a);
    b.sheet.wire(z, { x, y: yb });
    bPoints.push({ x, y: yb });
    b.x = x + 14 + widest(biasLines);
  }

  const left = b.x + GAP + 20;
  const [drain, src, gate] = transistor(b, q1, { x: left, y: 0 }, 'right', true, { x: left + 30, y: 30 }, 'middle');
  b.railTo(drain!);
  b.open = src!;
  b.enter('E', vFront);
  b.sheet.wire(gate!, { x: gate!.x, y: yb });
  bPoints.push({ x: gate!.x, y: yb });
  b.x = Math.max(src!.x, left + 30 + widest([q1.ref, ...deviceName(q1)]) / 2);

  const xe = src!.x + 36;
  let baseAt: Point;
  let xr: number;
  if (foldback && limiter) {
    const raLines = partLines(foldback.ra);
    const { labels } = b.lines(raLines, { x: xe + 14, y: -54 }, 'start');
    const [ra0, ra1] = b.twoPin(twoPinEntry(foldback.ra), { x: xe, y: -20 }, 'up', labels);
    b.sheet.wire({ x: xe, y: 0 }, ra0);
    const xm = xe + 14 + widest(raLines) + 20;
    const rbLines = partLines(foldback.rb);
    const rb = b.lines(rbLines, { x: xm + 14, y: -76 }, 'start');
    const [, rb1] = b.twoPin(twoPinEntry(foldback.rb), { x: xm, y: -110 }, 'down', rb.labels);
    b.ground(rb1);
    xr = Math.max(xm + 14 + widest(rbLines) + 20 + 30, xe + SPAN + 2 * GAP + 20);
    baseAt = { x: xr - 30, y: -110 };
    b.sheet.wire(ra1, { x: xe, y: -110 }, baseAt);
  } else {
    xr = xe + SPAN + 2 * GAP + 20;
    baseAt = { x: xr - 30, y: -50 };
    b.sheet.wire(baseAt, { x: xe, y: -50 }, { x: xe, y: 0 });
  }
  // The sense resistor centred between the emitter tap and the limiter's emitter.
  b.x = (xe + xr) / 2 - SPAN / 2 - GAP - Math.max(0, widest(partLines(rs)) - SPAN) / 2;
  b.series(twoPinEntry(rs), vFront, 'RIN');
  if (limiter) {
    const collector = { x: xr, y: baseAt.y - 30 };
    const [, emitter] = transistor(b, limiter, collector, 'down', false, { x: xr + 14, y: baseAt.y - 4 }, 'start');
    b.sheet.wire(emitter!, { x: xr, y: 0 });
    b.sheet.wire(collector, { x: xr, y: yb });
    bPoints.push({ x: xr, y: yb });
    b.x = Math.max(b.x, xr + 14 + widest([limiter.ref, ...deviceName(limiter)]));
  }
  // The standoff Zener at the right end of net B: cathode on B, anode to the output.
  const kx = b.x + GAP;
  const zLines = partLines(dz);
  const { labels } = b.lines(zLines, { x: kx + SPAN / 2, y: yb + 26 }, 'middle');
  const [anode, cathode] = b.twoPin(twoPinEntry(dz), { x: kx + SPAN, y: yb }, 'left', labels);
  bPoints.push(cathode);
  b.tagged(anode, 'OUT', 'right');
  const xs = bPoints.map((p) => p.x);
  b.sheet.wire({ x: Math.min(...xs), y: yb }, { x: Math.max(...xs), y: yb });
  b.hazard('B', Math.min(vInMax, vFront), { x: Math.min(...xs) + 16, y: yb - 16 });
  b.x = kx + SPAN + 14 + textWidth('OUT') + 20;
}

/** The switcher's set point: its feedback voltage times the divider's ratio (as the SPICE export reads it). */
function stageVolts(option: Option, sw: Component, parts: Component[], fallback: number): number {
  const vFb = option.assumptions[`${sw.ref}.vFb`]?.value;
  const upper = byRole(parts, 'feedback-upper')[0]?.value;
  const lower = byRole(parts, 'feedback-lower')[0]?.value;
  return vFb !== undefined && upper != null && lower ? vFb * (1 + upper / lower) : fallback;
}

/** Lays out the option's design on a board, from the input terminal to the output terminal. */
export function layoutOption(option: Option, rail: RailFigures): Board {
  const b = new Board();
  const vOutMax = Math.max(option.vOutRange.max, rail.vOut);
  b.terminal('in', ['IN', `${volts(rail.vIn.min)} – ${volts(rail.vIn.max)}`]);
  b.open = { x: 0, y: 0 };
  b.enter('IN', rail.vIn.max);
  const parts = option.components;
  const reg = byRole(parts, 'regulator')[0];
  const sw = byRole(parts, 'switch')[0];
  switch (option.topology) {
    case 'shunt':
      shunt(b, option, vOutMax);
      break;
    case 'linear':
      if (reg) linearSection(b, option, reg, section(parts, reg), vOutMax);
      break;
    case 'linear-predrop': {
      for (const c of byRole(parts, 'input-capacitor').slice(1)) b.chain([twoPinEntry(c)]);
      const vz = byRole(parts, 'standoff-zener')[0]?.value ?? rail.vIn.max;
      predropFront(b, option, rail.vIn.max, Math.min(rail.vIn.max, vOutMax + vz));
      if (reg) linearSection(b, option, reg, section(parts, reg), vOutMax);
      break;
    }
    case 'buck':
    case 'boost':
    case 'buck-boost':
      if (sw) switcherSection(b, sw, section(parts, sw), 'OUT', vOutMax, rail.vIn.max);
      break;
    case 'buck+linear':
      if (sw) {
        const stage = section(parts, sw);
        switcherSection(b, sw, stage, 'BUS', stageVolts(option, sw, stage, rail.vIn.max), rail.vIn.max);
      }
      if (reg) linearSection(b, option, reg, section(parts, reg), vOutMax);
      break;
  }
  b.x += GAP + 20;
  const range = `${volts(option.vOutRange.min)} – ${volts(option.vOutRange.max)}`;
  const out = b.terminal('out', ['OUT', `${volts(rail.vOut)} (${range})`, `up to ${formatSi(rail.iMax, 'A', 3)}`]);
  b.railTo(out);
  b.sheet.wire({ x: 0, y: GROUND_Y }, { x: out.x, y: GROUND_Y });
  // The 0 V rail is the circuit's earth: one symbol on it joins it to every local earth symbol.
  b.ground({ x: GAP / 2, y: GROUND_Y });
  b.placeHazards();
  for (const hs of byRole(parts, 'heatsink')) b.heatsink(hs, /for (\S+)$/.exec(hs.part)?.[1] ?? '');
  return b;
}
