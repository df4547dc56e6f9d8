/**
 * The trade-off of loss against parts cost as plot geometry (browser-safe, pure): both axes on
 * 1-2-5 logarithmic scales, since the ways to build one rail differ by decades in loss.
 */
import type { Option, TopologyId } from '../engine/types';

export type PointKind = 'pick' | 'buildable' | 'blocked';

export interface TradeoffPoint {
  topology: TopologyId;
  kind: PointKind;
  lossW: number;
  costCents: number;
}

export interface LogAxis {
  min: number;
  max: number;
  ticks: number[];
}

export function tradeoffPoints(options: readonly Option[], recommended: TopologyId | null): TradeoffPoint[] {
  return options.map((o) => ({
    topology: o.topology,
    kind: o.topology === recommended ? 'pick' : o.feasible ? 'buildable' : 'blocked',
    lossW: o.dissipation.totalMaxW,
    costCents: o.costCents,
  }));
}

/** A log axis over the positive values with a little room either side and 1-2-5 ticks inside it. */
export function logAxis(values: readonly number[]): LogAxis {
  const positive = values.filter((v) => v > 0 && Number.isFinite(v));
  const lo = positive.length ? Math.min(...positive) : 1;
  const hi = positive.length ? Math.max(...positive) : 1;
  const min = lo / 1.6;
  const max = hi * 1.6;
  return { min, max, ticks: logTicks(min, max) };
}

/** 1-2-5 values from min to max (both > 0), for the ticks of any log axis. */
export function logTicks(min: number, max: number): number[] {
  const ticks: number[] = [];
  for (let decade = Math.floor(Math.log10(min)); decade <= Math.ceil(Math.log10(max)); decade++)
    for (const m of [1, 2, 5]) {
      const t = Number((m * 10 ** decade).toPrecision(1));
      if (t >= min && t <= max) ticks.push(t);
    }
  return ticks;
}

/** Where a value falls on the axis, 0 at its minimum to 1 at its maximum; a value ≤ 0 sits at the minimum. */
export function logPosition(axis: LogAxis, value: number): number {
  const v = Math.max(value, axis.min);
  return Math.log(v / axis.min) / Math.log(axis.max / axis.min);
}

export interface LabelRequest {
  /** The point's centre, px. */
  x: number;
  y: number;
  /** The label's estimated width, px. */
  width: number;
}

export interface Box {
  left: number;
  top: number;
  right: number;
  bottom: number;
}

const LABEL_HEIGHT = 14;
const MARKER_CLEARANCE = 12;

const overlaps = (a: Box, b: Box) => a.left < b.right && b.left < a.right && a.top < b.bottom && b.top < a.bottom;

/**
 * Where each point's label goes, in the order given (put the most important first): right of
 * its point, else left, below or above, whichever first stays inside the plot and clear of every
 * marker and earlier label; else right, stepped down until clear. Returns each label's box.
 */
export function placeLabels(requests: readonly LabelRequest[], plot: Box): Box[] {
  const markers: Box[] = requests.map((r) => ({
    left: r.x - MARKER_CLEARANCE,
    top: r.y - MARKER_CLEARANCE,
    right: r.x + MARKER_CLEARANCE,
    bottom: r.y + MARKER_CLEARANCE,
  }));
  const placed: Box[] = [];
  const at = (left: number, top: number, width: number): Box => ({ left, top, right: left + width, bottom: top + LABEL_HEIGHT });
  const free = (b: Box) =>
    b.left >= plot.left &&
    b.right <= plot.right &&
    b.top >= plot.top &&
    b.bottom <= plot.bottom &&
    ![...markers, ...placed].some((m) => overlaps(m, b));
  for (const r of requests) {
    const gap = MARKER_CLEARANCE + 2;
    const tries = [
      at(r.x + gap, r.y - LABEL_HEIGHT / 2, r.width),
      at(r.x - gap - r.width, r.y - LABEL_HEIGHT / 2, r.width),
      at(r.x - r.width / 2, r.y + gap, r.width),
      at(r.x - r.width / 2, r.y - gap - LABEL_HEIGHT, r.width),
    ];
    let box = tries.find(free);
    if (!box) {
      const left = Math.min(r.x + gap, plot.right - r.width);
      let top = r.y - LABEL_HEIGHT / 2;
      while (!free(at(left, top, r.width)) && top < plot.bottom) top += LABEL_HEIGHT / 2;
      box = at(left, top, r.width);
    }
    placed.push(box);
  }
  return placed;
}
