// Placement on a left-to-right power path: the rail runs along y = 0 from the input terminal to the
// output terminal, series parts sit on it, shunt parts hang from it to the ground rail at GROUND_Y,
// and integrated circuits are blocks whose pins the layouts wire. Positions come from the order of
// placement and the width of each part's labels, never from per-design coordinates.
import type { Component } from '../engine/types.ts';
import { Sheet, type Label, type Pin, type Point } from './sheet.ts';
import { SPAN, frame, heatsink, terminalMarkup, type Direction } from './symbols.ts';
import { LINE, deviceName, detailText, textWidth, titleOf, valueText } from './words.ts';

export const GROUND_Y = 240;
/** Space between neighbouring columns on the power path. */
export const GAP = 26;
/** Nets above this DC voltage carry the dangerous-voltage mark (the extra-low-voltage limit, IEC 61140 / IEC 60449, from memory). */
export const HAZARD_V = 60;

type Draw = (t: ReturnType<typeof frame>) => string[];

export interface ChainEntry {
  c: Component;
  draw: Draw;
  /** Pin names, first pin first. */
  pins: [string, string];
  /** The symbol's first pin at the bottom (a diode with its cathode up). */
  reverse?: boolean;
}

export interface Box {
  minX: number;
  minY: number;
  maxX: number;
  maxY: number;
}

/** The label lines of a two-pin part: reference, value, make-up and ratings. */
export function partLines(c: Component): string[] {
  const value = valueText(c);
  if (value === null) return [c.ref, ...deviceName(c)];
  return [c.ref, value, detailText(c)].filter((s): s is string => s !== null);
}

export class Board {
  readonly sheet = new Sheet();
  readonly box: Box = { minX: 0, minY: 0, maxX: 0, maxY: GROUND_Y + 20 };
  /** Where a device's heatsink is drawn: beside its labels. */
  readonly heatsinkAt = new Map<string, Point>();
  /** The next free x on the power path. */
  x = 0;
  /** The rail's open end: the last pin placed on it. */
  open: Point = { x: 0, y: 0 };
  /** The highest DC voltage the present rail net carries. */
  volts = 0;
  private marked = new Set<string>();
  readonly hazardNets: string[] = [];
  net = 'IN';

  reach(x: number, y: number): void {
    this.box.minX = Math.min(this.box.minX, x);
    this.box.maxX = Math.max(this.box.maxX, x);
    this.box.minY = Math.min(this.box.minY, y);
    this.box.maxY = Math.max(this.box.maxY, y);
  }

  /** Label lines from `at` downward; the first line bold. Returns the labels and their right edge. */
  lines(texts: string[], at: Point, anchor: Label['anchor'], boldFirst = true): { labels: Label[]; right: number } {
    const labels = texts.map((text, i) => ({
      x: at.x,
      y: at.y + i * LINE,
      text,
      anchor,
      ...(i === 0 && boldFirst ? { weight: 'bold' as const } : {}),
    }));
    let right = at.x;
    for (const l of labels) {
      const w = textWidth(l.text);
      const left = anchor === 'start' ? l.x : anchor === 'middle' ? l.x - w / 2 : l.x - w;
      this.reach(left, l.y - 10);
      this.reach(left + w, l.y + 4);
      right = Math.max(right, left + w);
    }
    return { labels, right };
  }

  /** A two-pin symbol from `a` in direction `dir`, registered with its pins; returns both pin points. */
  twoPin(e: ChainEntry, a: Point, dir: Direction, labels: Label[], flip = false): [Point, Point] {
    const t = frame(a, dir, flip);
    const b = t(SPAN, 0);
    this.reach(Math.min(a.x, b.x) - 14, Math.min(a.y, b.y) - 14);
    this.reach(Math.max(a.x, b.x) + 14, Math.max(a.y, b.y) + 14);
    this.sheet.part({ ref: e.c.ref, markup: e.draw(t), labels, title: titleOf(e.c) }, [
      { ref: e.c.ref, name: e.pins[0], ...a },
      { ref: e.c.ref, name: e.pins[1], ...b },
    ]);
    return [a, b];
  }

