// A three-terminal regulator as a small macro model: the reference as a source with the class's
// value, an error amplifier with finite gain whose output is limited by the input rail, and a real
// pass device (Darlington NPN follower, or a PMOS for the low-dropout class) with the class's
// current limit. The output setting, load regulation, dropout and short-circuit current come out of
// the simulated circuit, not out of the engine's equation.
// Structure: Horowitz & Hill, The Art of Electronics, 3rd ed., §9.3 (three-terminal and low-dropout
// regulators — from memory); finite-gain feedback: Sedra & Smith, Microelectronic Circuits, 7th ed.,
// §2.2 and §11.1 (closed-loop error 1/(1 + Aβ) — from memory).
import type { Catalog, LinearRegulatorClass } from '../catalog.ts';
import type { Component, Option } from '../types.ts';
import { VT, assumed, catalogEntry, num } from './netlist-text.ts';

/**
 * Error amplifier: a transconductance into R‖C, 80 dB of DC gain with its dominant pole at 160 Hz
 * (1.6 MHz gain-bandwidth), typical of integrated regulators (from memory). The pole gives the
 * transient a state to start from, where a memoryless high-gain loop would not converge; with a
 * slower amplifier the low-dropout loop rings against its output capacitor inside the ESR window.
 */
const ERROR_GM = 1e-3;
const ERROR_R = 1e7;
const ERROR_C = 1e-10;
export const ERROR_GAIN = ERROR_GM * ERROR_R;
/** Darlington pass device: output transistor Vbe at the class's rated current, driver Vbe at its share (typical, from memory). */
const VBE_PASS_V = 0.8;
const VBE_DRIVER_V = 0.7;
const BF_PASS = 30;
const BF_DRIVER = 50;
/** PMOS pass device of the low-dropout class: threshold and the gate drive its amplifier can give (typical, from memory). */
const PMOS_THRESHOLD_V = 1;
const PMOS_DRIVE_V = 5;

export interface RegulatorParts {
  cls: LinearRegulatorClass;
  /** Divider: R1 across the reference (floating class) or from FB to ground; R2 the other leg. */
  lower: Component | undefined;
  upper: Component | undefined;
}

/** The regulator's class and its divider: the feedback resistors listed after it (a switcher's come before). */
export function regulatorParts(option: Option, regRef: string, catalog: Catalog): RegulatorParts {
  const at = option.components.findIndex((c) => c.ref === regRef);
  const reg = option.components[at];
  const cls = reg ? catalogEntry(catalog.linearRegulators, reg.part) : undefined;
  if (!reg || !cls)
    throw new Error(`The catalog has no regulator class "${reg?.part ?? regRef}"; the netlist needs its data-sheet figures.`);
  const after = option.components.slice(at);
  return { cls, lower: after.find((c) => c.role === 'feedback-lower'), upper: after.find((c) => c.role === 'feedback-upper') };
}

/** Current the regulator draws from its input at load iOut: the load, the divider, adjust-pin and ground-pin currents. */
export function regulatorInputCurrent(parts: RegulatorParts, iOut: number): number {
  const { cls, lower } = parts;
  return iOut + (lower ? cls.vRefV / (lower.value ?? 1) : 0) + cls.iAdjTypA + cls.iqA;
}

interface PassStage {
  lines: string[];
  /** The amplifier output that carries `i` through the pass device: where a transient starts it. */
  driveAt(i: number): number;
  /** The pass stage's internal nodes carrying `i` from an input at vIn to an output at vOut, as `.nodeset` terms. */
  guess(i: number, vIn: number, vOut: number): string[];
}

/** Darlington follower from `inNode` to `out`, driven from `<u>_d`; the amplifier's output stage stops `headroom` below the input. */
function darlington(u: string, inNode: string, cls: LinearRegulatorClass): PassStage {
  const iDriver = cls.iOutMaxA / (BF_PASS + 1);
  // The class's dropout at its rated current is the amplifier's headroom plus the two Vbe.
  const headroom = Math.max(0, cls.dropoutV - VBE_PASS_V - VBE_DRIVER_V);
  const above = `min(max(V(${u}_a), 0), max(V(${inNode}) - V(out) - ${num(headroom)}, 0))`;
  const driveAt = (i: number) => VBE_PASS_V + VBE_DRIVER_V + 2 * VT * Math.log(Math.max(i, 1e-6) / cls.iOutMaxA);
  return {
    lines: [
      // The output stage rides on OUT; it sits between the input and the base, so the base current comes from the input.
      `B${u}ea ${u}_d ${inNode} V = V(out) + ${above} - V(${inNode})`,
      `Q${u}d ${inNode} ${u}_d ${u}_e QD${u}`,
      `Q${u}p ${inNode} ${u}_e ${u}_o QP${u}`,
      `.model QD${u} NPN(BF=${BF_DRIVER} IS=${num(iDriver * Math.exp(-VBE_DRIVER_V / VT))})`,
      `.model QP${u} NPN(BF=${BF_PASS} IS=${num(cls.iOutMaxA * Math.exp(-VBE_PASS_V / VT))})`,
    ],
    driveAt,
    guess: (i, _vIn, vOut) => [
      `V(${u}_d)=${num(vOut + driveAt(i))}`,
      `V(${u}_e)=${num(vOut + VBE_PASS_V + VT * Math.log(Math.max(i, 1e-6) / cls.iOutMaxA))}`,
    ],
  };
}

