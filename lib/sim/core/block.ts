/**
 * One block of iterations: the unit of work that a thread computes. Everything in a block is a
 * function of (plan, run key, sampling, block index, block size) only, so the concatenated
 * blocks are the same to the bit whatever the number of threads.
 *
 * Column by column over typed arrays (no per-sample objects), each column of uniforms used while
 * it is still in cache:
 *   1. correlation groups: their columns of uniforms together, by Iman–Conover;
 *   2. drivers: one factor column each (1 where the driver does not occur);
 *   3. activity durations × their drivers' factors (cut at 0);
 *   4. line items × their drivers' factors, added to the cost;
 *   5. risks, from one uniform u each: occurrence u > 1 − p, size F⁻¹((u − (1 − p))/p); cost
 *      added, delay lengthening (or, negative, shortening) each of its activities; before and
 *      after mitigation from the same u, the response's cost in the post total; then the
 *      probabilistic branches, each from its own uniform as a risk: 0 days where it is absent;
 *   6. schedule passes: project duration and criticality counts (headline scenario);
 *   7. time-dependent items: rate × sampled duration of the activity, or of the project;
 *   8. tornado grades (16-bit) as each input passes, the swing sums, and the sums behind the
 *      achieved correlations.
 * Columns outside the groups are drawn when they are needed, each from its own stream, keyed by
 * its input's id (./random/stream-ids).
 *
 * With a tap (the allocation pass, ./stats/allocation) the block draws all its uniforms as
 * before, keeps the iterations the tap names, and computes steps 2–7 for those alone, adding
 * each item's and risk's cost in the headline scenario to the tap's sums; it writes nothing else.
 */

import type { Plan } from './compile';
import { allocateInduction, induceGroup, type InductionScratch } from './correlation/iman-conover';
import { fillLatinHypercube, fillMonteCarlo } from './random/columns';
import { Sfc32, streamFor } from './random/sfc32';
import type { RiskImpact } from './compile';
import {
  allocateForwardPass,
  downstreamOf,
  type ForwardPassBuffers,
  forwardPass,
} from './schedule/forward-pass';
import type { Sampling } from './formats';
import { type AllocationBand, type BandRoom, bandOf } from './stats/allocation-band';

/** Iterations per block; fixed, so that the split does not depend on the thread count. */
export const BLOCK_SIZE = 2000;

/** Value of one step of a stored grade: grades are kept as ⌊g·2¹⁶⌋ and read as (k + ½)/2¹⁶. */
export const GRADE_UNIT = 1 / 65536;

/** Where a block writes its per-iteration outputs (views of length n, n or 0, rows·n). */
export interface BlockSink {
  /** Headline scenario's cost per iteration. */
  cost: Float64Array;
  /** Project duration per iteration (empty when the model has no activities). */
  duration: Float64Array;
  /**
   * The other scenario (pre- or post-mitigation) when some risk has a post block, else empty;
   * a caller that wants the headline only may leave them out.
   */
  altCost?: Float64Array;
  altDuration?: Float64Array;
  /** Tornado grades: input s, iteration i at s·n + i, as ⌊grade·2¹⁶⌋. */
  grades: Uint16Array;
  /** When set, the P-level (0–1) around which the block keeps its allocation band, and where. */
  band?: { level: number; room: BandRoom };
}

/**
 * The allocation pass's view of a block: which of its iterations to recompute, and where each
 * input's cost over them is summed (slots: see ./stats/allocation).
 */
export interface AllocationTap {
  /** Iterations of the block (0-based, ascending). */
  index: Int32Array;
  /** Per slot, Σ of the input's cost over those iterations; added to. */
  sums: Float64Array;
  /** Slot of each cost item, rate item and risk. */
  itemSlot: Int32Array;
  rateSlot: Int32Array;
  riskSlot: Int32Array;
}

/** What a block returns besides its sink: small per-block sums. */
export interface BlockSummary {
  block: number;
  n: number;
  /** Iterations in which each activity was on the critical path. */
  critical: Int32Array;
  /** Per tornado input: Σg and Σg² of its grades g = (stored + ½)/2¹⁶ over the block. */
  gradeSums: Float64Array;
  /** Per correlation entry: Σa, Σb, Σa², Σb², Σab of the pair's uniforms. */
  pairSums: Float64Array;
  /** Per activity: Σd and Σd² of its sampled duration (headline scenario). */
  durationSums: Float64Array;
  /**
   * Per tornado input, 6 values: count, Σcost, Σduration where its grade ≤ 0.1, then the same
   * where its grade ≥ 0.9 (the swing).
   */
  swingSums: Float64Array;
  /** Each input's cost near the block's P-value, when the sink asked for it. */
  band?: AllocationBand;
}

