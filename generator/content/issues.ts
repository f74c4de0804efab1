/**
 * Problems found in content files. Loading never stops at the first one: every issue of
 * every file is collected and thrown together as one ContentErrors, so a person fixes
 * their files in one pass.
 */
import type { ContentMessage } from './messages.ts';

/** What kind of problem an issue is, for code that reacts to some of them. */
export type ContentIssueCode =
  | 'file-too-large'
  | 'not-utf8'
  | 'unreadable'
  | 'missing-file'
  | 'bad-file-name'
  | 'same-id-twice'
  | 'yaml-syntax'
  | 'duplicate-key'
  | 'too-many-aliases'
  | 'too-deep'
  | 'empty-file'
  | 'unknown-key'
  | 'missing-key'
  | 'wrong-type'
  | 'out-of-range'
  | 'bad-enum'
  | 'bad-value'
  | 'geometry'
  | 'order'
  | 'repeated'
  | 'unknown-id'
  | 'unknown-level'
  | 'layout'
  | 'more-problems'
  | 'skipped-file'
  | 'link-outside';

export interface IssueLocation {
  /** As shown to the person: relative to the content folder, or the path as given. */
  readonly file: string;
  readonly line: number;
  readonly column: number;
  /** Dotted path of the value, e.g. `base.valve_height_mm` or `levels[2].power_w`; '' for the whole file. */
  readonly field: string;
}

/** The location of a problem with a file as a whole (its name, bytes or encoding). */
export function wholeFile(file: string): IssueLocation {
  return { file, line: 1, column: 1, field: '' };
}

export class ContentIssue implements IssueLocation {
  readonly code: ContentIssueCode;
  readonly file: string;
  readonly line: number;
  readonly column: number;
  readonly field: string;
  /** What is wrong and how to fix it, as a message key and facts (words: generator/words/content.ts). */
  readonly message: ContentMessage;

  constructor(code: ContentIssueCode, at: IssueLocation, message: ContentMessage) {
    this.code = code;
    this.file = at.file;
    this.line = at.line;
    this.column = at.column;
    this.field = at.field;
    this.message = message;
  }

  /** For developers (stack traces, debugging); people read generator/words/content.ts issueLine. */
  toString(): string {
    return `${this.file}:${this.line}:${this.column} ${this.field} ${this.code} ${this.message.key}`;
  }
}

function byPlace(a: ContentIssue, b: ContentIssue): number {
  if (a.file !== b.file) return a.file < b.file ? -1 : 1;
  return a.line - b.line || a.column - b.column;
}

export class ContentErrors extends Error {
  /** Sorted by file, then line and column. */
  readonly issues: readonly ContentIssue[];

  /** `message` is for developers; people read generator/words/content.ts formatContentErrors. */
  constructor(issues: readonly ContentIssue[]) {
    const sorted = [...issues].sort(byPlace);
    super(`${sorted.length} content issue(s): ${sorted.map(String).join('; ')}`);
    this.name = 'ContentErrors';
    this.issues = sorted;
  }
}
