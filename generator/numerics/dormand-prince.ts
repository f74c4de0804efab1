/**
 * Adaptive Dormand–Prince 5(4) integration of y' = f(t, y) with dense output and terminal events.
 *
 * Integrates forward from t0 to tEnd and returns an outcome: 'finished' (at tEnd exactly),
 * 'event' (the earliest sign change of any event function), 'step-limit' or 'step-underflow'.
 * Numerical trouble is an outcome, never a throw; only malformed arguments throw
 * (IntegrateArgumentError). An exception thrown by f or by an event function propagates.
 *
 * Method: DOPRI5 (coefficients and sources in ./dormand-prince-tableau.ts). Seven stages, the
 * 5th-order solution is propagated (local extrapolation), the embedded 4th-order solution only
 * serves the error estimate. FSAL: the last stage is f at the new point and becomes the next
 * step's first, so an accepted step costs 6 evaluations of f (plus 1 at the start and 1 for the
 * starting-step heuristic).
 *
 * Tolerance contract
 * - rtol is relative (1e-6: about six correct digits per step), atol is absolute in each
 *   component's own unit (a number for all, or one per component) and is the floor that
 *   governs components near zero. A step is accepted when Hairer's RMS norm
 *       err = sqrt( (1/n) Σᵢ ( eᵢ / (atolᵢ + rtol·max(|y0ᵢ|, |y1ᵢ|)) )² ) ≤ 1,
 *   eᵢ = h·Σⱼ Eⱼ·kⱼᵢ being the estimated local error of the step (Hairer, Nørsett & Wanner,
 *   Solving ODEs I, 2nd ed., §II.4).
 * - This controls the local error of each step, not the global error. For non-stiff,
 *   well-conditioned problems the global error is typically a small multiple of the
 *   tolerance atol + rtol·|y| (tests/numerics/dormand-prince.test.ts measures ≤ 2.5× at tEnd
 *   over a few periods or time constants, and asserts ≤ 10×); it grows with the length of
 *   the interval and with the instability of the problem. It falls in proportion to rtol
 *   (h ∝ rtol^(1/5), global error ∝ h⁵).
 * - Below rtol ≈ 1e-13 nothing is gained: rounding sets the error floor (≈ 1e-14 relative on
 *   the oscillator test) while the step count keeps growing as rtol^(−1/5); tolerances that
 *   cannot be met at all end in 'step-underflow' or 'step-limit'.
 * - The dense output (DenseStep.interpolate) is a continuous extension of order 4: inside a
 *   step its error is of the same size as the controlled local error (measured ≤ 6.5× the
 *   tolerance at mid-step points, asserted ≤ 25×). It reproduces y and y' at both ends of
 *   the step, so the interpolated trajectory is C¹.
 * - Event times are located on the dense output to eventTimeTolerance; the accuracy of the
 *   state itself adds |Δg / g'|, the event function's error over its rate of change.
 *
 * Step-size control: the PI controller of DOPRI5 (Lund stabilisation, β = 0.04):
 *   h_new = h · clamp(0.9 · err^−(0.2 − 0.75β) · errPrev^β, 0.2, 10),
 * errPrev = max(err of the previous accepted step, 1e-4); after a rejection the new step is
 * h · max(0.2, 0.9 · err^−0.17) and the following accepted step does not grow; steps never
 * exceed maxStep. A stage whose input or derivative is not finite (NaN, ±∞) rejects the step
 * and divides h by 5; if that cannot recover, h falls below 16·eps·|t| and the outcome is
 * 'step-underflow'. Stages are never evaluated at non-finite states.
 *
 * Events (all terminal): after each accepted step every event value is evaluated at the step's
 * end and compared with the last nonzero value seen (respecting `direction`); reaching zero
 * counts as reaching the new sign. A value exactly zero at t0 has no sign: it is taken from
 * the next evaluation, so an event does not fire at the point where a caller restarts. Each
 * crossing is narrowed on the dense output (Illinois, ./root.ts), the earliest wins (ties: the
 * first in `events`), and the outcome's t is the right end of the final bracket, so the event
 * value at (t, y) already has its new sign or is zero, and |t − t_root| ≤ eventTimeTolerance.
 * An event value that changes sign twice within one step is not seen; bound maxStep if the
 * event functions can oscillate faster than the solution.
 *
 * Cost: all work buffers are allocated once per call; a step allocates nothing. The DenseStep
 * handed to onStep is one reused object, valid only until onStep returns.
 */
