/**
 * "Did you mean …?": the candidate nearest to a mistyped key, id or value by edit distance
 * (Levenshtein with adjacent transpositions, the "optimal string alignment" variant, so
 * `hieght` is one slip from `height`).
 */

/**
 * Edits (insert, delete, substitute, swap two neighbours; each costs 1) turning a into b.
 * editDistance('kitten', 'sitting') = 3; editDistance('hieght', 'height') = 1.
 */
export function editDistance(a: string, b: string): number {
  const rows: number[][] = [Array.from({ length: b.length + 1 }, (_, j) => j)];
  for (let i = 1; i <= a.length; i += 1) {
    const row = [i];
    for (let j = 1; j <= b.length; j += 1) {
      const cost = a[i - 1] === b[j - 1] ? 0 : 1;
      let best = Math.min(rows[i - 1]![j]! + 1, row[j - 1]! + 1, rows[i - 1]![j - 1]! + cost);
      if (i > 1 && j > 1 && a[i - 1] === b[j - 2] && a[i - 2] === b[j - 1]) {
        best = Math.min(best, rows[i - 2]![j - 2]! + 1);
      }
      row[j] = best;
    }
    rows.push(row);
  }
  return rows[a.length]![b.length]!;
}

/**
 * The candidate closest to `word` (case-insensitive) when it is a likely slip: at most one
 * edit per three letters (at least one, never the whole word), or a candidate the word
 * begins (`med` → `medium`). Ties go to the earlier candidate; undefined when none is close.
 */
export function nearest(word: string, candidates: Iterable<string>): string | undefined {
  const typed = word.toLowerCase();
  let best: string | undefined;
  let bestDistance = Infinity;
  for (const candidate of candidates) {
    const lower = candidate.toLowerCase();
    const longest = Math.max(typed.length, lower.length);
    const distance = editDistance(typed, lower);
    const slip = distance <= Math.max(1, Math.floor(longest / 3)) && distance < longest;
    const prefix = typed.length >= 3 && lower.startsWith(typed);
    if ((slip || prefix) && distance < bestDistance) {
      best = candidate;
      bestDistance = distance;
    }
  }
  return best;
}
