/**
 * Vega runtimes of chart specs, compiled once per shape. One card's chart differs from the
 * next card's only in its inline data and its numeric scale domains, and vega-lite's
 * compile and vega's parse (about half of a chart's cost) pass both through untouched,
 * with two exceptions that go into the shape's key: identical inline data sets are merged
 * into one source, and a domain whose first value is ≤ 0 and last ≥ 0 keeps the scale's
 * zero (vega-lite: compile/data/optimizers findSource, compile/scale/properties zero,
 * ScaleComponent.domainHasZero).
 *
 *   vega-lite spec ─ holes cut out (each data.values, each numeric scale.domain) ─▶ shape key
 *     ─ once per shape: compile + vega.parse a copy whose holes hold markers ─▶ template
 *     ─ each chart: the spec's own holes put back into the template ─▶ vega runtime,
 *       equal to vega.parse(compile(spec).spec)
 *
 * A template is checked when it is made: the first spec of its shape, put into it, must give
 * exactly the runtime a fresh compile and parse give, or that shape is compiled afresh
 * every time; so is any spec whose holes do not come out as expected. Each chart gets its
 * own copy of the template and its own View: a View marks some of its runtime's objects
 * (the guides' data rows get tuple ids), and a View reused across charts keeps its
 * scenegraph items, so one chart's SVG could depend on the chart before.
 */
import { isDeepStrictEqual } from 'node:util';
import * as vega from 'vega';
import { compile, type TopLevelSpec } from 'vega-lite';

type Hole =
  | { readonly kind: 'values'; readonly values: readonly unknown[] }
  | { readonly kind: 'domain'; readonly domain: readonly number[] };

/** Operator `operator` of the template takes hole `hole` of the spec. */
interface Patch {
  readonly operator: number;
  readonly hole: number;
}

interface Template {
  readonly runtime: vega.Runtime;
  /** Collect operators whose `value.$ingest` is a spec's inline data. */
  readonly ingest: readonly Patch[];
  /** Scale operators whose `params.domain` is a spec's numeric domain. */
  readonly domains: readonly Patch[];
}

/** Shapes kept; past this the cache starts again (a site has a few, one per band and units). */
export const MAX_SHAPES = 64;

/** Template of each shape key; null for a shape that is always compiled afresh. */
const templates = new Map<string, Template | null>();
const counts = { templated: 0, compiled: 0 };

const MARK = '\u0000stovecard-hole';

