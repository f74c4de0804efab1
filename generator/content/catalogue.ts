/**
 * The whole content folder as one Catalogue:
 *
 *   site.yaml, pots/, coffees/, stoves/, logs/ ─ list *.yaml / *.yml, sorted by name
 *     ─▶ pots, coffees, stoves: read + schema + own checks + SI        (in parallel)
 *     ─▶ logs and site.yaml: the same, plus the ids and levels they name
 *     ─▶ Catalogue, or one ContentErrors listing every issue of every file
 */
import { readdir, realpath, stat } from 'node:fs/promises';
import { extname, join, relative, isAbsolute } from 'node:path';
import { message } from './messages.ts';
import { buildCoffee } from './coffee.ts';
import { idOfFile, loadEntry, type Checked, type ValidFile } from './entry-file.ts';
import { ContentErrors, ContentIssue, wholeFile } from './issues.ts';
import { buildLog, type LogYaml } from './log.ts';
import { buildPot } from './pot.ts';
import type { KnownIds } from './references.ts';
import { ID_PATTERN, idLike } from './ids.ts';
import { buildSite, withBrand, type SiteYaml } from './site.ts';
import { loadBrand } from './brand.ts';
import { buildStove } from './stove.ts';
import type { Catalogue, EntryBase, SiteEntry } from './types.ts';

const FOLDERS = { pot: 'pots', coffee: 'coffees', stove: 'stoves', log: 'logs' } as const;
type FolderKind = keyof typeof FOLDERS;

const SITE_FILE = 'site.yaml';

interface ListedFile {
  /** Ids of a folder's files are sorted: the planner's card order follows them. */
  readonly id: string;
  readonly path: string;
  /** Relative to the content folder, with forward slashes: "pots/three-cup.yaml". */
  readonly file: string;
}

interface Listing {
  readonly files: readonly ListedFile[];
  readonly issues: readonly ContentIssue[];
  /** Editor lock and backup files and dotfiles, passed over (relative paths). */
  readonly skipped: readonly string[];
}

/** An entry file's extension, in any case: `.yaml`, `.YAML`, `.yml`. */
function isYamlName(name: string): boolean {
  return ['.yaml', '.yml'].includes(extname(name).toLowerCase());
}

/**
 * Files an editor or a file system leaves beside the real ones: dotfiles (`.x.yaml.swp`,
 * Emacs locks `.#x.yaml`, macOS `._x.yaml`), backups `x.yaml~`, Emacs autosaves `#x.yaml#`.
 */
function isEditorFile(name: string): boolean {
  return name.startsWith('.') || name.endsWith('~') || (name.startsWith('#') && name.endsWith('#'));
}

/** True when the real place of `file` is inside the content folder `root` (real path). */
async function staysInside(root: string, file: string): Promise<boolean> {
  try {
    const rel = relative(root, await realpath(file));
    return rel !== '' && !rel.startsWith('..') && !isAbsolute(rel);
  } catch {
    return true; // a broken link: reported as unreadable where it is read
  }
}

function linkOutside(file: string): ContentIssue {
  return new ContentIssue('link-outside', wholeFile(file), message('linkOutside'));
}

function unreadable(file: string, error: unknown): ContentIssue {
  const reason = (error as NodeJS.ErrnoException).code ?? String(error);
  return new ContentIssue('unreadable', wholeFile(file), message('unreadable', reason));
}

const compare = (a: string, b: string): number => (a < b ? -1 : a > b ? 1 : 0);

/** The entry files of one folder (none when it does not exist), and problems with their names. */
async function listFolder(contentDir: string, kind: FolderKind, root: string): Promise<Listing> {
  const folder = FOLDERS[kind];
  let names: string[];
  const issues: ContentIssue[] = [];
  const skipped: string[] = [];
  try {
    const entries = await readdir(join(contentDir, folder), { withFileTypes: true });
    for (const entry of entries) {
      if (isEditorFile(entry.name) && (entry.isFile() || entry.isSymbolicLink())) {
        if (entry.name.toLowerCase().includes('.y')) skipped.push(`${folder}/${entry.name}`);
      }
    }
    const listed = entries.filter((entry) => !isEditorFile(entry.name));
    names = listed.filter((entry) => entry.isFile()).map((entry) => entry.name);
    // A link to a shared entry file inside the content folder counts as that file; a link
    // that leaves the folder is not followed; a broken or looping link is an issue.
    for (const entry of listed.filter((each) => each.isSymbolicLink())) {
      if (!isYamlName(entry.name)) continue;
      const full = join(contentDir, folder, entry.name);
      if (!(await staysInside(root, full))) {
        issues.push(linkOutside(`${folder}/${entry.name}`));
        continue;
      }
      try {
        if ((await stat(full)).isFile()) names.push(entry.name);
      } catch (error) {
        issues.push(unreadable(`${folder}/${entry.name}`, error));
      }
    }
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'ENOENT')
      return { files: [], issues: [], skipped };
    return { files: [], issues: [unreadable(folder, error)], skipped };
  }
  const files: ListedFile[] = [];
  const fileOfId = new Map<string, string>();
  const yamlNames = names.filter(isYamlName);
  // By id, then by name: ids come out sorted even where `a-b.yaml` sorts before `a.yaml`.
  const listing = yamlNames
    .map((name) => ({
      id: idOfFile(name),
      path: join(contentDir, folder, name),
      file: `${folder}/${name}`,
    }))
    .sort((a, b) => compare(a.id, b.id) || compare(a.file, b.file));
  for (const listed of listing) {
    const other = fileOfId.get(listed.id);
    if (!ID_PATTERN.test(listed.id)) {
      issues.push(
        new ContentIssue(
          'bad-file-name',
          wholeFile(listed.file),
          message('badFileName', listed.id, idLike(listed.id)),
        ),
      );
    } else if (other !== undefined) {
      issues.push(
        new ContentIssue(
          'same-id-twice',
          wholeFile(listed.file),
          message('sameIdTwice', listed.id, other),
        ),
      );
    } else {
      fileOfId.set(listed.id, listed.file);
      files.push(listed);
    }
  }
  return { files, issues, skipped };
}