  /** A series part on the rail: wired from the open end, its labels below; the rail then carries `volts`. */
  series(e: ChainEntry, volts: number, net: string, extraGap = 0): [Point, Point] {
    const lines = partLines(e.c);
    const width = Math.max(SPAN, ...lines.map((l) => textWidth(l)));
    const left = this.x + GAP + extraGap + (width - SPAN) / 2;
    const mid = left + SPAN / 2;
    const { labels } = this.lines(lines, { x: mid, y: 30 }, 'middle');
    this.heatsinkAt.set(e.c.ref, { x: mid - 12, y: 30 + lines.length * LINE + 6 });
    const [a, b] = e.reverse
      ? this.twoPin(e, { x: left + SPAN, y: 0 }, 'left', labels).reverse()
      : this.twoPin(e, { x: left, y: 0 }, 'right', labels);
    this.railTo(a!);
    this.open = b!;
    this.x = left + width - (width - SPAN) / 2;
    this.enter(net, volts);
    return [a!, b!];
  }

  /** The rail from its open end to `p` (a pin or a point on the path). */
  railTo(p: Point): void {
    this.sheet.wire(this.open, p);
    this.mark(this.open, p);
    this.open = p;
  }

  /** The rail now carries net `net` at up to `volts`. */
  enter(net: string, volts: number): void {
    this.net = net;
    this.volts = volts;
  }

  /** One dangerous-voltage mark per rail net, placed once the drawing is complete (placeHazards). */
  private mark(from: Point, to: Point): void {
    if (from.y !== 0 || to.y !== 0 || to.x - from.x < 30 || this.volts <= HAZARD_V || this.marked.has(this.net)) return;
    this.marked.add(this.net);
    this.hazardNets.push(this.net);
    this.pendingMarks.push({ from, to });
  }
  private readonly pendingMarks: { from: Point; to: Point }[] = [];

  /** Each rail net's mark above the first free spot of its stretch of rail: no wire, pin or label there. */
  placeHazards(): void {
    const half = 13;
    const busy = (x: number, y: number) => {
      const [x0, x1, y0, y1] = [x - half, x + half, y - half, y + half];
      const hitsWire = this.sheet.wires.some((w) =>
        w.slice(1).some((b, i) => {
          const a = w[i]!;
          return Math.max(a.x, b.x) >= x0 && Math.min(a.x, b.x) <= x1 && Math.max(a.y, b.y) >= y0 && Math.min(a.y, b.y) <= y1;
        }),
      );
      const hitsLabel = this.sheet.parts.some((p) =>
        p.labels.some((l) => {
          const w = textWidth(l.text);
          const left = l.anchor === 'start' ? l.x : l.anchor === 'middle' ? l.x - w / 2 : l.x - w;
          return left <= x1 && left + w >= x0 && l.y - 10 <= y1 && l.y + 3 >= y0;
        }),
      );
      return hitsWire || hitsLabel || this.sheet.pins.some((p) => p.x >= x0 && p.x <= x1 && p.y >= y0 && p.y <= y1);
    };
    for (const { from, to } of this.pendingMarks) {
      const y = -18;
      let x = from.x + 16;
      while (x <= to.x - 16 && busy(x, y)) x += 4;
      const at = { x: x <= to.x - 16 ? x : from.x + 16, y };
      this.sheet.hazards.push(at);
      this.reach(at.x - 12, at.y - 12);
    }
  }

  /** The dangerous-voltage mark at `at` when net `net` may exceed HAZARD_V (once a net). */
  hazard(net: string, volts: number, at: Point): void {
    if (volts <= HAZARD_V || this.marked.has(net)) return;
    this.marked.add(net);
    this.hazardNets.push(net);
    this.sheet.hazards.push(at);
    this.reach(at.x - 12, at.y - 12);
  }