import * as tableau from './dormand-prince-tableau.ts';
import { locateSignChange } from './root.ts';

// Module-local copies of the coefficients: an imported binding can compile to a getter call
// under CommonJS transpilation (measured 3× slower per step there); a local const cannot.
const {
  A21,
  A31,
  A32,
  A41,
  A42,
  A43,
  A51,
  A52,
  A53,
  A54,
  A61,
  A62,
  A63,
  A64,
  A65,
  B1,
  B3,
  B4,
  B5,
  B6,
  C2,
  C3,
  C4,
  C5,
  D1,
  D3,
  D4,
  D5,
  D6,
  D7,
  E1,
  E3,
  E4,
  E5,
  E6,
  E7,
} = tableau;

/** The ODE right-hand side: writes f(t, y) into dydt (same length as y). Must not keep y. */
export type Derivative = (t: number, y: Float64Array, dydt: Float64Array) => void;

export interface EventFunction {
  readonly id: string;
  readonly value: (t: number, y: Float64Array) => number;
  /** +1: fire only when value goes from negative to positive; -1: positive to negative; 0: either. */
  readonly direction: 1 | -1 | 0;
}

export interface DenseStep {
  readonly t0: number;
  readonly t1: number;
  /** Continuous 4th-order extension over [t0, t1]; writes y(t) into out. */
  interpolate(t: number, out: Float64Array): void;
}

export interface IntegrateOptions {
  readonly rtol: number;
  /** Absolute tolerance, > 0: one for all components or one per component. */
  readonly atol: number | Float64Array;
  /** Default: Hairer's starting-step heuristic; 0 (a `lastStep` of no step) also means default. */
  readonly initialStep?: number;
  /** Default: |tEnd − t0|. */
  readonly maxStep?: number;
  /** Accepted + rejected steps; default 100_000. */
  readonly maxSteps?: number;
  readonly events?: readonly EventFunction[];
  /** Absolute, in the unit of t; default 1e-9 · max(1, |t|). */
  readonly eventTimeTolerance?: number;
  /** Called once per accepted step, in order; the last one ends at the event time if any. */
  readonly onStep?: (step: DenseStep) => void;
  /**
   * The step controller's memory (the previous accepted step's error norm) when resuming
   * at a point `onContinue` reported; default: a fresh start.
   */
  readonly errPrev?: number;
  /**
   * Called after each accepted step that does not end the call, with the state there, the
   * next step's size and the controller's memory. A new call from (t, y) with
   * initialStep = nextStep, errPrev = errPrev and the same tEnd, maxStep, tolerances and
   * events takes exactly the steps this call goes on to take: the way to branch off a run
   * at a step boundary without integrating its past again. y is only valid during the call.
   */
  readonly onContinue?: (t: number, y: Float64Array, nextStep: number, errPrev: number) => void;
}

interface OutcomeBase {
  readonly t: number;
  readonly y: Float64Array;
  /** Accepted steps. */
  readonly steps: number;
  readonly rejected: number;
  /** Evaluations of f. */
  readonly evaluations: number;
  /** Size of the last accepted step (0 if none); pass it back as initialStep on restart. */
  readonly lastStep: number;
}

export type IntegrateOutcome =
  | (OutcomeBase & { readonly kind: 'finished' })
  | (OutcomeBase & { readonly kind: 'event'; readonly eventId: string })
  | (OutcomeBase & { readonly kind: 'step-limit' })
  | (OutcomeBase & { readonly kind: 'step-underflow' });

