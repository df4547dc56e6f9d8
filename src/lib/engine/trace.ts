// Calculation trace: every number a person might question, with its equation and inputs.
import type { Quantity, TraceEntry } from './types.ts';

export type TraceInputs = Record<string, readonly [number, string]>;

export class Trace {
  readonly entries: TraceEntry[] = [];

  /**
   * Records a value computed by a closed formula and returns it, so a calculation reads as one
   * expression. The equation's right-hand side, over the named inputs, must give the value.
   */
  add(id: string, label: string, equation: string, inputs: TraceInputs, value: number, unit: string): number {
    return this.push('formula', id, label, equation, inputs, value, unit);
  }

  /** Records a value that is not a closed formula of its inputs: a minimum over corners, a search, a table look-up. */
  select(id: string, label: string, equation: string, inputs: TraceInputs, value: number, unit: string): number {
    return this.push('selection', id, label, equation, inputs, value, unit);
  }

  private push(
    kind: TraceEntry['kind'],
    id: string,
    label: string,
    equation: string,
    inputs: TraceInputs,
    value: number,
    unit: string,
  ): number {
    const mapped: Record<string, Quantity> = {};
    // for…in visits own keys in the order Object.entries would, without the pairs it allocates.
    for (const name in inputs) {
      const q = inputs[name]!;
      mapped[name] = { value: q[0], unit: q[1] };
    }
    this.entries.push({ id, label, kind, equation, inputs: mapped, result: { value, unit } });
    return value;
  }
}
