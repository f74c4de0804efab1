import { describe, expect, it } from 'vitest';
import {
  integrate,
  IntegrateArgumentError,
  type DenseStep,
  type Derivative,
  type EventFunction,
  type IntegrateOutcome,
} from '../../generator/numerics/dormand-prince.ts';

// Every expected value below is a closed-form solution, named where it is used. Tolerances are
// stated as multiples of the requested tolerance: the integrator controls the local error
// atol + rtol·|y| per step, and for these non-stiff problems the global error stays within a
// small multiple of it (measured: ≤ 2.4× at tEnd, ≤ 6.3× for the dense output at mid-step
// points; the bounds below, 10× and 25×, leave about 4× of room).

function expectWithin(actual: number, expected: number, tolerance: number, label: string): void {
  expect(
    Math.abs(actual - expected),
    `${label}: actual ${actual}, expected ${expected}, tolerance ${tolerance}`,
  ).toBeLessThanOrEqual(tolerance);
}

const RTOLS = [1e-4, 1e-6, 1e-8] as const;
/** atol relative to rtol, so that the relative part governs wherever |y| ≳ 1e-3. */
const ATOL_PER_RTOL = 1e-3;
const END_FACTOR = 10;
const DENSE_FACTOR = 25;

interface ClosedForm {
  readonly name: string;
  readonly f: Derivative;
  readonly t0: number;
  readonly tEnd: number;
  readonly exact: (t: number) => number[];
  /** Size the error is measured against: |y| for monotone solutions, the amplitude for
   * oscillating ones (relative error means nothing at a zero crossing). */
  readonly magnitude: (t: number) => number[];
}

const decay: ClosedForm = {
  name: "y' = −0.7y, y(0) = 1 → e^(−0.7t)",
  f: (_t, y, dy) => {
    dy[0] = -0.7 * y[0]!;
  },
  t0: 0,
  tEnd: 10,
  exact: (t) => [Math.exp(-0.7 * t)],
  magnitude: (t) => [Math.exp(-0.7 * t)],
};
const logistic: ClosedForm = {
  name: "y' = 2y(1 − y/10), y(0) = 0.1 → 10/(1 + 99e^(−2t))",
  f: (_t, y, dy) => {
    dy[0] = 2 * y[0]! * (1 - y[0]! / 10);
  },
  t0: 0,
  tEnd: 8,
  exact: (t) => [10 / (1 + 99 * Math.exp(-2 * t))],
  magnitude: (t) => [10 / (1 + 99 * Math.exp(-2 * t))],
};
const cosine: ClosedForm = {
  name: "y' = cos t, y(0) = 0 → sin t",
  f: (t, _y, dy) => {
    dy[0] = Math.cos(t);
  },
  t0: 0,
  tEnd: 10,
  exact: (t) => [Math.sin(t)],
  magnitude: () => [1],
};
const oscillator: ClosedForm = {
  name: "x'' = −x as (x, v), x(0) = 1, v(0) = 0 → (cos t, −sin t)",
  f: (_t, y, dy) => {
    dy[0] = y[1]!;
    dy[1] = -y[0]!;
  },
  t0: 0,
  tEnd: 20,
  exact: (t) => [Math.cos(t), -Math.sin(t)],
  magnitude: () => [1, 1],
};

function run(problem: ClosedForm, rtol: number, onStep?: (s: DenseStep) => void) {
  const y0 = Float64Array.from(problem.exact(problem.t0));
  return integrate(problem.f, problem.t0, y0, problem.tEnd, {
    rtol,
    atol: ATOL_PER_RTOL * rtol,
    ...(onStep ? { onStep } : {}),
  });
}

/** Largest |error| / (atol + rtol·magnitude) over the components: 1 is the per-step allowance. */
function scaledError(problem: ClosedForm, y: ArrayLike<number>, t: number, rtol: number): number {
  const size = problem.magnitude(t);
  return Math.max(
    ...problem
      .exact(t)
      .map((e, i) => Math.abs(y[i]! - e) / (ATOL_PER_RTOL * rtol + rtol * size[i]!)),
  );
}

