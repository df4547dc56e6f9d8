// Reads an ngspice netlist written by the engine back into nets of the design's parts, so a
// drawing's wiring can be compared with what the simulator is given. Element syntax: ngspice
// manual, chapter 3 (element cards: node counts per element letter) — from memory.
import type { Option } from '~/lib/engine/index.ts';

/** Nodes each element letter takes before its value or model (a controlled source's controlling pair included). */
const NODES: Record<string, number> = { R: 2, C: 2, L: 2, D: 2, I: 2, V: 2, B: 2, Q: 3, M: 4, S: 4, G: 4 };
/** Element-name prefixes the engine puts before a part's reference (longest first). */
const PREFIXES = ['RESR', 'RL', 'R', 'C', 'L', 'D', 'Q', 'M', 'V', 'G', 'B', 'I'];

/**
 * The part an element belongs to: the source and load are the terminals; the switcher's ideal
 * switches and gate drive belong to its switch IC, its rectifier element to the diode part; other
 * elements carry the part's reference after their letter (RR1, RESRC2, QU1d, VU1ref …).
 */
function ownerOf(name: string, option: Option, refs: string[]): string | null {
  if (name === 'V1') return 'IN';
  if (name === 'Iload' || name === 'Vshort') return 'OUT';
  if (/^(S\d|Vg|Von)/.test(name)) return option.components.find((c) => c.role === 'switch')?.ref ?? null;
  if (name === 'Dcatch' || name === 'Drect') return option.components.find((c) => c.role === 'diode')?.ref ?? null;
  for (const p of PREFIXES) {
    if (!name.startsWith(p)) continue;
    const rest = name.slice(p.length);
    const ref = refs.find((r) => rest.startsWith(r) && !/^\d/.test(rest.slice(r.length)));
    if (ref) return ref;
  }
  return null;
}

/** Nets as sets of owners ("IN", "OUT", "GND" and part references), each with two owners or more, sorted. */
export function spiceNets(netlist: string, option: Option): string[][] {
  const refs = option.components.map((c) => c.ref).sort((a, b) => b.length - a.length);
  const cards = netlist
    .split('\n')
    .map((l) => l.trim())
    .filter((l) => l && !l.startsWith('*') && !l.startsWith('.'))
    .map((l) => l.split(/\s+/));
  const own = new Set(cards.map(([name]) => ownerOf(name!, option, refs)));
  // The netlist folds the series resistor a regulator's output capacitor needs into that capacitor's ESR element.
  const esr = option.components.find((c) => c.role === 'series-resistor' && !own.has(c.ref));
  const regulator = option.components.findIndex((c) => c.role === 'regulator');
  const esrOf = option.components.slice(regulator).find((c) => c.role === 'output-capacitor');
  const parent = new Map<string, string>();
  const find = (a: string): string => {
    const p = parent.get(a) ?? a;
    return p === a ? a : find(p);
  };
  const owners = new Map<string, Set<string>>();
  for (const [name, ...rest] of cards) {
    const nodes = rest.slice(0, NODES[name![0]!] ?? 0);
    if (name === 'Vsense') {
      // A 0 V source measuring a current: a wire.
      parent.set(find(nodes[0]!), find(nodes[1]!));
      continue;
    }
    let owner = ownerOf(name!, option, refs);
    if (owner === null) throw new Error(`No part owns the netlist element ${name}.`);
    if (esr && esrOf && name === `RESR${esrOf.ref}`) owner = esr.ref;
    // The behavioural error amplifier and limiter are referred to the simulator's ground: no pin.
    const internal = /(ea|lim)$/.test(name!);
    for (const n of nodes) {
      if (n === '0' && internal) continue;
      const set = owners.get(n) ?? new Set<string>();
      set.add(owner);
      owners.set(n, set);
    }
  }
  owners.get('0')?.add('GND');
  const merged = new Map<string, Set<string>>();
  for (const [node, set] of owners) {
    const root = find(node);
    const into = merged.get(root) ?? new Set<string>();
    for (const o of set) into.add(o);
    merged.set(root, into);
  }
  return normalise([...merged.values()].map((s) => [...s]));
}

/** Nets with two owners or more, each sorted, the list sorted. */
export function normalise(nets: string[][]): string[][] {
  return nets
    .map((n) => [...new Set(n)].sort())
    .filter((n) => n.length >= 2)
    .map((n) => n.join(' '))
    .sort()
    .map((n) => n.split(' '));
}
