/**
 * The demo scenario: fictional clients and rails, for the demo only.
 * Specs follow the engine's brief schema (SI units, tolerances as fractions).
 */
import type { RailSpecInput } from '../engine/rail-spec';
import type { BriefState } from '../platform/db/schema';
import type { Role } from '../platform/auth/roles';

export const DEMO_PASSWORD = 'railwright-demo';

export interface DemoPerson {
  key: string;
  name: string;
  email: string;
  role: Role;
  company?: string;
  /** Lines of the address the balance invoice is billed to. */
  billingAddress?: string;
}

export const DEMO_PEOPLE: DemoPerson[] = [
  { key: 'admin', name: 'Maren Holt', email: 'admin@demo.railwright.test', role: 'admin' },
  { key: 'engineer', name: 'Idris Valcourt', email: 'engineer@demo.railwright.test', role: 'engineer' },
  {
    key: 'client',
    name: 'Priya Anand',
    email: 'client@demo.railwright.test',
    role: 'client',
    company: 'Fernhill Sensing Ltd',
    billingAddress: 'Fernhill Sensing Ltd\nAccounts payable\n12 Orchard Row\nLinwick LW4 9TD',
  },
  {
    key: 'quillon',
    name: 'Jonas Brekke',
    email: 'jonas@quillon.demo.railwright.test',
    role: 'client',
    company: 'Quillon Bench Instruments',
  },
  { key: 'harrow', name: 'Lucía Ferrand', email: 'lucia@harrowgate.demo.railwright.test', role: 'client', company: 'Harrowgate Controls' },
  {
    key: 'aster',
    name: 'Dr Tomasz Wren',
    email: 'wren@asterlab.demo.railwright.test',
    role: 'client',
    company: 'Aster Detector Laboratory',
  },
];

export interface DemoBrief {
  key: string;
  owner: string;
  title: string;
  state: BriefState;
  notes: string;
  /** Days before the seed time that the brief was submitted (drafts have none). */
  submittedDaysAgo?: number;
  /** The engineer's note on revision 1, for briefs that have been reviewed. */
  revisionNote?: string;
  /**
   * How far the quote of revision 1 has gone: sent to the client, accepted and its deposit paid,
   * the design delivered and its balance paid, or declined by the client.
   */
  quote?: 'sent' | 'deposit-paid' | 'paid-in-full' | 'declined';
  /** The client's purchase-order number given on acceptance. */
  purchaseOrder?: string;
  /** The client's reason, for a declined quote. */
  declineReason?: string;
  /** What the engineer asked the client to change, for a brief sent back (state `changes-requested`). */
  changeRequest?: string;
  /** The thread with the client, oldest first, starting two days after submission. */
  messages?: { by: 'client' | 'engineer'; body: string }[];
  spec: RailSpecInput;
}