function oscillatorInvariants(y: Float64Array, t: number): { energy: number; phase: number } {
  // Closed form: energy (x² + v²)/2 = 1/2, phase atan2(−v, x) = t (mod 2π).
  const energy = (y[0]! ** 2 + y[1]! ** 2) / 2;
  const turns = Math.round((t - Math.atan2(-y[1]!, y[0]!)) / (2 * Math.PI));
  return { energy, phase: Math.atan2(-y[1]!, y[0]!) + 2 * Math.PI * turns };
}

function expectKind<K extends IntegrateOutcome['kind']>(
  o: IntegrateOutcome,
  kind: K,
): asserts o is Extract<IntegrateOutcome, { kind: K }> {
  expect(o.kind, `outcome kind (t = ${o.t}, steps ${o.steps})`).toBe(kind);
}

describe('integrate — global error at tEnd against closed forms', () => {
  for (const problem of [decay, logistic, cosine]) {
    it.each(RTOLS)(`integrate(${problem.name}, rtol %s) is within 10·tol at tEnd`, (rtol) => {
      const o = run(problem, rtol);
      expectKind(o, 'finished');
      const err = scaledError(problem, o.y, o.t, rtol);
      expect(err, `${problem.name}, rtol ${rtol}: scaled error at t = ${o.t}`).toBeLessThanOrEqual(
        END_FACTOR,
      );
    });
  }

  it.each(RTOLS)(
    `integrate(${oscillator.name}, rtol %s) keeps energy and phase to 10·rtol`,
    (rtol) => {
      const o = run(oscillator, rtol);
      expectKind(o, 'finished');
      const { energy, phase } = oscillatorInvariants(o.y, o.t);
      expectWithin(energy, 0.5, END_FACTOR * rtol, `energy at t = ${o.t}, rtol ${rtol}`);
      expectWithin(phase, o.t, END_FACTOR * rtol, `phase at t = ${o.t}, rtol ${rtol}`);
    },
  );

  for (const problem of [decay, logistic, cosine, oscillator]) {
    it(`integrate(${problem.name}) error falls ≥ 10× per 100× smaller rtol`, () => {
      const errors = RTOLS.map((rtol) => {
        const o = run(problem, rtol);
        const exact = problem.exact(o.t);
        return Math.max(...exact.map((e, i) => Math.abs(o.y[i]! - e)));
      });
      for (let k = 1; k < errors.length; k++) {
        expect(
          errors[k - 1]! / errors[k]!,
          `error ratio rtol ${RTOLS[k - 1]} → ${RTOLS[k]} (errors ${errors.join(', ')})`,
        ).toBeGreaterThanOrEqual(10);
      }
    });
  }
});

