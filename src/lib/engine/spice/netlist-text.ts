// Small helpers shared by every netlist body: number formatting and reading an option's parts.
import type { Component, Option } from '../types.ts';

/** Thermal voltage at 27 °C, the simulator's default temperature. */
export const VT = 0.025865;

/** Nine significant figures, without trailing zeros: the simulator reads plain decimal or exponent form. */
export const num = (x: number) => Number(x.toPrecision(9)).toString();

export function byRole(option: Option, role: Component['role']): Component[] {
  return option.components.filter((c) => c.role === role);
}

/** The first part of a role; a design without it cannot be described. */
export function partOf(option: Option, role: Component['role']): Component {
  const part = byRole(option, role)[0];
  if (!part) throw new Error(`The ${option.topology} design has no ${role}; its netlist cannot be written.`);
  return part;
}

export function assumed(option: Option, key: string, fallback: number): number {
  return option.assumptions[key]?.value ?? fallback;
}

/**
 * The catalog entry a part was chosen from: its label, or the longest label the part's text starts
 * with (a design may add how the part is fitted, such as ", on an insulating pad").
 */
export function catalogEntry<T extends { label: string }>(entries: readonly T[], part: string): T | undefined {
  return entries.filter((e) => part === e.label || part.startsWith(`${e.label},`)).sort((a, b) => b.label.length - a.label.length)[0];
}
