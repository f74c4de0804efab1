/**
 * chartRuntime / renderChartSvg against the reference: vega-lite's compile and vega's
 * parse run afresh on every spec (what the chart step did before the shape cache), on
 * real plans of the demo content. A reference comparison, not a snapshot: both sides are
 * computed in the test.
 */
import * as vega from 'vega';
import { compile, type TopLevelSpec } from 'vega-lite';
import { beforeAll, describe, expect, it } from 'vitest';
import type { UnitSystem } from '../../generator/content/types.ts';
import type { AcceptedPlan } from '../../generator/planning/types.ts';
import { cupChartSpec, renderChartSvg } from '../../generator/render/chart.ts';
import {
  MAX_SHAPES,
  chartRuntime,
  chartRuntimeCounts,
} from '../../generator/render/chart-runtime.ts';
import { useFontMetricsInVega } from '../../generator/render/text-measure.ts';
import { demoCatalogue, plan } from './demo.ts';

/** The chart step as it was: compile, parse and render every spec from scratch. */
async function freshSvg(spec: TopLevelSpec): Promise<string> {
  useFontMetricsInVega();
  const view = new vega.View(vega.parse(compile(spec).spec), { renderer: 'none' });
  try {
    vega.resetSVGDefIds();
    const svg = await view.toSVG();
    return svg.replace('<svg ', '<svg preserveAspectRatio="xMinYMin meet" ');
  } finally {
    view.finalize();
  }
}

const specOf = (p: AcceptedPlan, units: UnitSystem): TopLevelSpec =>
  cupChartSpec({ units, plan: p.brew.cupCurve, cold: p.coldBrew.cupCurve, bandK: p.targetBandK });

/** A deep copy: a spec's rows are marked with vega tuple ids once rendered. */
const copy = (spec: TopLevelSpec): TopLevelSpec => JSON.parse(JSON.stringify(spec)) as TopLevelSpec;

let plans: AcceptedPlan[];

beforeAll(async () => {
  const catalogue = await demoCatalogue();
  const seen = new Set<string>();
  plans = [];
  // Accepted plans of different pots, coffees (target bands) and stoves, up to five.
  for (const set of catalogue.site.sets) {
    for (const request of set.cards) {
      const id = `${request.potId}|${request.coffeeId}|${request.stoveId}`;
      if (seen.has(id) || plans.length >= 5) continue;
      seen.add(id);
      const p = plan(catalogue, request);
      if (p.refused === null) plans.push(p);
    }
  }
  if (plans.length < 3) throw new Error(`only ${plans.length} demo cards have a recipe`);
});

describe('renderChartSvg(spec) against a fresh compile of the same spec', () => {
  it('gives the same SVG for every demo plan, in both unit systems, from the shape cache', async () => {
    for (const units of ['metric', 'us'] as const) {
      for (const p of plans) {
        // Twice: the first spec of a shape makes its template, the second is filled from it.
        for (let i = 0; i < 2; i++) {
          const before = chartRuntimeCounts().templated;
          const fast = await renderChartSvg(specOf(p, units));
          const fromTemplate = chartRuntimeCounts().templated === before + 1;
          const reference = await freshSvg(specOf(p, units));
          expect(fast, `${p.potId} ${p.coffeeId} ${p.stoveId} ${units}`).toBe(reference);
          if (i === 1) expect(fromTemplate, 'the second render came from a template').toBe(true);
        }
      }
    }
  });

  it('gives the same runtime as vega.parse(compile(spec).spec), operator for operator', () => {
    for (const p of plans) {
      const spec = specOf(p, 'metric');
      chartRuntime(copy(spec)); // make sure the shape has its template
      expect(chartRuntime(copy(spec))).toEqual(vega.parse(compile(copy(spec)).spec));
    }
  });

  it('is not changed by the charts drawn before it (the template stays as made)', async () => {
    const [a, b] = plans;
    const first = await renderChartSvg(specOf(a!, 'metric'));
    await renderChartSvg(specOf(b!, 'metric'));
    await renderChartSvg(specOf(b!, 'us'));
    expect(await renderChartSvg(specOf(a!, 'metric'))).toBe(first);
  });
});

describe('chartRuntime(spec) shapes', () => {
  /** The line layer's x domain set to `domain`. */
  const withXDomain = (spec: TopLevelSpec, domain: number[]): TopLevelSpec => {
    const out = copy(spec) as unknown as {
      layer: { encoding: { x?: { scale: { domain: number[] } } } }[];
    };
    out.layer[1]!.encoding.x!.scale.domain = domain;
    return out as unknown as TopLevelSpec;
  };

  it('a domain that no longer spans zero is compiled as its own shape (vega-lite drops zero)', async () => {
    const spec = specOf(plans[0]!, 'metric');
    await renderChartSvg(withXDomain(spec, [0, 40]));
    await renderChartSvg(withXDomain(spec, [0, 55]));
    for (const domain of [
      [5, 40],
      [-10, 40],
      [-20, -10],
    ]) {
      const changed = withXDomain(spec, domain);
      expect(chartRuntime(copy(changed)), `x domain ${domain}`).toEqual(
        vega.parse(compile(copy(changed)).spec),
      );
      expect(await renderChartSvg(copy(changed))).toBe(await freshSvg(copy(changed)));
    }
  });

  it('a single view with a three-value domain and -0 is filled like a fresh compile', async () => {
    const single = (rows: { a: number; b: number }[], domain: number[]) =>
      ({
        data: { values: rows },
        mark: 'line',
        encoding: {
          x: { field: 'a', type: 'quantitative', scale: { domain } },
          y: { field: 'b', type: 'quantitative', scale: { domain: [1, 2.5, 7] } },
        },
      }) as TopLevelSpec;
    const specs = [
      single([{ a: 1, b: 2 }], [-0, 5]),
      single(
        [
          { a: 1, b: 2 },
          { a: 3, b: 6 },
        ],
        [-1, 4],
      ),
      single([{ a: 2, b: 3 }], [0, 9]),
    ];
    const before = chartRuntimeCounts().templated;
    for (const spec of specs) {
      expect(chartRuntime(copy(spec))).toEqual(vega.parse(compile(copy(spec)).spec));
      expect(await renderChartSvg(copy(spec))).toBe(await freshSvg(copy(spec)));
    }
    expect(chartRuntimeCounts().templated).toBeGreaterThan(before);
  });

  it('two layers with equal inline data (merged by vega-lite) give the fresh result', async () => {
    const spec = copy(specOf(plans[0]!, 'metric')) as unknown as {
      layer: { data: { values: unknown[] } }[];
    };
    spec.layer[0]!.data.values = JSON.parse(JSON.stringify(spec.layer[1]!.data.values));
    const merged = spec as unknown as TopLevelSpec;
    expect(chartRuntime(copy(merged))).toEqual(vega.parse(compile(copy(merged)).spec));
  });

  it(`holds at most MAX_SHAPES (${MAX_SHAPES}) shapes however many it sees`, () => {
    const spec = specOf(plans[0]!, 'metric');
    for (let width = 200; width < 200 + MAX_SHAPES + 8; width++) {
      chartRuntime({ ...copy(spec), width } as TopLevelSpec);
      expect(chartRuntimeCounts().shapes).toBeLessThanOrEqual(MAX_SHAPES);
    }
  });
});
