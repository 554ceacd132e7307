// The model file and the result file of the engine (docs/model-format.md, docs/result-format.md).
// Version 2 of the model adds project-span items, richer risks (several activities, opportunities,
// mitigation), risk drivers and settings; a version 1 file keeps its meaning.

export type DistSpec =
  | { type: 'fixed'; value: number }
  | { type: 'uniform'; low: number; high: number }
  | { type: 'triangular'; low: number; mode: number; high: number; range?: 'min-max' | 'p10-p90' }
  | { type: 'pert'; low: number; mode: number; high: number; range?: 'min-max' | 'p10-p90' }
  | { type: 'normal'; mean: number; sd: number }
  | { type: 'lognormal'; p10: number; p90: number }
  | { type: 'lognormal'; mean: number; sd: number };

export type Sampling = 'mc' | 'lhs';

/**
 * A line item: a distribution of its amount, a rate per day of one activity, or (span "project")
 * a rate per day of the whole project's duration.
 */
export interface ModelItem {
  id: string;
  name?: string;
  /** Deterministic amount; defaults to the distribution's base (see Distribution.base). */
  base?: number;
  dist?: DistSpec;
  ratePerDay?: DistSpec | number;
  activity?: string;
  /** "project": the rate runs with the project's duration (no activity). */
  span?: 'project';
}

/** After the response: missing fields keep the value before it. */
export interface RiskPost {
  probability?: number;
  cost?: DistSpec;
  delay?: DistSpec;
}

export interface ModelRisk {
  id: string;
  name?: string;
  probability: number;
  /** Negative values are opportunities. */
  cost?: DistSpec;
  delay?: DistSpec;
  /** Version 1: the one activity that the delay lengthens. */
  activity?: string;
  /** The activities that the delay lengthens (each by the same amount). */
  activities?: string[];
  /** The line items the risk's cost belongs to (for the allocation of contingency). */
  items?: string[];
  /** "linked" (default): one draw sizes cost and delay; "independent": the delay has its own. */
  sizes?: 'linked' | 'independent';
  post?: RiskPost;
  /** The response's own cost, counted in the post-mitigation total. */
  mitigationCost?: DistSpec | number;
}

/** A risk driver: in iterations where it occurs, one factor multiplies every input it applies to. */
export interface ModelDriver {
  id: string;
  name?: string;
  /** Default 1. */
  probability?: number;
  factor: DistSpec;
  /** Ids of line items and activities. */
  applies: string[];
}

/**
 * A link's type: FS (default) the successor starts at least lag after the predecessor finishes;
 * SS it starts at least lag after the predecessor starts; FF it finishes at least lag after the
 * predecessor finishes; SF it finishes at least lag after the predecessor starts.
 */
export type LinkType = 'FS' | 'SS' | 'FF' | 'SF';

/** A plain id is finish-to-start with no lag; a negative lag is a lead. */
export type Predecessor = string | { id: string; type?: LinkType; lag?: number };

export interface ModelActivity {
  id: string;
  name?: string;
  duration: DistSpec;
  predecessors?: Predecessor[];
  /**
   * Probabilistic branch: the probability that the activity happens (default 1). Where it does
   * not, its duration and its time-dependent costs are zero and its links pass through.
   */
  existence?: number;
}

export interface ModelCorrelation {
  a: string;
  b: string;
  rho: number;
}

export interface ModelSettings {
  iterations?: number;
  seed?: number | string;
  sampling?: Sampling;
  /** Headline scenario; default "post" when a risk has a post block, else "pre". */
  mitigation?: 'pre' | 'post';
  /** Level of the joint-confidence frontier, in (0, 1). */
  jointConfidence?: number;
  /** P-level the contingency is allocated at, e.g. "P80". */
  contingencyLevel?: ContingencyLevel;
}

export type ContingencyLevel = 'P50' | 'P70' | 'P80' | 'P90';

export interface ModelProjectHeader {
  stage?: string;
  /** AACE estimate class, 1–5. */
  estimateClass?: number;
  /** The day work starts, YYYY-MM-DD: working days count from it. */
  baseDate?: string;
}

