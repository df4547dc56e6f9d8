// Netlists of the Zener shunt, the linear regulator and the linear regulator with a high-voltage
// pre-drop, built from the design's part list (snapped values) and the catalog's device figures.
import type { Catalog } from '../catalog.ts';
import type { Component, Option } from '../types.ts';
import { byRole, catalogEntry, num, partOf } from './netlist-text.ts';
import { passDeviceLines, senseTransistorLines } from './pass-device.ts';
import { regulatorInputCurrent, regulatorLines, regulatorParts, setpointOf } from './regulator.ts';
import { shuntReferenceLines } from './shunt-reference.ts';
import { zenerModel } from './zener.ts';

export interface SpiceCorner {
  vIn: number;
  iOut: number;
  /** The output shorted to ground through a 0 V source `Vshort` (its current is the short-circuit current) instead of the load. */
  short?: boolean;
}

/** The load on `out`: the corner's current, or a short. */
const load = (corner: SpiceCorner) => (corner.short ? 'Vshort out 0 DC 0' : `Iload out 0 DC ${num(corner.iOut)}`);

/** Series resistor into the rail, held by a Zener or by a precision shunt reference with its divider. */
export function shunt(option: Option, corner: SpiceCorner, catalog: Catalog): string[] {
  const rs = partOf(option, 'series-resistor');
  const dz = byRole(option, 'zener')[0];
  const holder = dz
    ? [`D${dz.ref} 0 out DZ${dz.ref}`, zenerModel(`DZ${dz.ref}`, dz, catalog)]
    : shuntReferenceLines(option, partOf(option, 'regulator'), catalog);
  return [`V1 in 0 DC ${num(corner.vIn)}`, `R${rs.ref} in out ${num(rs.value ?? 0)}`, ...holder, load(corner), '.op'];
}

export function linear(option: Option, corner: SpiceCorner, catalog: Catalog): string[] {
  const reg = partOf(option, 'regulator');
  return [
    `V1 in 0 DC ${num(corner.vIn)}`,
    ...regulatorLines(option, reg.ref, 'in', catalog, corner.iOut, { vIn: corner.vIn, shorted: corner.short === true }),
    load(corner),
    '.op',
  ];
}

/**
 * Current limiter, where the design has one: the sense transistor pulls the pass device's base or
 * gate (`b`) down once the sense resistor's drop (`e` to `rin`) reaches its Vbe. A foldback limiter
 * feeds its base from a divider, RA from `e` and RB to ground — the two bias resistors listed
 * after it (The Art of Electronics, 2nd ed., §6.06, foldback current limiting — from memory).
 */
function currentLimiter(option: Option): { lines: string[]; divider: Option['components'] } {
  const limiter = byRole(option, 'limit-transistor')[0];
  if (!limiter) return { lines: [], divider: [] };
  const [ra, rb] = option.components.slice(option.components.indexOf(limiter)).filter((c) => c.role === 'bias-resistor');
  if (!ra || !rb) return { lines: senseTransistorLines(limiter, 'b', 'e', 'rin'), divider: [] };
  const base = `${limiter.ref}_b`;
  return {
    lines: [
      ...senseTransistorLines(limiter, 'b', base, 'rin'),
      `R${ra.ref} e ${base} ${num(ra.value ?? 0)}`,
      `R${rb.ref} ${base} 0 ${num(rb.value ?? 0)}`,
    ],
    divider: [ra, rb],
  };
}

/** Transconductance parameter of the depletion MOSFET's level-1 card, A/V² (typical of small high-voltage parts, from memory). */
const DEPLETION_KP = 0.05;

/**
 * The depletion MOSFET from the input, gate on `b`, its set resistor from its source to `b`: the
 * card's threshold puts Vgs = −|Vgs| at the nominal current |Vgs|/Rset, iD = KP/2·(vGS − VTO)²
 * (Sedra & Smith, 7th ed., §5.2 — from memory).
 */
function currentSourceLines(m: Component, rset: Component, catalog: Catalog): string[] {
  const dev = catalogEntry(catalog.passDevices, m.part);
  if (!dev) throw new Error(`The catalog has no current source "${m.part}"; the netlist needs its data-sheet figures.`);
  const r = rset.value ?? 1;
  const vto = -dev.vControlV - Math.sqrt((2 * dev.vControlV) / r / DEPLETION_KP);
  return [
    `M${m.ref} in b ${m.ref}_s ${m.ref}_s ND${m.ref}`,
    `.model ND${m.ref} NMOS(LEVEL=1 VTO=${num(vto)} KP=${num(DEPLETION_KP)})`,
    `R${rset.ref} ${m.ref}_s b ${num(r)}`,
  ];
}

/**
 * The pass device from the input to `e`, its base or gate on node `b` held by the standoff Zener
 * above the output and fed through the bias resistor; the sense resistor from `e` to the
 * regulator's input `rin`.
 */
export function predrop(option: Option, corner: SpiceCorner, catalog: Catalog): string[] {
  const q = partOf(option, 'pass-transistor');
  const dz = partOf(option, 'standoff-zener');
  const rs = partOf(option, 'sense-resistor');
  const reg = partOf(option, 'regulator');
  const limiter = currentLimiter(option);
  const rb = byRole(option, 'bias-resistor').find((c) => !limiter.divider.includes(c));
  if (!rb) throw new Error('The linear-predrop design has no bias resistor for its pass device; its netlist cannot be written.');
  // A second limit-transistor is the depletion MOSFET current source; the bias resistor then sets its current.
  const source = byRole(option, 'limit-transistor')[1];
  // Starting point: the Zener in breakdown, the pass device at its control voltage, the regulator
  // at its setpoint; with the output shorted, the regulator saturated at its dropout carrying the
  // limiter's 27 °C short-circuit current.
  const parts = regulatorParts(option, reg.ref, catalog);
  const vc = catalogEntry(catalog.passDevices, q.part)?.vControlV ?? 0;
  const shorted = corner.short === true;
  const iShort = option.trace.find((t) => t.id === 'predrop.ifault.room')?.result.value ?? parts.cls.iLimitA;
  const i = shorted ? iShort : regulatorInputCurrent(parts, corner.iOut);
  const vOut = shorted ? 0 : setpointOf(parts);
  // A low input leaves the base short of the standoff: it cannot rise above the input.
  const base = Math.min(vOut + (dz.value ?? 0), corner.vIn);
  const rin = shorted ? parts.cls.dropoutV : base - vc - i * (rs.value ?? 0);
  const e = rin + i * (rs.value ?? 0);
  // A corner where the regulator would sit below its dropout has no such state to start from.
  const consistent = shorted || rin >= vOut + parts.cls.dropoutV;
  return [
    `V1 in 0 DC ${num(corner.vIn)}`,
    ...passDeviceLines(q, 'in', 'b', 'e', catalog),
    ...(source ? currentSourceLines(source, rb, catalog) : [`R${rb.ref} in b ${num(rb.value ?? 0)}`]),
    `D${dz.ref} out b DZ${dz.ref}`,
    zenerModel(`DZ${dz.ref}`, dz, catalog),
    `R${rs.ref} e rin ${num(rs.value ?? 0)}`,
    ...limiter.lines,
    ...regulatorLines(option, reg.ref, 'rin', catalog, corner.iOut, consistent ? { vIn: rin, shorted, iShort } : undefined),
    ...(consistent ? [`.nodeset V(b)=${num(e + vc)} V(e)=${num(e)} V(rin)=${num(rin)}`] : []),
    load(corner),
    '.op',
  ];
}
