// Loss terms of a switching stage beside conduction: switching overlap, output capacitance,
// dead time, gate drive, quiescent current and inductor core loss; Rds(on) at temperature; and
// the discontinuous-conduction duty cycles.
import type { SwitcherClass } from '../catalog.ts';

/** Rds(on) rises about 0.4 %/K in silicon MOSFETs, some +40 % from 25 to 125 °C (common practice). */
export const RDS_TEMPCO_PER_K = 0.004;
/** Body-diode forward drop during dead time (common practice for silicon MOSFETs). */
export const BODY_DIODE_V = 0.7;

/** Rds(on) at junction temperature Tj: Rds25·(1 + α·(Tj − 25)). */
export function rdsAt(rds25: number, tjC: number): number {
  return rds25 * (1 + RDS_TEMPCO_PER_K * Math.max(0, tjC - 25));
}

export interface CycleLosses {
  /** Voltage–current overlap at both edges: ½·V·I·(tr + tf)·fsw. */
  switching: number;
  /** Switch-node capacitance charged and dumped each cycle: ½·Coss·V²·fsw. */
  coss: number;
  /** Body diode conducting through both dead times: Vbody·I·2·tdead·fsw (synchronous stages). */
  deadTime: number;
  /** Gate charge: Qg·Vdrive·fsw per switching transistor. */
  gate: number;
}

/** Losses every switching cycle costs at switch-node voltage vSw and switched current iSw. */
export function cycleLosses(stage: SwitcherClass, vSw: number, iSw: number, fsw: number, switches: number): CycleLosses {
  const sync = stage.rectification === 'sync';
  return {
    switching: 0.5 * vSw * Math.max(0, iSw) * (stage.riseS + stage.fallS) * fsw,
    coss: 0.5 * stage.cossF * vSw * vSw * fsw,
    deadTime: sync ? BODY_DIODE_V * Math.max(0, iSw) * 2 * stage.deadTimeS * fsw : 0,
    gate: stage.qgC * stage.vDriveV * fsw * switches,
  };
}

export function sumCycle(c: CycleLosses): number {
  return c.switching + c.coss + c.deadTime + c.gate;
}

/**
 * Buck in discontinuous conduction: D = M·√(K/(1 − M)) with M = Vout/Vin and K = 2L·fsw/R, R = Vout/Iout
 * (Erickson & Maksimović, Fundamentals of Power Electronics, 2nd ed., ch. 5, buck DCM conversion ratio).
 */
export function buckDcmDuty(vIn: number, vOut: number, iOut: number, fsw: number, henries: number): number {
  const m = Math.min(0.999, vOut / vIn);
  const k = (2 * henries * fsw * iOut) / vOut;
  return Math.min(1, m * Math.sqrt(k / (1 - m)));
}

/**
 * Boost in discontinuous conduction: D = √(K·M·(M − 1)) with M = Vout/Vin
 * (Erickson & Maksimović, 2nd ed., ch. 5, boost DCM conversion ratio).
 */
export function boostDcmDuty(vIn: number, vOut: number, iOut: number, fsw: number, henries: number): number {
  const m = Math.max(1, vOut / vIn);
  const k = (2 * henries * fsw * iOut) / vOut;
  return Math.min(1, Math.sqrt(k * m * (m - 1)));
}

/**
 * Light-load behaviour below the boundary (inductor current under half its ripple): a diode stage
 * runs in DCM; a synchronous burst-mode stage delivers packets of ordinary cycles and sleeps
 * between them; a synchronous forced-PWM stage stays continuous, its current reversing.
 */
export type ConductionMode = 'ccm' | 'dcm' | 'burst';

export function conductionMode(stage: SwitcherClass, iInductor: number, iBoundary: number): ConductionMode {
  if (iInductor >= iBoundary) return 'ccm';
  if (stage.rectification === 'diode') return 'dcm';
  return stage.lightLoad === 'burst' ? 'burst' : 'ccm';
}

/** Share of time a burst-mode stage switches: the load over the boundary load (1 when not bursting). */
export function burstShare(stage: SwitcherClass, iInductor: number, iBoundary: number): number {
  return stage.lightLoad === 'burst' && iInductor < iBoundary && iBoundary > 0 ? iInductor / iBoundary : 1;
}