/** A malformed argument to integrate (a programming error, not numerical trouble). */
export class IntegrateArgumentError extends RangeError {
  override readonly name = 'IntegrateArgumentError';
}

const SAFETY = 0.9;
const MIN_FACTOR = 0.2;
const MAX_FACTOR = 10;
const BETA = 0.04;
const EXPONENT = 0.2 - 0.75 * BETA;
const ERR_PREV_FLOOR = 1e-4;
/** DOPRI5 stretches the step by up to 1 % to reach tEnd rather than leave a sliver. */
const LAST_STEP_STRETCH = 1.01;
const UNDERFLOW = 16 * Number.EPSILON;
const DEFAULT_MAX_STEPS = 100_000;
const DEFAULT_EVENT_TOLERANCE = 1e-9;

/**
 * Integrates y' = f(t, y) from (t0, y0) towards tEnd ≥ t0 with DOPRI5; see the file header for
 * the tolerance contract and the event rules. y0 is not modified; the outcome's y is a fresh array.
 */
export function integrate(
  f: Derivative,
  t0: number,
  y0: Float64Array,
  tEnd: number,
  options: IntegrateOptions,
): IntegrateOutcome {
  const n = y0.length;
  validate(t0, y0, tEnd, options);
  const rtol = options.rtol;
  const atol = perComponent(options.atol, n);
  const maxStep = options.maxStep ?? tEnd - t0;
  const maxSteps = options.maxSteps ?? DEFAULT_MAX_STEPS;
  const onStep = options.onStep;
  const events = options.events ?? [];

  const ws = new Workspace(n, atol, rtol);
  ws.y.set(y0);
  const counts: Counts = { steps: 0, rejected: 0, evaluations: 0, lastStep: 0 };
  let t = t0;
  if (tEnd === t0) return { kind: 'finished', ...snapshot(t, ws.y, counts) };

  f(t, ws.y, ws.k1);
  counts.evaluations++;
  if (!allFinite(ws.k1)) return { kind: 'step-underflow', ...snapshot(t, ws.y, counts) };
  const tracker = new EventTracker(events, t, ws.y, options.eventTimeTolerance);

  let h = options.initialStep ?? 0;
  if (h === 0) {
    h = startingStep(f, t, ws, maxStep);
    counts.evaluations++;
  }
  h = Math.min(h, maxStep);

  let errPrev = options.errPrev ?? ERR_PREV_FLOOR;
  let previousRejected = false;
  const onContinue = options.onContinue;
  for (;;) {
    if (counts.steps + counts.rejected >= maxSteps) {
      return { kind: 'step-limit', ...snapshot(t, ws.y, counts) };
    }
    let last = false;
    if (t + LAST_STEP_STRETCH * h >= tEnd) {
      h = tEnd - t;
      last = true;
    } else if (!(h > UNDERFLOW * Math.abs(t))) {
      return { kind: 'step-underflow', ...snapshot(t, ws.y, counts) };
    }

    const err = attemptStep(f, t, h, ws, counts);
    if (!(err <= 1)) {
      counts.rejected++;
      h *= Number.isFinite(err)
        ? Math.max(MIN_FACTOR, SAFETY / Math.pow(err, EXPONENT))
        : MIN_FACTOR;
      previousRejected = true;
      continue;
    }

    counts.steps++;
    counts.lastStep = h;
    const t1 = last ? tEnd : t + h;
    const dense = ws.dense;
    const crossed = tracker.valuesAt(t1, ws.y1);
    if (onStep !== undefined || crossed) dense.prepare(ws, t, t1, h);
    if (crossed) {
      const hit = tracker.earliest(dense, ws.scratch);
      if (hit !== undefined) {
        const y = new Float64Array(n);
        dense.interpolate(hit.t, y);
        if (onStep !== undefined) {
          dense.t1 = hit.t;
          onStep(dense);
        }
        return { kind: 'event', eventId: hit.id, t: hit.t, y, ...counters(counts) };
      }
    }
    tracker.commit();
    if (onStep !== undefined) onStep(dense);
    ws.advance();
    t = t1;
    if (last) return { kind: 'finished', ...snapshot(t, ws.y, counts) };

    const growth = Math.pow(err, EXPONENT) / Math.pow(errPrev, BETA) / SAFETY;
    let hNew = h / Math.min(1 / MIN_FACTOR, Math.max(1 / MAX_FACTOR, growth));
    errPrev = Math.max(err, ERR_PREV_FLOOR);
    hNew = Math.min(hNew, maxStep);
    if (previousRejected) hNew = Math.min(hNew, h);
    previousRejected = false;
    h = hNew;
    if (onContinue !== undefined) onContinue(t, ws.y, h, errPrev);
  }
}

