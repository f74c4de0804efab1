/**
 * Finds the outside checks of a test file and the marking each one carries (DEVELOPERS.md,
 * "Adding a check"). A test (`it`, `it.each(…)`, `test`) is an outside check when its body
 * asserts against a number written in the test: a numeric literal other than 0, 1, 2 and
 * their negatives, on a line that asserts (`expect…`, `.toBe…`, `.toEqual`, `.toMatch…`).
 * Its marking is looked for, in this order, in its name, in the strings and comments of its
 * body (assertion labels included), in the comment lines right above it, and then in the
 * same places of each enclosing `describe`, innermost first.
 *
 * A marking is one of
 *   source          a published source named: "source: …", or one of SOURCE_NAMES
 *   closed form     "closed form" / "closed-form" (an exact solution the test derives)
 *   common practice "common practice, no source"
 *   from memory     "from memory"
 *   snapshot        "regression snapshot"
 *   own rule        "own rule": the number is stovecard's own specification (an input
 *                   limit, a unit of the YAML, a synthetic truth a fit must recover, the
 *                   integrator's contract), not an outside value; listed, so a reader sees it
 * The scanner reads TypeScript as text: it skips strings, template literals and comments
 * when matching brackets, which is all the test files need.
 */

export type MarkingKind =
  'source' | 'closed form' | 'common practice' | 'from memory' | 'snapshot' | 'own rule';

/** Published sources the tests cite by name (a test may also write "source: …"). */
export const SOURCE_NAMES: readonly string[] = [
  'IAPWS',
  'IF97',
  'SR1-86',
  'R12-08',
  'CRC',
  'NIST',
  'Incropera',
  'SCA',
  'ISO 2533',
  'ICAO',
  'CODATA',
  'NBS Circular',
  'ENERGY STAR',
  'US DOE',
  'Corrochano',
  'Lemmon',
  'Dormand',
  'Hairer',
  'Hagen–Poiseuille',
  'Darcy',
  'Levenberg',
  'Marquardt',
  'SP 811',
  'JCGM',
];

const MARKINGS: readonly [MarkingKind, RegExp][] = [
  ['common practice', /common practice, no source/i],
  ['from memory', /from memory/i],
  ['snapshot', /regression snapshot/i],
  ['closed form', /closed[ -]form/i],
  ['own rule', /own rule/i],
  ['source', new RegExp(`source:|${SOURCE_NAMES.map(escapeRegExp).join('|')}`)],
];

function escapeRegExp(text: string): string {
  return text.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
}

export interface OutsideCheck {
  readonly file: string;
  readonly line: number;
  readonly name: string;
  /** Null when nothing marks it. */
  readonly marking: MarkingKind | null;
  /** The text the marking was found in (trimmed), for the list. */
  readonly markedBy: string | null;
}

interface Span {
  readonly kind: 'describe' | 'test';
  readonly name: string;
  readonly start: number;
  readonly end: number;
  /** Strings and comments inside the call, with where each starts. */
  readonly texts: readonly { readonly text: string; readonly at: number }[];
  /** Comment lines right above the call. */
  readonly above: string;
  /** The call's text with strings and comments blanked (for the number check). */
  readonly code: string;
}

/** Index just past the string, template or comment starting at i, or i when none starts. */
function skipLiteral(src: string, i: number): number {
  const c = src[i];
  if (c === '/' && src[i + 1] === '/') {
    const end = src.indexOf('\n', i);
    return end < 0 ? src.length : end;
  }
  if (c === '/' && src[i + 1] === '*') {
    const end = src.indexOf('*/', i + 2);
    return end < 0 ? src.length : end + 2;
  }
  if (c === "'" || c === '"' || c === '`') {
    let j = i + 1;
    while (j < src.length && src[j] !== c) {
      if (src[j] === '\\') j++;
      else if (c === '`' && src[j] === '$' && src[j + 1] === '{') {
        j = matchClose(src, j + 1) - 1;
      }
      j++;
    }
    return j + 1;
  }
  return i;
}

/** Index just past the bracket closing the one at `open`. */
function matchClose(src: string, open: number): number {
  let depth = 0;
  let i = open;
  while (i < src.length) {
    const skipped = skipLiteral(src, i);
    if (skipped !== i) {
      i = skipped;
      continue;
    }
    const c = src[i]!;
    if (c === '(' || c === '[' || c === '{') depth++;
    else if (c === ')' || c === ']' || c === '}') {
      depth--;
      if (depth === 0) return i + 1;
    }
    i++;
  }
  return src.length;
}