/**
 * PMOS pass device (source at the input) whose gate the amplifier pulls down by at most the drive
 * or the whole input; KP so that full drive carries the rated current at the class's dropout
 * (triode region, iD = KP·((vGS − Vt)·vDS − vDS²/2): Sedra & Smith, 7th ed., §5.2 — from memory).
 */
function pmosPass(u: string, inNode: string, cls: LinearRegulatorClass): PassStage {
  const vov = PMOS_DRIVE_V - PMOS_THRESHOLD_V;
  const kp = cls.iOutMaxA / (vov * cls.dropoutV - (cls.dropoutV * cls.dropoutV) / 2);
  const driveAt = (i: number) => PMOS_THRESHOLD_V + Math.sqrt((2 * Math.max(i, 0)) / kp);
  return {
    lines: [
      `B${u}ea ${u}_g ${inNode} V = -min(max(V(${u}_a), 0), min(max(V(${inNode}), 0), ${PMOS_DRIVE_V}))`,
      `M${u}p ${u}_o ${u}_g ${inNode} ${inNode} PM${u}`,
      `.model PM${u} PMOS(LEVEL=1 VTO=${-PMOS_THRESHOLD_V} KP=${num(kp)})`,
    ],
    driveAt,
    guess: (i, vIn) => [`V(${u}_g)=${num(vIn - driveAt(i))}`],
  };
}

/**
 * Current limit: the pass device's current, sensed by a 0 V source between its output `<u>_o`
 * and OUT, pulls the amplifier's node down once it passes the class's limit, with a
 * transconductance that overwhelms the amplifier's largest error current (gm × its input) within
 * a fraction of a milliampere: a behavioural stand-in for the sense resistor and transistor of an
 * integrated regulator (Horowitz & Hill, The Art of Electronics, 3rd ed., §9.3 — from memory).
 */
const LIMIT_GAIN = 10;

function currentLimitLines(u: string, cls: LinearRegulatorClass): string[] {
  return [`V${u}lim ${u}_o out DC 0`, `B${u}lim ${u}_a 0 I = ${LIMIT_GAIN}*max(i(V${u}lim) - ${num(cls.iLimitA)}, 0)`];
}

/** The amplifier's gain stage: node `<u>_a` carries gain × (V(plus) − V(minus)) after the pole; it starts at `start`. */
export function errorAmplifier(u: string, plus: string, minus: string, start: number): string[] {
  return [
    `G${u}ea 0 ${u}_a ${plus} ${minus} ${num(ERROR_GM)}`,
    `R${u}ea ${u}_a 0 ${num(ERROR_R)}`,
    `C${u}ea ${u}_a 0 ${num(ERROR_C)} IC=${num(start)}`,
  ];
}

/** The output the divider sets (the class's own value for a preset class). */
export function setpointOf({ cls, lower, upper }: RegulatorParts): number {
  return lower && upper && cls.kind !== 'fixed' ? cls.vRefV * (1 + (upper.value ?? 0) / (lower.value ?? 1)) : cls.vRefV;
}

/**
 * The regulator's output capacitor (the first listed after it) with its ESR, in series with the
 * resistor the design adds where the class needs more ESR. A transient starts it at the divider's
 * setpoint; the simulation then settles to its own output.
 */
function outputCapacitorLines(option: Option, regRef: string, parts: RegulatorParts): string[] {
  const after = option.components.slice(option.components.findIndex((c) => c.ref === regRef));
  const cout = after.find((c) => c.role === 'output-capacitor');
  if (!cout) return [];
  const extra = after.find((c) => c.role === 'series-resistor')?.value ?? 0;
  const setpoint = setpointOf(parts);
  return [
    `C${cout.ref} out ${cout.ref}_esr ${num(assumed(option, `${cout.ref}.cEff`, cout.value ?? 0))} IC=${num(setpoint)}`,
    `RESR${cout.ref} ${cout.ref}_esr 0 ${num(Math.max(assumed(option, `${cout.ref}.esr`, 0) + extra, 1e-3))}`,
  ];
}

