/**
 * A value `stovecard fit --write` measured carries its note (`fitted ± σ % from <log>,
 * <date>`, content/provenance.ts) into the plan and the card: the plan's timing range uses
 * the fitted σ (2σ, as planning/plan.ts inputSpread says), so a tighter fit visibly narrows
 * the card's range, and the card says which log measured what and when. The stove and the
 * fitted powers are our own invention; the rule (2σ ranges) is this project's choice.
 */
import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadCoffeeFile, loadStoveFile } from '../../generator/content/index.ts';
import type { StoveEntry } from '../../generator/content/types.ts';
import { finalShareSpread, inputSpread, planCard } from '../../generator/planning/plan.ts';
import type { AcceptedPlan } from '../../generator/planning/types.ts';
import { stationCardView } from '../../generator/render/card-view.ts';
import { OPTIONS, demoCatalogue } from '../render/demo.ts';

let dir: string;

const stoveYaml = (
  note: (sigma: string) => string,
) => `name: An invented two-ring gas hob, small ring
kind: gas
levels:
  - { label: low, power_w: 600, heat_to_pot_w: 210 }${note('4')}
  - { label: medium, power_w: 1000, heat_to_pot_w: 330 }${note('4')}
  - { label: high, power_w: 1500, heat_to_pot_w: 480 }${note('4')}
`;

async function stove(name: string, text: string): Promise<StoveEntry> {
  const file = path.join(dir, `${name}.yaml`);
  await writeFile(file, text);
  return loadStoveFile(file);
}

beforeAll(async () => {
  dir = await mkdtemp(path.join(tmpdir(), 'stovecard-provenance-'));
});
afterAll(async () => {
  await rm(dir, { recursive: true, force: true });
});

describe('a fitted value’s note', () => {
  it('is read back with its σ, log and date, also after a comment of the file’s own', async () => {
    const s = await stove(
      'noted',
      stoveYaml(() => ' # timed on the bar; fitted ± 4 % from logs/bar-week.yaml, 2026-11-30'),
    );
    expect(s.levels.map((l) => l.provenance)).toEqual(
      s.levels.map(() => ({ sigmaRel: 0.04, log: 'logs/bar-week.yaml', date: '2026-11-30' })),
    );
    const bare = await stove(
      'bare',
      stoveYaml(() => ''),
    );
    expect(bare.levels.every((l) => l.fitted && l.provenance === undefined)).toBe(true);
  });

  // own rule: the spread is stovecard's own (2 σ of the heat; 5 % when a level is
  // measured with no σ written), not an outside value.
  it('narrows the timing range to the fitted σ and is named on the card', async () => {
    const catalogue = await demoCatalogue();
    const pot = catalogue.pots.get('three-cup')!;
    const coffee = catalogue.coffees.get('house-blend')!;
    const noted = {
      ...(await stove(
        'noted',
        stoveYaml(() => ' # fitted ± 2 % from logs/bar-week.yaml, 2026-11-30'),
      )),
      id: 'noted',
    };
    const bare = {
      ...(await stove(
        'bare',
        stoveYaml(() => ''),
      )),
      id: 'bare',
    };
    // Measured without a σ: heat ± 2 × 5 %; with the note's 2 %: ± 2 × 2 %.
    expect(inputSpread(coffee, bare).heatShare).toBeCloseTo(0.1, 10);
    expect(inputSpread(coffee, noted).heatShare).toBeCloseTo(0.04, 10);
    const request = {
      pot,
      coffee,
      room: catalogue.site.room,
      kettlePresetsK: catalogue.site.kettlePresetsK,
    };
    const a = planCard({ ...request, stove: noted }) as AcceptedPlan;
    const b = planCard({ ...request, stove: bare }) as AcceptedPlan;
    expect(a.refused).toBeNull();
    expect(b.refused).toBeNull();
    const width = (p: AcceptedPlan) => p.offHeatS.highS - p.offHeatS.lowS;
    expect(width(a)).toBeLessThan(width(b));
    const view = await stationCardView(
      a,
      { ...catalogue, stoves: new Map([[noted.id, noted]]) },
      OPTIONS,
    );
    expect(view.recipe!.expect.notes.join(' ')).toMatch(
      /this setting’s heat \(± 2 %, logs\/bar-week\.yaml, 2026-11-30\)/,
    );
  });
});

/** An invented coffee with its bed tightening, the final share's line ending in `note`. */
const coffeeYaml = (note: string) => `name: An invented washed lot, stovetop grind
roast: medium
grind: medium-fine
permeability_m2: 0.8e-12 # fitted ± 5 % from logs/bar-week.yaml, 2026-11-30
bulk_density_g_ml: 0.38
retention_g_per_g: 1.2
bed:
  tightening:
    final_share: 0.6${note}
    over_ml: 40
`;

