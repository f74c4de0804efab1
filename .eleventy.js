// Eleventy wiring only: folders, the generator's filters and the copied assets. The data
// (computed card views) is added by generator/pipeline/eleventy.ts when it runs Eleventy.
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const projectRoot = path.dirname(fileURLToPath(import.meta.url));

export default async function (eleventyConfig) {
  await import('tsx/esm');
  const { filters, passthroughCopies } = await import('./generator/render/eleventy-setup.ts');
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
