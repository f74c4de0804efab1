/**
 * `stovecard init [DIR]`: a new content folder that builds at once, and never a file
 * written over. The modeline is the line the YAML language server reads
 * (`# yaml-language-server: $schema=<path or URL>`, from the redhat yaml-language-server
 * README, from memory); the demo's own files use the same relative form.
 */
import { mkdir, mkdtemp, readdir, readFile, rm, writeFile } from 'node:fs/promises';
import { existsSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { schemaPathFor } from '../../generator/cli/init.ts';
import { INIT_FILES } from '../../generator/words/init.ts';
import { runMain } from '../hostile/cli-run.ts';

let root: string;

beforeAll(async () => {
  root = await mkdtemp(path.join(tmpdir(), 'stovecard-init-'));
});

afterAll(async () => {
  await rm(root, { recursive: true, force: true });
});

/** Every file under dir, relative, with its bytes. */
async function snapshot(dir: string): Promise<Map<string, string>> {
  const out = new Map<string, string>();
  for (const entry of await readdir(dir, { withFileTypes: true, recursive: true }))
    if (entry.isFile()) {
      const full = path.join(entry.parentPath, entry.name);
      out.set(path.relative(dir, full), (await readFile(full)).toString('base64'));
    }
  return out;
}

describe('stovecard init', () => {
  it('writes one entry of each kind that `stovecard build` builds into cards at once', async () => {
    const content = path.join(root, 'new-content');
    const init = await runMain(['init', content]);
    expect(init.code, init.stderr).toBe(0);
    for (const { file } of INIT_FILES) {
      const text = await readFile(path.join(content, file), 'utf8');
      const first = text.split('\n')[0]!;
      const target = /^# yaml-language-server: \$schema=(\S+)$/.exec(first)?.[1];
      expect(target, file).toBeDefined();
      const schemaFile = target!.startsWith('file:')
        ? fileURLToPath(target!)
        : path.resolve(path.dirname(path.join(content, file)), target!);
      expect(existsSync(schemaFile), `${file} → ${schemaFile}`).toBe(true);
      // Comments explain the keys: most lines that set a key carry one.
      const keyLines = text.split('\n').filter((l) => /^\s*-?\s*[a-z_]+:/.test(l));
      const explained = keyLines.filter((l) => l.includes(' # '));
      expect(explained.length / keyLines.length, file).toBeGreaterThan(0.6);
    }
    const site = path.join(root, 'new-site');
    const build = await runMain(['build', '--content', content, '--out', site]);
    expect(build.code, build.stderr).toBe(0);
    expect(build.stderr).toMatch(/1 station cards, 1 inserts; 0 without a recipe/);
    const cards = (await readdir(path.join(site, 'cards'))).sort();
    const slug = 'three-cup--first-roast--kitchen-gas';
    expect(cards).toEqual([slug, `${slug}.pdf`]);
    expect(existsSync(path.join(site, 'cards', slug, 'index.html'))).toBe(true);
  }, 240_000);

  it('refuses a folder that is not empty, naming it, and leaves every byte as it was', async () => {
    const mine = path.join(root, 'my-content');
    await mkdir(path.join(mine, 'pots'), { recursive: true });
    await writeFile(path.join(mine, 'site.yaml'), '# my own site, not to be lost\nunits: us\n');
    await writeFile(path.join(mine, 'pots', 'three-cup.yaml'), 'name: My pot\n');
    const before = await snapshot(mine);
    const run = await runMain(['init', mine]);
    expect(run.code).not.toBe(0);
    expect(run.stderr).toContain(mine);
    expect(run.stderr).toContain('not empty');
    expect(run.stderr).toContain('nothing was written');
    expect(await snapshot(mine)).toEqual(before);
  });

  it('refuses a path that is a file, and says how to call it', async () => {
    const file = path.join(root, 'a-file.yaml');
    await writeFile(file, 'mine\n');
    const run = await runMain(['init', file]);
    expect(run.code).not.toBe(0);
    expect(run.stderr).toContain('is a file, not a folder');
    expect(await readFile(file, 'utf8')).toBe('mine\n');
  });

  it('--help says what it writes; two folders are a usage error', async () => {
    const help = await runMain(['init', '--help']);
    expect(help.code).toBe(0);
    expect(help.stdout).toContain('Usage: stovecard init [DIR]');
    const two = await runMain(['init', path.join(root, 'x'), path.join(root, 'y')]);
    expect(two.code).toBe(2);
    expect(existsSync(path.join(root, 'x'))).toBe(false);
  });

  it('inside the project the modeline is relative, as the demo content writes it', async () => {
    const demoFirstLine = (await readFile('content/pots/three-cup.yaml', 'utf8')).split('\n')[0];
    const file = path.resolve('content/pots/three-cup.yaml');
    expect(`# yaml-language-server: $schema=${schemaPathFor(file, 'pot')}`).toBe(demoFirstLine);
    const siteLine = (await readFile('content/site.yaml', 'utf8')).split('\n')[0];
    expect(
      `# yaml-language-server: $schema=${schemaPathFor(path.resolve('content/site.yaml'), 'site')}`,
    ).toBe(siteLine);
  });
});