  /**
   * A vertical chain of two-pin parts from the rail (at the next column) down to the ground rail,
   * labels to the right; returns the column's x and the midpoints of the wires between parts.
   */
  chain(entries: ChainEntry[], labelSide: 'right' | 'left' = 'right'): { x: number; mids: Point[]; tops: Point[]; bottoms: Point[] } {
    const texts = entries.map((e) => partLines(e.c));
    const labelWidth = Math.max(...texts.flat().map((t) => textWidth(t)));
    const x = this.x + GAP + (labelSide === 'left' ? labelWidth + 14 : 0);
    return this.chainAt(x, entries, labelSide, texts, labelWidth);
  }

  chainAt(
    x: number,
    entries: ChainEntry[],
    labelSide: 'right' | 'left',
    texts = entries.map((e) => partLines(e.c)),
    labelWidth = Math.max(...texts.flat().map((t) => textWidth(t))),
    top = 0,
  ): { x: number; mids: Point[]; tops: Point[]; bottoms: Point[] } {
    const n = entries.length;
    const gap = (GROUND_Y - top - n * SPAN) / (n + 1);
    const mids: Point[] = [];
    const tops: Point[] = [];
    const bottoms: Point[] = [];
    let y = top;
    let from: Point = { x, y: top };
    entries.forEach((e, i) => {
      const start = y + gap;
      const centre = start + SPAN / 2;
      const lx = labelSide === 'right' ? x + 14 : x - 14;
      const { labels } = this.lines(
        texts[i]!,
        { x: lx, y: centre - ((texts[i]!.length - 1) * LINE) / 2 + 4 },
        labelSide === 'right' ? 'start' : 'end',
      );
      this.heatsinkAt.set(e.c.ref, { x: lx, y: centre + ((texts[i]!.length + 1) * LINE) / 2 + 4 });
      const [p1, p2] = e.reverse
        ? this.twoPin(e, { x, y: start + SPAN }, 'up', labels).reverse()
        : this.twoPin(e, { x, y: start }, 'down', labels);
      this.sheet.wire(from, p1!);
      if (i > 0) mids.push({ x, y: Math.round((from.y + p1!.y) / 2) });
      tops.push(p1!);
      bottoms.push(p2!);
      from = p2!;
      y = start + SPAN;
    });
    this.sheet.wire(from, { x, y: GROUND_Y });
    this.x = Math.max(this.x, labelSide === 'right' ? x + 14 + labelWidth : x);
    return { x, mids, tops, bottoms };
  }

  /** A terminal pair: the rail end and its return on the ground rail, labelled on the outer side. */
  terminal(side: 'in' | 'out', lines: string[]): Point {
    const at = { x: this.x, y: 0 };
    const ret = { x: this.x, y: GROUND_Y };
    const ref = side === 'in' ? 'IN' : 'OUT';
    const anchor = side === 'in' ? 'end' : 'start';
    const dx = side === 'in' ? -10 : 10;
    const { labels } = this.lines(lines, { x: at.x + dx, y: -22 }, anchor);
    const back = this.lines(['0 V'], { x: ret.x + dx, y: ret.y + 4 }, anchor, false);
    this.sheet.part(
      {
        ref,
        terminal: true,
        markup: [terminalMarkup(at), terminalMarkup(ret)],
        labels: [...labels, ...back.labels],
        title: lines.join(' '),
      },
      [
        { ref, name: '+', ...at },
        { ref, name: '0V', ...ret },
      ],
    );
    this.sheet.tag(at, ref, side === 'in' ? 'left' : 'right', true);
    this.reach(at.x, at.y);
    return at;
  }

