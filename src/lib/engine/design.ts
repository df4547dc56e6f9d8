// What every topology designer hands to the common assembly step (corners, ratings, thermal,
// tolerance, cautions, scoring): the parts, an operating-point model and an output model.
import type { Catalog } from './catalog.ts';
import type { Component, ComponentRole, Fix, Issue, Quantity, TopologyId } from './types.ts';
import type { ThermalPart } from './thermal.ts';
import type { ToleranceModel } from './tolerance.ts';
import type { Trace } from './trace.ts';

export interface PartStress {
  w: number;
  v: number;
}

export interface OperatingPoint {
  /** False where the circuit cannot regulate at this input and load (dropout, duty limit). */
  readonly regulates: boolean;
  readonly pInW: number;
  readonly pOutW: number;
  readonly stress: Record<string, PartStress>;
}

/**
 * An operating point whose part stresses are worked out on first reading: the charts' many points
 * need only the powers, the corners need the stresses too.
 */
class PointWithLazyStress implements OperatingPoint {
  private worked: Record<string, PartStress> | null = null;
  constructor(
    readonly regulates: boolean,
    readonly pInW: number,
    readonly pOutW: number,
    private readonly work: () => Record<string, PartStress>,
  ) {}
  get stress(): Record<string, PartStress> {
    this.worked ??= this.work();
    return this.worked;
  }
}

export function operatingPoint(regulates: boolean, pInW: number, pOutW: number, stress: () => Record<string, PartStress>): OperatingPoint {
  return new PointWithLazyStress(regulates, pInW, pOutW, stress);
}

export interface DesignPart extends Component {
  /** Resistor ratings (power, limiting voltage, series strings) come from the worst stresses. */
  rateAsResistor: boolean;
  thermal: (ThermalPart & { protectedInFault: boolean }) | null;
}

export type { Fix };

export interface Design {
  topology: TopologyId;
  label: string;
  parts: DesignPart[];
  issues: Issue[];
  trace: Trace;
  operate(vIn: number, iOut: number): OperatingPoint;
  /** Output shorted to ground at the highest input. */
  fault: OperatingPoint;
  output: ToleranceModel;
  rippleVpp: number;
  /** Typical device parameters the figures rest on (editable assumptions; used by the SPICE export). */
  assumptions: Record<string, Quantity>;
  /** For each remaining blocker that a known change clears. */
  fixes?: Fix[];
}

/** Hands out reference designators R1, R2, C1… in order, so composed designs never clash. */
export class Refs {
  private readonly counters = new Map<string, number>();
  next(prefix: string): string {
    const n = (this.counters.get(prefix) ?? 0) + 1;
    this.counters.set(prefix, n);
    return `${prefix}${n}`;
  }
}

interface PartInit {
  ref: string;
  role: ComponentRole;
  part: string;
  value?: number | null;
  unit?: string | null;
  ratingW?: number | null;
  ratingV?: number | null;
  tolerance?: number | null;
  costCents?: number;
  rateAsResistor?: boolean;
  thermal?: DesignPart['thermal'];
}

export function makePart(init: PartInit): DesignPart {
  return {
    ref: init.ref,
    role: init.role,
    value: init.value ?? null,
    unit: init.unit ?? null,
    ratingW: init.ratingW ?? null,
    ratingV: init.ratingV ?? null,
    tolerance: init.tolerance ?? null,
    part: init.part,
    quantity: 1,
    costCents: init.costCents ?? 0,
    rateAsResistor: init.rateAsResistor ?? false,
    thermal: init.thermal ?? null,
  };
}

/** gradeCents: a precision grade's extra cost per resistor, added to the power rating's price. */
/** Price of one resistor of this power rating (the largest on the list past its end). */
export function resistorCents(catalog: Catalog, ratingW: number): number {
  const rows = catalog.costs.resistorCentsByW;
  return (rows.find((r) => r.w >= ratingW) ?? rows[rows.length - 1]!).cents;
}

export function resistorPart(
  ref: string,
  role: ComponentRole,
  ohms: number,
  tolerance: number,
  series: string,
  gradeCents = 0,
): DesignPart {
  return makePart({
    ref,
    role,
    part: `Resistor, ${series}, ${Number((tolerance * 100).toPrecision(3))} %`,
    value: ohms,
    unit: 'Ω',
    tolerance,
    costCents: gradeCents,
    rateAsResistor: true,
  });
}

export function blocker(code: string, message: string): Issue {
  return { code, severity: 'blocker', message };
}
export function caution(code: string, message: string): Issue {
  return { code, severity: 'caution', message };
}
export function info(code: string, message: string): Issue {
  return { code, severity: 'info', message };
}

/** Guards a divisor so an impossible case stays finite (the caller reports it as an issue). */
export function atLeast(value: number, floor: number): number {
  return Number.isFinite(value) && value > floor ? value : floor;
}
