// The engine's result types: the JSON contract of the evaluate answer (names are stable).

export const topologyIds = ['shunt', 'linear', 'linear-predrop', 'buck', 'boost', 'buck-boost', 'buck+linear'] as const;
export type TopologyId = (typeof topologyIds)[number];

export const componentRoles = [
  'series-resistor',
  'zener',
  'regulator',
  'feedback-lower',
  'feedback-upper',
  'pass-transistor',
  'standoff-zener',
  'bias-resistor',
  'sense-resistor',
  'limit-transistor',
  'inductor',
  'switch',
  'diode',
  'input-capacitor',
  'output-capacitor',
  'bypass-capacitor',
  'protection-diode',
  'heatsink',
] as const;
export type ComponentRole = (typeof componentRoles)[number];

export type Severity = 'blocker' | 'caution' | 'info';

export interface Issue {
  code: string;
  severity: Severity;
  message: string;
}

export interface Quantity {
  value: number;
  unit: string;
}

export interface TraceEntry {
  id: string;
  label: string;
  /** `formula`: the equation's right-hand side recomputes the result from the inputs; `selection`: a minimum over corners, a search or a table look-up. */
  kind: 'formula' | 'selection';
  equation: string;
  inputs: Record<string, Quantity>;
  result: Quantity;
}

export interface Component {
  ref: string;
  role: ComponentRole;
  /** Part value in `unit`; null for parts identified by class alone (regulators, transistors). */
  value: number | null;
  unit: string | null;
  ratingW: number | null;
  ratingV: number | null;
  tolerance: number | null;
  /** Catalog class or a short description of the part. */
  part: string;
  /** Parts in a series string sharing the value (value is the string's total); 1 otherwise. */
  quantity: number;
  costCents: number;
}

export interface PartDissipation {
  ref: string;
  role: ComponentRole;
  maxW: number;
  faultW: number;
}

export interface Junction {
  ref: string;
  /** Junction temperature at the worst dissipation; held at tjMaxC when the part would pass its limit. */
  tjC: number;
  tjMaxC: number;
  heatsink: boolean;
  /** The part would pass its limit: tjC is then the limit, not a temperature it could reach. */
  beyondLimit: boolean;
}

export interface Histogram {
  min: number;
  max: number;
  counts: number[];
}

export interface MonteCarloResult {
  draws: number;
  seed: number;
  mean: number;
  sigma: number;
  fractionInTolerance: number;
  histogram: Histogram;
}

export interface Curves {
  /** Efficiency at iTyp and total dissipation at iMax; null where the option cannot run at that input. */
  vIn: number[];
  efficiency: (number | null)[];
  dissipationW: (number | null)[];
}

export interface SubScores {
  efficiency: number;
  heat: number;
  partCount: number;
  noise: number;
  cost: number;
}

export interface Caution {
  code: string;
  message: string;
}

/** What would clear a blocker, and what it costs where that is known. */
export interface Fix {
  code: string;
  change: string;
  costCents?: number;
  message: string;
}

/** Both views of the output spread, and which one decided feasibility. */
export interface ToleranceView {
  /** Extreme values over the parts' tolerance bands, with half the ripple on each side. */
  worstCase: { min: number; max: number };
  /** Root-sum-square sigma of the output, and the Monte Carlo fraction (ripple included) inside the band. */
  statistical: { sigma: number; yield: number };
  rule: 'worst-case' | 'statistical';
}

export interface Option {
  topology: TopologyId;
  label: string;
  feasible: boolean;
  /** Null for an infeasible option: it is not ranked against the feasible ones. */
  score: number | null;
  subScores: SubScores;
  issues: Issue[];
  /** For each blocker a different choice would clear: what to change and what it costs. */
  fixes: Fix[];
  efficiency: { nominal: number; worst: number };
  dissipation: { totalMaxW: number; parts: PartDissipation[] };
  heatsink: { required: boolean; maxThetaSaCW: number | null };
  junctions: Junction[];
  partCount: number;
  costCents: number;
  outputRippleVpp: number;
  vOutRange: { min: number; max: number };
  tolerance: ToleranceView;
  monteCarlo: MonteCarloResult;
  components: Component[];
  curves: Curves;
  cautions: Caution[];
  /** Typical device parameters behind the figures: typical — confirm against the chosen part's data. */
  assumptions: Record<string, Quantity>;
  trace: TraceEntry[];
}

export interface Evaluation {
  recommended: TopologyId | null;
  /** In words, why the recommended option won (or why there is none); absent from answers saved before it existed. */
  reason?: string;
  options: Option[];
}
