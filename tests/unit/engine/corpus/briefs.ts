// Ordinary supply briefs a consultancy sees, with the topologies an experienced power engineer
// would accept for each and why. Sources: "common practice" marks a fact of the trade; "from
// memory" a recalled figure; a named text where one states the rule.
import type { NoiseClass, RailSpecInput } from '~/lib/engine/rail-spec.ts';
import type { TopologyId } from '~/lib/engine/types.ts';

export const corpusFamilies = ['usb-adapter', 'battery', 'bus', 'quiet', 'precision', 'step-up', 'high-voltage', 'light-load'] as const;
export type CorpusFamily = (typeof corpusFamilies)[number];

export interface CorpusBrief {
  id: string;
  family: CorpusFamily;
  spec: RailSpecInput;
  /** Topologies a competent engineer would accept as the recommendation. */
  accept: readonly TopologyId[];
  why: string;
}

interface Rail {
  /** Input: lowest, nominal, highest, V. */
  vin: readonly [number, number, number];
  ripple?: number;
  source: 'battery' | 'adapter' | 'rectified' | 'bus';
  vout: number;
  tol?: number;
  /** Load: lowest, typical, highest, A. */
  load: readonly [number, number, number];
  noise?: NoiseClass;
  /** Ripple limit, V p-p, where the load states one tighter than its class's default. */
  maxRipple?: number;
  ambient?: number;
  airflow?: 'enclosed' | 'still-air' | 'forced-air';
}

function rail(r: Rail): RailSpecInput {
  return {
    input: { vMin: r.vin[0], vNom: r.vin[1], vMax: r.vin[2], rippleVpp: r.ripple ?? 0, source: r.source },
    output: { v: r.vout, tolerance: r.tol ?? 0.05, iMin: r.load[0], iTyp: r.load[1], iMax: r.load[2] },
    noise: { class: r.noise ?? 'digital', ...(r.maxRipple !== undefined ? { maxRippleVpp: r.maxRipple } : {}) },
    thermal: { ambientMaxC: r.ambient ?? 40, airflow: r.airflow ?? 'still-air' },
  };
}

// Input ranges used again and again (common practice unless marked).
/** USB 2.0 VBUS at a high-power port, 4.75–5.25 V (USB 2.0 specification, DC electrical characteristics table, from memory). */
const USB = [4.75, 5, 5.25] as const;
/** A single Li-ion cell from cut-off to full charge (common practice). */
const LI_ION = [3.0, 3.7, 4.2] as const;
/** Two alkaline AA cells from end of life to fresh (common practice). */
const TWO_AA = [1.8, 2.4, 3.2] as const;
/** A 12 V vehicle system in normal running, 9–16 V (ISO 16750-2 supply ranges, from memory). */
const VEHICLE_12 = [9, 13.5, 16] as const;
/** A 24 V vehicle system in normal running, 18–32 V (ISO 16750-2, from memory). */
const VEHICLE_24 = [18, 27, 32] as const;
/** Rectified and smoothed 230 V mains with tolerance, about 300–360 V (common practice). */
const MAINS_230 = [300, 325, 360] as const;
/** A 9 V alkaline battery from end of life to fresh (common practice). */
const NINE_VOLT = [6, 9, 9.6] as const;
/** Three alkaline AA cells from end of life to fresh (common practice). */
const THREE_AA = [2.7, 3.6, 4.8] as const;
/** A powered device's input behind a PoE link, 37–57 V (IEEE 802.3af/at PD input range, from memory). */
const POE = [37, 48, 57] as const;
/** A nominal 12 V solar panel from dim light under load to open circuit on a cold day, about 10–22 V (common practice). */
const SOLAR_12 = [10, 17, 22] as const;
/** A 110 V railway battery, 0.7–1.25 × nominal in steady state (EN 50155 supply range, from memory). */
const RAIL_110 = [77, 110, 137.5] as const;

const LDO_SMALL = 'common practice: a small LDO dissipates well under 1 W here; a switcher saves too little to pay for its parts and noise';
const BUCK_LOSS = 'common practice: a linear regulator would burn several watts here; a buck converter is the standard answer';
const BOOST_ONLY = 'common practice: the output is above every input, a boost converter is the simplest stage that steps up';
const STRADDLE = 'common practice: the input spans the output, only a buck-boost (four-switch or SEPIC) regulates over the whole range';
const QUIET_LINEAR = 'common practice: a linear regulator has no switching ripple, and its loss is small at this load';
const QUIET_HYBRID =
  'common practice: the loss rules out a linear regulator alone; a switcher followed by an LDO post-regulator meets the ripple limit';
const PREDROP =
  'common practice: the differential exceeds any three-terminal regulator; a high-voltage transistor pre-drop ahead of the regulator, sized for the short, carries it';
const TINY =
  'common practice: at milliwatts a linear regulator (or a Zener shunt) is the cheapest, smallest answer; a switcher saves almost nothing';

