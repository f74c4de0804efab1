/**
 * Eleventy, run programmatically over templates/ with the build's computed data as one
 * global (`stovecard`, a SiteData). The simulation is never run from a template: by the
 * time Eleventy starts, every plan, chart and drawing is a string in that object.
 */
import Eleventy from '@11ty/eleventy';
import path from 'node:path';
import { COMPILED, PROJECT_ROOT } from '../project-root.ts';
import type { SiteData } from '../render/site-view.ts';

export { PROJECT_ROOT };

// .eleventy.js loads the filters from dist/ when the generator runs compiled, else through tsx.
if (COMPILED) process.env.STOVECARD_COMPILED = '1';
export const TEMPLATES_DIR = path.join(PROJECT_ROOT, 'templates');
export const ELEVENTY_CONFIG = path.join(PROJECT_ROOT, '.eleventy.js');

/** Name of the global the templates read. */
export const DATA_NAME = 'stovecard';

export interface EleventyRun {
  readonly outDir: string;
  readonly data: SiteData;
}

function eleventy(run: EleventyRun, runMode: 'build' | 'serve' = 'build'): Eleventy {
  return new Eleventy(TEMPLATES_DIR, run.outDir, {
    configPath: ELEVENTY_CONFIG,
    quietMode: true,
    runMode,
    config(config) {
      config.addGlobalData(DATA_NAME, run.data);
    },
  });
}

/** Writes the site into run.outDir; returns the number of pages written. */
export async function writeSite(run: EleventyRun): Promise<number> {
  const site = eleventy(run);
  // Quiet: the build prints its own progress and summary; errors still reject write().
  site.disableLogger();
  const results = (await site.write()) as unknown;
  return countPages(results);
}

function countPages(results: unknown): number {
  // write() resolves to [passthroughResults, templateResults]; count written templates.
  if (!Array.isArray(results)) return 0;
  const templates = results[1];
  return Array.isArray(templates)
    ? templates.flat(Infinity).filter((r) => r && typeof r === 'object').length
    : 0;
}

/** Eleventy's dev server over an already built folder's data (live reload on rebuilds). */
export function serveEleventy(run: EleventyRun): Eleventy {
  return eleventy(run, 'serve');
}
