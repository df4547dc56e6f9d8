// Symbol shapes after IEC 60617 (the IEC's graphical symbols for diagrams): rectangular resistor,
// parallel-plate capacitor (one hollow plate and "+" where polarised), semicircle-winding inductor,
// triangle-and-bar diodes with the breakdown (Zener) and Schottky bar forms, MOSFET with broken
// (enhancement) or solid (depletion) channel, bipolar transistor without envelope, rectangle for an
// integrated circuit, the earth symbol and open-circle terminals. One symbol set, used everywhere.
import type { Point } from './sheet.ts';

export type Direction = 'right' | 'down' | 'left' | 'up';

/** A two-pin symbol spans this many units from pin to pin. */
export const SPAN = 60;

/**
 * Local frame: u runs from the first pin toward the second, v across it (v > 0 is below a
 * rightward symbol); `flip` mirrors v, for a transistor whose control pin faces the other side.
 */
export function frame(at: Point, dir: Direction, flip = false) {
  const s = flip ? -1 : 1;
  return (u: number, v: number): Point => {
    const w = v * s;
    if (dir === 'right') return { x: at.x + u, y: at.y + w };
    if (dir === 'left') return { x: at.x - u, y: at.y - w };
    if (dir === 'down') return { x: at.x - w, y: at.y + u };
    return { x: at.x + w, y: at.y - u };
  };
}
type Frame = ReturnType<typeof frame>;

const f = (n: number) => String(Math.round(n * 10) / 10);
const xy = (p: Point) => `${f(p.x)} ${f(p.y)}`;

/** A polyline path through the frame's points. */
export function line(t: Frame, ...uv: [number, number][]): string {
  return `<path d="M${uv.map(([u, v]) => xy(t(u, v))).join(' L')}"/>`;
}

function polygon(t: Frame, filled: boolean, ...uv: [number, number][]): string {
  return `<path d="M${uv.map(([u, v]) => xy(t(u, v))).join(' L')} Z"${filled ? ' fill="#1e2329"' : ''}/>`;
}

/** IEC 60617 S00555: a rectangle; a string of equal resistors as that many rectangles in series. */
export function resistor(t: Frame, count = 1): string[] {
  const shown = Math.min(count, 3);
  const start = 12;
  const gap = shown > 1 ? 4 : 0;
  const each = (SPAN - 2 * start - gap * (shown - 1)) / shown;
  const out = [line(t, [0, 0], [start, 0]), line(t, [SPAN - start, 0], [SPAN, 0])];
  for (let i = 0; i < shown; i++) {
    const a = start + i * (each + gap);
    out.push(polygon(t, false, [a, -6], [a + each, -6], [a + each, 6], [a, 6]));
    if (i > 0) out.push(line(t, [a - gap, 0], [a, 0]));
  }
  return out;
}

/** IEC 60617 S00567 / S00571: two plates; a polarised part's positive plate (first pin) hollow, marked "+". */
export function capacitor(t: Frame, polarised: boolean): string[] {
  const out = [line(t, [0, 0], [26, 0]), line(t, [34, 0], [SPAN, 0]), line(t, [34, -12], [34, 12])];
  if (!polarised) return [...out, line(t, [26, -12], [26, 12])];
  const plus = t(19, 13);
  return [
    ...out,
    polygon(t, false, [23, -12], [27, -12], [27, 12], [23, 12]),
    `<path d="M${f(plus.x - 3.5)} ${f(plus.y)} h7 M${f(plus.x)} ${f(plus.y - 3.5)} v7" stroke-width="1.4"/>`,
  ];
}

/** IEC 60617 S00583: four semicircular windings. */
export function inductor(t: Frame): string[] {
  const humps = [14, 22, 30, 38].map((u) => `A4 4 0 0 1 ${xy(t(u + 8, 0))}`).join(' ');
  return [`<path d="M${xy(t(0, 0))} L${xy(t(14, 0))} ${humps} L${xy(t(SPAN, 0))}"/>`];
}

export type DiodeKind = 'rectifier' | 'zener' | 'schottky';