/** Stored grades k with (k + ½)/2¹⁶ ≤ 0.1, and ≥ 0.9. */
const SWING_LOW_MAX = 6553;
const SWING_HIGH_MIN = 58982;

interface Workspace {
  /** Column length: every column view below has this length; a block uses its first n values. */
  stride: number;
  /** Views of the grouped columns, by variable (null for ungrouped variables). */
  groupedColumn: (Float64Array | null)[];
  /** Views per group member, in group order, for the induction. */
  groupColumns: Float64Array[][];
  /** Activity durations, column a at a·stride: pre-mitigation, and post (when there is a post). */
  durations: Float64Array;
  durationColumn: Float64Array[];
  postDurations: Float64Array;
  postDurationColumn: Float64Array[];
  /** Driver factors, one column per driver. */
  factorColumn: Float64Array[];
  preCost: Float64Array;
  postCost: Float64Array;
  preTotal: Float64Array;
  postTotal: Float64Array;
  free: Float64Array;
  free2: Float64Array;
  tmp: Float64Array;
  /** A risk's delays per iteration, kept apart from its costs (in tmp) for the other scenario. */
  delayTmp: Float64Array;
  sizes: Float64Array;
  occurred: Uint8Array;
  /** A risk's delay uniforms where it occurs. */
  delayU: Float64Array;
  /** The iterations where the risk at hand occurs. */
  hits: Int32Array;
  perm: Int32Array;
  rng: Sfc32;
  induction: InductionScratch;
  schedule: ForwardPassBuffers | null;
  /** Row of each variable in the grades, −1 when not a tornado input. */
  gradeRowOfVariable: Int32Array;
  /** The iterations of each tornado row in the swing's bands (positions in a block: < BLOCK_SIZE, 16 bits). */
  swing: SwingMarks;
  /** Each allocation slot's cost per iteration (slot s at s·stride), made when first needed. */
  inputCost: Float64Array | null;
  /** Activities that some risk's delay acts on (the others need no second cut at zero). */
  delayed: Int32Array;
  /**
   * 1 for the activities whose finish may differ after mitigation: those a risk with a post
   * block delays, and all that follow them (the rest keep the first pass's finish).
   */
  postChanged: Uint8Array | null;
}

const workspaces = new WeakMap<Plan, Workspace>();

function columnsOf(store: Float64Array, count: number, stride: number): Float64Array[] {
  return Array.from({ length: count }, (_, a) => store.subarray(a * stride, (a + 1) * stride));
}