function isRecord(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

const isFiniteNumber = (v: unknown): v is number => typeof v === 'number' && Number.isFinite(v);

/** Inline data sets and numeric domains (two values or more) of a single or layered view. */
function holesOf(spec: unknown): Hole[] {
  const holes: Hole[] = [];
  const visit = (node: unknown): void => {
    if (!isRecord(node)) return;
    const data = node['data'];
    if (isRecord(data) && Array.isArray(data['values'])) {
      holes.push({ kind: 'values', values: data['values'] });
    }
    const encoding = node['encoding'];
    if (isRecord(encoding)) {
      for (const channel of Object.values(encoding)) {
        const scale = isRecord(channel) ? channel['scale'] : undefined;
        const domain = isRecord(scale) ? scale['domain'] : undefined;
        if (Array.isArray(domain) && domain.length >= 2 && domain.every(isFiniteNumber)) {
          holes.push({ kind: 'domain', domain });
        }
      }
    }
    const layer = node['layer'];
    if (Array.isArray(layer)) layer.forEach(visit);
  };
  visit(spec);
  return holes;
}

const holeObject = (hole: Hole): object => (hole.kind === 'values' ? hole.values : hole.domain);

/** JSON data equality as vega-lite's deepEqual sees it (key order does not count). */
function sameData(a: unknown, b: unknown): boolean {
  if (a === b) return true;
  if (Array.isArray(a) || Array.isArray(b)) {
    if (!Array.isArray(a) || !Array.isArray(b) || a.length !== b.length) return false;
    return a.every((v, i) => sameData(v, b[i]));
  }
  if (isRecord(a) && isRecord(b)) {
    const keys = Object.keys(a);
    if (keys.length !== Object.keys(b).length) return false;
    return keys.every((k) => Object.hasOwn(b, k) && sameData(a[k], b[k]));
  }
  return Number.isNaN(a) && Number.isNaN(b);
}

/** Holes that can be cut out: each its own object, no two inline data sets equal. */
function separable(holes: readonly Hole[]): boolean {
  if (new Set(holes.map(holeObject)).size !== holes.length) return false;
  const data = holes.filter((h) => h.kind === 'values');
  return data.every((h, i) => data.slice(i + 1).every((o) => !sameData(h.values, o.values)));
}

/** The spec as JSON with each hole replaced by `fill(hole, index)`. */
function withHoles(
  spec: TopLevelSpec,
  holes: readonly Hole[],
  fill: (hole: Hole, i: number) => unknown,
) {
  const index = new Map<object, number>(holes.map((h, i) => [holeObject(h), i]));
  return JSON.stringify(spec, (_key, value: unknown) => {
    const i = typeof value === 'object' && value !== null ? index.get(value) : undefined;
    return i === undefined ? value : fill(holes[i]!, i);
  });
}

/** What of a hole the compile can depend on: for a domain, its length and whether it spans 0. */
function shapeKey(spec: TopLevelSpec, holes: readonly Hole[]): string {
  return withHoles(spec, holes, (hole, i) =>
    hole.kind === 'values'
      ? { [MARK]: i }
      : { [MARK]: i, length: hole.domain.length, ...zeroClass(hole.domain) },
  );
}

function zeroClass(domain: readonly number[]) {
  return { firstAtMostZero: domain[0]! <= 0, lastAtLeastZero: domain[domain.length - 1]! >= 0 };
}

/**
 * A marker number for element `j` of domain hole `i`: unique digits, the sign the compile
 * reads kept (first element ≤ 0 stays ≤ 0, last ≥ 0 stays ≥ 0).
 */
function marker(domain: readonly number[], i: number, j: number): number {
  const magnitude = 7e9 + i * 1000 + j + 0.25;
  const { firstAtMostZero, lastAtLeastZero } = zeroClass(domain);
  if (j === 0) return firstAtMostZero ? -magnitude : magnitude;
  if (j === domain.length - 1) return lastAtLeastZero ? magnitude : -magnitude;
  return magnitude;
}

/** A template made from the spec with markers in its holes, or null if they do not come out whole. */
function makeTemplate(spec: TopLevelSpec, holes: readonly Hole[]): Template | null {
  const marked = JSON.parse(
    withHoles(spec, holes, (hole, i) =>
      hole.kind === 'values'
        ? [{ [MARK]: i }]
        : hole.domain.map((_, j) => marker(hole.domain, i, j)),
    ),
  ) as TopLevelSpec;
  const markedHoles = holesOf(marked);
  if (markedHoles.length !== holes.length) return null;
  const runtime = vega.parse(compile(marked).spec);
  const ingest: Patch[] = [];
  const domains: Patch[] = [];
  runtime.operators.forEach((op, operator) => {
    const value = (op as { value?: { $ingest?: unknown } }).value;
    const ingested = isRecord(value) ? value['$ingest'] : undefined;
    const hole = markedHoles.findIndex((h) => h.kind === 'values' && h.values === ingested);
    if (hole >= 0) ingest.push({ operator, hole });
    const domain = op.type === 'scale' ? op.params?.['domain'] : undefined;
    if (Array.isArray(domain)) {
      const found = markedHoles.findIndex(
        (h) => h.kind === 'domain' && isDeepStrictEqual(h.domain, domain),
      );
      if (found >= 0) domains.push({ operator, hole: found });
    }
  });
  const patched = new Set([...ingest, ...domains].map((p) => p.hole));
  if (patched.size !== holes.length || ingest.length + domains.length !== holes.length) return null;
  // No marker copied anywhere else (into an expression, a signal, an axis).
  const text = JSON.stringify(runtime);
  for (const hole of markedHoles) {
    if (hole.kind !== 'domain') continue;
    for (const v of hole.domain) {
      if (text.split(String(Math.abs(v))).length !== 2) return null;
    }
  }
  return { runtime, ingest, domains };
}

/**
 * A deep copy that keeps each object's prototype (vega-parser's operators are `Entry`
 * objects). A View takes some of its runtime's objects as its own (the guides' data rows
 * get tuple ids), so no two Views are given the same objects.
 */
function deepCopy<T>(value: T): T {
  if (typeof value !== 'object' || value === null) return value;
  if (Array.isArray(value)) return value.map(deepCopy) as T;
  const out = Object.create(Object.getPrototypeOf(value) as object | null) as Record<
    string,
    unknown
  >;
  for (const key of Object.keys(value))
    out[key] = deepCopy((value as Record<string, unknown>)[key]);
  return out as T;
}

/** A copy of the template's runtime with `holes` put in (the template itself is never run). */
function fill(template: Template, holes: readonly Hole[]): vega.Runtime {
  const runtime = deepCopy(template.runtime);
  const operators = runtime.operators as unknown as {
    value: Record<string, unknown>;
    params: Record<string, unknown>;
  }[];
  for (const { operator, hole } of template.ingest) {
    operators[operator]!.value['$ingest'] = (
      holes[hole] as Extract<Hole, { kind: 'values' }>
    ).values;
  }
  for (const { operator, hole } of template.domains) {
    operators[operator]!.params['domain'] = [
      ...(holes[hole] as Extract<Hole, { kind: 'domain' }>).domain,
    ];
  }
  return runtime;
}

function fresh(spec: TopLevelSpec): vega.Runtime {
  counts.compiled++;
  return vega.parse(compile(spec).spec);
}

/**
 * The vega runtime of a vega-lite spec, equal to `vega.parse(compile(spec).spec)`: from its
 * shape's template when it has one. The runtime reads the spec's inline data arrays (vega
 * marks their rows with tuple ids, as on the fresh path).
 */
export function chartRuntime(spec: TopLevelSpec): vega.Runtime {
  const holes = holesOf(spec);
  if (holes.length === 0 || !separable(holes)) return fresh(spec);
  const key = shapeKey(spec, holes);
  let template = templates.get(key);
  if (template === undefined) {
    if (templates.size >= MAX_SHAPES) templates.clear();
    const made = makeTemplate(spec, holes);
    const reference = fresh(spec);
    template = made !== null && isDeepStrictEqual(fill(made, holes), reference) ? made : null;
    templates.set(key, template);
    return reference;
  }
  if (template === null) return fresh(spec);
  counts.templated++;
  return fill(template, holes);
}

/** How the runtimes so far were made, and the shapes held (for tests and benchmarks). */
export function chartRuntimeCounts(): { templated: number; compiled: number; shapes: number } {
  return { ...counts, shapes: templates.size };
}
