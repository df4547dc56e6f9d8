// SPICE netlist export (ngspice dialect) of a designed option at one operating corner. The linear
// family uses the simulator's own device models (see spice/); the switchers are driven open loop at
// the engine's duty cycle with ideal switches carrying the stage's Rds(on).
import { defaultCatalog, type Catalog } from '../catalog.ts';
import type { Option } from '../types.ts';
import { boostPoint } from '../topologies/boost.ts';
import { buckBoostPoint } from '../topologies/buck-boost.ts';
import { buckPoint } from '../topologies/buck.ts';
import { linear, predrop, shunt, type SpiceCorner } from './linear-family.ts';
import { VT, assumed, byRole, num } from './netlist-text.ts';
import { regulatorInputCurrent, regulatorLines, regulatorParts } from './regulator.ts';

export type { SpiceCorner };

/** Open-loop transient: switching periods simulated and the tail averaged. */
export const BUCK_PERIODS = 300;
export const BUCK_AVERAGE_PERIODS = 50;

/** What every switcher netlist needs: the stage, its assumed figures, the power inductor and output capacitors. */
function switcherParts(option: Option, catalog: Catalog) {
  const sw = byRole(option, 'switch')[0]!;
  const stage = catalog.switchers.find((s) => s.label === sw.part);
  if (!stage) throw new Error(`The catalog has no switcher stage "${sw.part}".`);
  const [l1, l2] = byRole(option, 'inductor');
  const couts = byRole(option, 'output-capacitor');
  const lower = byRole(option, 'feedback-lower')[0]!;
  const upper = byRole(option, 'feedback-upper')[0]!;
  const fsw = assumed(option, `${sw.ref}.fsw`, stage.fswDefaultHz);
  return {
    stage,
    l1: l1!,
    l2,
    couts,
    fsw,
    rds: assumed(option, `${sw.ref}.rdsOn`, stage.rdsOnOhm),
    dcr: assumed(option, `${l1!.ref}.dcr`, 0),
    esr: assumed(option, `${couts[0]!.ref}.esr`, 0),
    henries: l1!.value ?? 0,
    vOut: stage.vFbV * (1 + (upper.value ?? 0) / (lower.value ?? 1)),
    period: 1 / fsw,
    vf: assumed(option, `${byRole(option, 'diode')[0]?.ref ?? 'D1'}.vf`, stage.diodeVfV),
  };
}
type SwitcherParts = ReturnType<typeof switcherParts>;

/** Open loop at the engine's duty cycle; pulse width is measured between the edges' midpoints. */
function gateDrive(net: SwitcherParts, d: number): string {
  const edge = net.period / 200;
  return `Vg g 0 PULSE(0 1 0 ${num(edge)} ${num(edge)} ${num(Math.max(0, d * net.period - edge))} ${num(net.period)})`;
}

/**
 * Each period starts with the on-time, where the inductor current is at its valley: starting there
 * rather than at the average keeps the open-loop LC from ringing through the run.
 */
const valley = (average: number, rippleA: number) => average - rippleA / 2;

const SWITCH_ON_HIGH = (rds: number) => `.model SWHI SW(VT=0.5 VH=0 RON=${num(rds)} ROFF=1e7)`;
const SWITCH_ON_LOW = (rds: number) => `.model SWLO SW(VT=-0.5 VH=0 RON=${num(rds)} ROFF=1e7)`;
const diodeModel = (name: string, iA: number, vf: number) => `.model ${name} D(IS=${num(Math.max(iA, 1e-3) * Math.exp(-vf / VT))} N=1)`;