describe('a bed’s final share: measured or assumed', () => {
  async function coffee(name: string, text: string) {
    const file = path.join(dir, `${name}.yaml`);
    await writeFile(file, text);
    return { ...(await loadCoffeeFile(file)), id: name };
  }

  // own rule: the share's corners are 2σ in ln f either way (f·e^(∓2σ), within 0.1–1),
  // σ assumed 0.3 (ASSUMED_FINAL_SHARE_SIGMA_LN) or the note's; the arithmetic is closed form
  it('spreads the share by the note’s σ, or by the assumed 30 %', async () => {
    const assumed = await coffee('assumed', coffeeYaml(''));
    const measured = await coffee(
      'measured',
      coffeeYaml(' # fitted ± 8 % from logs/bar-week.yaml, 2026-12-01'),
    );
    expect(assumed.tighteningProvenance).toBeUndefined();
    expect(finalShareSpread(assumed)).toEqual({
      low: 0.6 * Math.exp(-0.6),
      high: 1,
      sigmaLn: 0.3,
      measured: false,
    });
    expect(finalShareSpread(measured)).toEqual({
      low: 0.6 * Math.exp(-0.16),
      high: 0.6 * Math.exp(0.16),
      sigmaLn: 0.08,
      measured: true,
    });
    expect(finalShareSpread({ ...assumed, bed: { ...assumed.bed, tightening: undefined } })).toBe(
      undefined,
    );
  });

  // own rule: the ranges follow the inputs' uncertainty (2σ corners), so a measured share
  // narrows the card's off-heat range; the card names it (en + es)
  it('narrows the off-heat range when measured, and the card says which', async () => {
    const catalogue = await demoCatalogue();
    const pot = catalogue.pots.get('three-cup')!;
    const hob = {
      ...(await stove(
        'noted',
        stoveYaml(() => ' # fitted ± 2 % from logs/bar-week.yaml, 2026-11-30'),
      )),
      id: 'noted',
    };
    const assumed = await coffee('assumed', coffeeYaml(''));
    const measured = await coffee(
      'measured',
      coffeeYaml(' # fitted ± 8 % from logs/bar-week.yaml, 2026-12-01'),
    );
    const request = {
      pot,
      stove: hob,
      room: catalogue.site.room,
      kettlePresetsK: catalogue.site.kettlePresetsK,
    };
    const a = planCard({ ...request, coffee: measured }) as AcceptedPlan;
    const b = planCard({ ...request, coffee: assumed }) as AcceptedPlan;
    expect(a.refused).toBeNull();
    expect(b.refused).toBeNull();
    // Same recipe inputs but the share's σ: the nominal run is the same.
    expect(a.offHeatS.midS).toBe(b.offHeatS.midS);
    const width = (p: AcceptedPlan) => p.offHeatS.highS - p.offHeatS.lowS;
    expect(width(a)).toBeLessThan(width(b));
    const cat = {
      ...catalogue,
      stoves: new Map([[hob.id, hob]]),
      coffees: new Map([
        [measured.id, measured],
        [assumed.id, assumed],
      ]),
    };
    const notes = async (p: AcceptedPlan, language: string) =>
      (await stationCardView(p, cat, { ...OPTIONS, language })).recipe!.expect.notes.join(' ');
    expect(await notes(a, 'en')).toMatch(
      /how much the bed tightens as it brews \(± 8 %, logs\/bar-week\.yaml, 2026-12-01\)/,
    );
    expect(await notes(a, 'en')).not.toMatch(/not yet weighed/);
    expect(await notes(b, 'en')).toMatch(
      /the bed tightening as its entry says \(not yet weighed\)/,
    );
    expect(await notes(b, 'en')).not.toMatch(/how much the bed tightens/);
    expect(await notes(a, 'es')).toMatch(
      /cuánto se compacta la cama durante la preparación \(± 8 %, logs\/bar-week\.yaml, /,
    );
    expect(await notes(b, 'es')).toMatch(/que la cama se compacta como indica su ficha/);
    // The printed range itself, as the card formats it (m:ss–m:ss), is narrower too.
    const printed = async (p: AcceptedPlan) =>
      (await stationCardView(p, cat, OPTIONS)).recipe!.timings.offHeat;
    const [pa, pb] = [await printed(a), await printed(b)];
    expect(pa.highS - pa.lowS).toBeLessThan(pb.highS - pb.lowS);
  });
});