function workspaceFor(plan: Plan, n: number): Workspace {
  const existing = workspaces.get(plan);
  if (existing && existing.stride >= n) return existing;
  const stride = Math.max(n, BLOCK_SIZE);
  const acts = plan.activities.length;
  let slots = 0;
  for (const g of plan.groups) slots += g.k;
  const groupedStore = new Float64Array(slots * stride);
  const groupedColumn: (Float64Array | null)[] = new Array(plan.variables).fill(null);
  let slot = 0;
  const groupColumns = plan.groups.map((g) =>
    Array.from(g.vars, (v) => {
      const view = groupedStore.subarray(slot * stride, ++slot * stride);
      groupedColumn[v] = view;
      return view;
    }),
  );
  const durations = new Float64Array(acts * stride);
  const postDurations = new Float64Array(plan.hasPost ? acts * stride : 0);
  const gradeRowOfVariable = new Int32Array(plan.variables).fill(-1);
  plan.sensitivity.forEach((s, row) => (gradeRowOfVariable[s.v] = row));
  const column = () => new Float64Array(stride);
  const delayed = new Set<number>();
  const mitigated = new Set<number>();
  for (const r of plan.risks) {
    if (!(r.pre.delay || r.post?.delay)) continue;
    for (const a of r.activities) {
      delayed.add(a);
      if (r.post) mitigated.add(a);
    }
  }
  const ws: Workspace = {
    stride,
    groupedColumn,
    groupColumns,
    durations,
    durationColumn: columnsOf(durations, acts, stride),
    postDurations,
    postDurationColumn: plan.hasPost ? columnsOf(postDurations, acts, stride) : [],
    factorColumn: columnsOf(new Float64Array(plan.drivers.length * stride), plan.drivers.length, stride),
    preCost: column(),
    postCost: plan.hasPost ? column() : new Float64Array(0),
    preTotal: column(),
    postTotal: plan.hasPost ? column() : new Float64Array(0),
    free: column(),
    free2: column(),
    tmp: column(),
    delayTmp: column(),
    sizes: column(),
    occurred: new Uint8Array(stride),
    delayU: column(),
    hits: new Int32Array(stride),
    perm: new Int32Array(stride),
    rng: new Sfc32(),
    induction: allocateInduction(plan.maxGroupSize, stride),
    schedule: acts ? allocateForwardPass(acts, stride) : null,
    gradeRowOfVariable,
    swing: {
      at: new Uint16Array(plan.sensitivity.length * stride),
      low: new Int32Array(plan.sensitivity.length),
      high: new Int32Array(plan.sensitivity.length),
    },
    inputCost: null,
    delayed: Int32Array.from([...delayed].sort((a, b) => a - b)),
    postChanged: plan.network && plan.hasPost ? downstreamOf(plan.network, mitigated) : null,
  };
  workspaces.set(plan, ws);
  return ws;
}

/** Iterations [block·BLOCK_SIZE, …) of a run of `total` iterations: the block's size. */
export function blockLength(block: number, total: number): number {
  return Math.max(0, Math.min(BLOCK_SIZE, total - block * BLOCK_SIZE));
}

// Small loops as functions of their own: each is optimised once, quickly, whatever the model;
// one large function holding them all would be recompiled as it meets new distributions.

function addInto(acc: Float64Array, x: Float64Array, n: number): void {
  for (let i = 0; i < n; i++) acc[i] += x[i];
}

function addConstant(acc: Float64Array, x: number, n: number): void {
  for (let i = 0; i < n; i++) acc[i] += x;
}

function addProduct(acc: Float64Array, x: Float64Array, y: Float64Array, n: number): void {
  for (let i = 0; i < n; i++) acc[i] += x[i] * y[i];
}

function addScaled(acc: Float64Array, x: number, y: Float64Array, n: number): void {
  for (let i = 0; i < n; i++) acc[i] += x * y[i];
}

function clampAtZero(x: Float64Array, n: number): void {
  for (let i = 0; i < n; i++) if (x[i] < 0) x[i] = 0;
}

function sumOf(x: Float64Array, n: number): number {
  let s = 0;
  for (let i = 0; i < n; i++) s += x[i];
  return s;
}

function sumOfProducts(x: Float64Array, y: Float64Array, n: number): number {
  let s = 0;
  for (let i = 0; i < n; i++) s += x[i] * y[i];
  return s;
}

/** into[j] = x[index[j]]; in place when x is into (index ascending, so index[j] ≥ j). */
function gatherInto(x: Float64Array, index: Int32Array, into: Float64Array): Float64Array {
  for (let j = 0; j < index.length; j++) into[j] = x[index[j]];
  return into;
}

function productInto(out: Float64Array, x: Float64Array, y: Float64Array, n: number): void {
  for (let i = 0; i < n; i++) out[i] = x[i] * y[i];
}

function scaledInto(out: Float64Array, x: number, y: Float64Array, n: number): void {
  for (let i = 0; i < n; i++) out[i] = x * y[i];
}

function multiplyInto(acc: Float64Array, x: Float64Array, n: number): void {
  for (let i = 0; i < n; i++) acc[i] *= x[i];
}

/** Largest double below 1. */
const BELOW_ONE = 1 - 2 ** -53;

/** The grade (u − q)/p of an occurring draw u > q = 1 − p, kept inside (0, 1). */
function conditionalGrade(u: number, q: number, p: number): number {
  const x = (u - q) / p;
  return x >= 1 ? BELOW_ONE : x > 0 ? x : 2 ** -53;
}

/**
 * From a risk's (or driver's) uniform u and probability p: mask[i] = 1 when u > 1 − p, and the
 * conditional grade w = (u − (1 − p))/p in (0, 1) there (½ elsewhere, never read).
 */