/** Output capacitor with its ESR at `node`, then the optional LC post-filter; the load connects to `rail`. */
function outputNetwork(option: Option, net: SwitcherParts, node: string, iOut: number): { lines: string[]; rail: string } {
  const c1 = net.couts[0]!;
  // The capacitance left at the working DC bias, where the engine states it.
  const lines = [
    `C${c1.ref} ${node} nc1 ${num(assumed(option, `${c1.ref}.cEff`, c1.value ?? 0))} IC=${num(net.vOut)}`,
    `RESR${c1.ref} nc1 0 ${num(Math.max(net.esr, 1e-6))}`,
  ];
  const c2 = net.couts[1];
  if (!net.l2 || !c2) return { lines, rail: node };
  lines.push(
    `L${net.l2.ref} ${node} nf ${num(net.l2.value ?? 0)} IC=${num(iOut)}`,
    `RL${net.l2.ref} nf rail ${num(assumed(option, `${net.l2.ref}.dcr`, 0.01))}`,
    `C${c2.ref} rail nc2 ${num(c2.value ?? 0)} IC=${num(net.vOut)}`,
    `RESR${c2.ref} nc2 0 ${num(Math.max(assumed(option, `${c2.ref}.esr`, net.esr), 1e-6))}`,
  );
  return { lines, rail: 'rail' };
}

/** The converter's output network, the load on its rail and the transient. */
function loadedOutput(option: Option, net: SwitcherParts, corner: SpiceCorner): string[] {
  const { lines, rail } = outputNetwork(option, net, 'out', corner.iOut);
  return [...lines, `Iload ${rail} 0 DC ${num(corner.iOut)}`, transientLine(net)];
}

const transientLine = (net: SwitcherParts) =>
  `.tran ${num(net.period / 100)} ${num(BUCK_PERIODS * net.period)} 0 ${num(net.period / 100)} uic`;

/** Buck power stage from `in` to the capacitor at `node`, carrying iOut on average. */
function buckStageLines(net: SwitcherParts, vIn: number, iOut: number, node: string): string[] {
  const p = buckPoint({ ...net.stage, rdsOnOhm: net.rds }, vIn, net.vOut, iOut, net.fsw, net.henries, net.dcr);
  const lines = [`V1 in 0 DC ${num(vIn)}`, gateDrive(net, p.d), `S1 in sw g 0 SWHI`, SWITCH_ON_HIGH(net.rds)];
  if (net.stage.rectification === 'sync') lines.push(`S2 sw 0 0 g SWLO`, SWITCH_ON_LOW(net.rds));
  else lines.push(`Dcatch 0 sw DCATCH`, diodeModel('DCATCH', iOut, net.vf));
  lines.push(
    `L${net.l1.ref} sw nl ${num(net.henries)} IC=${num(valley(iOut, p.rippleA))}`,
    `Vsense nl nl2 DC 0`,
    `RL${net.l1.ref} nl2 ${node} ${num(net.dcr)}`,
  );
  return lines;
}

function buck(option: Option, corner: SpiceCorner, catalog: Catalog): string[] {
  const net = switcherParts(option, catalog);
  return [...buckStageLines(net, corner.vIn, corner.iOut, 'out'), ...loadedOutput(option, net, corner)];
}

/** Boost power stage: the inductor from the input to the switch node, a low-side switch, the rectifier to `node`. */
function boostStageLines(net: SwitcherParts, vIn: number, iOut: number, node: string): string[] {
  const p = boostPoint({ ...net.stage, rdsOnOhm: net.rds }, vIn, net.vOut, iOut, net.fsw, net.henries, net.dcr);
  const lines = [
    `V1 in 0 DC ${num(vIn)}`,
    gateDrive(net, p.d),
    `Vsense in nl DC 0`,
    `L${net.l1.ref} nl nl2 ${num(net.henries)} IC=${num(valley(p.inductorA, p.rippleA))}`,
    `RL${net.l1.ref} nl2 sw ${num(net.dcr)}`,
    `S1 sw 0 g 0 SWHI`,
    SWITCH_ON_HIGH(net.rds),
  ];
  if (net.stage.rectification === 'sync') lines.push(`S2 sw ${node} 0 g SWLO`, SWITCH_ON_LOW(net.rds));
  else lines.push(`Drect sw ${node} DRECT`, diodeModel('DRECT', iOut, net.vf));
  return lines;
}

function boost(option: Option, corner: SpiceCorner, catalog: Catalog): string[] {
  const net = switcherParts(option, catalog);
  return [...boostStageLines(net, corner.vIn, corner.iOut, 'out'), ...loadedOutput(option, net, corner)];
}