/** IEC 60617 S00641 (and S00646 breakdown, S00649 Schottky bar forms): anode at the first pin. */
export function diode(t: Frame, kind: DiodeKind): string[] {
  const out = [line(t, [0, 0], [21, 0]), line(t, [39, 0], [SPAN, 0]), polygon(t, true, [21, -10], [21, 10], [39, 0])];
  if (kind === 'zener') return [...out, line(t, [35, -12], [39, -10], [39, 10], [43, 12])];
  if (kind === 'schottky') return [...out, line(t, [43, -7], [43, -10], [39, -10], [39, 10], [35, 10], [35, 7])];
  return [...out, line(t, [39, -10], [39, 10])];
}

/** An adjustable shunt reference: a breakdown diode (cathode first) with its reference lead at (30, 26). */
export function shuntReference(t: Frame): string[] {
  return [...diode(t, 'zener'), line(t, [30, 5], [30, 26])];
}

/**
 * IEC 60617 S00626 (N-channel, enhancement: broken channel; depletion: solid): drain at the first
 * pin, source at the second, gate at (30, 30); the substrate arrow points into the channel.
 */
export function nMosfet(t: Frame, depletion: boolean): string[] {
  const channel = depletion
    ? [line(t, [16, 12], [44, 12])]
    : [line(t, [16, 12], [24, 12]), line(t, [26, 12], [34, 12]), line(t, [36, 12], [44, 12])];
  return [
    ...channel,
    line(t, [0, 0], [20, 0], [20, 12]),
    line(t, [SPAN, 0], [40, 0], [40, 12]),
    line(t, [30, 12], [30, 0], [40, 0]),
    polygon(t, true, [30, 11], [27, 4], [33, 4]),
    line(t, [16, 20], [44, 20]),
    line(t, [30, 20], [30, 30]),
  ];
}

/** IEC 60617 S00633 (NPN, no envelope): collector at the first pin, emitter at the second, base at (30, 30). */
export function npn(t: Frame): string[] {
  return [
    line(t, [15, 12], [45, 12]),
    line(t, [30, 12], [30, 30]),
    line(t, [0, 0], [18, 0], [24, 12]),
    line(t, [SPAN, 0], [42, 0], [36, 12]),
    polygon(t, true, [42, 0], [36.5, 3.2], [40.2, 6]),
  ];
}

/** A finned heatsink beside its device (a drawing aid: no electrical pins). */
export function heatsink(at: Point): string[] {
  const fins = [0, 8, 16, 24].map((dx) => `M${f(at.x + dx)} ${f(at.y)} v-10`).join(' ');
  return [`<path d="M${f(at.x - 2)} ${f(at.y)} h28 ${fins}" stroke-width="1.6"/>`];
}

/** IEC 60617 S00200, earth (ground), hanging below `at`. */
export function groundMarkup(at: Point): string {
  return `<path d="M${xy(at)} v10 M${f(at.x - 10)} ${f(at.y + 10)} h20 M${f(at.x - 6)} ${f(at.y + 14)} h12 M${f(at.x - 2)} ${f(at.y + 18)} h4"/>`;
}

/** IEC 60617 S00017: an open-circle terminal. */
export function terminalMarkup(at: Point): string {
  return `<circle cx="${f(at.x)}" cy="${f(at.y)}" r="4.5" fill="#ffffff"/>`;
}

/** IEC 60417-5036, dangerous voltage: a triangle with a lightning flash, centred on `at`. */
export function hazardMarkup(at: Point): string {
  const { x, y } = at;
  return [
    `<path d="M${f(x)} ${f(y - 11)} L${f(x + 11)} ${f(y + 8)} L${f(x - 11)} ${f(y + 8)} Z" fill="#fcf4e2" stroke="#8a5a00" stroke-width="1.6"/>`,
    `<path d="M${f(x + 1.5)} ${f(y - 5)} L${f(x - 2.5)} ${f(y + 1.5)} L${f(x + 1)} ${f(y + 1)} L${f(x - 1.5)} ${f(y + 6.5)} L${f(x + 3)} ${f(y - 0.5)} L${f(x - 0.5)} ${f(y)} Z" fill="#1e2329" stroke="none"/>`,
  ].join('');
}
