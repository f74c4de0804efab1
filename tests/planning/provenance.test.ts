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
import { loadStoveFile } from '../../generator/content/index.ts';
import type { StoveEntry } from '../../generator/content/types.ts';
import { inputSpread, planCard } from '../../generator/planning/plan.ts';
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