function occurrenceGrades(u: Float64Array, p: number, mask: Uint8Array, w: Float64Array, n: number): void {
  const q = 1 - p;
  for (let i = 0; i < n; i++) {
    if (u[i] > q) {
      mask[i] = 1;
      w[i] = conditionalGrade(u[i], q, p);
    } else {
      mask[i] = 0;
      w[i] = 0.5;
    }
  }
}

/**
 * The iterations where a risk with uniform u and probability p occurs (u > 1 − p), ascending, into
 * hits, and their conditional grades (as occurrenceGrades) into w; returns how many.
 */
function occurrences(u: Float64Array, p: number, hits: Int32Array, w: Float64Array, n: number): number {
  const q = 1 - p;
  let m = 0;
  for (let i = 0; i < n; i++) {
    if (u[i] > q) {
      w[m] = conditionalGrade(u[i], q, p);
      hits[m++] = i;
    }
  }
  return m;
}

/** into[j] = x[hits[j]], j < m. */
function gatherHits(x: Float64Array, hits: Int32Array, m: number, into: Float64Array): Float64Array {
  for (let j = 0; j < m; j++) into[j] = x[hits[j]];
  return into;
}

/** acc[hits[j]] += x[j], j < m. */
function addAtHits(acc: Float64Array, x: Float64Array, hits: Int32Array, m: number): void {
  for (let j = 0; j < m; j++) acc[hits[j]] += x[j];
}

/** Version 1 delays: negative samples count as 0 days. */
function addPositiveAtHits(acc: Float64Array, x: Float64Array, hits: Int32Array, m: number): void {
  for (let j = 0; j < m; j++) if (x[j] > 0) acc[hits[j]] += x[j];
}

/** x[i] = 0 where mask is 0. */
function keepWhere(x: Float64Array, mask: Uint8Array, n: number): void {
  for (let i = 0; i < n; i++) if (!mask[i]) x[i] = 0;
}

/** out[i] = x[i] where mask, else 1. */
function factorWhere(x: Float64Array, mask: Uint8Array, out: Float64Array, n: number): void {
  for (let i = 0; i < n; i++) out[i] = mask[i] ? x[i] : 1;
}

/**
 * Where a block notes, per tornado row, the iterations whose grade falls in the swing's bands
 * (≤ 0.1 and ≥ 0.9): row r's segment of `at` (stride long) holds the low ones from its start,
 * ascending, and the high ones from its end, descending; `low[r]`/`high[r]` count them (−1 until
 * the row's grades are stored in the block).
 */
interface SwingMarks {
  at: Uint16Array;
  low: Int32Array;
  high: Int32Array;
}

/**
 * Stores k = ⌊g·2¹⁶⌋ at grades[off…] and Σg, Σg² of the stored values read back as (k + ½)/2¹⁶;
 * notes the iterations in the swing's bands (SwingMarks).
 */
function storeGrades(
  g: Float64Array,
  grades: Uint16Array,
  off: number,
  sums: Float64Array,
  row: number,
  n: number,
  marks: SwingMarks,
  stride: number,
) {
  // Integer sums (exact in double precision for any block size used here), scaled once; the sum
  // of squares in two halves, so that consecutive additions do not wait on each other (exact
  // integers, so the split does not change the sum). The band marks without branches (an
  // iteration's band is a coin toss): each iteration is written at the next free place of both
  // lists, and a list moves on only when the iteration belongs to it.
  const at = marks.at;
  let lo = row * stride;
  let hi = lo + stride - 1;
  const first = lo;
  const last = hi;
  let s1 = 0;
  let s2a = 0;
  let s2b = 0;
  let i = 0;
  for (; i + 1 < n; i += 2) {
    const x = g[i] * 65536;
    const k = x >= 65535 ? 65535 : x | 0;
    const y = g[i + 1] * 65536;
    const m = y >= 65535 ? 65535 : y | 0;
    grades[off + i] = k;
    grades[off + i + 1] = m;
    s1 += k + m;
    s2a += k * k;
    s2b += m * m;
    at[lo] = i;
    lo += (k - SWING_LOW_MAX - 1) >>> 31;
    at[hi] = i;
    hi -= (SWING_HIGH_MIN - 1 - k) >>> 31;
    at[lo] = i + 1;
    lo += (m - SWING_LOW_MAX - 1) >>> 31;
    at[hi] = i + 1;
    hi -= (SWING_HIGH_MIN - 1 - m) >>> 31;
  }
  if (i < n) {
    const x = g[i] * 65536;
    const k = x >= 65535 ? 65535 : x | 0;
    grades[off + i] = k;
    s1 += k;
    s2a += k * k;
    at[lo] = i;
    lo += (k - SWING_LOW_MAX - 1) >>> 31;
    at[hi] = i;
    hi -= (SWING_HIGH_MIN - 1 - k) >>> 31;
  }
  marks.low[row] = lo - first;
  marks.high[row] = last - hi;
  const s2 = s2a + s2b;
  // Σ(k + ½) = Σk + n/2 and Σ(k + ½)² = Σk² + Σk + n/4.
  sums[2 * row] = (s1 + n / 2) * GRADE_UNIT;
  sums[2 * row + 1] = (s2 + s1 + n / 4) * GRADE_UNIT * GRADE_UNIT;
}