describe('integrate — dense output against closed forms', () => {
  for (const problem of [decay, logistic, cosine, oscillator]) {
    it.each(RTOLS)(
      `interpolate(${problem.name}, rtol %s) at θ = ¼, ½, ¾ of every step is within 25·tol`,
      (rtol) => {
        const out = new Float64Array(problem.exact(0).length);
        let worst = 0;
        let where = NaN;
        const o = run(problem, rtol, (step) => {
          for (const theta of [0.25, 0.5, 0.75]) {
            const t = step.t0 + theta * (step.t1 - step.t0);
            step.interpolate(t, out);
            const err = scaledError(problem, out, t, rtol);
            if (err > worst) [worst, where] = [err, t];
          }
        });
        expectKind(o, 'finished');
        expect(
          worst,
          `${problem.name}, rtol ${rtol}: worst scaled dense error (t = ${where})`,
        ).toBeLessThanOrEqual(DENSE_FACTOR);
      },
    );
  }

  it("interpolate(y' = 4t³) reproduces t⁴ to rounding (the extension is exact for cubic integrands)", () => {
    const out = new Float64Array(1);
    let worst = 0;
    integrate((t, _y, dy) => void (dy[0] = 4 * t ** 3), 0, new Float64Array(1), 2, {
      rtol: 1e-3,
      atol: 1e-3,
      initialStep: 0.5,
      maxStep: 0.5,
      onStep: (step) => {
        for (const theta of [0.1, 0.3, 0.5, 0.9]) {
          const t = step.t0 + theta * (step.t1 - step.t0);
          step.interpolate(t, out);
          worst = Math.max(worst, Math.abs(out[0]! - t ** 4));
        }
      },
    });
    expectWithin(worst, 0, 1e-14 * 16, 'worst |interpolant − t⁴| on [0, 2]');
  });

  it('onStep(step) is called once per accepted step, contiguous from t0 to tEnd', () => {
    const spans: [number, number][] = [];
    const o = run(oscillator, 1e-6, (step) => spans.push([step.t0, step.t1]));
    expectKind(o, 'finished');
    expect(spans.length, 'calls vs accepted steps').toBe(o.steps);
    expect(spans[0]![0], 'first t0').toBe(oscillator.t0);
    expect(spans.at(-1)![1], 'last t1').toBe(oscillator.tEnd);
    spans
      .slice(1)
      .forEach(([t0], k) => expect(t0, `step ${k + 1} starts where ${k} ended`).toBe(spans[k]![1]));
  });
});

describe('integrate — events', () => {
  const x: (direction: 1 | -1 | 0, id?: string) => EventFunction = (direction, id = 'x = 0') => ({
    id,
    value: (_t, y) => y[0]!,
    direction,
  });
  const oscillate = (
    t0: number,
    y0: number[],
    tEnd: number,
    events: EventFunction[],
    extra: { initialStep?: number; rtol?: number; onStep?: (s: DenseStep) => void } = {},
  ) =>
    integrate(oscillator.f, t0, Float64Array.from(y0), tEnd, {
      rtol: extra.rtol ?? 1e-12,
      atol: 1e-14,
      events,
      eventTimeTolerance: 1e-9,
      ...(extra.initialStep !== undefined ? { initialStep: extra.initialStep } : {}),
      ...(extra.onStep ? { onStep: extra.onStep } : {}),
    });
  // State error at rtol 1e-12 moves the root by ≲ 1e-11; the bracket adds ≤ eventTimeTolerance.
  const EVENT_SLACK = 1e-9 + 1e-11;

  // closed form: x = cos t is zero at π/2 and 3π/2
  it('integrate(x = cos t, event x = 0 downward) stops at π/2 within eventTimeTolerance', () => {
    const o = oscillate(0, [1, 0], 10, [x(-1)]);
    expectKind(o, 'event');
    expect(o.eventId).toBe('x = 0');
    expectWithin(o.t, Math.PI / 2, EVENT_SLACK, 'event time vs π/2');
    expect(o.y[0], `x(t = ${o.t}) already has its new sign`).toBeLessThanOrEqual(0);
    expectWithin(o.y[1]!, -1, 1e-10, 'v at the event vs −sin(π/2)');
  });

  // closed form: x = cos t is zero at π/2 and 3π/2
  it('integrate(x = cos t, event x = 0 upward) ignores π/2 and stops at 3π/2', () => {
    const o = oscillate(0, [1, 0], 10, [x(1)]);
    expectKind(o, 'event');
    expectWithin(o.t, (3 * Math.PI) / 2, EVENT_SLACK, 'event time vs 3π/2');
    expect(o.y[0], `x(t = ${o.t}) already has its new sign`).toBeGreaterThanOrEqual(0);
  });

  it("integrate(y' = 1, events y = 0.7 and y = 0.4 in one step) returns the earliest", () => {
    const spans: [number, number][] = [];
    const level = (c: number): EventFunction => ({
      id: `y = ${c}`,
      value: (_t, y) => y[0]! - c,
      direction: 0,
    });
    const o = integrate((_t, _y, dy) => void (dy[0] = 1), 0, new Float64Array(1), 1, {
      rtol: 1e-6,
      atol: 1e-9,
      initialStep: 1,
      events: [level(0.7), level(0.4)],
      onStep: (s) => spans.push([s.t0, s.t1]),
    });
    expectKind(o, 'event');
    expect(o.steps, 'both crossings lie in the single step [0, 1]').toBe(1);
    expect(o.eventId).toBe('y = 0.4');
    expectWithin(o.t, 0.4, 1e-9, 'event time vs 0.4 (closed form y = t)');
    expect(spans, 'onStep ends at the event time').toEqual([[0, o.t]]);
  });

  // closed form: x = cos t is zero at π/2
  it('integrate(from x(π/2) = 0 exactly, event x = 0 either way) does not fire at t0', () => {
    const o = oscillate(Math.PI / 2, [0, -1], 10, [x(0)]);
    expectKind(o, 'event');
    expectWithin(o.t, (3 * Math.PI) / 2, EVENT_SLACK, 'first firing vs 3π/2');
  });

  it('integrate(restart from the event with lastStep) continues to the closed form', () => {
    const first = oscillate(0, [1, 0], 10, [x(-1)], { rtol: 1e-8 });
    expectKind(first, 'event');
    expect(first.lastStep, 'lastStep of the event step').toBeGreaterThan(0);
    const second = oscillate(first.t, Array.from(first.y), 10, [x(0)], {
      rtol: 1e-8,
      initialStep: first.lastStep,
    });
    expectKind(second, 'event');
    expectWithin(second.t, (3 * Math.PI) / 2, 1e-9 + 1e-7, 'next crossing vs 3π/2');
    const third = oscillate(second.t, Array.from(second.y), 10, [], {
      rtol: 1e-8,
      initialStep: second.lastStep,
    });
    expectKind(third, 'finished');
    expectWithin(third.y[0]!, Math.cos(10), END_FACTOR * 1e-8, 'x(10) vs cos 10');
    expectWithin(third.y[1]!, -Math.sin(10), END_FACTOR * 1e-8, 'v(10) vs −sin 10');
  });
});

