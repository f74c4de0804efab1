// Eleventy wiring only: folders, the generator's filters and the copied assets. The data
// (computed card views) is added by generator/pipeline/eleventy.ts when it runs Eleventy.
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const projectRoot = path.dirname(fileURLToPath(import.meta.url));

export default async function (eleventyConfig) {
  // bin/stovecard.js runs the compiled generator (dist/) and says so; from the sources
  // (tsx, vitest) the TypeScript is loaded through tsx.
  let setup;
  if (process.env.STOVECARD_COMPILED === '1') {
    setup = await import('./dist/generator/render/eleventy-setup.js');
  } else {
    await import('tsx/esm');
    setup = await import('./generator/render/eleventy-setup.ts');
  }
  const { filters, passthroughCopies } = setup;
  for (const [name, filter] of Object.entries(filters)) eleventyConfig.addFilter(name, filter);
  eleventyConfig.addPassthroughCopy(passthroughCopies());
  // Every value from YAML is escaped; only our own SVG strings are marked | safe.
  eleventyConfig.setNunjucksEnvironmentOptions({ autoescape: true, throwOnUndefined: true });
  return {
    // Absolute, so a build started from any folder finds the templates. No `output` here: the
    // build passes its temporary folder (beside site/), and a folder set here would override it.
    dir: {
      input: path.join(projectRoot, 'templates'),
      includes: '_includes',
      layouts: '_includes/layouts',
    },
    templateFormats: ['njk'],
    htmlTemplateEngine: 'njk',
  };
}