/** Strings and comments of src[start, end), and the text with them blanked. */
function literals(
  src: string,
  start: number,
  end: number,
): { texts: { text: string; at: number }[]; code: string } {
  const texts: { text: string; at: number }[] = [];
  let code = '';
  let i = start;
  while (i < end) {
    const skipped = skipLiteral(src, i);
    if (skipped !== i) {
      texts.push({ text: src.slice(i, skipped), at: i });
      code += src.slice(i, skipped).replace(/[^\n]/g, ' ');
      i = skipped;
    } else {
      code += src[i];
      i++;
    }
  }
  return { texts, code };
}

/** The contiguous comment lines just above the line holding `index`. */
function commentAbove(src: string, index: number): string {
  const lines = src.slice(0, index).split('\n');
  lines.pop();
  const out: string[] = [];
  while (lines.length > 0) {
    const line = lines.pop()!.trim();
    if (line.startsWith('//') || line.startsWith('*') || line.startsWith('/*')) out.unshift(line);
    else break;
  }
  return out.join('\n');
}

const CALL = /\b(describe|it|test)(\.each\s*)?\s*\(/g;

function spans(src: string): Span[] {
  const out: Span[] = [];
  const { code: blanked } = literals(src, 0, src.length);
  for (const m of blanked.matchAll(CALL)) {
    const at = m.index!;
    if (at > 0 && /[.\w$]/.test(blanked[at - 1]!)) continue;
    let open = at + m[0].length - 1;
    // it.each(rows)('name', …): the call that matters is the second.
    if (m[2]) {
      const afterTable = matchClose(src, open);
      const next = /^\s*\(/.exec(src.slice(afterTable));
      if (!next) continue;
      open = afterTable + next[0].length - 1;
    }
    const end = matchClose(src, open);
    const nameMatch = /^\(\s*(['"`])((?:\\.|(?!\1)[\s\S])*)\1/.exec(src.slice(open));
    const { texts, code } = literals(src, open, end);
    out.push({
      kind: m[1] === 'describe' ? 'describe' : 'test',
      name: nameMatch ? nameMatch[2]! : '(unnamed)',
      start: at,
      end,
      texts,
      above: commentAbove(src, at),
      code,
    });
  }
  return out;
}

const ASSERTING = /expect\w*\s*\(|\.to[A-Z]\w*\s*\(/;
const NUMBER = /(?<![\w.$])-?(?:\d+\.\d*|\.\d+|\d+)(?:e[-+]?\d+)?(?![\w.])/gi;
const TRIVIAL = new Set(['0', '1', '2', '-1', '-2']);

/** True when some asserting line of the test's code holds a number other than 0, 1, 2. */
export function assertsANumber(code: string): boolean {
  return code
    .split('\n')
    .filter((line) => ASSERTING.test(line))
    .some((line) =>
      [...line.matchAll(NUMBER)].some((n) => !TRIVIAL.has(n[0].replace(/\.0*$/, ''))),
    );
}

function markingOf(texts: readonly string[]): { kind: MarkingKind; text: string } | null {
  for (const [kind, pattern] of MARKINGS) {
    const text = texts.find((t) => pattern.test(t));
    if (text) return { kind, text: text.replace(/\s+/g, ' ').trim() };
  }
  return null;
}

/** The outside checks of one test file's source and what marks each. */
export function outsideChecks(file: string, src: string): OutsideCheck[] {
  const all = spans(src);
  const { code: blanked } = literals(src, 0, src.length);
  const describes = all.filter((s) => s.kind === 'describe');
  const lineOf = (index: number) => src.slice(0, index).split('\n').length;
  return all
    .filter((s) => s.kind === 'test' && assertsANumber(s.code))
    .map((test) => {
      const enclosing = describes
        .filter((d) => d.start < test.start && d.end >= test.end)
        .sort((a, b) => b.start - a.start);
      let found = markingOf([test.name, ...test.texts.map((t) => t.text), test.above]);
      for (const d of enclosing) {
        if (found) break;
        // A describe's own comments: outside every test it holds and not right above one.
        const tests = all.filter((s) => s.kind === 'test' && s.start > d.start && s.end <= d.end);
        const own = d.texts.filter(
          (t) =>
            /^\/[/*]/.test(t.text) &&
            !tests.some(
              (s) =>
                (t.at >= s.start && t.at < s.end) ||
                (t.at < s.start && blanked.slice(t.at, s.start).trim() === ''),
            ),
        );
        found = markingOf([d.name, d.above, ...own.map((t) => t.text)]);
      }
      return {
        file,
        line: lineOf(test.start),
        name: test.name,
        marking: found?.kind ?? null,
        markedBy: found?.text ?? null,
      };
    });
}
