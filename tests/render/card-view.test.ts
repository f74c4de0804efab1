/**
 * stationCardView / insertCardView on real plans of the demo content: every number is the
 * plan's, converted by the unit definitions (NIST SP 811, Appendix B) and rounded as printed.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import type { Catalogue } from '../../generator/content/types.ts';
import type { AcceptedPlan, RefusedPlan } from '../../generator/planning/types.ts';
import { insertCardView, stationCardView } from '../../generator/render/card-view.ts';
import { crossSection } from '../../generator/render/cross-section.ts';
import { refusalText } from '../../generator/render/plan-text.ts';
import { cardWords } from '../../generator/words/card.ts';
import { expectOneSource } from './one-source.ts';
import { OPTIONS, demoCatalogue, firstAcceptedPlan, plan, refusedPlan } from './demo.ts';

const NBSP = '\u00a0';
const ML_PER_FL_OZ = 29.5735295625;
const G_PER_OZ = 28.349523125;
const MM_PER_IN = 25.4;
const fahrenheit = (k: number) => ((k - 273.15) * 9) / 5 + 32;
const fixed = (v: number, d: number) => (Math.round(v * 10 ** d) / 10 ** d).toFixed(d);
const RANGE = /^\d+:[0-5]\d–\d+:[0-5]\d$|^\d+:[0-5]\d$/;

let catalogue: Catalogue;
let accepted: AcceptedPlan;
let refused: RefusedPlan;

beforeAll(async () => {
  catalogue = await demoCatalogue();
  accepted = firstAcceptedPlan(catalogue);
  refused = refusedPlan(catalogue);
});

describe('stationCardView(accepted plan, metric)', () => {
  it('prints the fill, dose and temperature of the plan in mL, g and °C', async () => {
    const view = await stationCardView(accepted, catalogue, { ...OPTIONS, units: 'metric' });
    const r = view.recipe!;
    expect(view.refusal).toBeNull();
    // The fill is a safety limit: printed rounded down, never up.
    expect(r.water.fillVolume.text).toBe(`${Math.floor(accepted.fillM3 * 1e6)}${NBSP}mL`);
    expect(r.water.fillMass.text).toBe(`${Math.floor(accepted.fillKg * 1e3)}${NBSP}g`);
    expect(r.water.temperature.text).toBe(`${fixed(accepted.startK - 273.15, 0)}${NBSP}°C`);
    expect(r.coffee.dose.text).toBe(`${fixed(accepted.doseKg * 1e3, 1)}${NBSP}g`);
    expect(r.water.fillHeight.text).toBe(`${Math.floor(accepted.fillHeightM * 1e3)}${NBSP}mm`);
    expect(r.water.belowValve.text).toBe(`${Math.floor(accepted.belowValveM * 1e3)}${NBSP}mm`);
    expect(r.heat.level).toBe(accepted.levelLabel);
  });

  it('prints the timings as low–high ranges that contain the plan’s spread', async () => {
    const r = (await stationCardView(accepted, catalogue, OPTIONS)).recipe!;
    for (const [printed, range] of [
      [r.timings.firstCoffee, accepted.firstCoffeeS],
      [r.timings.offHeat, accepted.offHeatS],
    ] as const) {
      expect(printed.text).toMatch(RANGE);
      expect(printed.lowS).toBeLessThanOrEqual(range.lowS);
      expect(printed.highS).toBeGreaterThanOrEqual(range.highS);
      expect(range.lowS - printed.lowS).toBeLessThan(5);
      expect(printed.highS - range.highS).toBeLessThan(5);
    }
  });

  it('prints the share in band against the cold start, and the valve', async () => {
    const e = (await stationCardView(accepted, catalogue, OPTIONS)).recipe!.expect;
    const all = e.rows.map((row) => `${row.label} ${row.value}`).join('\n');
    expect(all).toContain(`${fixed(accepted.extraction.inBandShare * 100, 0)}${NBSP}%`);
    expect(all).toContain(`${fixed(accepted.coldStart.inBandShare * 100, 0)}${NBSP}%`);
    const pot = catalogue.pots.get(accepted.potId)!;
    expect(all.includes('assumed')).toBe(pot.valveOpeningAssumed);
    if (pot.valveOpeningAssumed) {
      // Nobody measured it: two significant figures, why it is assumed, and whom to ask.
      expect(all).toContain(
        `about ${Number((accepted.valveOpeningGaugePa / 1e5).toPrecision(2))}${NBSP}bar`,
      );
      expect(all).not.toContain(`${fixed(accepted.valveOpeningGaugePa / 1e5, 2)}${NBSP}bar`);
      expect(all).toContain('no value was given');
      expect(all).toContain('ask the maker');
    } else {
      expect(all).toContain(`${fixed(accepted.valveOpeningGaugePa / 1e5, 2)}${NBSP}bar`);
    }
  });

  it('carries the compact cautions and the deferral on A6, the full ones elsewhere', async () => {
    const a6 = await stationCardView(accepted, catalogue, { ...OPTIONS, paper: 'A6' });
    expect(a6.cautions.form).toBe('compact');
    expect(a6.cautions.items).toEqual(cardWords.cautions.compact);
    expect(a6.cautions.deferral).toBe(cardWords.cautions.deferral);
    const a4 = await stationCardView(accepted, catalogue, { ...OPTIONS, paper: 'A4' });
    expect(a4.cautions.form).toBe('full');
  });

  it('always carries the cautions and the footer', async () => {
    const view = await stationCardView(accepted, catalogue, OPTIONS);
    expect(view.cautions.items).toEqual(cardWords.cautions.full);
    expect(view.cautions.deferral).toBe(cardWords.cautions.deferral);
    expect(view.footer.built).toContain('2024-05-01');
    expect(view.footer.built).toContain('abcdef12');
    expect(view.footer.printedBy).toContain(catalogue.site.business.name);
    expect(view.footer.qrSvg === null).toBe(catalogue.site.baseUrl === undefined);
  });

  it('carries the cross-section and the chart as SVG', async () => {
    const r = (await stationCardView(accepted, catalogue, OPTIONS)).recipe!;
    expect(r.water.crossSectionSvg).toMatch(/^<svg [^>]*class="cross-section"/);
    expect(r.chart.svg).toMatch(/^<svg /);
    expect(r.chart.spec.$schema).toContain('vega-lite');
  });
});

describe('stationCardView at altitude', () => {
  it('states the boiling point at the site’s altitude, and not at sea level', async () => {
    const request = {
      potId: accepted.potId,
      coffeeId: accepted.coffeeId,
      stoveId: accepted.stoveId,
    };
    const high = {
      ...catalogue,
      site: { ...catalogue.site, room: { ...catalogue.site.room, altitudeM: 1500 } },
    };
    const p = plan(high, request);
    const rows = (view: Awaited<ReturnType<typeof stationCardView>>) =>
      view.recipe?.expect.rows.map((r) => r.label) ?? [];
    expect(p.refused, 'the demo card is refused at 1500 m').toBeNull();
    const view = await stationCardView(p, high, OPTIONS);
    const row = view.recipe!.expect.rows.find((r) => r.label === cardWords.expect.boiling)!;
    expect(row.value).toContain(`${fixed(p.boilingK - 273.15, 0)}${NBSP}°C`);
    expect(row.value).toContain(`1500${NBSP}m`);
    expect(rows(await stationCardView(accepted, catalogue, OPTIONS))).not.toContain(
      cardWords.expect.boiling,
    );
  });
});

describe('stationCardView(accepted plan, us)', () => {
  it('prints fl oz, oz, °F, in and psi from the same plan', async () => {
    const view = await stationCardView(accepted, catalogue, { ...OPTIONS, units: 'us' });
    const r = view.recipe!;
    expect(view.page.units).toBe('us');
    expect(r.water.fillVolume.text).toBe(
      `${(Math.floor(((accepted.fillM3 * 1e6) / ML_PER_FL_OZ) * 10) / 10).toFixed(1)}${NBSP}fl oz`,
    );
    expect(r.water.fillMass.text).toBe(
      `${(Math.floor(((accepted.fillKg * 1e3) / G_PER_OZ) * 10) / 10).toFixed(1)}${NBSP}oz`,
    );
    expect(r.coffee.dose.text).toBe(`${fixed((accepted.doseKg * 1e3) / G_PER_OZ, 2)}${NBSP}oz`);
    expect(r.water.temperature.text).toBe(`${fixed(fahrenheit(accepted.startK), 0)}${NBSP}°F`);
    expect(r.water.fillHeight.text).toBe(
      `${fixed((accepted.fillHeightM * 1e3) / MM_PER_IN, 2)}${NBSP}in`,
    );
    const all = r.expect.rows.map((row) => row.value).join('\n');
    // 1 psi = 6894.757293168 Pa (NIST SP 811); an assumed valve to two significant figures.
    const valvePsi = accepted.valveOpeningGaugePa / 6894.757293168;
    const pot = catalogue.pots.get(accepted.potId)!;
    expect(all).toContain(
      pot.valveOpeningAssumed
        ? `about ${Number(valvePsi.toPrecision(2))}${NBSP}psi`
        : `${fixed(valvePsi, 1)}${NBSP}psi`,
    );
    expect(r.chart.svg).toContain('fl oz');
    expect(r.chart.svg).toContain('°F');
  });

  it('has the same timings in both unit systems', async () => {
    const metric = (await stationCardView(accepted, catalogue, { ...OPTIONS, units: 'metric' }))
      .recipe!;
    const us = (await stationCardView(accepted, catalogue, { ...OPTIONS, units: 'us' })).recipe!;
    expect(us.timings).toEqual(metric.timings);
  });
});

describe('stationCardView(refused plan)', () => {
  it('prints why and what to change, the cautions, and no recipe', async () => {
    const view = await stationCardView(refused, catalogue, OPTIONS);
    expect(view.recipe).toBeNull();
    const text = refusalText(refused.refused, 'metric');
    expect(view.refusal!.reason).toBe(text.reason);
    expect(view.refusal!.suggestion).toBe(text.suggestion);
    expect(view.cautions.items.length).toBeGreaterThan(5);
    expect(JSON.stringify(view)).not.toMatch(/"fillVolume"|"dose"/);
  });

  it('a very tight coffee (permeability ÷ 1000) is refused with the planner’s reason', async () => {
    const tight = {
      ...catalogue,
      coffees: new Map(
        [...catalogue.coffees].map(([id, c]) => [
          id,
          { ...c, bed: { ...c.bed, permeabilityM2: c.bed.permeabilityM2 / 1000 } },
        ]),
      ),
    } as Catalogue;
    const request = {
      potId: accepted.potId,
      coffeeId: accepted.coffeeId,
      stoveId: accepted.stoveId,
    };
    const p = plan(tight, request);
    const view = await stationCardView(p, tight, OPTIONS);
    expect((view.recipe === null) !== (view.refusal === null)).toBe(true);
    expect(p.refused).not.toBeNull();
    expect(view.refusal!.reason).toBe(refusalText(p.refused!, 'metric').reason);
  });
});

describe('insertCardView', () => {
  it('has a row per pot × heat kind, refused rows saying "not suitable" with a short reason', async () => {
    const set = catalogue.site.sets.find((s) => s.layout === 'insert')!;
    const coffeeId = set.coffeeIds[0]!;
    const rows = set.cards
      .filter((r) => r.coffeeId === coffeeId)
      .map((r) => ({ potId: r.potId, stoveId: r.stoveId, plan: plan(catalogue, r) }));
    const view = await insertCardView({ setId: set.id, coffeeId, rows }, catalogue, OPTIONS);
    expect(view.rows).toHaveLength(rows.length);
    for (const [i, row] of view.rows.entries()) {
      const p = rows[i]!.plan;
      if (p.refused) {
        expect(row.refused!.label).toBe(cardWords.insert.notSuitable);
        expect(row.refused!.reason).toBe(cardWords.refusal.short[p.refused.code]);
        expect(row.fill).toBeNull();
      } else {
        expect(row.fill!.text).toBe(`${Math.floor(p.fillM3 * 1e6)}${NBSP}mL`);
        expect(row.firstCoffee!.text).toMatch(RANGE);
      }
    }
    expect(view.rows.some((row) => row.refused)).toBe(true);
    expect(view.cautions.items).toEqual(cardWords.cautions.full);
    expect(view.cautions.deferral).toBe(cardWords.cautions.deferral);
    expect(view.webLine === null).toBe(catalogue.site.baseUrl === undefined);
  });
});

describe('escaping', () => {
  it('text from YAML inside our own SVG is escaped', () => {
    const pot = catalogue.pots.get(accepted.potId)!;
    const { svg } = crossSection({
      pot: pot.model,
      potName: '<script>alert(1)</script> & "x"',
      fillHeightM: accepted.fillHeightM,
      units: 'metric',
    });
    expect(svg).not.toContain('<script>');
    expect(svg).toContain('&lt;script&gt;alert(1)&lt;/script&gt; &amp; &quot;x&quot;');
  });

  it('view strings stay plain text (escaping is the template’s job, autoescape on)', async () => {
    const hostile = '<script>alert(1)</script> & "x"';
    const coffees = new Map(catalogue.coffees);
    coffees.set(accepted.coffeeId, { ...coffees.get(accepted.coffeeId)!, name: hostile });
    const view = await stationCardView(accepted, { ...catalogue, coffees }, OPTIONS);
    expect(view.title).toBe(hostile);
  });
});

describe('one number, one source: the one-cup demo cards', () => {
  // The gap below the valve was printed 3 mm in the text and 4 mm in the drawing (two
  // computations); both now format the plan's belowValveM, rounded down (a safety limit).
  it('labels the drawing with the same gap as the text, in mm and in inches', async () => {
    let checked = 0;
    for (const coffeeId of catalogue.coffees.keys()) {
      for (const stoveId of ['bar-gas', 'home-radiant']) {
        const p = plan(catalogue, { potId: 'one-cup', coffeeId, stoveId });
        if (p.refused) continue;
        for (const units of ['metric', 'us'] as const) {
          const view = await stationCardView(p, catalogue, { ...OPTIONS, units });
          if (units === 'metric') expectOneSource(view, p, `${coffeeId}/${stoveId}`);
          const r = view.recipe!;
          expect(r.water.fillLineText).toContain(r.water.belowValve.text);
          expect(r.water.crossSectionSvg).toContain(
            cardWords.crossSection.margin(r.water.belowValve.text).replace(/"/g, '&quot;'),
          );
          checked++;
        }
      }
    }
    expect(checked).toBeGreaterThanOrEqual(8);
  });

  it('prints the recipe’s own peak with the corners’ range', async () => {
    const r = (await stationCardView(accepted, catalogue, { ...OPTIONS, units: 'metric' })).recipe!;
    const row = r.expect.rows.find((x) => x.label === cardWords.expect.peakPressure)!;
    expect(row.value.startsWith(`${(accepted.peakGaugePa / 1e5).toFixed(2)}${NBSP}bar`)).toBe(true);
    expect(accepted.peakGaugeRangePa.lowPa).toBeLessThanOrEqual(accepted.peakGaugePa);
    expect(accepted.peakGaugeRangePa.highPa).toBeGreaterThanOrEqual(accepted.peakGaugePa);
  });
});