interface Loaded<E> {
  readonly entries: ReadonlyMap<string, E>;
  readonly issues: readonly ContentIssue[];
}

async function loadAll<T, E extends EntryBase>(
  kind: FolderKind,
  files: readonly ListedFile[],
  build: (valid: ValidFile<T>) => Checked<E>,
): Promise<Loaded<E>> {
  const results = await Promise.all(
    files.map((listed) => loadEntry(kind, listed.path, listed.file, build)),
  );
  const entries = new Map<string, E>();
  for (const { value } of results) if (value) entries.set(value.id, value);
  return { entries, issues: results.flatMap((result) => result.issues) };
}

/** Read and check every file of the content folder; throws ContentErrors listing all problems. */
export async function loadCatalogue(contentDir: string): Promise<Catalogue> {
  let rootNames: string[];
  try {
    rootNames = await readdir(contentDir);
  } catch (error) {
    throw new ContentErrors([unreadable(contentDir, error)]);
  }
  const root = await realpath(contentDir).catch(() => contentDir);
  const [pots, coffees, stoves, logs] = await Promise.all([
    listFolder(contentDir, 'pot', root),
    listFolder(contentDir, 'coffee', root),
    listFolder(contentDir, 'stove', root),
    listFolder(contentDir, 'log', root),
  ]);
  const siteLeaves =
    rootNames.includes(SITE_FILE) && !(await staysInside(root, join(contentDir, SITE_FILE)));
  const idsOf = (listing: Listing): string[] => listing.files.map((each) => each.id);
  const known: KnownIds = { pot: idsOf(pots), coffee: idsOf(coffees), stove: idsOf(stoves) };

  const [potEntries, coffeeEntries, stoveEntries] = await Promise.all([
    loadAll('pot', pots.files, buildPot),
    loadAll('coffee', coffees.files, buildCoffee),
    loadAll('stove', stoves.files, buildStove),
  ]);
  const references = { known, stoves: stoveEntries.entries };
  const noSite: Checked<SiteEntry> = {
    issues: [new ContentIssue('missing-file', wholeFile(SITE_FILE), message('missingSiteFile'))],
  };
  let siteFile: ValidFile<SiteYaml> | null = null;
  const [logEntries, siteAlone] = await Promise.all([
    loadAll('log', logs.files, (file: ValidFile<LogYaml>) => buildLog(file, references)),
    siteLeaves
      ? { issues: [linkOutside(SITE_FILE)] }
      : rootNames.includes(SITE_FILE)
        ? loadEntry('site', join(contentDir, SITE_FILE), SITE_FILE, (file: ValidFile<SiteYaml>) => {
            siteFile = file;
            return buildSite(file, known);
          })
        : noSite,
  ]);

  // The brand's logo is a file of its own, read once site.yaml is known to be valid.
  const brand =
    siteFile !== null && siteAlone.value !== undefined
      ? await loadBrand(siteFile, contentDir)
      : { issues: [] };
  const site: Checked<SiteEntry> =
    siteAlone.value !== undefined && brand.brand !== undefined
      ? { value: withBrand(siteAlone.value, brand.brand), issues: siteAlone.issues }
      : siteAlone;
  const issues = [
    ...brand.issues,
    ...[pots, coffees, stoves, logs].flatMap((each) => each.issues),
    ...[potEntries, coffeeEntries, stoveEntries, logEntries].flatMap((each) => each.issues),
    ...site.issues,
  ];
  if (issues.length > 0 || site.value === undefined) throw new ContentErrors(issues);
  return {
    contentDir,
    site: site.value,
    pots: potEntries.entries,
    coffees: coffeeEntries.entries,
    stoves: stoveEntries.entries,
    logs: logEntries.entries,
    skipped: [pots, coffees, stoves, logs].flatMap((each) => each.skipped),
  };
}