export interface Model {
  format: 'outturn-model';
  version: 1 | 2;
  name?: string;
  currency?: string;
  /** What the project says of itself; the engine reads none of it (a new project takes it from the file). */
  project?: ModelProjectHeader;
  items: ModelItem[];
  risks?: ModelRisk[];
  activities?: ModelActivity[];
  correlations?: ModelCorrelation[];
  drivers?: ModelDriver[];
  targets?: { cost?: number; duration?: number };
  settings?: ModelSettings;
}

export type Interval = [number, number];

export type PercentileKey =
  'P5' | 'P10' | 'P20' | 'P30' | 'P40' | 'P50' | 'P60' | 'P70' | 'P80' | 'P90' | 'P95';

export interface TotalSummary {
  base: number;
  mean: number;
  sd: number;
  min: number;
  max: number;
  percentiles: Record<PercentileKey, number>;
  /** Every key of `percentiles` (version 1 results carry P10, P50, P80 and P90 only). */
  percentileCI95: Record<PercentileKey, Interval>;
  contingency: { P50: number; P80: number; P90: number };
  contingencyCI95?: { P50: Interval; P80: Interval; P90: Interval };
  /** Present when the model sets a target for this total. */
  probabilityWithinTarget?: { value: number; ci95: Interval };
}

export type InputKind = 'item' | 'activity' | 'risk' | 'driver';

export interface SensitivityEntry {
  id: string;
  rankCorrelation: number;
  /** ρ²/Σρ² over the listed inputs: a share of the explained rank variance, not of money. */
  varianceShare: number;
  /** Version 2 results. */
  kind?: InputKind;
  /** Mean total where the input's sample is at or below its P10, and at or above its P90. */
  swing?: Interval;
  /** Schedule sensitivity index (duration entries of activities). */
  ssi?: number;
}

export interface ScenarioSummary {
  cost: { mean: number; percentiles: Record<PercentileKey, number> };
  duration?: { mean: number; percentiles: Record<PercentileKey, number> };
}

export interface MitigationResult {
  used: 'pre' | 'post';
  pre: ScenarioSummary;
  post: ScenarioSummary;
}

/** Present when both targets are given (the app reads `probability` whenever `joint` exists). */
export interface JointResult {
  probability: number;
  ci95: Interval;
  /** P(cost ≤ its Pk and duration ≤ its Pk). */
  atPLevels?: { P50: number; P70: number; P80: number; P90: number };
  frontier?: { level: number; points: { duration: number; cost: number }[] };
}

/**
 * Euler allocation of the contingency at `level` (docs/result-format.md): each input's mean cost
 * over the `iterations` whose total lies nearest that P-value, minus its base.
 */
export interface AllocationResult {
  level: ContingencyLevel;
  /** The cost's contingency at `level` (its P-value minus the base). */
  contingency: number;
  /** Iterations in the window the means are taken over (about 1% of the run). */
  iterations: number;
  /** Per line item (with the risks that name it); and per risk that names no line item. */
  items: Record<string, number>;
  risks: Record<string, number>;
}

export interface AchievedCorrelation {
  a: string;
  b: string;
  target: number;
  used: number;
  /** null when the pair could not be induced (one side has no spread). */
  achieved: number | null;
}

/**
 * Running estimates for the convergence chart (docs/result-format.md):
 * at each checkpoint `iterations[k]`, the P50 and P80 of the first iterations[k] iterations
 * and their distribution-free 95% intervals.
 */
export interface ConvergenceSeries {
  P50: number[];
  P50ci95: Interval[];
  P80: number[];
  P80ci95: Interval[];
}

export interface SimulationResult {
  format: 'outturn-result';
  version: 1 | 2;
  iterations: number;
  seed: number | string;
  sampling: Sampling;
  elapsedMs: number;
  cost: TotalSummary;
  duration?: TotalSummary;
  joint?: JointResult;
  mitigation?: MitigationResult;
  allocation?: AllocationResult;
  sensitivity: { cost: SensitivityEntry[]; duration: SensitivityEntry[] };
  criticality: Record<string, number>;
  achievedCorrelations: AchievedCorrelation[];
  warnings: string[];
  convergence: { iterations: number[]; cost: ConvergenceSeries; duration?: ConvergenceSeries };
}