interface Counts {
  steps: number;
  rejected: number;
  evaluations: number;
  lastStep: number;
}

function counters(c: Counts): Omit<OutcomeBase, 't' | 'y'> {
  return {
    steps: c.steps,
    rejected: c.rejected,
    evaluations: c.evaluations,
    lastStep: c.lastStep,
  };
}

function snapshot(t: number, y: Float64Array, c: Counts): OutcomeBase {
  return { t, y: y.slice(), ...counters(c) };
}

/** Preallocated buffers of one integrate call. y/y1 and k1/k7 swap roles on acceptance. */
class Workspace {
  y: Float64Array;
  y1: Float64Array;
  k1: Float64Array;
  k7: Float64Array;
  readonly k2: Float64Array;
  readonly k3: Float64Array;
  readonly k4: Float64Array;
  readonly k5: Float64Array;
  readonly k6: Float64Array;
  /** Stage input. */
  readonly stage: Float64Array;
  /** For the event functions during root finding. */
  readonly scratch: Float64Array;
  readonly dense: DopriDenseStep;
  readonly n: number;
  readonly atol: Float64Array;
  readonly rtol: number;

  constructor(n: number, atol: Float64Array, rtol: number) {
    this.n = n;
    this.atol = atol;
    this.rtol = rtol;
    const buffer = () => new Float64Array(n);
    this.y = buffer();
    this.y1 = buffer();
    this.k1 = buffer();
    this.k7 = buffer();
    this.k2 = buffer();
    this.k3 = buffer();
    this.k4 = buffer();
    this.k5 = buffer();
    this.k6 = buffer();
    this.stage = buffer();
    this.scratch = buffer();
    this.dense = new DopriDenseStep(n);
  }

  /** Makes the accepted y1 the current state and its derivative k7 the next k1 (FSAL). */
  advance(): void {
    const y = this.y;
    this.y = this.y1;
    this.y1 = y;
    const k1 = this.k1;
    this.k1 = this.k7;
    this.k7 = k1;
  }
}

/**
 * One DOPRI5 step of size h from (t, ws.y) with ws.k1 = f(t, y): fills k2…k7 and y1 and returns
 * the RMS error norm, or Infinity as soon as a stage input or k7 is not finite.
 */
