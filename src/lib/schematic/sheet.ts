// The drawing as data: placed symbols with their pins, wires, net tags and ground symbols. The
// layouts write to a Sheet; the SVG writer reads it; `connections()` reads back which pins the
// drawn wires join, from the geometry alone, so what a reader sees is what is checked.

export interface Point {
  x: number;
  y: number;
}

export interface Pin extends Point {
  ref: string;
  name: string;
  /** A control pin (feedback, IC supply) the power-path check leaves out. */
  signal?: boolean;
}

export interface Label {
  x: number;
  y: number;
  text: string;
  anchor: 'start' | 'middle' | 'end';
  weight?: 'bold';
  /** Pin names inside a block: the smaller size. */
  small?: boolean;
}

export interface PlacedPart {
  ref: string;
  /** Symbol markup in sheet coordinates (paths, circles). */
  markup: string[];
  labels: Label[];
  title: string;
  /** An input or output terminal pair rather than a part of the design. */
  terminal?: boolean;
}

/** A named net tag: every tag of one name belongs to one net, as if wired. */
export interface Tag extends Point {
  name: string;
  /** Which way the tag points from its wire end. */
  side: 'up' | 'down' | 'left' | 'right';
  /** A terminal's own name: joins like a tag, drawn as the terminal. */
  hidden?: boolean;
}

export class Sheet {
  readonly parts: PlacedPart[] = [];
  readonly pins: Pin[] = [];
  readonly wires: Point[][] = [];
  readonly tags: Tag[] = [];
  /** Ground symbols, each hanging below its point. */
  readonly grounds: Point[] = [];
  readonly hazards: Point[] = [];
  readonly notes: Label[] = [];

  part(p: PlacedPart, pins: Pin[]): void {
    this.parts.push(p);
    this.pins.push(...pins);
  }

  wire(...points: Point[]): void {
    if (points.length >= 2) this.wires.push(points);
  }

  tag(at: Point, name: string, side: Tag['side'], hidden = false): void {
    this.tags.push({ ...at, name, side, ...(hidden ? { hidden } : {}) });
  }

  ground(at: Point): void {
    this.grounds.push(at);
  }

  /** Junction dots: where three or more wire ends and pins meet, or a wire ends on another's run. */
  junctions(): Point[] {
    const ends = this.wires.flatMap((w) => [w[0]!, w[w.length - 1]!]);
    const count = new Map<string, { p: Point; n: number }>();
    for (const p of [...ends, ...this.pins]) {
      const k = key(p);
      const c = count.get(k) ?? { p, n: 0 };
      c.n += 1;
      count.set(k, c);
    }
    for (const p of ends) {
      const c = count.get(key(p))!;
      if (this.wires.some((w) => segmentsOf(w).some(([a, b]) => inside(p, a, b)))) c.n += 2;
    }
    return [...count.values()].filter((c) => c.n >= 3).map((c) => c.p);
  }

  /**
   * Nets as the drawing shows them: each a sorted list of `REF.pin` names (and `GND` for the ground
   * symbols). Wire ends and pins join a wire when they lie on it; crossings without an end join nothing.
   */
  connections(): string[][] {
    const points: (Point & { id: string })[] = [
      ...this.pins.map((p) => ({ ...p, id: `${p.ref}.${p.name}` })),
      ...this.grounds.map((p) => ({ ...p, id: 'GND' })),
      ...this.tags.map((p) => ({ ...p, id: `tag:${p.name}` })),
    ];
    const parent = new Map<string, string>();
    const find = (a: string): string => {
      const p = parent.get(a) ?? a;
      if (p === a) return a;
      const root = find(p);
      parent.set(a, root);
      return root;
    };
    const union = (a: string, b: string) => parent.set(find(a), find(b));
    const wireIds = this.wires.map((_, i) => `wire:${i}`);
    const onWire = (p: Point) => this.wires.flatMap((w, i) => (segmentsOf(w).some(([a, b]) => onSegment(p, a, b)) ? [wireIds[i]!] : []));
    const at = new Map<string, string>();
    for (const p of points) {
      for (const w of onWire(p)) union(p.id, w);
      // A symbol placed on a pin (an earth on a resistor's end) joins it without a wire.
      const here = at.get(key(p));
      if (here) union(p.id, here);
      else at.set(key(p), p.id);
    }
    this.wires.forEach((w, i) => {
      for (const end of [w[0]!, w[w.length - 1]!]) for (const other of onWire(end)) union(wireIds[i]!, other);
    });
    // Every ground symbol shares the id GND, and every tag of one name its tag id: one net each.
    const nets = new Map<string, Set<string>>();
    for (const p of points) {
      const root = find(p.id);
      const set = nets.get(root) ?? new Set<string>();
      if (!p.id.startsWith('tag:')) set.add(p.id);
      nets.set(root, set);
    }
    return [...nets.values()]
      .map((s) => [...s].sort())
      .filter((n) => n.length > 0)
      .sort((a, b) => a[0]!.localeCompare(b[0]!));
  }
}

const key = (p: Point) => `${p.x},${p.y}`;

function segmentsOf(w: Point[]): [Point, Point][] {
  return w.slice(1).map((p, i) => [w[i]!, p]);
}

/** On the segment, ends included; the layouts draw only horizontal and vertical runs. */
function onSegment(p: Point, a: Point, b: Point): boolean {
  if (a.x === b.x) return p.x === a.x && p.y >= Math.min(a.y, b.y) && p.y <= Math.max(a.y, b.y);
  if (a.y === b.y) return p.y === a.y && p.x >= Math.min(a.x, b.x) && p.x <= Math.max(a.x, b.x);
  return false;
}

/** Strictly between the ends. */
function inside(p: Point, a: Point, b: Point): boolean {
  return onSegment(p, a, b) && key(p) !== key(a) && key(p) !== key(b);
}