export const DEMO_BRIEFS: DemoBrief[] = [
  {
    key: 'logger-battery',
    owner: 'client',
    title: 'Field logger, 5 V from a 12 V lead-acid battery',
    state: 'paid-in-full',
    submittedDaysAgo: 34,
    revisionNote: 'Buck from the battery; efficient across the whole charge range, no heatsink needed.',
    quote: 'paid-in-full',
    purchaseOrder: 'FS-PO-2231',
    notes: 'Logger and modem in a roadside cabinet; the battery is kept on float by a solar charger.',
    spec: {
      input: { vMin: 11.5, vNom: 12.6, vMax: 14.4, rippleVpp: 0.05, source: 'battery' },
      output: { v: 5, tolerance: 0.05, iMin: 0.02, iTyp: 0.15, iMax: 0.4 },
      noise: { class: 'digital' },
      thermal: { ambientMaxC: 55, airflow: 'enclosed' },
    },
  },
  {
    key: 'sensor-node',
    owner: 'client',
    title: 'Soil-moisture node, 3.3 V from one Li-ion cell',
    state: 'deposit-paid',
    submittedDaysAgo: 12,
    revisionNote: 'Buck-boost keeps 3.3 V across the whole discharge; quiescent current checked for the sleep budget.',
    quote: 'deposit-paid',
    notes: 'Node sleeps most of the time; radio bursts of about 120 mA every 15 minutes. Cell runs from 4.2 V down to 3.0 V.',
    spec: {
      input: { vMin: 3.0, vNom: 3.7, vMax: 4.2, rippleVpp: 0, source: 'battery' },
      output: { v: 3.3, tolerance: 0.05, iMin: 0.0005, iTyp: 0.02, iMax: 0.15 },
      noise: { class: 'sensor' },
      thermal: { ambientMaxC: 50, airflow: 'enclosed' },
    },
  },
  {
    key: 'sensor-gateway',
    owner: 'client',
    title: 'Gateway logic rail, 5 V from a 12 V adapter',
    state: 'draft',
    notes: 'Still deciding on the adapter; a 12 V, 1 A brick is likely.',
    spec: {
      input: { vMin: 10.8, vNom: 12, vMax: 13.2, rippleVpp: 0.1, source: 'adapter' },
      output: { v: 5, tolerance: 0.05, iMin: 0.05, iTyp: 0.3, iMax: 0.6 },
      noise: { class: 'digital' },
      thermal: { ambientMaxC: 45, airflow: 'still-air' },
    },
  },
  {
    key: 'bench-analog',
    owner: 'quillon',
    title: 'Bench meter analog front-end, quiet 12 V',
    state: 'quoted',
    submittedDaysAgo: 6,
    revisionNote: 'Switcher with an LC post-filter meets the 0.5 mV budget at far less heat than a linear from the rectified input.',
    quote: 'sent',
    messages: [
      {
        by: 'client',
        body: 'Before we accept: will the switcher’s frequency land inside our 1–10 kHz measurement band, or alias into it?',
      },
      {
        by: 'engineer',
        body: 'No — it runs at several hundred kHz, and the LC post-filter takes its ripple below the 0.5 mV budget. The quote’s design section lists the figures; the test report will include a spectrum of the rail.',
      },
    ],
    notes: 'Feeds a 24-bit ADC reference buffer and op-amps; the ripple budget is tight.',
    spec: {
      input: { vMin: 16, vNom: 18, vMax: 20, rippleVpp: 1.2, source: 'rectified' },
      output: { v: 12, tolerance: 0.05, iMin: 0.01, iTyp: 0.08, iMax: 0.15 },
      noise: { class: 'precision', maxRippleVpp: 0.0005 },
      thermal: { ambientMaxC: 40, airflow: 'still-air' },
    },
  },
  {
    key: 'controller-24v',
    owner: 'harrow',
    title: 'PLC I/O card, 5 V at 1.5 A from the 24 V bus',
    state: 'in-review',
    submittedDaysAgo: 3,
    revisionNote: 'First pass as briefed; check the load-dump clamp level with the client before quoting.',
    quote: 'declined',
    declineReason: 'Our bus clamps load dumps at 36 V, not 30 V — the quote is for the wrong input range. Please quote again for 18–36 V.',
    notes: 'Cabinet reaches 55 °C in summer. The 24 V bus sags to 18 V during motor starts and reaches 30 V on load dump clamps.',
    spec: {
      input: { vMin: 18, vNom: 24, vMax: 30, rippleVpp: 0.5, source: 'bus' },
      output: { v: 5, tolerance: 0.05, iMin: 0.1, iTyp: 0.9, iMax: 1.5 },
      noise: { class: 'digital' },
      thermal: { ambientMaxC: 55, airflow: 'enclosed' },
    },
  },
  {
    key: 'motor-logic',
    owner: 'harrow',
    title: 'Drive controller logic, 3.3 V from the 48 V bus',
    state: 'changes-requested',
    submittedDaysAgo: 2,
    changeRequest:
      'Before we can quote: does the 60 V maximum include the spikes from regenerative braking? And please give the load step of the gate-driver logic — the brief has only the 0.5 A maximum.',
    notes: 'Logic and gate-driver supply for a 48 V motor drive; the bus also feeds the motor.',
    spec: {
      input: { vMin: 36, vNom: 48, vMax: 60, rippleVpp: 0.5, source: 'bus' },
      output: { v: 3.3, tolerance: 0.03, iMin: 0.01, iTyp: 0.2, iMax: 0.5 },
      noise: { class: 'digital' },
      thermal: { ambientMaxC: 50, airflow: 'enclosed' },
    },
  },
  {
    key: 'detector-hv',
    owner: 'aster',
    title: 'Detector bias, 150 V from a 300–350 V supply',
    state: 'submitted',
    submittedDaysAgo: 1,
    notes: 'Bias for a drift detector; the lab already has a 300–350 V rectified supply. Load is small but must be stable.',
    spec: {
      input: { vMin: 300, vNom: 325, vMax: 350, rippleVpp: 4, source: 'rectified' },
      output: { v: 150, tolerance: 0.08, iMin: 0.002, iTyp: 0.01, iMax: 0.02 },
      noise: { class: 'sensor', maxRippleVpp: 0.01 },
      thermal: { ambientMaxC: 35, airflow: 'still-air' },
    },
  },
];

/** The consultancy's demo prices (integer minor units; hours per topology and per complexity driver). */
export const DEMO_RATE_CARD = {
  id: 1,
  currency: 'EUR',
  hourlyRateMinor: 11_500,
  designHoursByTopology: {
    shunt: 3,
    linear: 5,
    'linear-predrop': 10,
    buck: 12,
    boost: 12,
    'buck-boost': 16,
    'buck+linear': 16,
  },
  complexityHours: { highVoltage: 6, tightNoise: 4, heatsink: 3, perRevision: 1.5 },
  hvReviewMinor: 48_000,
  prototypePerUnitMinor: 9_500,
  testReportMinor: 36_000,
  taxRateBp: 2_000,
  depositBp: 3_000,
  validityDays: 30,
  registrationNumber: '08812734',
  taxId: 'EU372918455',
};