function attemptStep(f: Derivative, t: number, h: number, ws: Workspace, counts: Counts): number {
  const { n, y, y1, k1, k2, k3, k4, k5, k6, k7, stage, atol, rtol } = ws;
  let probe = 0;

  for (let i = 0; i < n; i++) {
    const v = y[i]! + h * A21 * k1[i]!;
    stage[i] = v;
    probe += v * 0;
  }
  if (probe !== 0) return Infinity;
  f(t + C2 * h, stage, k2);
  counts.evaluations++;

  for (let i = 0; i < n; i++) {
    const v = y[i]! + h * (A31 * k1[i]! + A32 * k2[i]!);
    stage[i] = v;
    probe += v * 0;
  }
  if (probe !== 0) return Infinity;
  f(t + C3 * h, stage, k3);
  counts.evaluations++;

  for (let i = 0; i < n; i++) {
    const v = y[i]! + h * (A41 * k1[i]! + A42 * k2[i]! + A43 * k3[i]!);
    stage[i] = v;
    probe += v * 0;
  }
  if (probe !== 0) return Infinity;
  f(t + C4 * h, stage, k4);
  counts.evaluations++;

  for (let i = 0; i < n; i++) {
    const v = y[i]! + h * (A51 * k1[i]! + A52 * k2[i]! + A53 * k3[i]! + A54 * k4[i]!);
    stage[i] = v;
    probe += v * 0;
  }
  if (probe !== 0) return Infinity;
  f(t + C5 * h, stage, k5);
  counts.evaluations++;

  for (let i = 0; i < n; i++) {
    const v =
      y[i]! + h * (A61 * k1[i]! + A62 * k2[i]! + A63 * k3[i]! + A64 * k4[i]! + A65 * k5[i]!);
    stage[i] = v;
    probe += v * 0;
  }
  if (probe !== 0) return Infinity;
  f(t + h, stage, k6);
  counts.evaluations++;

  for (let i = 0; i < n; i++) {
    const v = y[i]! + h * (B1 * k1[i]! + B3 * k3[i]! + B4 * k4[i]! + B5 * k5[i]! + B6 * k6[i]!);
    y1[i] = v;
    probe += v * 0;
  }
  if (probe !== 0) return Infinity;
  f(t + h, y1, k7);
  counts.evaluations++;

  let sum = 0;
  for (let i = 0; i < n; i++) {
    const k7i = k7[i]!;
    probe += k7i * 0;
    const e = h * (E1 * k1[i]! + E3 * k3[i]! + E4 * k4[i]! + E5 * k5[i]! + E6 * k6[i]! + E7 * k7i);
    const scale = atol[i]! + rtol * Math.max(Math.abs(y[i]!), Math.abs(y1[i]!));
    const ratio = e / scale;
    sum += ratio * ratio;
  }
  if (probe !== 0) return Infinity;
  return Math.sqrt(sum / n);
}

/**
 * Hairer's starting step (Solving ODEs I, §II.4, "Starting step size"), with ws.k1 = f(t, y):
 * h0 = 0.01·‖y‖/‖f‖ (1e-6 if either is tiny), one explicit Euler step to estimate ‖y''‖, then
 * h = min(100·h0, (0.01 / max(‖f‖, ‖y''‖))^(1/5), maxStep). Uses one evaluation of f.
 */
function startingStep(f: Derivative, t: number, ws: Workspace, maxStep: number): number {
  const { n, y, k1, stage, k2, atol, rtol } = ws;
  let dy = 0;
  let df = 0;
  for (let i = 0; i < n; i++) {
    const scale = atol[i]! + rtol * Math.abs(y[i]!);
    dy += (y[i]! / scale) ** 2;
    df += (k1[i]! / scale) ** 2;
  }
  dy = Math.sqrt(dy / n);
  df = Math.sqrt(df / n);
  let h0 = dy < 1e-5 || df < 1e-5 ? 1e-6 : 0.01 * (dy / df);
  h0 = Math.min(h0, maxStep);

  for (let i = 0; i < n; i++) stage[i] = y[i]! + h0 * k1[i]!;
  f(t + h0, stage, k2);
  let d2 = 0;
  for (let i = 0; i < n; i++) {
    const scale = atol[i]! + rtol * Math.abs(y[i]!);
    d2 += ((k2[i]! - k1[i]!) / scale) ** 2;
  }
  d2 = Math.sqrt(d2 / n) / h0;
  if (!Number.isFinite(d2)) return h0;
  const d = Math.max(df, d2);
  const h1 = d <= 1e-15 ? Math.max(1e-6, h0 * 1e-3) : Math.pow(0.01 / d, 1 / 5);
  return Math.min(100 * h0, h1, maxStep);
}