/**
 * Where the operating-point search starts (ngspice `.nodeset`): the regulator at the state the
 * engine expects, its input at vIn. A high-gain loop started from all nodes at zero otherwise
 * needs the simulator's gmin or source stepping to find its way; the answer does not depend on it.
 */
export interface RegulatorGuess {
  vIn: number;
  /** The output shorted, carrying iShort (the class's current limit unless a limiter ahead of it holds less). */
  shorted: boolean;
  iShort?: number;
}

/**
 * The regulator `regRef` fed from `inNode`, its output on node `out`, its divider and pin currents.
 * `iOut` is the corner's load, where a transient starts the amplifier; `guess` adds the starting point of a DC operating point.
 */
export function regulatorLines(
  option: Option,
  regRef: string,
  inNode: string,
  catalog: Catalog,
  iOut: number,
  guess?: RegulatorGuess,
): string[] {
  const parts = regulatorParts(option, regRef, catalog);
  const { cls, lower, upper } = parts;
  const u = regRef;
  const divided = cls.kind !== 'fixed' && lower !== undefined && upper !== undefined;
  const pass = cls.kind === 'ldo' && divided ? pmosPass(u, inNode, cls) : darlington(u, inNode, cls);
  const start = pass.driveAt(regulatorInputCurrent(parts, iOut) - cls.iqA);
  const lines: string[] = [];
  if (divided && cls.kind === 'adjustable') {
    // Floating reference from ADJ to the sense node; R1 from OUT to ADJ, R2 from ADJ to ground; the adjust-pin current into R2.
    lines.push(
      `V${u}ref ${u}_r adj DC ${num(cls.vRefV)}`,
      ...errorAmplifier(u, `${u}_r`, 'out', start),
      ...pass.lines,
      `I${u}adj ${inNode} adj DC ${num(cls.iAdjTypA)}`,
      `R${lower.ref} out adj ${num(lower.value ?? 0)}`,
      `R${upper.ref} adj 0 ${num(upper.value ?? 0)}`,
    );
  } else if (divided) {
    // Ground-referenced feedback: R2 from OUT to FB, R1 from FB to ground; the FB pin's bias current out of the divider.
    lines.push(
      `V${u}ref ${u}_r 0 DC ${num(cls.vRefV)}`,
      ...errorAmplifier(u, `${u}_r`, 'adj', start),
      ...pass.lines,
      `I${u}fb adj 0 DC ${num(cls.iAdjTypA)}`,
      `R${upper.ref} out adj ${num(upper.value ?? 0)}`,
      `R${lower.ref} adj 0 ${num(lower.value ?? 0)}`,
    );
  } else {
    // Preset output: the internal divider senses OUT against the class's output value.
    lines.push(`V${u}ref ${u}_r 0 DC ${num(cls.vRefV)}`, ...errorAmplifier(u, `${u}_r`, 'out', start), ...pass.lines);
  }
  if (cls.iqA > 0) lines.push(`I${u}q ${inNode} 0 DC ${num(cls.iqA)}`);
  lines.push(...currentLimitLines(u, cls));
  if (guess) {
    // Shorted at the limit, the pass current sits above it by the amplifier's full error current over the limit's gain.
    const i = guess.shorted
      ? (guess.iShort ?? cls.iLimitA + (ERROR_GM * cls.vRefV) / LIMIT_GAIN)
      : regulatorInputCurrent(parts, iOut) - cls.iqA;
    const vOut = guess.shorted ? 0 : setpointOf(parts);
    // The divider's tap: a reference below OUT (floating) or at the reference (ground-referenced); shorted, what the adjust-pin current lifts it.
    const r1 = lower?.value ?? 0;
    const r2 = upper?.value ?? 0;
    const tap = guess.shorted
      ? cls.kind === 'adjustable'
        ? (cls.iAdjTypA * r1 * r2) / Math.max(r1 + r2, 1e-9)
        : 0
      : cls.kind === 'adjustable'
        ? vOut - cls.vRefV
        : cls.vRefV;
    const adj = divided ? [`V(adj)=${num(tap)}`] : [];
    lines.push(
      ['.nodeset', `V(out)=${num(vOut)}`, ...adj, `V(${u}_a)=${num(pass.driveAt(i))}`, ...pass.guess(i, guess.vIn, vOut)].join(' '),
    );
  }
  return [...lines, ...outputCapacitorLines(option, regRef, parts)];
}