describe('integrate — outcomes', () => {
  // own rule: the integrator's contract, not an outside value
  it('integrate(maxSteps 3) returns step-limit with a consistent state', () => {
    const o = integrate(decay.f, 0, Float64Array.of(1), 10, {
      rtol: 1e-8,
      atol: 1e-12,
      maxSteps: 3,
    });
    expectKind(o, 'step-limit');
    expect(o.steps + o.rejected, 'accepted + rejected').toBe(3);
    expect(o.t, 'stopped before tEnd').toBeLessThan(10);
    expectWithin(o.y[0]!, Math.exp(-0.7 * o.t), 1e-7, `y(${o.t}) vs e^(−0.7t)`);
  });

  // own rule: the integrator's contract, not an outside value
  it('integrate(tEnd = 10.3) finishes at tEnd exactly', () => {
    const tEnd = 0.1 * 103;
    const o = integrate(decay.f, 0, Float64Array.of(1), tEnd, { rtol: 1e-6, atol: 1e-12 });
    expectKind(o, 'finished');
    expect(o.t).toBe(tEnd);
    expectWithin(o.y[0]! / Math.exp(-0.7 * tEnd), 1, END_FACTOR * 1e-6, 'y(tEnd)/e^(−0.7·tEnd)');
  });

  // own rule: the integrator's contract, not an outside value
  it('integrate(t0 = tEnd) finishes at once with y0', () => {
    const o = integrate(decay.f, 3, Float64Array.of(2), 3, { rtol: 1e-6, atol: 1e-9 });
    expectKind(o, 'finished');
    expect([o.t, o.y[0], o.steps, o.evaluations]).toEqual([3, 2, 0, 0]);
  });

  // own rule: the integrator's contract, not an outside value
  it('integrate(f = NaN past t = 2) ends in step-underflow just before 2, without throwing', () => {
    const f: Derivative = (t, y, dy) => {
      dy[0] = t > 2 ? NaN : -0.7 * y[0]!;
    };
    const o = integrate(f, 0, Float64Array.of(1), 10, { rtol: 1e-6, atol: 1e-12 });
    expectKind(o, 'step-underflow');
    expect(o.t, 't never passes the bad region').toBeLessThanOrEqual(2);
    expectWithin(o.t, 2, 1e-12, 'stopped where f went bad');
    expectWithin(o.y[0]! / Math.exp(-0.7 * o.t), 1, 1e-5, 'y(t)/e^(−0.7t) at the stop');
    expect(o.evaluations, 'evaluations (bounded)').toBeLessThan(10_000);
  });

  it('integrate(f = NaN everywhere) returns step-underflow with no step taken', () => {
    const o = integrate((_t, _y, dy) => dy.fill(NaN), 0, Float64Array.of(1), 1, {
      rtol: 1e-6,
      atol: 1e-9,
    });
    expectKind(o, 'step-underflow');
    expect([o.t, o.y[0], o.steps]).toEqual([0, 1, 0]);
  });

  // own rule: the integrator's contract, not an outside value
  it('integrate(maxStep 0.25) never takes a longer step', () => {
    let longest = 0;
    const o = integrate(decay.f, 0, Float64Array.of(1), 10, {
      rtol: 1e-4,
      atol: 1e-8,
      maxStep: 0.25,
      onStep: (s) => void (longest = Math.max(longest, s.t1 - s.t0)),
    });
    expectKind(o, 'finished');
    expect(longest, 'longest step vs maxStep 0.25').toBeLessThanOrEqual(0.25);
    expect(o.lastStep, 'lastStep vs maxStep 0.25').toBeLessThanOrEqual(0.25);
  });

  // own rule: the integrator's contract, not an outside value
  it('integrate(atol per component) takes a Float64Array and refuses one of the wrong length', () => {
    const atol = Float64Array.of(1e-12, 1e-12);
    const o = integrate(oscillator.f, 0, Float64Array.of(1, 0), 20, { rtol: 1e-8, atol });
    expectKind(o, 'finished');
    expectWithin(o.y[0]!, Math.cos(20), END_FACTOR * 1e-8, 'x(20) vs cos 20');
    const short = { rtol: 1e-8, atol: Float64Array.of(1e-12) };
    expect(() => integrate(oscillator.f, 0, Float64Array.of(1, 0), 20, short)).toThrow(
      IntegrateArgumentError,
    );
  });

  // own rule: the integrator's contract, not an outside value
  it('integrate(tEnd < t0) throws IntegrateArgumentError (a programming error, not an outcome)', () => {
    expect(() => integrate(decay.f, 1, Float64Array.of(1), 0, { rtol: 1e-6, atol: 1e-9 })).toThrow(
      IntegrateArgumentError,
    );
  });
});

describe('integrate — stiff-ish sanity', () => {
  it("integrate(y' = −50(y − cos t), y(0) = 0) finishes at the closed form, stability-limited", () => {
    // Closed form: y = (2500 cos t + 50 sin t)/2501 − (2500/2501)·e^(−50t).
    const exact = (t: number): number =>
      (2500 * Math.cos(t) + 50 * Math.sin(t)) / 2501 - (2500 / 2501) * Math.exp(-50 * t);
    const rtol = 1e-6;
    const o = integrate(
      (t, y, dy) => void (dy[0] = -50 * (y[0]! - Math.cos(t))),
      0,
      Float64Array.of(0),
      10,
      {
        rtol,
        atol: 1e-9,
      },
    );
    expectKind(o, 'finished');
    expectWithin(o.y[0]!, exact(10), END_FACTOR * (rtol * Math.abs(exact(10)) + 1e-9), 'y(10)');
    // source: Hairer, Nørsett & Wanner, Solving Ordinary Differential Equations I, §II.5 / §IV.2
    // (DOPRI5's stability region reaches about −3.3 on the real axis): at least 10·50/3.4 ≈ 147 steps.
    expect(o.steps, 'accepted steps').toBeGreaterThanOrEqual(147);
  });
});