/**
 * Four-switch buck-boost: S1/S2 are the buck leg from the input to sw1, S3/S4 the boost leg from sw2
 * to `node`, the inductor between. The leg the engine's mode switches follows the gate; the
 * other leg holds its top switch on (gate `on`) and its bottom switch off.
 */
function buckBoostStageLines(net: SwitcherParts, vIn: number, iOut: number, node: string): string[] {
  const p = buckBoostPoint({ ...net.stage, rdsOnOhm: net.rds }, vIn, net.vOut, iOut, net.fsw, net.henries, net.dcr);
  const held = { top: 'on 0 SWHI', bottom: '0 on SWHI' };
  const pwm = { top: 'g 0 SWHI', bottom: '0 g SWLO' };
  // In the transition region both legs switch: the buck leg on its own gate g1 at its duty.
  const transition = p.region === 'transition';
  const buckLeg = transition ? { top: 'g1 0 SWHI', bottom: '0 g1 SWLO' } : p.boost ? held : pwm;
  const boostLeg = p.boost ? { top: pwm.bottom, bottom: pwm.top } : held;
  return [
    `V1 in 0 DC ${num(vIn)}`,
    gateDrive(net, p.d),
    ...(transition ? [gateDrive(net, p.dBuck).replace(/^Vg g /, 'Vg1 g1 ')] : []),
    `Von on 0 DC 1`,
    `S1 in sw1 ${buckLeg.top}`,
    `S2 sw1 0 ${buckLeg.bottom}`,
    `Vsense sw1 nl DC 0`,
    `L${net.l1.ref} nl nl2 ${num(net.henries)} IC=${num(valley(p.il, p.rippleA))}`,
    `RL${net.l1.ref} nl2 sw2 ${num(net.dcr)}`,
    `S3 sw2 0 ${boostLeg.bottom}`,
    `S4 sw2 ${node} ${boostLeg.top}`,
    SWITCH_ON_HIGH(net.rds),
    SWITCH_ON_LOW(net.rds),
  ];
}

function buckBoost(option: Option, corner: SpiceCorner, catalog: Catalog): string[] {
  const net = switcherParts(option, catalog);
  return [...buckBoostStageLines(net, corner.vIn, corner.iOut, 'out'), ...loadedOutput(option, net, corner)];
}

/**
 * The converter that fits the input (buck, boost or four-switch buck-boost) to the intermediate rail
 * `bus`, then the post-regulator from `bus` to `out`. The stage carries the regulator's input
 * current: the load, its divider, adjust-pin and ground-pin currents.
 */
function buckLinear(option: Option, corner: SpiceCorner, catalog: Catalog): string[] {
  const net = switcherParts(option, catalog);
  const reg = byRole(option, 'regulator')[0]!;
  const iBus = regulatorInputCurrent(regulatorParts(option, reg.ref, catalog), corner.iOut);
  const bus = outputNetwork(option, net, 'bus', iBus);
  const stage = { buck: buckStageLines, boost: boostStageLines, 'buck-boost': buckBoostStageLines }[net.stage.converter];
  return [
    ...stage(net, corner.vIn, iBus, 'bus'),
    ...bus.lines,
    ...regulatorLines(option, reg.ref, bus.rail, catalog, corner.iOut),
    `Iload out 0 DC ${num(corner.iOut)}`,
    transientLine(net),
  ];
}

const BODIES: Record<Option['topology'], (option: Option, corner: SpiceCorner, catalog: Catalog) => string[]> = {
  shunt,
  linear,
  'linear-predrop': predrop,
  buck,
  boost,
  'buck-boost': buckBoost,
  'buck+linear': buckLinear,
};

/** The netlist of an option at a corner. */
export function toSpiceNetlist(option: Option, corner: SpiceCorner, catalog: Catalog = defaultCatalog): string {
  const body = BODIES[option.topology](option, corner, catalog);
  return [
    `* ${option.label} at ${num(corner.vIn)} V in, ${num(corner.iOut)} A out (generic models, typical parameters)`,
    ...body,
    '.end',
    '',
  ].join('\n');
}
