/**
 * How a value the user wrote (a path, a key, a YAML value, a URL) is shown in a message:
 * at most SHOWN_MAX characters of it, with control characters and the bidirectional
 * controls that could reorder a terminal line or a page written as visible escapes
 * (`\n`, `\u202e`), so a message never carries a file's whole contents, a terminal
 * command, or text that displays other than it reads.
 */

export const SHOWN_MAX = 80;

/** C0 and C1 controls, DEL, and the Unicode bidirectional controls (UAX #9, table 4). */
const UNSAFE = /[\u0000-\u001f\u007f-\u009f\u061c\u200e\u200f\u202a-\u202e\u2066-\u2069]/g;

const NAMED: Record<string, string> = { '\n': '\\n', '\r': '\\r', '\t': '\\t' };

/** `text` with every control and bidi character written as an escape. */
export function escapeUnsafe(text: string): string {
  return text.replace(
    UNSAFE,
    (c) => NAMED[c] ?? `\\u${c.charCodeAt(0).toString(16).padStart(4, '0')}`,
  );
}

/** True when `text` holds a control or bidirectional control character. */
export function hasUnsafe(text: string): boolean {
  UNSAFE.lastIndex = 0;
  const found = UNSAFE.test(text);
  UNSAFE.lastIndex = 0;
  return found;
}

/**
 * `text` safe to print: escaped, and cut to SHOWN_MAX characters with the number left out
 * ("…(+1234 characters)").
 */
export function shown(text: string, max = SHOWN_MAX): string {
  const cut = text.length > max ? text.slice(0, max) : text;
  const rest = text.length - cut.length;
  return `${escapeUnsafe(cut)}${rest > 0 ? `…(+${rest} characters)` : ''}`;
}
