// Schematic drawings of a designed option: pure (engine types in, SVG text out), the same in the
// browser, on the server, in the PDF and in the download. Symbols after IEC 60617 (symbols.ts).
import type { Option } from '../engine/types.ts';
import { HAZARD_V } from './board.ts';
import { layoutOption, type RailFigures } from './layouts.ts';
import { boardSvg } from './svg.ts';
import { valueText } from './words.ts';

export type { RailFigures };
export { HAZARD_V };

export interface Schematic {
  svg: string;
  /** Nets as drawn: each the sorted `REF.pin` names its wires join (`GND` for the earth symbols). */
  nets: string[][];
  /** Control pins (feedback, an IC's supply) the power-path comparison with the SPICE export leaves out. */
  signalPins: string[];
  /** Whether a net may exceed the extra-low-voltage limit. */
  hazardous: boolean;
}

/** The brief's figures the terminals print: the input range, the set point and the largest load. */
export function railFiguresOf(spec: { input: { vMin: number; vMax: number }; output: { v: number; iMax: number } }): RailFigures {
  return { vIn: { min: spec.input.vMin, max: spec.input.vMax }, vOut: spec.output.v, iMax: spec.output.iMax };
}

export const HAZARD_NOTE = `Marked nets may exceed ${HAZARD_V} V DC: dangerous voltage. Isolate and discharge before touching; local codes and licensed practice apply.`;

/** The option's circuit drawn; `id` keeps the drawing's title and description ids unique on a page. */
export function drawSchematic(option: Option, rail: RailFigures, id = 'schematic'): Schematic {
  const board = layoutOption(option, rail);
  const hazardous = board.hazardNets.length > 0;
  const parts = option.components.map((c) => [c.ref, c.part, valueText(c)].filter(Boolean).join(', ')).join('; ');
  const svg = boardSvg(board, {
    id,
    title: `Schematic: ${option.label}`,
    desc: `Input ${rail.vIn.min}–${rail.vIn.max} V, output ${rail.vOut} V. Parts: ${parts}.${hazardous ? ` ${HAZARD_NOTE}` : ''}`,
    notes: hazardous ? [HAZARD_NOTE] : [],
  });
  return {
    svg,
    nets: board.sheet.connections(),
    signalPins: board.sheet.pins.filter((p) => p.signal).map((p) => `${p.ref}.${p.name}`),
    hazardous,
  };
}
