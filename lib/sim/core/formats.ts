// The model file and the result file of the engine, as TypeScript shapes. Fields, units and
// meaning: docs/model-format.md and docs/result-format.md.

export type DistSpec =
  | { type: 'fixed'; value: number }
  | { type: 'uniform'; low: number; high: number }
  | { type: 'triangular'; low: number; mode: number; high: number; range?: 'min-max' | 'p10-p90' }
  | { type: 'pert'; low: number; mode: number; high: number; range?: 'min-max' | 'p10-p90' }
  | { type: 'normal'; mean: number; sd: number }
  | { type: 'lognormal'; p10: number; p90: number }
  | { type: 'lognormal'; mean: number; sd: number };

export type Sampling = 'mc' | 'lhs';

/** A line item: either a distribution of its amount, or a rate per day of one activity. */
export interface ModelItem {
  id: string;
  name?: string;
  /** Deterministic amount; defaults to the distribution's base (see Distribution.base). */
  base?: number;
  dist?: DistSpec;
  ratePerDay?: DistSpec | number;
  activity?: string;
}

export interface ModelRisk {
  id: string;
  name?: string;
  probability: number;
  cost?: DistSpec;
  delay?: DistSpec;
  /** The activity that the delay lengthens (required when `delay` is given). */
  activity?: string;
}

export type Predecessor = string | { id: string; lag?: number };

export interface ModelActivity {
  id: string;
  name?: string;
  duration: DistSpec;
  predecessors?: Predecessor[];
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
}

export interface Model {
  format: 'outturn-model';
  version: 1;
  name?: string;
  currency?: string;
  items: ModelItem[];
  risks?: ModelRisk[];
  activities?: ModelActivity[];
  correlations?: ModelCorrelation[];
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
  percentileCI95: { P10: Interval; P50: Interval; P80: Interval; P90: Interval };
  contingency: { P50: number; P80: number; P90: number };
  /** Present when the model sets a target for this total. */
  probabilityWithinTarget?: { value: number; ci95: Interval };
}

export interface SensitivityEntry {
  id: string;
  rankCorrelation: number;
  varianceShare: number;
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
  version: 1;
  iterations: number;
  seed: number | string;
  sampling: Sampling;
  elapsedMs: number;
  cost: TotalSummary;
  duration?: TotalSummary;
  joint?: { probability: number; ci95: Interval };
  sensitivity: { cost: SensitivityEntry[]; duration: SensitivityEntry[] };
  criticality: Record<string, number>;
  achievedCorrelations: AchievedCorrelation[];
  warnings: string[];
  convergence: { iterations: number[]; cost: ConvergenceSeries; duration?: ConvergenceSeries };
}
