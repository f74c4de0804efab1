/**
 * After the plan phase: the cards a station set took from `every_coffee_with_every_pot`
 * whose plan is refused leave the set (unless it says `include_refused: true`), and a
 * station card no set and no insert row uses any more is not rendered at all. Each set
 * keeps the refusal code of every card it left out, for its page to say how many and why.
 */
import type { CardJobs, SetJob } from './cards.ts';
import type { PlannedCard } from './plan-all.ts';
import type { RefusalCode } from '../planning/types.ts';

export function leaveOutRefused(jobs: CardJobs, plans: ReadonlyMap<string, PlannedCard>): CardJobs {
  // Sets list their cards by key (a language part before the slug); plans are by slug.
  const slugOf = new Map(jobs.stations.map((job) => [job.key, job.slug]));
  const refusalOf = (key: string): RefusalCode | null =>
    plans.get(slugOf.get(key) ?? key)?.plan.refused?.code ?? null;
  const leftOutOf = new Map<string, Set<string>>();
  const sets: SetJob[] = jobs.sets.map((set) => {
    const optional = new Set(set.optionalSlugs ?? []);
    const gone = set.cardSlugs.filter((key) => optional.has(key) && refusalOf(key) !== null);
    if (gone.length === 0) return { ...set, leftOut: [] };
    leftOutOf.set(set.id, new Set(gone));
    return {
      ...set,
      cardSlugs: set.cardSlugs.filter((key) => !leftOutOf.get(set.id)!.has(key)),
      leftOut: gone.map((key) => refusalOf(key)!),
    };
  });
  if (leftOutOf.size === 0) return { ...jobs, sets };
  const insertRows = new Set(
    jobs.inserts.flatMap((job) => job.rows.map((r) => `${r.potId}|${r.coffeeId}|${r.stoveId}`)),
  );
  const stations = jobs.stations.flatMap((job) => {
    const setIds = job.setIds.filter((id) => !leftOutOf.get(id)?.has(job.key));
    const { potId, coffeeId, stoveId } = job.request;
    const inInsert = insertRows.has(`${potId}|${coffeeId}|${stoveId}`);
    return setIds.length > 0 || inInsert ? [{ ...job, setIds }] : [];
  });
  return { ...jobs, sets, stations };
}