/** Whether every activity's duration is the same before and after mitigation over the block. */
function sameDurations(ws: Workspace, n: number): boolean {
  // The post columns start as copies of the pre ones; only risk delays make them differ.
  for (const a of ws.delayed) {
    const pre = ws.durationColumn[a];
    const post = ws.postDurationColumn[a];
    for (let i = 0; i < n; i++) if (pre[i] !== post[i]) return false;
  }
  return true;
}

/** Σa, Σb, Σa², Σb², Σab into out[at…at+4]. */
function pairSumsInto(a: Float64Array, b: Float64Array, n: number, out: Float64Array, at: number): void {
  let sa = 0;
  let sb = 0;
  let saa = 0;
  let sbb = 0;
  let sab = 0;
  for (let i = 0; i < n; i++) {
    const x = a[i];
    const y = b[i];
    sa += x;
    sb += y;
    saa += x * x;
    sbb += y * y;
    sab += x * y;
  }
  out[at] = sa;
  out[at + 1] = sb;
  out[at + 2] = saa;
  out[at + 3] = sbb;
  out[at + 4] = sab;
}

/** Σd, Σd² of a column into out[at], out[at + 1]. */
function momentsInto(x: Float64Array, n: number, out: Float64Array, at: number): void {
  let s1 = 0;
  let s2 = 0;
  for (let i = 0; i < n; i++) {
    s1 += x[i];
    s2 += x[i] * x[i];
  }
  out[at] = s1;
  out[at + 1] = s2;
}

/**
 * The swing sums of one tornado row (see BlockSummary.swingSums) from its band marks: each
 * band's iterations added in ascending order.
 */
function swingFromMarks(
  marks: SwingMarks,
  row: number,
  stride: number,
  cost: Float64Array,
  duration: Float64Array,
  out: Float64Array,
  at: number,
): void {
  const idx = marks.at;
  const first = row * stride;
  const nl = marks.low[row];
  const nh = marks.high[row];
  let cl = 0;
  let dl = 0;
  let ch = 0;
  let dh = 0;
  for (let j = first; j < first + nl; j++) cl += cost[idx[j]];
  for (let j = first + stride - 1; j > first + stride - 1 - nh; j--) ch += cost[idx[j]];
  if (duration.length > 0) {
    for (let j = first; j < first + nl; j++) dl += duration[idx[j]];
    for (let j = first + stride - 1; j > first + stride - 1 - nh; j--) dh += duration[idx[j]];
  }
  out[at] = nl;
  out[at + 1] = cl;
  out[at + 2] = dl;
  out[at + 3] = nh;
  out[at + 4] = ch;
  out[at + 5] = dh;
}