  /** A short stub from `pin` toward `side` ending in a net tag named `name`. */
  tagged(pin: Point, name: string, side: 'up' | 'down' | 'left' | 'right'): void {
    const d = 14;
    const end =
      side === 'left'
        ? { x: pin.x - d, y: pin.y }
        : side === 'right'
          ? { x: pin.x + d, y: pin.y }
          : side === 'up'
            ? { x: pin.x, y: pin.y - d }
            : { x: pin.x, y: pin.y + d };
    this.sheet.wire(pin, end);
    this.sheet.tag(end, name, side);
    const w = textWidth(name) + 16;
    this.reach(
      side === 'left' ? end.x - w : end.x + (side === 'right' ? w : w / 2),
      end.y + (side === 'down' ? 20 : side === 'up' ? -20 : 10),
    );
    this.reach(end.x - (side === 'up' || side === 'down' ? w / 2 : 0), end.y - 10);
  }

  /** A local earth symbol hanging from `at`. */
  ground(at: Point): void {
    this.sheet.ground(at);
    this.reach(at.x + 12, at.y + 22);
  }

  /**
   * An integrated circuit as a rectangle with its pins on the edges (each pin's name inside), its
   * reference and short name above. Returns the pins' points.
   */
  ic(
    c: Component,
    topLeft: Point,
    w: number,
    h: number,
    pins: { name: string; side: 'left' | 'right' | 'top' | 'bottom'; at: number; signal?: boolean }[],
    /** Where the name starts, left-aligned, when a wire rises from the block's top; centred otherwise. */
    headFrom?: number,
  ): Record<string, Point> {
    const points: Record<string, Point> = {};
    const markup = [`<path d="M${topLeft.x} ${topLeft.y} h${w} v${h} h${-w} Z" fill="#ffffff"/>`];
    const pinLabels: Label[] = [];
    const registered: Pin[] = [];
    for (const p of pins) {
      const at =
        p.side === 'left'
          ? { x: topLeft.x, y: topLeft.y + p.at }
          : p.side === 'right'
            ? { x: topLeft.x + w, y: topLeft.y + p.at }
            : p.side === 'top'
              ? { x: topLeft.x + p.at, y: topLeft.y }
              : { x: topLeft.x + p.at, y: topLeft.y + h };
      points[p.name] = at;
      registered.push({ ref: c.ref, name: p.name, ...at, ...(p.signal ? { signal: true } : {}) });
      const inset =
        p.side === 'left'
          ? { x: at.x + 5, y: at.y + 4, anchor: 'start' as const }
          : p.side === 'right'
            ? { x: at.x - 5, y: at.y + 4, anchor: 'end' as const }
            : p.side === 'top'
              ? { x: at.x, y: at.y + 13, anchor: 'middle' as const }
              : { x: at.x, y: at.y - 5, anchor: 'middle' as const };
      pinLabels.push({ x: inset.x, y: inset.y, text: p.name, anchor: inset.anchor, small: true });
    }
    const names = [c.ref, ...deviceName(c)];
    const headTop = topLeft.y - 8 - (names.length - 1) * LINE;
    const head =
      headFrom === undefined
        ? this.lines(names, { x: topLeft.x + w / 2, y: headTop }, 'middle')
        : this.lines(names, { x: headFrom, y: headTop }, 'start');
    // A heatsink goes above the name, so the pins and their wires below stay clear.
    this.heatsinkAt.set(c.ref, { x: topLeft.x + w / 2 - 40, y: headTop - 30 });
    this.reach(topLeft.x, topLeft.y);
    this.reach(topLeft.x + w, topLeft.y + h);
    this.sheet.part({ ref: c.ref, markup, labels: [...head.labels, ...pinLabels], title: titleOf(c) }, registered);
    return points;
  }

  /** A heatsink drawn beside the device it cools, with its reference and thermal resistance. */
  heatsink(c: Component, device: string): void {
    const at = this.heatsinkAt.get(device) ?? { x: this.box.minX + 20, y: GROUND_Y + 40 };
    const body = { x: at.x, y: at.y + 10 };
    const { labels } = this.lines(
      [c.ref, valueText(c)].filter((s): s is string => s !== null),
      { x: at.x + 34, y: at.y + 4 },
      'start',
    );
    this.reach(at.x - 2, at.y - 2);
    this.sheet.part({ ref: c.ref, markup: heatsink(body), labels, title: titleOf(c) }, []);
  }
}