/** The dense output of the latest accepted step (coefficients r1…r5 of the tableau header). */
class DopriDenseStep implements DenseStep {
  t0 = 0;
  t1 = 0;
  private h = 1;
  /** End of the full step, where the interpolant returns y1 exactly. */
  private tStepEnd = 0;
  private yEnd: Float64Array;
  private readonly r1: Float64Array;
  private readonly r2: Float64Array;
  private readonly r3: Float64Array;
  private readonly r4: Float64Array;
  private readonly r5: Float64Array;
  private readonly n: number;

  constructor(n: number) {
    this.n = n;
    this.r1 = new Float64Array(n);
    this.r2 = new Float64Array(n);
    this.r3 = new Float64Array(n);
    this.r4 = new Float64Array(n);
    this.r5 = new Float64Array(n);
    this.yEnd = this.r1;
  }

  /** Builds the interpolant of the step just accepted in ws (before ws.advance()). */
  prepare(ws: Workspace, t0: number, t1: number, h: number): void {
    const { n, y, y1, k1, k3, k4, k5, k6, k7 } = ws;
    const { r1, r2, r3, r4, r5 } = this;
    for (let i = 0; i < n; i++) {
      const y0i = y[i]!;
      const dy = y1[i]! - y0i;
      const bspl = h * k1[i]! - dy;
      r1[i] = y0i;
      r2[i] = dy;
      r3[i] = bspl;
      r4[i] = dy - h * k7[i]! - bspl;
      r5[i] =
        h * (D1 * k1[i]! + D3 * k3[i]! + D4 * k4[i]! + D5 * k5[i]! + D6 * k6[i]! + D7 * k7[i]!);
    }
    this.t0 = t0;
    this.t1 = t1;
    this.h = h;
    this.tStepEnd = t1;
    this.yEnd = y1;
  }

  interpolate(t: number, out: Float64Array): void {
    if (t === this.tStepEnd) {
      out.set(this.yEnd);
      return;
    }
    const theta = (t - this.t0) / this.h;
    const theta1 = 1 - theta;
    const { n, r1, r2, r3, r4, r5 } = this;
    for (let i = 0; i < n; i++) {
      out[i] = r1[i]! + theta * (r2[i]! + theta1 * (r3[i]! + theta * (r4[i]! + theta1 * r5[i]!)));
    }
  }
}

/** Event values and signs between steps, and the location of the earliest crossing. */
class EventTracker {
  /** Value at the start of the current step. */
  private readonly start: Float64Array;
  /** Value at the end of the current step. */
  private readonly end: Float64Array;
  /** Last nonzero sign seen (0 while none has been seen). */
  private readonly sign: Int8Array;
  private readonly fired: Uint8Array;
  private readonly events: readonly EventFunction[];
  private readonly timeTolerance: number | undefined;

  constructor(
    events: readonly EventFunction[],
    t0: number,
    y0: Float64Array,
    timeTolerance: number | undefined,
  ) {
    this.events = events;
    this.timeTolerance = timeTolerance;
    const m = events.length;
    this.start = new Float64Array(m);
    this.end = new Float64Array(m);
    this.sign = new Int8Array(m);
    this.fired = new Uint8Array(m);
    for (let i = 0; i < m; i++) {
      const v = events[i]!.value(t0, y0);
      this.start[i] = v;
      this.sign[i] = v > 0 ? 1 : v < 0 ? -1 : 0;
    }
  }

  /** Evaluates every event at the end of the step; true if one of them fires in the step. */
  valuesAt(t1: number, y1: Float64Array): boolean {
    const { events, end, sign, fired } = this;
    let any = false;
    for (let i = 0; i < events.length; i++) {
      const event = events[i]!;
      const v = event.value(t1, y1);
      end[i] = v;
      const s = sign[i]!;
      const changed = s > 0 ? v <= 0 : s < 0 ? v >= 0 : false;
      const wanted = event.direction === 0 || event.direction === -s;
      fired[i] = changed && wanted ? 1 : 0;
      if (changed && wanted) any = true;
    }
    return any;
  }

