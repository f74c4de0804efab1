/** The demo content and real plans of it, shared by the render tests (planned once per file). */
import { loadCatalogue } from '../../generator/content/index.ts';
import type { Catalogue, CardRequest } from '../../generator/content/types.ts';
import { planCard } from '../../generator/planning/plan.ts';
import type { AcceptedPlan, CardPlan, RefusedPlan } from '../../generator/planning/types.ts';

export async function demoCatalogue(): Promise<Catalogue> {
  return loadCatalogue('content');
}

export function plan(catalogue: Catalogue, request: CardRequest): CardPlan {
  return planCard({
    pot: catalogue.pots.get(request.potId)!,
    coffee: catalogue.coffees.get(request.coffeeId)!,
    stove: catalogue.stoves.get(request.stoveId)!,
    room: catalogue.site.room,
    kettlePresetsK: catalogue.site.kettlePresetsK,
  });
}

/** The first station card of the demo sets whose plan has a recipe. */
export function firstAcceptedPlan(catalogue: Catalogue): AcceptedPlan {
  for (const set of catalogue.site.sets) {
    for (const request of set.cards) {
      const p = plan(catalogue, request);
      if (p.refused === null) return p;
    }
  }
  throw new Error('no demo card has a recipe: the planner refuses every demo request');
}

/** An aluminium pot without an induction plate on the induction stove: always refused. */
export function refusedPlan(catalogue: Catalogue): RefusedPlan {
  const pot = [...catalogue.pots.values()].find((p) => !p.inductionReady);
  const stove = [...catalogue.stoves.values()].find((s) => s.stoveKind === 'induction');
  if (!pot || !stove)
    throw new Error('the demo content has no aluminium pot or no induction stove');
  const p = plan(catalogue, {
    potId: pot.id,
    coffeeId: catalogue.coffees.keys().next().value!,
    stoveId: stove.id,
  });
  if (p.refused === null) throw new Error(`${pot.id} on ${stove.id} was given a recipe`);
  return p;
}

export const OPTIONS = { builtOn: '2024-05-01', fingerprint: 'abcdef12' } as const;
