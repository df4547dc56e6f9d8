// Which symbol draws each part of a design, by its role and its catalog text.
import type { Component, ComponentRole } from '../engine/types.ts';
import type { ChainEntry } from './board.ts';
import { capacitor, diode, inductor, nMosfet, npn, resistor, type DiodeKind } from './symbols.ts';

const RESISTORS = new Set<ComponentRole>(['series-resistor', 'feedback-lower', 'feedback-upper', 'bias-resistor', 'sense-resistor']);
const CAPACITORS = new Set<ComponentRole>(['input-capacitor', 'output-capacitor', 'bypass-capacitor']);

/** Electrolytic, polymer and tantalum capacitors have a positive terminal. */
export const isPolarised = (c: Component) => /electrolytic|polymer|tantalum/i.test(c.part);

function diodeKind(c: Component): DiodeKind {
  if (c.role === 'zener' || c.role === 'standoff-zener') return 'zener';
  return /schottky/i.test(c.part) ? 'schottky' : 'rectifier';
}

/** The two-pin entry for a resistor, capacitor, inductor or diode (anode first). */
export function twoPinEntry(c: Component, reverse = false): ChainEntry {
  if (RESISTORS.has(c.role)) return { c, draw: (t) => resistor(t, c.quantity), pins: ['1', '2'], reverse };
  if (CAPACITORS.has(c.role)) {
    const polarised = isPolarised(c);
    return { c, draw: (t) => capacitor(t, polarised), pins: polarised ? ['+', '-'] : ['1', '2'], reverse };
  }
  if (c.role === 'inductor') return { c, draw: (t) => inductor(t), pins: ['1', '2'], reverse };
  const kind = diodeKind(c);
  return { c, draw: (t) => diode(t, kind), pins: ['A', 'K'], reverse };
}

/** A three-pin transistor: the symbol and its pin names (first, second, control). */
export function transistorEntry(c: Component): { draw: ChainEntry['draw']; pins: [string, string, string] } {
  if (/\bNPN\b/.test(c.part)) return { draw: (t) => npn(t), pins: ['C', 'E', 'B'] };
  const depletion = /depletion/i.test(c.part);
  return { draw: (t) => nMosfet(t, depletion), pins: ['D', 'S', 'G'] };
}

export function byRole(components: readonly Component[], role: ComponentRole): Component[] {
  return components.filter((c) => c.role === role);
}
