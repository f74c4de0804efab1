/** expandCards: the sets of the demo site as station jobs, insert jobs and set outlines. */
import { beforeAll, describe, expect, it } from 'vitest';
import { expandCards } from '../../generator/pipeline/cards.ts';
import { loadCatalogue } from '../../generator/content/index.ts';
import type { Catalogue } from '../../generator/content/types.ts';
import { heatKindOf } from '../../generator/content/heat-kind.ts';

let catalogue: Catalogue;
beforeAll(async () => {
  catalogue = await loadCatalogue('content');
});

describe('expandCards(demo)', () => {
  it('plans each distinct pot × coffee × stove once, station cards and insert rows alike', () => {
    const jobs = expandCards(catalogue);
    const slugs = jobs.stations.map((s) => s.slug);
    // One card per request and language (its key); a request's slug once per language.
    const keys = jobs.stations.map((s) => s.key);
    expect(new Set(keys).size).toBe(keys.length);
    const perLanguage = jobs.stations.map((s) => `${s.language}/${s.slug}`);
    expect(new Set(perLanguage).size).toBe(perLanguage.length);
    const requested = new Set(
      catalogue.site.sets
        .filter((s) => s.layout === 'station')
        .flatMap((s) => s.cards.map((r) => `${r.potId}--${r.coffeeId}--${r.stoveId}`)),
    );
    for (const slug of requested) expect(slugs).toContain(slug);
    for (const insert of jobs.inserts) {
      for (const row of insert.rows)
        expect(slugs).toContain(`${row.potId}--${row.coffeeId}--${row.stoveId}`);
    }
  });

  it('a card in two station sets is one page listed by both', () => {
    const jobs = expandCards(catalogue);
    const shared = jobs.stations.find((s) => s.setIds.length > 1);
    expect(shared).toBeDefined();
    for (const setId of shared!.setIds) {
      expect(jobs.sets.find((s) => s.id === setId)!.cardSlugs).toContain(shared!.key);
    }
  });

  it('an insert has one row per pot × heat kind, pots by size, then gas, electric, induction', () => {
    const jobs = expandCards(catalogue);
    const order = ['gas', 'electric', 'induction'];
    for (const insert of jobs.inserts) {
      const keys = insert.rows.map(
        (r) => `${r.potId}|${heatKindOf[catalogue.stoves.get(r.stoveId)!.stoveKind]}`,
      );
      expect(new Set(keys).size).toBe(keys.length);
      for (let i = 1; i < insert.rows.length; i++) {
        const a = insert.rows[i - 1]!,
          b = insert.rows[i]!;
        const cupsA = catalogue.pots.get(a.potId)!.cups,
          cupsB = catalogue.pots.get(b.potId)!.cups;
        expect(cupsA).toBeLessThanOrEqual(cupsB);
        if (a.potId === b.potId) {
          const ka = order.indexOf(heatKindOf[catalogue.stoves.get(a.stoveId)!.stoveKind]);
          const kb = order.indexOf(heatKindOf[catalogue.stoves.get(b.stoveId)!.stoveKind]);
          expect(ka).toBeLessThan(kb);
        }
      }
      expect(insert.rows.every((r) => r.coffeeId === insert.coffeeId)).toBe(true);
    }
  });

  it('a coffee in two insert sets gets a second page slug', () => {
    const insertSet = catalogue.site.sets.find((s) => s.layout === 'insert')!;
    const twice = {
      ...catalogue,
      site: { ...catalogue.site, sets: [insertSet, { ...insertSet, id: 'second' }] },
    };
    const slugs = expandCards(twice).inserts.map((i) => i.slug);
    expect(new Set(slugs).size).toBe(slugs.length);
    expect(slugs).toContain(`${insertSet.coffeeIds[0]}--second`);
  });
});
