/**
 * Reads one content file as bytes and decodes it as strict UTF-8, refusing files too large
 * to be an entry. The sha256 of the bytes fingerprints the entry for the build cache.
 */
import { createHash } from 'node:crypto';
import { open } from 'node:fs/promises';
import { message } from './messages.ts';
import { ContentIssue, wholeFile } from './issues.ts';

/** 1 MiB: an entry is a few hundred bytes; anything this large is the wrong file. */
export const MAX_CONTENT_FILE_BYTES = 1024 * 1024;

export type ContentText =
  | { readonly ok: true; readonly text: string; readonly hash: string }
  | { readonly ok: false; readonly issue: ContentIssue };

function decodes(bytes: Uint8Array, length: number, stream: boolean): boolean {
  try {
    new TextDecoder('utf-8', { fatal: true }).decode(bytes.subarray(0, length), { stream });
    return true;
  } catch {
    return false;
  }
}

/** Byte offset where the first invalid UTF-8 sequence starts (the bytes are known to be invalid). */
function firstInvalidByte(bytes: Uint8Array): number {
  // Longest prefix that decodes when more bytes may follow; invariant: `low` decodes, `high` does not.
  let low = 0;
  let high = bytes.length + 1;
  while (high - low > 1) {
    const middle = Math.floor((low + high) / 2);
    if (decodes(bytes, middle, true)) low = middle;
    else high = middle;
  }
  // That prefix may end inside the bad sequence (a lead byte whose continuation never came).
  let start = Math.min(low, bytes.length - 1);
  while (start > 0 && !decodes(bytes, start, false)) start -= 1;
  return start;
}

function positionOfByte(bytes: Uint8Array, offset: number): { line: number; column: number } {
  const lineStart = bytes.lastIndexOf(0x0a, offset - 1) + 1;
  let line = 1;
  for (let i = 0; i < lineStart; i += 1) if (bytes[i] === 0x0a) line += 1;
  const column = new TextDecoder('utf-8').decode(bytes.subarray(lineStart, offset)).length + 1;
  return { line, column };
}

/** Read `path`; `file` is how messages name it. */
export async function readContentText(path: string, file: string): Promise<ContentText> {
  const whole = wholeFile(file);
  let bytes: Uint8Array;
  try {
    const handle = await open(path, 'r');
    try {
      const { size } = await handle.stat();
      if (size > MAX_CONTENT_FILE_BYTES) {
        const wording = message('fileTooLarge', size, MAX_CONTENT_FILE_BYTES);
        return { ok: false, issue: new ContentIssue('file-too-large', whole, wording) };
      }
      bytes = await handle.readFile();
    } finally {
      await handle.close();
    }
  } catch (error) {
    const reason = (error as NodeJS.ErrnoException).code ?? String(error);
    return {
      ok: false,
      issue: new ContentIssue('unreadable', whole, message('unreadable', reason)),
    };
  }
  const hash = createHash('sha256').update(bytes).digest('hex');
  try {
    return { ok: true, text: new TextDecoder('utf-8', { fatal: true }).decode(bytes), hash };
  } catch {
    const at = { ...whole, ...positionOfByte(bytes, firstInvalidByte(bytes)) };
    return { ok: false, issue: new ContentIssue('not-utf8', at, message('notUtf8')) };
  }
}