export const CORPUS: readonly CorpusBrief[] = [
  // USB and adapter rails to logic voltages.
  {
    id: 'usb-3v3-150ma',
    family: 'usb-adapter',
    spec: rail({ vin: USB, ripple: 0.05, source: 'adapter', vout: 3.3, load: [0.01, 0.08, 0.15] }),
    accept: ['linear', 'buck'],
    why: LDO_SMALL,
  },
  {
    id: 'usb-3v3-500ma',
    family: 'usb-adapter',
    spec: rail({ vin: USB, ripple: 0.05, source: 'adapter', vout: 3.3, load: [0.02, 0.3, 0.5] }),
    accept: ['linear', 'buck', 'buck+linear'],
    why: 'common practice: about 1 W in an LDO is acceptable with copper area; a buck is also usual',
  },
  {
    id: 'usb-1v8-300ma',
    family: 'usb-adapter',
    spec: rail({ vin: USB, ripple: 0.05, source: 'adapter', vout: 1.8, load: [0.01, 0.15, 0.3] }),
    accept: ['buck', 'linear'],
    why: 'common practice: about 1 W in an LDO is tolerable; a low-voltage buck is the efficient choice',
  },
  {
    id: 'usb-1v2-1a',
    family: 'usb-adapter',
    spec: rail({ vin: USB, ripple: 0.05, source: 'adapter', vout: 1.2, load: [0.05, 0.6, 1] }),
    accept: ['buck'],
    why: BUCK_LOSS,
  },
  {
    id: 'usb-3v3-1a',
    family: 'usb-adapter',
    spec: rail({ vin: USB, ripple: 0.05, source: 'adapter', vout: 3.3, load: [0.05, 0.5, 1] }),
    accept: ['buck', 'buck+linear'],
    why: 'common practice: 2 W in an LDO needs a heatsink on a USB gadget; a buck is usual',
  },
  {
    id: 'adapter12-5v-500ma',
    family: 'usb-adapter',
    spec: rail({ vin: [11.4, 12, 12.6], ripple: 0.1, source: 'adapter', vout: 5, load: [0.02, 0.3, 0.5] }),
    accept: ['buck'],
    why: BUCK_LOSS,
  },
  {
    id: 'adapter12-3v3-100ma',
    family: 'usb-adapter',
    spec: rail({ vin: [11.4, 12, 12.6], ripple: 0.1, source: 'adapter', vout: 3.3, load: [0.005, 0.05, 0.1] }),
    accept: ['linear', 'buck'],
    why: 'common practice: under 1 W in an LDO in a SOT-223 is fine; a small buck is also usual',
  },
  {
    id: 'adapter9-5v-200ma',
    family: 'usb-adapter',
    spec: rail({ vin: [8.5, 9, 9.5], ripple: 0.1, source: 'adapter', vout: 5, load: [0.01, 0.1, 0.2] }),
    accept: ['linear', 'buck'],
    why: 'common practice: under 1 W in a linear regulator; a buck is also usual',
  },
  {
    id: 'adapter12-1v8-1a5',
    family: 'usb-adapter',
    spec: rail({ vin: [11.4, 12, 12.6], ripple: 0.1, source: 'adapter', vout: 1.8, load: [0.05, 1, 1.5] }),
    accept: ['buck'],
    why: BUCK_LOSS,
  },
  {
    id: 'adapter19-5v-2a',
    family: 'usb-adapter',
    spec: rail({ vin: [18, 19, 20], ripple: 0.2, source: 'adapter', vout: 5, load: [0.05, 1, 2] }),
    accept: ['buck'],
    why: BUCK_LOSS,
  },
  {
    id: 'usbpd20-3v3-3a',
    family: 'usb-adapter',
    spec: rail({ vin: [19, 20, 21], ripple: 0.2, source: 'adapter', vout: 3.3, load: [0.1, 2, 3] }),
    accept: ['buck'],
    why: BUCK_LOSS,
  },
  {
    id: 'adapter24-12v-1a',
    family: 'usb-adapter',
    spec: rail({ vin: [22.8, 24, 25.2], ripple: 0.2, source: 'adapter', vout: 12, load: [0.05, 0.6, 1] }),
    accept: ['buck'],
    why: BUCK_LOSS,
  },

  // Li-ion and 2×AA batteries: step-down, step-up, straddling.
  {
    id: 'liion-3v3-300ma',
    family: 'battery',
    spec: rail({ vin: LI_ION, source: 'battery', vout: 3.3, load: [0.001, 0.1, 0.3] }),
    accept: ['buck-boost'],
    why: STRADDLE,
  },
  {
    id: 'liion-1v8-200ma',
    family: 'battery',
    spec: rail({ vin: LI_ION, source: 'battery', vout: 1.8, load: [0.001, 0.1, 0.2] }),
    accept: ['buck', 'linear'],
    why: 'common practice: a buck doubles battery life over an LDO at this load; an LDO is still acceptable for cost',
  },
  {
    id: 'liion-1v2-500ma',
    family: 'battery',
    spec: rail({ vin: LI_ION, source: 'battery', vout: 1.2, load: [0.005, 0.2, 0.5] }),
    accept: ['buck'],
    why: 'common practice: a linear regulator would waste two thirds of the battery',
  },
  {
    id: 'liion-5v-1a',
    family: 'battery',
    spec: rail({ vin: LI_ION, source: 'battery', vout: 5, load: [0.01, 0.5, 1] }),
    accept: ['boost'],
    why: BOOST_ONLY,
  },
  {
    id: 'liion-12v-200ma',
    family: 'battery',
    spec: rail({ vin: LI_ION, source: 'battery', vout: 12, load: [0.005, 0.1, 0.2] }),
    accept: ['boost'],
    why: BOOST_ONLY,
  },
  {
    id: 'liion-3v3-50ma-sensor',
    family: 'battery',
    spec: rail({ vin: LI_ION, source: 'battery', vout: 3.3, load: [0.001, 0.02, 0.05], noise: 'sensor' }),
    accept: ['buck-boost', 'buck+linear'],
    why: 'common practice: the input straddles the output; a buck-boost, with an LDO after it where the ripple demands',
  },
  {
    id: 'liion-3v0-100ma',
    family: 'battery',
    spec: rail({ vin: [3.4, 3.7, 4.2], source: 'battery', vout: 3.0, load: [0.001, 0.05, 0.1] }),
    accept: ['linear', 'buck'],
    why: 'common practice: a low-dropout regulator needs under 0.2 V at 100 mA; cheapest and quiet',
  },
  {
    id: '2aa-3v3-100ma',
    family: 'battery',
    spec: rail({ vin: TWO_AA, source: 'battery', vout: 3.3, load: [0.001, 0.05, 0.1] }),
    accept: ['boost', 'buck-boost'],
    why: 'common practice: two cells sit below 3.3 V for their whole life; a boost (or a buck-boost) is standard',
  },
  {
    id: '2aa-5v-200ma',
    family: 'battery',
    spec: rail({ vin: TWO_AA, source: 'battery', vout: 5, load: [0.001, 0.1, 0.2] }),
    accept: ['boost'],
    why: BOOST_ONLY,
  },
  {
    id: '2aa-1v8-50ma',
    family: 'battery',
    spec: rail({ vin: [2.1, 2.6, 3.2], source: 'battery', vout: 1.8, load: [0.001, 0.02, 0.05] }),
    accept: ['linear', 'buck'],
    why: 'common practice: an LDO with 0.3 V headroom at 50 mA; a low-voltage buck for longer life',
  },
  {
    id: '2aa-1v2-100ma',
    family: 'battery',
    spec: rail({ vin: [2.5, 2.8, 3.2], source: 'battery', vout: 1.2, load: [0.001, 0.05, 0.1] }),
    accept: ['buck', 'linear'],
    why: 'common practice: a low-voltage synchronous buck; an LDO is acceptable at this load',
  },
  {
    id: '2aa-1v8-20ma',
    family: 'battery',
    spec: rail({ vin: [2.0, 2.6, 3.2], source: 'battery', vout: 1.8, load: [0.001, 0.01, 0.02] }),
    accept: ['linear', 'buck'],
    why: "common practice: an LDO until the cells sag near 2 V; a low-voltage buck that runs from 1.8 V (100 % duty in dropout) for the cells' whole life",
  },
  {
    id: '4aa-3v3-100ma',
    family: 'battery',
    spec: rail({ vin: [3.6, 5, 6.4], source: 'battery', vout: 3.3, load: [0.001, 0.05, 0.1] }),
    accept: ['linear', 'buck'],
    why: 'common practice: a PMOS LDO drops about 0.1 V at 0.1 A, well inside the 0.3 V left at end of life; a buck only for longer life',
  },
  {
    id: 'liion-3v0-50ua-sensor',
    family: 'battery',
    spec: rail({ vin: [3.2, 3.7, 4.2], source: 'battery', vout: 3.0, tol: 0.03, load: [0.000005, 0.00002, 0.00005], noise: 'sensor' }),
    accept: ['linear'],
    why: "common practice: a µA-quiescent LDO; at 50 µA its dropout is a few tens of mV and a switcher's own draw would exceed the load",
  },
  {
    id: '2s-liion-5v-1a',
    family: 'battery',
    spec: rail({ vin: [6, 7.4, 8.4], source: 'battery', vout: 5, load: [0.01, 0.5, 1] }),
    accept: ['buck'],
    why: BUCK_LOSS,
  },
  {
    id: '2s-liion-3v3-2a',
    family: 'battery',
    spec: rail({ vin: [6, 7.4, 8.4], source: 'battery', vout: 3.3, load: [0.01, 1, 2] }),
    accept: ['buck'],
    why: BUCK_LOSS,
  },

  // 12/24/48 V buses and vehicle inputs to logic voltages.
  {
    id: 'bus12-5v-50ma',
    family: 'bus',
    spec: rail({ vin: [10.8, 12, 13.2], ripple: 0.1, source: 'bus', vout: 5, load: [0.005, 0.03, 0.05] }),
    accept: ['linear', 'buck'],
    why: 'common practice: 0.4 W in an LDO; a buck is also usual',
  },
  {
    id: 'bus12-3v3-1a',
    family: 'bus',
    spec: rail({ vin: [10.8, 12, 13.2], ripple: 0.1, source: 'bus', vout: 3.3, load: [0.02, 0.5, 1] }),
    accept: ['buck'],
    why: BUCK_LOSS,
  },
  {
    id: 'bus12-1v0-3a',
    family: 'bus',
    spec: rail({ vin: [10.8, 12, 13.2], ripple: 0.1, source: 'bus', vout: 1.0, load: [0.1, 2, 3] }),
    accept: ['buck'],
    why: BUCK_LOSS,
  },
  {
    id: 'bus12-1v2-1a',
    family: 'bus',
    spec: rail({ vin: [10.8, 12, 13.2], ripple: 0.1, source: 'bus', vout: 1.2, load: [0.02, 0.5, 1] }),
    accept: ['buck'],
    why: BUCK_LOSS,
  },
  {
    id: 'bus24-5v-100ma',
    family: 'bus',
    spec: rail({ vin: [20, 24, 28], ripple: 0.2, source: 'bus', vout: 5, load: [0.005, 0.05, 0.1] }),
    accept: ['buck', 'linear'],
    why: 'common practice: 2.3 W worst in an LDO needs copper or a small heatsink; a small buck is the usual choice',
  },
  {
    id: 'bus24-3v3-500ma',
    family: 'bus',
    spec: rail({ vin: [20, 24, 28], ripple: 0.2, source: 'bus', vout: 3.3, load: [0.01, 0.3, 0.5] }),
    accept: ['buck'],
    why: BUCK_LOSS,
  },
  {
    id: 'bus24-1v8-2a',
    family: 'bus',
    spec: rail({ vin: [20, 24, 28], ripple: 0.2, source: 'bus', vout: 1.8, load: [0.05, 1, 2] }),
    accept: ['buck'],
    why: BUCK_LOSS,
  },
  {
    id: 'bus24-1v2-300ma',
    family: 'bus',
    spec: rail({ vin: [20, 24, 28], ripple: 0.2, source: 'bus', vout: 1.2, load: [0.01, 0.2, 0.3] }),
    accept: ['buck', 'buck+linear'],
    why: 'common practice: a buck at a frequency low enough for its minimum on-time, or two stages',
  },
  {
    id: 'bus48-5v-200ma',
    family: 'bus',
    spec: rail({ vin: [36, 48, 60], ripple: 0.5, source: 'bus', vout: 5, load: [0.005, 0.1, 0.2] }),
    accept: ['buck'],
    why: BUCK_LOSS,
  },
  {
    id: 'bus48-3v3-1a',
    family: 'bus',
    spec: rail({ vin: [36, 48, 60], ripple: 0.5, source: 'bus', vout: 3.3, load: [0.02, 0.5, 1] }),
    accept: ['buck'],
    why: BUCK_LOSS,
  },
  {
    id: 'bus48-12v-500ma',
    family: 'bus',
    spec: rail({ vin: [36, 48, 60], ripple: 0.5, source: 'bus', vout: 12, load: [0.01, 0.3, 0.5] }),
    accept: ['buck'],
    why: BUCK_LOSS,
  },
  {
    id: 'vehicle12-5v-500ma',
    family: 'bus',
    spec: rail({ vin: VEHICLE_12, ripple: 0.5, source: 'bus', vout: 5, load: [0.01, 0.3, 0.5], ambient: 70, airflow: 'enclosed' }),
    accept: ['buck'],
    why: BUCK_LOSS,
  },
  {
    id: 'vehicle12-3v3-100ma',
    family: 'bus',
    spec: rail({ vin: VEHICLE_12, ripple: 0.5, source: 'bus', vout: 3.3, load: [0.005, 0.05, 0.1], ambient: 70, airflow: 'enclosed' }),
    accept: ['linear', 'buck'],
    why: 'common practice: 1.3 W worst in an LDO is borderline at 70 °C; a buck is also usual',
  },
  {
    id: 'vehicle24-5v-1a',
    family: 'bus',
    spec: rail({ vin: VEHICLE_24, ripple: 0.5, source: 'bus', vout: 5, load: [0.02, 0.5, 1], ambient: 70, airflow: 'enclosed' }),
    accept: ['buck'],
    why: BUCK_LOSS,
  },
  {
    id: 'vehicle24-1v8-200ma',
    family: 'bus',
    spec: rail({ vin: VEHICLE_24, ripple: 0.5, source: 'bus', vout: 1.8, load: [0.005, 0.1, 0.2], ambient: 70, airflow: 'enclosed' }),
    accept: ['buck'],
    why: BUCK_LOSS,
  },
  {
    id: 'bus24-9-36v-12v-500ma',
    family: 'bus',
    spec: rail({ vin: [9, 24, 36], ripple: 0.5, source: 'bus', vout: 12, load: [0.01, 0.25, 0.5] }),
    accept: ['buck-boost', 'buck+linear'],
    why: 'common practice: a 9–36 V industrial input straddles 12 V; a four-switch buck-boost rated for the whole range with derating (a 60 V controller with external MOSFETs)',
  },
  {
    id: 'bus48-1v0-2a',
    family: 'bus',
    spec: rail({ vin: [40, 48, 56], source: 'bus', vout: 1.0, tol: 0.03, load: [0.1, 1, 2], ambient: 50, airflow: 'enclosed' }),
    accept: ['buck'],
    why: 'common practice: a 100 V-rated synchronous buck with a sub-volt feedback reference, run slow enough for its minimum on-time (or a two-stage design); a linear stage would burn about 110 W',
  },
  {
    id: 'liion-3v3-2pct-200ma-sensor',
    family: 'battery',
    spec: rail({
      vin: LI_ION,
      source: 'battery',
      vout: 3.3,
      tol: 0.02,
      load: [0.001, 0.05, 0.2],
      noise: 'sensor',
      ambient: 50,
      airflow: 'enclosed',
    }),
    accept: ['buck-boost', 'buck+linear'],
    why: STRADDLE,
  },

  // Quiet analog and RF rails.
  {
    id: 'quiet-usb-3v3-rf-50ma',
    family: 'quiet',
    spec: rail({ vin: USB, ripple: 0.05, source: 'adapter', vout: 3.3, load: [0.005, 0.03, 0.05], noise: 'rf' }),
    accept: ['linear'],
    why: QUIET_LINEAR,
  },
  {
    id: 'quiet-12-5v-sensor-100ma',
    family: 'quiet',
    spec: rail({ vin: [11.4, 12, 12.6], ripple: 0.1, source: 'adapter', vout: 5, load: [0.01, 0.05, 0.1], noise: 'sensor' }),
    accept: ['linear', 'buck+linear', 'buck'],
    why: 'common practice: a linear regulator is quietest at 0.8 W loss; a buck meeting a 10 mV ripple limit suits most sensor loads',
  },
  {
    id: 'quiet-12-3v3-rf-500ma',
    family: 'quiet',
    spec: rail({ vin: [11.4, 12, 12.6], ripple: 0.1, source: 'adapter', vout: 3.3, load: [0.02, 0.3, 0.5], noise: 'rf' }),
    accept: ['buck+linear'],
    why: QUIET_HYBRID,
  },
  {
    id: 'quiet-24-5v-precision-200ma',
    family: 'quiet',
    spec: rail({ vin: [22, 24, 26], ripple: 0.2, source: 'bus', vout: 5, load: [0.01, 0.1, 0.2], noise: 'precision' }),
    accept: ['buck+linear'],
    why: QUIET_HYBRID,
  },
  {
    id: 'quiet-24-5v-rf-2pct-1a',
    family: 'quiet',
    spec: rail({ vin: [22, 24, 26], ripple: 0.2, source: 'bus', vout: 5, tol: 0.02, load: [0.02, 0.5, 1], noise: 'rf' }),
    accept: ['buck+linear', 'buck'],
    why: 'common practice: a buck then a precision LDO holding ±2 % at 1 A; a buck with an LC post-filter where the spur limit allows',
  },
  {
    id: 'quiet-5-12v-rf-50ma',
    family: 'quiet',
    spec: rail({ vin: USB, ripple: 0.05, source: 'adapter', vout: 12, load: [0.005, 0.03, 0.05], noise: 'rf' }),
    accept: ['buck+linear'],
    why: 'common practice: a boost to just above 12 V, then an LDO that rejects its switching ripple',
  },
  {
    id: 'quiet-usb-1v8-rf-100ma',
    family: 'quiet',
    spec: rail({ vin: USB, ripple: 0.05, source: 'adapter', vout: 1.8, load: [0.005, 0.05, 0.1], noise: 'rf' }),
    accept: ['linear'],
    why: QUIET_LINEAR,
  },
  {
    id: 'quiet-liion-3v3-rf-100ma',
    family: 'quiet',
    spec: rail({ vin: LI_ION, source: 'battery', vout: 3.3, load: [0.001, 0.05, 0.1], noise: 'rf' }),
    accept: ['buck+linear'],
    why: 'common practice: a buck-boost keeps the input of an LDO post-regulator above its dropout over the whole cell range',
  },
  {
    id: 'quiet-15-12v-analog-50ma',
    family: 'quiet',
    spec: rail({ vin: [14, 15, 16], ripple: 0.05, source: 'bus', vout: 12, load: [0.005, 0.03, 0.05], noise: 'precision' }),
    accept: ['linear'],
    why: QUIET_LINEAR,
  },
  {
    id: 'quiet-9-5v-adc-20ma',
    family: 'quiet',
    spec: rail({ vin: [8.5, 9, 9.5], ripple: 0.05, source: 'adapter', vout: 5, load: [0.002, 0.01, 0.02], noise: 'precision' }),
    accept: ['linear'],
    why: QUIET_LINEAR,
  },

  // Precision rails, ±1–3 %.
  {
    id: 'prec-usb-3v3-3pct-100ma',
    family: 'precision',
    spec: rail({ vin: [4.75, 5, 5.25], ripple: 0.05, source: 'adapter', vout: 3.3, tol: 0.03, load: [0.005, 0.05, 0.1], noise: 'sensor' }),
    accept: ['linear'],
    why: 'common practice: a 1 % LDO or an adjustable one with 0.1 % resistors holds ±3 % quietly',
  },
  {
    id: 'prec-usb-3v3-1pct-50ma',
    family: 'precision',
    spec: rail({ vin: USB, ripple: 0.05, source: 'adapter', vout: 3.3, tol: 0.01, load: [0.001, 0.02, 0.05], noise: 'sensor' }),
    accept: ['linear'],
    why: 'common practice: a 0.5 % precision LDO with 0.1 % resistors holds ±1 %',
  },
  {
    id: 'prec-12-5v-2pct-100ma',
    family: 'precision',
    spec: rail({ vin: [11.4, 12, 12.6], ripple: 0.1, source: 'adapter', vout: 5, tol: 0.02, load: [0.005, 0.05, 0.1] }),
    accept: ['linear', 'buck'],
    why: 'common practice: a precision regulator with tight resistors; a buck with a 1 % reference is also usual',
  },
  {
    id: 'prec-24-3v3-3pct-300ma',
    family: 'precision',
    spec: rail({ vin: [20, 24, 28], ripple: 0.2, source: 'bus', vout: 3.3, tol: 0.03, load: [0.01, 0.2, 0.3] }),
    accept: ['buck', 'buck+linear'],
    why: 'common practice: a buck with a 1 % feedback reference and 0.1 % divider holds ±3 %',
  },
  {
    id: 'prec-liion-3v3-3pct-200ma',
    family: 'precision',
    spec: rail({ vin: LI_ION, source: 'battery', vout: 3.3, tol: 0.03, load: [0.001, 0.1, 0.2] }),
    accept: ['buck-boost', 'buck+linear'],
    why: STRADDLE,
  },
  {
    id: 'prec-12-10v-1pct-20ma',
    family: 'precision',
    spec: rail({ vin: [11.4, 12, 12.6], ripple: 0.05, source: 'adapter', vout: 10, tol: 0.01, load: [0.002, 0.01, 0.02], noise: 'sensor' }),
    accept: ['linear', 'shunt'],
    why: 'common practice: a precision LDO, or an adjustable precision shunt reference at this small load',
  },
  {
    id: 'prec-usb-2v5-1pct-10ma',
    family: 'precision',
    spec: rail({ vin: USB, ripple: 0.05, source: 'adapter', vout: 2.5, tol: 0.01, load: [0.001, 0.005, 0.01], noise: 'sensor' }),
    accept: ['linear', 'shunt'],
    why: 'common practice: a 2.5 V precision shunt reference with a series resistor, or a precision LDO',
  },
  {
    id: 'prec-24-5v-1pct-1a',
    family: 'precision',
    spec: rail({ vin: [22, 24, 26], ripple: 0.2, source: 'bus', vout: 5, tol: 0.01, load: [0.02, 0.5, 1] }),
    accept: ['buck', 'buck+linear'],
    why: 'common practice: a precision LDO after a buck, or a buck with 0.5 % reference and 0.1 % divider',
  },
  {
    id: 'prec-12-1v8-2pct-500ma',
    family: 'precision',
    spec: rail({ vin: [11.4, 12, 12.6], ripple: 0.1, source: 'adapter', vout: 1.8, tol: 0.02, load: [0.01, 0.3, 0.5] }),
    accept: ['buck', 'buck+linear'],
    why: BUCK_LOSS,
  },
  {
    id: 'prec-3v3-1v2-2pct-1a',
    family: 'precision',
    spec: rail({ vin: [3.135, 3.3, 3.465], ripple: 0.03, source: 'bus', vout: 1.2, tol: 0.02, load: [0.02, 0.6, 1] }),
    accept: ['buck'],
    why: 'common practice: a low-voltage synchronous buck (2.5–5.5 V in) is the standard point-of-load answer',
  },
  {
    id: 'prec-48-12v-2pct-300ma',
    family: 'precision',
    spec: rail({ vin: [44, 48, 52], ripple: 0.5, source: 'bus', vout: 12, tol: 0.02, load: [0.01, 0.2, 0.3] }),
    accept: ['buck', 'buck+linear'],
    why: BUCK_LOSS,
  },

  // Step-up to 12/24/48 V.
  {
    id: 'up-12-24v-500ma',
    family: 'step-up',
    spec: rail({ vin: [9, 12, 16], ripple: 0.2, source: 'bus', vout: 24, load: [0.01, 0.2, 0.5] }),
    accept: ['boost'],
    why: BOOST_ONLY,
  },
  {
    id: 'up-5-12v-200ma',
    family: 'step-up',
    spec: rail({ vin: USB, ripple: 0.05, source: 'adapter', vout: 12, load: [0.005, 0.1, 0.2] }),
    accept: ['boost'],
    why: BOOST_ONLY,
  },
  {
    id: 'up-24-48v-200ma',
    family: 'step-up',
    spec: rail({ vin: [20, 24, 28], ripple: 0.2, source: 'bus', vout: 48, load: [0.005, 0.1, 0.2] }),
    accept: ['boost'],
    why: BOOST_ONLY,
  },
  {
    id: 'up-12-48v-100ma',
    family: 'step-up',
    spec: rail({ vin: [10.8, 12, 13.2], ripple: 0.1, source: 'bus', vout: 48, load: [0.005, 0.05, 0.1] }),
    accept: ['boost'],
    why: 'common practice: a fourfold step-up (duty about 0.78) is still a plain boost',
  },
  {
    id: 'up-5-24v-50ma',
    family: 'step-up',
    spec: rail({ vin: USB, ripple: 0.05, source: 'adapter', vout: 24, load: [0.001, 0.02, 0.05] }),
    accept: ['boost'],
    why: 'common practice: a fivefold step-up (duty about 0.8) at low current is a plain boost',
  },
  {
    id: 'up-3v3-12v-100ma',
    family: 'step-up',
    spec: rail({ vin: [3.135, 3.3, 3.465], ripple: 0.03, source: 'bus', vout: 12, load: [0.005, 0.05, 0.1] }),
    accept: ['boost'],
    why: BOOST_ONLY,
  },
  {
    id: 'up-12-15v-1a',
    family: 'step-up',
    spec: rail({ vin: [11.4, 12, 12.6], ripple: 0.1, source: 'adapter', vout: 15, load: [0.02, 0.5, 1] }),
    accept: ['boost'],
    why: BOOST_ONLY,
  },
  {
    id: 'vehicle12-12v-500ma',
    family: 'step-up',
    spec: rail({ vin: VEHICLE_12, ripple: 0.5, source: 'bus', vout: 12, load: [0.01, 0.3, 0.5], ambient: 70, airflow: 'enclosed' }),
    accept: ['buck-boost'],
    why: STRADDLE,
  },

  // Mains-rectified and 100–500 V buses, 1–100 mA.
  {
    id: 'hv-400-300v-20ma',
    family: 'high-voltage',
    spec: rail({ vin: [380, 400, 420], ripple: 10, source: 'rectified', vout: 300, load: [0.002, 0.01, 0.02] }),
    accept: ['linear-predrop'],
    why: PREDROP,
  },
  {
    id: 'hv-400-300v-100ma',
    family: 'high-voltage',
    spec: rail({ vin: [380, 400, 420], ripple: 10, source: 'rectified', vout: 300, load: [0.01, 0.05, 0.1] }),
    accept: ['linear-predrop'],
    why: 'common practice: a pre-drop pass device on a heatsink with a foldback current limit for the short',
  },
  {
    id: 'hv-mains-12v-5ma',
    family: 'high-voltage',
    spec: rail({ vin: MAINS_230, ripple: 15, source: 'rectified', vout: 12, load: [0.001, 0.003, 0.005] }),
    accept: ['linear-predrop', 'buck', 'shunt'],
    why: 'common practice: under 2 W at a few mA; a pre-drop, a Zener shunt from the bus, or a small offline buck',
  },
  {
    id: 'hv-mains-15v-50ma',
    family: 'high-voltage',
    spec: rail({ vin: MAINS_230, ripple: 15, source: 'rectified', vout: 15, load: [0.005, 0.03, 0.05] }),
    accept: ['buck'],
    why: 'common practice: a linear stage would burn about 17 W; an offline buck converter is standard',
  },
  {
    id: 'hv-150-100v-10ma',
    family: 'high-voltage',
    spec: rail({ vin: [140, 150, 160], ripple: 2, source: 'bus', vout: 100, load: [0.001, 0.005, 0.01] }),
    accept: ['linear-predrop', 'buck'],
    why: 'common practice: a pre-drop transistor ahead of a floating regulator (which needs its minimum load through the divider), or a buck controller with a 250 V MOSFET that loses less',
  },
  {
    id: 'hv-200-48v-50ma',
    family: 'high-voltage',
    spec: rail({ vin: [180, 200, 220], ripple: 3, source: 'bus', vout: 48, load: [0.005, 0.03, 0.05] }),
    accept: ['buck', 'linear-predrop'],
    why: 'common practice: about 9 W in a pre-drop on a heatsink, or a high-voltage buck',
  },
  {
    id: 'hv-100-12v-20ma',
    family: 'high-voltage',
    spec: rail({ vin: [90, 100, 110], ripple: 1, source: 'bus', vout: 12, load: [0.002, 0.01, 0.02] }),
    accept: ['linear-predrop', 'buck'],
    why: 'common practice: 2 W in a pre-drop, or a 100 V buck',
  },
  {
    id: 'hv-100-48v-50ma',
    family: 'high-voltage',
    spec: rail({ vin: [90, 100, 110], ripple: 1, source: 'bus', vout: 48, tol: 0.03, load: [0.001, 0.025, 0.05] }),
    accept: ['buck', 'linear-predrop'],
    why: 'common practice: 2.4 W out; a buck rated for 110 V with derating (a 150 V part) holds ±3 % with a 1 % feedback reference, or a pre-drop burning about 3 W',
  },
  {
    id: 'hv-450-400v-5ma',
    family: 'high-voltage',
    spec: rail({ vin: [430, 450, 500], ripple: 10, source: 'rectified', vout: 400, load: [0.001, 0.003, 0.005] }),
    accept: ['linear-predrop'],
    why: PREDROP,
  },
  {
    id: 'hv-mains120-5v-2ma',
    family: 'high-voltage',
    spec: rail({ vin: [150, 170, 190], ripple: 10, source: 'rectified', vout: 5, load: [0.0005, 0.001, 0.002] }),
    accept: ['shunt', 'linear-predrop', 'buck'],
    why: 'common practice: a few hundred mW; a resistor-fed Zener or a pre-drop',
  },
  {
    id: 'hv-500-300v-1ma',
    family: 'high-voltage',
    spec: rail({ vin: [470, 500, 530], ripple: 5, source: 'bus', vout: 300, load: [0.0002, 0.0005, 0.001] }),
    accept: ['linear-predrop', 'shunt'],
    why: 'common practice: a bias rail at 1 mA; a pre-drop, or a Zener string fed by a resistor',
  },
  {
    id: 'hv-400-250v-2pct-10ma',
    family: 'high-voltage',
    spec: rail({ vin: [380, 400, 420], ripple: 10, source: 'rectified', vout: 250, tol: 0.02, load: [0.002, 0.005, 0.01] }),
    accept: ['linear-predrop'],
    why: "common practice: a pre-drop with the regulator's ±1 % reference selection and 0.1 % divider resistors holds ±2 %",
  },
  {
    id: 'hv-200-150v-2pct-30ma',
    family: 'high-voltage',
    spec: rail({ vin: [180, 200, 220], ripple: 3, source: 'bus', vout: 150, tol: 0.02, load: [0.005, 0.02, 0.03] }),
    accept: ['linear-predrop'],
    why: 'common practice: about 2 W in a pre-drop; a ±1 % reference selection and 0.1 % resistors hold ±2 %',
  },
  {
    id: 'hv-300-150v-20ma',
    family: 'high-voltage',
    spec: rail({ vin: [280, 300, 320], ripple: 5, source: 'rectified', vout: 150, load: [0.005, 0.01, 0.02], noise: 'sensor' }),
    accept: ['linear-predrop'],
    why: PREDROP,
  },

  // Light loads, µA to mA.
  {
    id: 'light-coin-1v8-10ua',
    family: 'light-load',
    spec: rail({ vin: [2.5, 3, 3.2], source: 'battery', vout: 1.8, load: [0.000001, 0.000005, 0.00001] }),
    accept: ['linear'],
    why: 'common practice: a low-quiescent LDO (µA) keeps a coin cell alive; a Zener would drain it',
  },
  {
    id: 'light-usb-3v3-1ma',
    family: 'light-load',
    spec: rail({ vin: USB, ripple: 0.05, source: 'adapter', vout: 3.3, load: [0.0001, 0.0005, 0.001] }),
    accept: ['linear', 'shunt'],
    why: TINY,
  },
  {
    id: 'light-12-5v-2ma',
    family: 'light-load',
    spec: rail({ vin: [11.4, 12, 12.6], ripple: 0.1, source: 'adapter', vout: 5, load: [0.0002, 0.001, 0.002] }),
    accept: ['linear', 'shunt'],
    why: TINY,
  },
  {
    id: 'light-liion-3v3-100ua',
    family: 'light-load',
    spec: rail({ vin: [3.5, 3.7, 4.2], source: 'battery', vout: 3.3, load: [0.00001, 0.00005, 0.0001] }),
    accept: ['linear'],
    why: 'common practice: a low-quiescent LDO; at 100 µA its µA of quiescent current is what matters',
  },
  {
    id: 'light-24-3v3-5ma',
    family: 'light-load',
    spec: rail({ vin: [20, 24, 28], ripple: 0.2, source: 'bus', vout: 3.3, load: [0.0005, 0.002, 0.005] }),
    accept: ['linear', 'buck', 'shunt'],
    why: TINY,
  },
  {
    id: 'light-9v-5v-500ua',
    family: 'light-load',
    spec: rail({ vin: [6.5, 9, 9.6], source: 'battery', vout: 5, load: [0.00005, 0.0002, 0.0005] }),
    accept: ['linear'],
    why: 'common practice: a low-quiescent LDO on a 9 V battery',
  },
  {
    id: 'light-48-12v-1ma',
    family: 'light-load',
    spec: rail({ vin: [36, 48, 60], ripple: 0.5, source: 'bus', vout: 12, load: [0.0001, 0.0005, 0.001] }),
    accept: ['linear', 'linear-predrop', 'shunt'],
    why: TINY,
  },
  {
    id: 'light-3v3-1v2-200ua',
    family: 'light-load',
    spec: rail({ vin: [3.135, 3.3, 3.465], ripple: 0.03, source: 'bus', vout: 1.2, load: [0.00002, 0.0001, 0.0002] }),
    accept: ['linear'],
    why: TINY,
  },
  {
    id: 'light-usb-1v8-25mw',
    family: 'light-load',
    spec: rail({ vin: USB, ripple: 0.05, source: 'adapter', vout: 1.8, load: [0.001, 0.01, 0.014] }),
    accept: ['linear'],
    why: 'common practice: a 25 mW rail; an LDO loses a few tens of milliwatts, not worth a switcher and its inductor',
  },
  // Further ordinary rails: other batteries, PoE, solar, railway, fan and analog rails, ADC references.
  {
    id: '9v-5v-20ma',
    family: 'battery',
    spec: rail({ vin: NINE_VOLT, source: 'battery', vout: 5, load: [0.0005, 0.01, 0.02] }),
    accept: ['linear', 'buck'],
    why: 'common practice: under 0.1 W lost in a low-quiescent LDO on a 9 V battery; a small buck only to stretch its life',
  },
  {
    id: '2aa-12v-20ma',
    family: 'battery',
    spec: rail({ vin: TWO_AA, source: 'battery', vout: 12, load: [0.0005, 0.01, 0.02] }),
    accept: ['boost'],
    why: 'common practice: a bias rail for a display or a relay from two cells; a small boost that runs down to the cells’ 1.8 V end of life',
  },
  {
    id: '3aa-3v3-100ma',
    family: 'battery',
    spec: rail({ vin: THREE_AA, source: 'battery', vout: 3.3, load: [0.001, 0.04, 0.1] }),
    accept: ['buck-boost'],
    why: STRADDLE,
  },
  {
    id: '4aa-5v-200ma',
    family: 'battery',
    spec: rail({ vin: [3.6, 5, 6.4], source: 'battery', vout: 5, load: [0.001, 0.1, 0.2] }),
    accept: ['buck-boost'],
    why: STRADDLE,
  },
  {
    id: 'liion-5v-500ma',
    family: 'battery',
    spec: rail({ vin: LI_ION, source: 'battery', vout: 5, load: [0.005, 0.2, 0.5] }),
    accept: ['boost'],
    why: BOOST_ONLY,
  },
  {
    id: '2s-liion-1v8-1a',
    family: 'battery',
    spec: rail({ vin: [6, 7.4, 8.4], source: 'battery', vout: 1.8, load: [0.01, 0.4, 1] }),
    accept: ['buck'],
    why: BUCK_LOSS,
  },
  {
    id: 'bus24-12v-2a-fan',
    family: 'bus',
    spec: rail({ vin: [21.6, 24, 26.4], ripple: 0.2, source: 'bus', vout: 12, tol: 0.1, load: [0.1, 1.2, 2] }),
    accept: ['buck'],
    why: 'common practice: a fan tolerates ±10 %; 24 W through a linear regulator would waste as much as it delivers, a buck is standard',
  },
  {
    id: 'poe-3v3-1a',
    family: 'bus',
    spec: rail({ vin: POE, ripple: 0.3, source: 'bus', vout: 3.3, load: [0.05, 0.5, 1] }),
    accept: ['buck'],
    why: BUCK_LOSS,
  },
  {
    id: 'poe-5v-50ma',
    family: 'bus',
    spec: rail({ vin: POE, ripple: 0.3, source: 'bus', vout: 5, load: [0.002, 0.02, 0.05] }),
    accept: ['buck'],
    why: 'common practice: a housekeeping rail off a PoE input; a linear stage would burn 2.6 W for 0.25 W delivered, a small 100 V buck is usual',
  },
  {
    id: 'poe-12v-500ma',
    family: 'bus',
    spec: rail({ vin: POE, ripple: 0.3, source: 'bus', vout: 12, load: [0.02, 0.3, 0.5] }),
    accept: ['buck'],
    why: BUCK_LOSS,
  },
  {
    id: 'vehicle12-3v3-1a',
    family: 'bus',
    spec: rail({ vin: VEHICLE_12, source: 'bus', vout: 3.3, load: [0.02, 0.4, 1] }),
    accept: ['buck'],
    why: BUCK_LOSS,
  },
  {
    id: 'solar-5v-500ma',
    family: 'bus',
    spec: rail({ vin: SOLAR_12, source: 'bus', vout: 5, load: [0.005, 0.2, 0.5] }),
    accept: ['buck'],
    why: 'common practice: a panel from 10 V to 22 V open-circuit; a buck rated past the open-circuit voltage, a linear would waste most of the harvest',
  },
  {
    id: 'rail110-24v-500ma',
    family: 'high-voltage',
    spec: rail({ vin: RAIL_110, ripple: 2, source: 'bus', vout: 24, load: [0.02, 0.3, 0.5] }),
    accept: ['buck'],
    why: 'common practice: a non-isolated buck rated past 137.5 V; a linear stage would lose over 50 W',
  },
  {
    id: 'rail110-5v-1a',
    family: 'high-voltage',
    spec: rail({ vin: RAIL_110, ripple: 2, source: 'bus', vout: 5, load: [0.02, 0.5, 1] }),
    accept: ['buck'],
    why: 'common practice: a controller buck with a 250 V MOSFET and a power catch diode; a linear stage would lose over 130 W',
  },
  {
    id: 'bus3v3-1v8-2pct-2a',
    family: 'precision',
    spec: rail({ vin: [3.135, 3.3, 3.465], ripple: 0.03, source: 'bus', vout: 1.8, tol: 0.02, load: [0.05, 1, 2] }),
    accept: ['buck'],
    why: 'common practice: a low-voltage synchronous buck with a ±1 % feedback reference; an LDO would lose 3 W',
  },
  {
    id: 'bus3v3-2v5-300ma',
    family: 'bus',
    spec: rail({ vin: [3.135, 3.3, 3.465], ripple: 0.03, source: 'bus', vout: 2.5, load: [0.01, 0.15, 0.3] }),
    accept: ['linear', 'buck'],
    why: LDO_SMALL,
  },
  {
    id: 'bus12-9v-300ma',
    family: 'bus',
    spec: rail({ vin: [11.4, 12, 12.6], ripple: 0.1, source: 'bus', vout: 9, load: [0.01, 0.15, 0.3] }),
    accept: ['linear', 'buck'],
    why: 'common practice: about 1 W in a regulator in a tab package; a buck is also usual',
  },
  {
    id: 'bus5-3v3-2a',
    family: 'usb-adapter',
    spec: rail({ vin: [4.75, 5, 5.25], ripple: 0.05, source: 'bus', vout: 3.3, load: [0.05, 1, 2] }),
    accept: ['buck'],
    why: BUCK_LOSS,
  },
  {
    id: 'up-5-15v-100ma',
    family: 'step-up',
    spec: rail({ vin: USB, ripple: 0.05, source: 'adapter', vout: 15, load: [0.002, 0.05, 0.1] }),
    accept: ['boost'],
    why: BOOST_ONLY,
  },
  {
    id: 'up-3v3-5v-300ma',
    family: 'step-up',
    spec: rail({ vin: [3.135, 3.3, 3.465], ripple: 0.03, source: 'bus', vout: 5, load: [0.01, 0.15, 0.3] }),
    accept: ['boost'],
    why: BOOST_ONLY,
  },
  {
    id: 'quiet-adapter12-5v-150mv-100ma',
    family: 'quiet',
    spec: rail({ vin: [11.4, 12, 12.6], ripple: 0.15, source: 'adapter', vout: 5, load: [0.005, 0.05, 0.1], noise: 'precision' }),
    accept: ['linear', 'buck+linear'],
    why: 'common practice: a linear regulator rejects 60–80 dB of the 100–120 Hz ripple, leaving well under the 1 mV limit; 0.7 W is fine in a tab package',
  },
  {
    id: 'quiet-adapter12-3v3-200mv-50ma',
    family: 'quiet',
    spec: rail({
      vin: [11.4, 12, 12.6],
      ripple: 0.2,
      source: 'adapter',
      vout: 3.3,
      load: [0.005, 0.03, 0.05],
      noise: 'sensor',
      maxRipple: 100e-6,
    }),
    accept: ['linear'],
    why: 'common practice: 100 µV from 200 mV of 100–120 Hz ripple needs 66 dB, which a bypassed adjustable regulator gives (about 80 dB, from memory); a switcher would add its own ripple',
  },
  {
    id: 'quiet-usb-3v3-rf-500ma',
    family: 'quiet',
    spec: rail({ vin: USB, ripple: 0.05, source: 'adapter', vout: 3.3, load: [0.01, 0.2, 0.5], noise: 'rf' }),
    accept: ['linear', 'buck+linear'],
    why: 'common practice: a radio module from USB; an LDO losing about 1 W, or a buck to just above the rail and an LDO, keeps switching spurs off the radio',
  },
  {
    id: 'quiet-24-3v3-rf-2a',
    family: 'quiet',
    spec: rail({ vin: [21.6, 24, 26.4], ripple: 0.2, source: 'bus', vout: 3.3, load: [0.05, 1, 2], noise: 'rf' }),
    accept: ['buck+linear'],
    why: 'common practice: a linear stage alone would lose 45 W; a buck to just above 3.3 V and a 3 A LDO after it',
  },
  {
    id: 'quiet-adapter12-5v-rf-80ma',
    family: 'quiet',
    spec: rail({ vin: [11.4, 12, 12.6], ripple: 0.1, source: 'adapter', vout: 5, tol: 0.02, load: [0.005, 0.04, 0.08], noise: 'rf' }),
    accept: ['linear', 'buck+linear'],
    why: QUIET_LINEAR,
  },
  {
    id: 'quiet-24-15v-analog-100ma',
    family: 'quiet',
    spec: rail({ vin: [21.6, 24, 26.4], ripple: 0.2, source: 'bus', vout: 15, tol: 0.03, load: [0.005, 0.05, 0.1], noise: 'precision' }),
    accept: ['linear', 'buck+linear'],
    why: QUIET_LINEAR,
  },
  {
    id: 'prec-5-3v3-0p5pct-adc-5ma',
    family: 'precision',
    spec: rail({ vin: USB, ripple: 0.05, source: 'adapter', vout: 3.3, tol: 0.005, load: [0.0005, 0.002, 0.005], noise: 'precision' }),
    accept: ['linear'],
    why: 'common practice: an ADC reference rail; a precision series reference (±0.1 %, from memory) holds ±0.5 % at a few mA',
  },
  {
    id: 'prec-12-3v3-1pct-adc-50ma',
    family: 'precision',
    spec: rail({ vin: [11.4, 12, 12.6], ripple: 0.1, source: 'bus', vout: 3.3, tol: 0.01, load: [0.005, 0.02, 0.05], noise: 'precision' }),
    accept: ['linear', 'buck+linear'],
    why: 'common practice: a quiet ratiometric rail for an ADC and its sensors; a precision LDO with 0.1 % resistors, or one after a small buck',
  },
  {
    id: 'prec-12-2v5-0p5pct-ref-10ma',
    family: 'precision',
    spec: rail({
      vin: [11.4, 12, 12.6],
      ripple: 0.1,
      source: 'bus',
      vout: 2.5,
      tol: 0.005,
      load: [0.001, 0.005, 0.01],
      noise: 'precision',
    }),
    accept: ['linear'],
    why: 'common practice: an ADC reference rail; a precision series reference (±0.1 %, from memory) holds ±0.5 % at 10 mA from 12 V',
  },
  {
    id: 'hv-200-180v-5ma',
    family: 'high-voltage',
    spec: rail({ vin: [190, 200, 220], ripple: 2, source: 'bus', vout: 180, tol: 0.03, load: [0.0005, 0.003, 0.005] }),
    accept: ['linear-predrop'],
    why: PREDROP,
  },
  {
    id: 'hv-400-15v-10ma-bias',
    family: 'high-voltage',
    spec: rail({ vin: [370, 400, 420], ripple: 5, source: 'bus', vout: 15, load: [0.001, 0.005, 0.01] }),
    accept: ['buck', 'linear-predrop'],
    why: 'common practice: a gate-drive bias from a 400 V link; an off-line buck, or a pre-drop transistor at 4 W where simplicity matters',
  },
  {
    id: 'hv-mains-3v3-100ma',
    family: 'high-voltage',
    spec: rail({ vin: MAINS_230, ripple: 15, source: 'rectified', vout: 3.3, load: [0.005, 0.05, 0.1] }),
    accept: ['buck+linear', 'buck'],
    why: 'common practice: a non-isolated off-line buck to a bus of several volts (its shortest on-time cannot reach 3.3 V from 360 V) and an LDO after it, or an off-line buck that skips pulses',
  },
  {
    id: 'hv-mains120-24v-20ma',
    family: 'high-voltage',
    spec: rail({ vin: [140, 165, 190], ripple: 10, source: 'rectified', vout: 24, load: [0.001, 0.01, 0.02] }),
    accept: ['buck', 'linear-predrop'],
    why: 'common practice: rectified 120 V mains; an off-line buck, or a pre-drop transistor at 3 W',
  },
  {
    id: 'light-48-5v-10ma',
    family: 'light-load',
    spec: rail({ vin: [40, 48, 57], ripple: 0.3, source: 'bus', vout: 5, load: [0.001, 0.005, 0.01] }),
    accept: ['linear', 'linear-predrop', 'buck', 'shunt'],
    why: 'common practice: a high-voltage LDO loses 0.5 W, a small buck less; a shunt reference with a 2 W feed resistor is the cheapest and is still built at 10 mA, though it wastes about 1 W',
  },
  {
    id: 'bus-3v3-1v2-3a',
    family: 'bus',
    spec: rail({ vin: [3.135, 3.3, 3.465], ripple: 0.03, source: 'bus', vout: 1.2, tol: 0.03, load: [0.1, 2, 3] }),
    accept: ['buck'],
    why: 'common practice: a core rail off a 3.3 V bus; a linear stage would burn 6 W, a 2.5–5.5 V synchronous buck rated 3–4 A is the usual part',
  },
  {
    id: 'bus-2v5-1v0-1a',
    family: 'bus',
    spec: rail({ vin: [2.375, 2.5, 2.625], ripple: 0.02, source: 'bus', vout: 1.0, tol: 0.03, load: [0.05, 0.5, 1] }),
    accept: ['buck'],
    why: 'common practice: a 2.5 V bus at −5 % is 2.375 V, so the buck must start below 2.5 V (parts from 2.3 V are common); a linear stage would lose 1.6 W',
  },
  {
    id: 'bus-12-1v0-5a',
    family: 'bus',
    spec: rail({ vin: [11, 12, 13], ripple: 0.1, source: 'bus', vout: 1.0, tol: 0.03, load: [0.2, 3, 5] }),
    accept: ['buck'],
    why: 'common practice: a point-of-load rail off 12 V; a 6 A synchronous buck in a thermally enhanced package',
  },
  {
    id: 'up-5-48v-20ma',
    family: 'step-up',
    spec: rail({ vin: USB, ripple: 0.05, source: 'adapter', vout: 48, load: [0.001, 0.01, 0.02] }),
    accept: ['boost'],
    why: 'common practice: a bias rail from USB; a boost controller near 92 % duty at a few hundred kHz (its minimum off-time allows it), a tenfold step',
  },
  {
    id: 'light-48-3v3-5ma',
    family: 'light-load',
    spec: rail({ vin: [36, 48, 60], ripple: 0.3, source: 'bus', vout: 3.3, load: [0.0005, 0.002, 0.005] }),
    accept: ['buck', 'linear', 'linear-predrop'],
    why: 'common practice: a high-voltage LDO loses about 0.3 W and a small buck a few tens of mW; a shunt fed from a 60 V maximum would burn 0.7 W for a 16 mW load',
  },
  {
    id: 'battery-9v-3v3-100ua',
    family: 'battery',
    spec: rail({ vin: NINE_VOLT, source: 'battery', vout: 3.3, tol: 0.03, load: [0.00001, 0.00005, 0.0001], noise: 'sensor' }),
    accept: ['linear'],
    why: 'common practice: a µA-quiescent LDO rated for 16 V; a shunt or a 1 A regulator with milliamps of quiescent current would drain the battery dozens of times faster than the load',
  },
  {
    id: 'up-12-48v-500ma',
    family: 'step-up',
    spec: rail({ vin: [11, 12, 13], ripple: 0.1, source: 'bus', vout: 48, load: [0.01, 0.3, 0.5] }),
    accept: ['boost'],
    why: 'common practice: a boost controller with a 100 V MOSFET; the output capacitors and the heat leave a window of switching frequencies (about 0.5–0.65 MHz here) that the design must find',
  },
  {
    id: 'bus-veh24-12v-3a',
    family: 'bus',
    spec: rail({ vin: VEHICLE_24, ripple: 0.3, source: 'bus', vout: 12, load: [0.1, 2, 3] }),
    accept: ['buck'],
    why: 'common practice: a 60 V synchronous buck rated 5 A (a 36 V part has no margin over 32 V with derating); a linear stage would burn 60 W',
  },
  {
    id: 'quiet-24-15v-precision-500ma',
    family: 'quiet',
    spec: rail({ vin: [22, 24, 26], ripple: 0.2, source: 'bus', vout: 15, tol: 0.02, load: [0.01, 0.3, 0.5], noise: 'precision' }),
    accept: ['buck+linear'],
    why: 'common practice: a linear regulator alone would burn 5.5 W; a buck to just above the rail and a low-noise LDO keep switching spurs off a precision-analog load',
  },
];
