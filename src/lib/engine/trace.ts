// Calculation trace: every number a person might question, with its equation and inputs.
import type { Quantity, TraceEntry } from './types.ts';

export type TraceInputs = Record<string, readonly [number, string]>;

export class Trace {
  readonly entries: TraceEntry[] = [];

  /** Records a computed value and returns it, so a calculation reads as one expression. */
  add(id: string, label: string, equation: string, inputs: TraceInputs, value: number, unit: string): number {
    const mapped: Record<string, Quantity> = {};
    for (const [name, [v, u]] of Object.entries(inputs)) mapped[name] = { value: v, unit: u };
    this.entries.push({ id, label, equation, inputs: mapped, result: { value, unit } });
    return value;
  }
}
