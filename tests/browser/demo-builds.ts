/**
 * The demo content built at one paper size into a temporary folder, by the site build's own
 * buildSite. Pass the same cache folder to every call: the plans do not depend on the
 * paper, so only the first build plans and the others reuse them.
 */
import { cp, readFile, writeFile } from 'node:fs/promises';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { buildSite, type BuildResult } from '../../generator/pipeline/build-site.ts';
import type { PaperSize } from '../../generator/content/types.ts';

export const DEMO_CONTENT = fileURLToPath(new URL('../../content/', import.meta.url));
export const PAPERS: readonly PaperSize[] = ['A4', 'A5', 'A6', 'letter', 'half-letter'];
/** 2024-05-01: the date printed on the cards, so pages are the same from run to run. */
export const BUILD_ENV: NodeJS.ProcessEnv = { SOURCE_DATE_EPOCH: '1714521600' };

export interface DemoBuild {
  readonly result: BuildResult;
  readonly outDir: string;
}

/** Letter sizes are printed in US units, as a US café would set them. */
export async function buildDemoAt(
  root: string,
  paper: PaperSize,
  cacheDir: string,
): Promise<DemoBuild> {
  const content = path.join(root, `content-${paper}`);
  await cp(DEMO_CONTENT, content, { recursive: true });
  const site = path.join(content, 'site.yaml');
  let yaml = (await readFile(site, 'utf8')).replace(/^paper: .*$/m, `paper: ${paper}`);
  if (paper === 'letter' || paper === 'half-letter')
    yaml = yaml.replace(/^units: .*$/m, 'units: us');
  await writeFile(site, yaml);
  const outDir = path.join(root, `site-${paper}`);
  const result = await buildSite({ contentDir: content, outDir, cacheDir, env: BUILD_ENV });
  return { result, outDir };
}
