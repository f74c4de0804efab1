/**
 * Sentences of the build under faults (issue 16): the --out folder, the swap, the cache,
 * file-system failures, the server. Every value the user wrote goes through shown()
 * (at most 80 characters, control and bidi characters escaped).
 */
import { shown } from './shown.ts';

/** What to change, by the file system's error code. */
const FS_ADVICE: Record<string, string> = {
  EACCES: 'permission denied: make it writable for you (chmod/chown) or choose another folder',
  EPERM: 'the operation is not permitted there: choose another folder',
  EROFS: 'the file system is read-only: choose a folder on a writable disk',
  ENOSPC:
    'the disk is full: free some space (the build needs about twice the site) and build again',
  EDQUOT: 'your disk quota is used up: free some space and build again',
  EBUSY:
    'it is in use by another program (an open window, a server, a sync tool): close that and build again',
  ENAMETOOLONG:
    'the path is too long for the file system: use a shorter --out or content path, or shorter ids',
  ENOTDIR:
    'a part of the path is a file, not a folder: remove or rename that file, or choose another path',
  EISDIR: 'a folder is in the way where a file belongs: remove or rename it',
  EMFILE: 'too many files are open: raise the limit (ulimit -n) and build again',
  ENFILE: 'too many files are open on this system: close some programs and build again',
  EIO: 'the disk reported a read or write error: check the disk and build again',
  ELOOP: 'a chain of links loops: fix or remove the link',
  EEXIST: 'something is already there: remove it or choose another path',
  EXDEV: 'the folders are on different disks: keep --out on one disk',
};

const CACHE_KINDS: Record<string, readonly [string, string]> = {
  plans: ['plan', 'plans'],
  views: ['card view', 'card views'],
  pages: ['page', 'pages'],
  pdfs: ['PDF', 'PDFs'],
};

const kindOrder = (folder: string): number => {
  const i = Object.keys(CACHE_KINDS).indexOf(folder);
  return i < 0 ? Infinity : i;
};

export const faultWords = {
  outNotASite: (outDir: string): string =>
    `--out ${shown(outDir)} is a folder that holds other files and was not made by stovecard build (it has no .stovecard-site file), and the build replaces the whole --out folder; choose a new or empty folder, or move its files away first`,
  outLinkLoop: (outDir: string): string =>
    `--out ${shown(outDir)} is a link that leads to itself; remove the link or choose another folder`,
  /** A file-system failure: the path, what went wrong and what to change. */
  fileSystem: (code: string, file: string | undefined): string => {
    const advice =
      FS_ADVICE[code] ?? `the file system refused (${code}): check the path and build again`;
    return file === undefined ? `${advice} (${code})` : `${shown(file)}: ${advice} (${code})`;
  },
  knownFileSystemCode: (code: string): boolean => code in FS_ADVICE,
  previousNotRemoved: (folder: string, code: string): string =>
    `note: the new site is in place, but the previous one at ${shown(folder)} could not be removed (${code}); delete it yourself when you no longer need it`,
  skippedFiles: (files: readonly string[]): string =>
    `note: skipped ${files.length} editor lock, backup or hidden file${files.length === 1 ? '' : 's'}: ${files
      .slice(0, 5)
      .map((file) => shown(file))
      .join(', ')}${files.length > 5 ? `, and ${files.length - 5} more` : ''}`,
  sweptLeftovers: (names: readonly string[]): string =>
    `note: removed ${names.length} folder${names.length === 1 ? '' : 's'} an interrupted build had left: ${names
      .slice(0, 5)
      .map((name) => shown(name))
      .join(', ')}${names.length > 5 ? `, and ${names.length - 5} more` : ''}`,
  damagedCache: (counts: Readonly<Record<string, number>>): string =>
    `note: made again ${Object.entries(counts)
      .sort(([a], [b]) => kindOrder(a) - kindOrder(b))
      .map(([folder, n]) => {
        const [one, many] = CACHE_KINDS[folder] ?? [`${folder} file`, `${folder} files`];
        return `${n} ${n === 1 ? one : many}`;
      })
      .join(', ')} whose cached copy failed its check (damaged or changed on disk)`,
  portInUse: (port: number): string =>
    `port ${port} is in use by another program; stop it or choose another with --port`,
  portNotAllowed: (port: number): string =>
    `port ${port} needs special rights on this system; choose one above 1023 with --port`,
  flagOutOfRange: (flag: string, value: number, min: number, max: number, unit: string): string =>
    `${flag} ${value} is outside ${min}–${max} ${unit}, the range the model covers (as site.yaml's room); give a value inside it`,
  /** `plan`'s summary when a cold start would deliver no coffee (its mean is not a number). */
  coldStartNoCoffee: 'cold start: no coffee reaches the cup',
  qrTooDense: (
    url: string,
    modules: number,
    moduleMm: number,
    printedMm: number,
    minMm: number,
  ): string =>
    `site.yaml base_url: the QR code of ${shown(url)} needs ${modules} modules across ${printedMm.toFixed(1)} mm (${moduleMm.toFixed(2)} mm each, under the ${minMm} mm a phone reads); shorten base_url or the ids in the address`,
  pageCollision: (page: string, first: string, second: string): string =>
    `two cards would share the page ${shown(page)}: ${shown(first)} and ${shown(second)}; rename one of the ids`,
} as const;