export function simulateBlock(
  plan: Plan,
  key: Uint32Array,
  sampling: Sampling,
  block: number,
  size: number,
  sink: BlockSink,
  tap?: AllocationTap,
): BlockSummary {
  const ws = workspaceFor(plan, size);
  // Iterations drawn (size) and iterations computed (n): all of them, or the tap's.
  const n = tap ? tap.index.length : size;
  // The allocation band: each input's cost per iteration, kept while the block runs.
  const nItems = plan.costItems.length;
  const nRates = plan.rateItems.length;
  const slots = nItems + nRates + plan.risks.length;
  if (!tap && sink.band !== undefined && !ws.inputCost) ws.inputCost = new Float64Array(slots * ws.stride);
  const keep = !tap && sink.band !== undefined ? ws.inputCost : null;
  const kept = (slot: number) => keep!.subarray(slot * ws.stride, slot * ws.stride + n);
  const { tmp, occurred, sizes, preCost, postCost } = ws;
  const { hasPost } = plan;
  const rows = plan.sensitivity.length;
  const { grades } = sink;
  const gradeSums = new Float64Array(2 * rows);
  preCost.fill(0, 0, n);
  ws.swing.low.fill(-1);

  /** The uniforms of variable v: its group's column, or drawn now into `into`. */
  const uniforms = (v: number, into: Float64Array): Float64Array => {
    const grouped = ws.groupedColumn[v];
    if (grouped) return tap ? gatherInto(grouped, tap.index, into) : grouped;
    const rng = streamFor(key, block, plan.streamIds[v], ws.rng);
    if (sampling === 'lhs') fillLatinHypercube(rng, into, size, ws.perm);
    else fillMonteCarlo(rng, into, size);
    return tap ? gatherInto(into, tap.index, into) : into;
  };
  /** Uniforms of variable v, their grades stored when v is a tornado input. */
  const column = (v: number, into: Float64Array): Float64Array => {
    const u = uniforms(v, into);
    const row = ws.gradeRowOfVariable[v];
    if (row >= 0 && !tap) storeGrades(u, grades, row * n, gradeSums, row, n, ws.swing, ws.stride);
    return u;
  };
  const applyDrivers = (list: Int32Array, x: Float64Array) => {
    for (let k = 0; k < list.length; k++) multiplyInto(x, ws.factorColumn[list[k]], n);
  };

  // 1. Correlation groups.
  for (let k = 0; k < plan.groups.length; k++) {
    induceGroup(plan.groups[k], ws.groupColumns[k], size, key, block, sampling, ws.induction, plan.streamIds);
  }

  // 2. Driver factors.
  for (let k = 0; k < plan.drivers.length; k++) {
    const d = plan.drivers[k];
    const f = ws.factorColumn[k];
    if (d.v < 0) f.fill(d.probability > 0 ? d.factor.mean : 1, 0, n);
    else {
      occurrenceGrades(column(d.v, ws.free), d.probability, occurred, sizes, n);
      d.factor.quantileInto(sizes, tmp, n);
      factorWhere(tmp, occurred, f, n);
    }
  }

  // 3. Durations.
  const acts = plan.activities.length;
  for (let a = 0; a < acts; a++) {
    const { dist, v, drivers } = plan.activities[a];
    const d = ws.durationColumn[a];
    if (v < 0) d.fill(Math.max(0, dist.mean), 0, n);
    else dist.quantileInto(column(v, ws.free), d, n);
    applyDrivers(drivers, d);
    clampAtZero(d, n);
  }
  if (hasPost) ws.postDurations.set(ws.durations);

  // 4. Line items (the same in both scenarios).
  for (let k = 0; k < plan.costItems.length; k++) {
    const { dist, v, drivers } = plan.costItems[k];
    if (v < 0 && drivers.length === 0) {
      addConstant(preCost, dist.mean, n);
      if (tap) tap.sums[tap.itemSlot[k]] += dist.mean * n;
      if (keep) kept(k).fill(dist.mean);
    } else {
      // Computed where the band keeps it, when it does (no copy).
      const x = keep ? kept(k) : tmp;
      if (v < 0) x.fill(dist.mean, 0, n);
      else dist.quantileInto(column(v, ws.free), x, n);
      applyDrivers(drivers, x);
      addInto(preCost, x, n);
      if (tap) tap.sums[tap.itemSlot[k]] += sumOf(x, n);
    }
  }
  if (hasPost) postCost.set(preCost.subarray(0, n));

  // 5. Risks: both scenarios from the same uniforms.
  /** How many of ws.hits the risk at hand occurs in (kept for the other scenario's `again`). */
  let hitCount = 0;
  const applyRisk = (
    x: RiskImpact,
    u: Float64Array | null,
    uDelay: Float64Array | null,
    activities: Int32Array,
    cost: Float64Array,
    durations: Float64Array[],
    /** Tap slot of the risk's cost in this scenario, −1 when not tapped. */
    slot: number,
    /** Where its cost per iteration is kept for the band (headline scenario), else null. */
    keepInto: Float64Array | null,
    /**
     * The same impact was just applied to the other scenario: its occurrences, costs (in tmp)
     * and delays (in delayTmp) are still at hand and are added again rather than drawn again.
     */
    again: boolean,
  ) => {
    const p = x.probability;
    if (p <= 0) return;
    // Sizes are computed for the iterations where the risk occurs alone (compact, in hits order).
    const { hits, delayTmp } = ws;
    if (again) {
      // Nothing to draw.
    } else if (u) hitCount = occurrences(u, p, hits, sizes, n);
    else {
      for (let i = 0; i < n; i++) hits[i] = i;
      sizes.fill(0.5, 0, n);
      hitCount = n;
    }
    const m = hitCount;
    if (x.cost) {
      if (!again) x.cost.quantileInto(sizes, tmp, m);
      addAtHits(cost, tmp, hits, m);
      if (tap && slot >= 0) tap.sums[slot] += sumOf(tmp, m);
      if (keepInto) addAtHits(keepInto, tmp, hits, m);
    }
    if (x.delay && activities.length) {
      if (!again) x.delay.quantileInto(uDelay ? gatherHits(uDelay, hits, m, ws.delayU) : sizes, delayTmp, m);
      for (let j = 0; j < activities.length; j++) {
        if (plan.version === 1) addPositiveAtHits(durations[activities[j]], delayTmp, hits, m);
        else addAtHits(durations[activities[j]], delayTmp, hits, m);
      }
    }
  };
  const postHeadline = hasPost && plan.headline === 'post';
  for (let r = 0; r < plan.risks.length; r++) {
    const risk = plan.risks[r];
    const slot = tap ? tap.riskSlot[r] : -1;
    const u = risk.v >= 0 ? column(risk.v, ws.free2) : null;
    const uDelay = risk.vDelay >= 0 ? uniforms(risk.vDelay, ws.free) : null;
    const own = keep ? kept(nItems + nRates + r).fill(0) : null;
    const preOwn = postHeadline ? null : own;
    applyRisk(
      risk.pre,
      u,
      uDelay,
      risk.activities,
      preCost,
      ws.durationColumn,
      postHeadline ? -1 : slot,
      preOwn,
      false,
    );
    if (!hasPost) continue;
    const postSlot = postHeadline ? slot : -1;
    const postOwn = postHeadline ? own : null;
    // Without a post block the risk acts after mitigation as before: the same draws, added again.
    const postRisk = risk.post ?? risk.pre;
    const again = risk.post === null;
    applyRisk(
      postRisk,
      u,
      uDelay,
      risk.activities,
      postCost,
      ws.postDurationColumn,
      postSlot,
      postOwn,
      again,
    );
    const m = risk.mitigationCost;
    if (m) {
      if (risk.vMitigation < 0) {
        addConstant(postCost, m.mean, n);
        if (tap && postSlot >= 0) tap.sums[postSlot] += m.mean * n;
        if (postOwn) addConstant(postOwn, m.mean, n);
      } else {
        m.quantileInto(uniforms(risk.vMitigation, ws.free), tmp, n);
        addInto(postCost, tmp, n);
        if (tap && postSlot >= 0) tap.sums[postSlot] += sumOf(tmp, n);
        if (postOwn) addInto(postOwn, tmp, n);
      }
    }
  }
  // Opportunities shorten activities, never below zero days (an activity no delay acts on is
  // as cut at step 3).
  if (plan.version !== 1) {
    for (const a of ws.delayed) {
      clampAtZero(ws.durationColumn[a], n);
      if (hasPost) clampAtZero(ws.postDurationColumn[a], n);
    }
  }

  // 5b. Probabilistic branches: where an activity does not happen, its duration (delays
  // included) is 0, and so are its time-dependent costs; its links still pass through.
  for (let a = 0; a < acts; a++) {
    const { existence, vExists } = plan.activities[a];
    if (existence >= 1) continue;
    if (vExists < 0) occurred.fill(0, 0, n);
    else occurrenceGrades(uniforms(vExists, ws.free), existence, occurred, sizes, n);
    keepWhere(ws.durationColumn[a], occurred, n);
    if (hasPost) keepWhere(ws.postDurationColumn[a], occurred, n);
  }

  // 6. Schedule: criticality counts in the headline scenario.
  const critical = new Int32Array(acts);
  if (plan.network && ws.schedule) {
    // The other scenario needs its project duration only; the allocation pass neither count.
    const counts = tap ? null : critical;
    if (hasPost && sameDurations(ws, n)) {
      // No delay differs between the scenarios in this block: one pass serves both.
      forwardPass(plan.network, ws.durations, n, ws.schedule, ws.preTotal, counts);
      ws.postTotal.set(ws.preTotal.subarray(0, n));
    } else {
      forwardPass(plan.network, ws.durations, n, ws.schedule, ws.preTotal, postHeadline ? null : counts);
      if (hasPost)
        forwardPass(
          plan.network,
          ws.postDurations,
          n,
          ws.schedule,
          ws.postTotal,
          postHeadline ? counts : null,
          ws.postChanged!,
        );
    }
  }

  // 7. Time-dependent items: an activity's duration, or the project's.
  for (let k = 0; k < plan.rateItems.length; k++) {
    const { rate, v, activity, drivers } = plan.rateItems[k];
    const dPre = activity >= 0 ? ws.durationColumn[activity] : ws.preTotal;
    const dPost = activity >= 0 ? ws.postDurationColumn[activity] : ws.postTotal;
    const dHead = postHeadline ? dPost : dPre;
    if (v < 0 && drivers.length === 0) {
      addScaled(preCost, rate.mean, dPre, n);
      if (hasPost) addScaled(postCost, rate.mean, dPost, n);
      if (tap) tap.sums[tap.rateSlot[k]] += rate.mean * sumOf(dHead, n);
      if (keep) scaledInto(kept(nItems + k), rate.mean, dHead, n);
    } else {
      if (v < 0) tmp.fill(rate.mean, 0, n);
      else rate.quantileInto(column(v, ws.free), tmp, n);
      applyDrivers(drivers, tmp);
      addProduct(preCost, tmp, dPre, n);
      if (hasPost) addProduct(postCost, tmp, dPost, n);
      if (tap) tap.sums[tap.rateSlot[k]] += sumOfProducts(tmp, dHead, n);
      if (keep) productInto(kept(nItems + k), tmp, dHead, n);
    }
  }
  if (tap)
    return {
      block,
      n: 0,
      critical,
      gradeSums,
      pairSums: new Float64Array(0),
      durationSums: new Float64Array(0),
      swingSums: new Float64Array(0),
    };

  // The totals out: headline, then the other scenario.
  sink.cost.set((postHeadline ? postCost : preCost).subarray(0, n));
  if (plan.network) sink.duration.set((postHeadline ? ws.postTotal : ws.preTotal).subarray(0, n));
  if (hasPost && sink.altCost) {
    sink.altCost.set((postHeadline ? preCost : postCost).subarray(0, n));
    if (plan.network) sink.altDuration?.set((postHeadline ? ws.preTotal : ws.postTotal).subarray(0, n));
  }

  // 8. Moments of the headline durations, swing sums, sums for the achieved correlations.
  const durationSums = new Float64Array(2 * acts);
  const headDurations = postHeadline ? ws.postDurationColumn : ws.durationColumn;
  for (let a = 0; a < acts; a++) momentsInto(headDurations[a], n, durationSums, 2 * a);
  const swingSums = new Float64Array(6 * rows);
  for (let r = 0; r < rows; r++) {
    // Steps 1–7 draw every tornado input's column, which notes its marks; stale marks would
    // give another block's swing.
    if (ws.swing.low[r] < 0) throw new Error(`Tornado input ${plan.sensitivity[r].id} was not drawn.`);
    swingFromMarks(ws.swing, r, ws.stride, sink.cost, sink.duration, swingSums, 6 * r);
  }
  const pairSums = new Float64Array(plan.correlations.length * 5);
  plan.correlations.forEach((c, k) => {
    if (c.va >= 0) pairSumsInto(ws.groupedColumn[c.va]!, ws.groupedColumn[c.vb]!, n, pairSums, 5 * k);
  });

  const band = keep
    ? bandOf(sink.cost, n, sink.band!.level, keep, ws.stride, slots, sink.band!.room)
    : undefined;
  return { block, n, critical, gradeSums, pairSums, durationSums, swingSums, ...(band ? { band } : {}) };
}