  /** Moves the step-end values to the step start (no event fired). */
  commit(): void {
    const { start, end, sign } = this;
    for (let i = 0; i < start.length; i++) {
      const v = end[i]!;
      start[i] = v;
      if (v > 0) sign[i] = 1;
      else if (v < 0) sign[i] = -1;
    }
  }

  /** Narrows every firing event on the dense output; the earliest right bracket end wins. */
  earliest(dense: DopriDenseStep, scratch: Float64Array): { id: string; t: number } | undefined {
    const { events, start, end, fired } = this;
    const a = dense.t0;
    const b = dense.t1;
    const tolerance = this.timeTolerance ?? DEFAULT_EVENT_TOLERANCE * Math.max(1, Math.abs(b));
    let best: { id: string; t: number } | undefined;
    for (let i = 0; i < events.length; i++) {
      if (fired[i] === 0) continue;
      const event = events[i]!;
      const g = (t: number): number => {
        dense.interpolate(t, scratch);
        return event.value(t, scratch);
      };
      const bracket = locateSignChange(g, a, start[i]!, b, end[i]!, tolerance);
      if (best === undefined || bracket.right < best.t) best = { id: event.id, t: bracket.right };
    }
    return best;
  }
}

function allFinite(v: Float64Array): boolean {
  let probe = 0;
  for (let i = 0; i < v.length; i++) probe += v[i]! * 0;
  return probe === 0;
}

function perComponent(atol: number | Float64Array, n: number): Float64Array {
  return typeof atol === 'number' ? new Float64Array(n).fill(atol) : Float64Array.from(atol);
}

function validate(t0: number, y0: Float64Array, tEnd: number, o: IntegrateOptions): void {
  const fail = (what: string): never => {
    throw new IntegrateArgumentError(`integrate: ${what}`);
  };
  if (!Number.isFinite(t0) || !Number.isFinite(tEnd) || !(tEnd >= t0)) {
    fail(`needs finite t0 ≤ tEnd (got t0 = ${t0}, tEnd = ${tEnd}); it integrates forward only`);
  }
  if (y0.length === 0) fail('y0 is empty; pass at least one state variable');
  if (!allFinite(y0)) fail(`y0 has a non-finite component (${Array.from(y0).join(', ')})`);
  if (!(o.rtol >= 0 && Number.isFinite(o.rtol))) {
    fail(`rtol must be a finite number ≥ 0 (got ${o.rtol})`);
  }
  const atol = typeof o.atol === 'number' ? [o.atol] : Array.from(o.atol);
  if (typeof o.atol !== 'number' && atol.length !== y0.length) {
    fail(`atol has ${atol.length} components for ${y0.length} state variables`);
  }
  if (!atol.every((a) => a > 0 && Number.isFinite(a))) {
    fail(`atol must be finite and > 0 in every component (got ${atol.join(', ')})`);
  }
  if (o.initialStep !== undefined && !(o.initialStep >= 0 && Number.isFinite(o.initialStep))) {
    fail(`initialStep must be finite and ≥ 0, 0 meaning "choose" (got ${o.initialStep})`);
  }
  if (o.errPrev !== undefined && !(o.errPrev > 0 && Number.isFinite(o.errPrev))) {
    fail(`errPrev must be finite and > 0 (got ${o.errPrev})`);
  }
  if (o.maxStep !== undefined && !(o.maxStep > 0)) {
    fail(`maxStep must be > 0 (got ${o.maxStep})`);
  }
  if (o.maxSteps !== undefined && !(Number.isInteger(o.maxSteps) && o.maxSteps > 0)) {
    fail(`maxSteps must be a positive integer (got ${o.maxSteps})`);
  }
  if (o.eventTimeTolerance !== undefined && !(o.eventTimeTolerance > 0)) {
    fail(`eventTimeTolerance must be > 0 (got ${o.eventTimeTolerance})`);
  }
}
