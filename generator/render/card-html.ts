/**
 * A station card's HTML, from its view: the one markup of the card, used by the site's
 * pages (templates call these as filters: `{{ card | stationCardHtml | safe }}`) and by the
 * customer's page in the browser (generator/browser/planner.ts), so both show the same card.
 * Every text of the view is escaped here; only the view's own drawings (cross-section,
 * chart, QR code: SVG this generator made) go in as they are.
 */
import type { Cautions, Footer, StationCardView, Warnings } from './card-view.ts';
import { logoDataUri, type BrandView } from './brand.ts';

const ESCAPES: Record<string, string> = {
  '&': '&amp;',
  '<': '&lt;',
  '>': '&gt;',
  '"': '&quot;',
  "'": '&#39;',
};

/** Text or attribute value made safe for HTML (the five characters Nunjucks escapes). */
export function escapeHtml(value: unknown): string {
  return String(value ?? '').replace(/[&<>"']/g, (c) => ESCAPES[c]!);
}

const e = escapeHtml;
const each = <T>(items: readonly T[], html: (item: T, i: number) => string): string =>
  items.map(html).join('');

export function warningsHtml(warnings: Warnings | null | undefined): string {
  if (!warnings) return '';
  return `<section class="warnings" role="note">
  <p><strong>${e(warnings.heading)}:</strong>${each(warnings.items, (item) => ` ${e(item)}`)}</p>
</section>
`;
}

export function cautionsHtml(cautions: Cautions): string {
  return `<section class="cautions${cautions.form === 'compact' ? ' is-compact' : ''}">
  <h2>${e(cautions.heading)}</h2>
  <ul>${each(cautions.items, (item) => `<li>${e(item)}</li>`)}</ul>
  <p class="deferral">${e(cautions.deferral)}</p>
</section>
`;
}

export function footerHtml(footer: Footer): string {
  const url = footer.webUrl ? `<p class="url">${e(footer.qrCaption)} ${e(footer.webUrl)}</p>` : '';
  const qr = footer.qrSvg ? `<figure class="qr-box">${footer.qrSvg}</figure>` : '';
  return `<footer class="card-foot">
  <div class="foot-text">
    <p>${e(footer.printedBy)} · ${e(footer.built)}</p>
    ${url}
  </div>
  ${qr}
</footer>
`;
}

function recipeHtml(r: NonNullable<StationCardView['recipe']>): string {
  const notes = (lines: readonly string[], strongLast = false) =>
    each(
      lines,
      (line, i) =>
        `<p class="note${strongLast && i === lines.length - 1 ? ' strong' : ''}">${e(line)}</p>`,
    );
  const big = (q: { value: string; unit: string }) =>
    `<p class="big">${e(q.value)}<span class="unit">${e(q.unit)}</span></p>`;
  return `
  <div class="top">
    <div class="top-steps">
      <section class="step step-water">
        <h2><span class="n">1</span>${e(r.water.heading)}</h2>
        <div class="pair">
          <div>
            <p class="label">${e(r.water.temperatureLabel)}</p>
            ${big(r.water.temperature)}
            ${notes(r.water.temperatureNotes)}
          </div>
          <div>
            <p class="label">${e(r.water.fillLabel)}</p>
            ${big(r.water.fillVolume)}
            <p class="note">${e(r.water.fillMassText)}</p>
            <p class="note">${e(r.water.fillLineText)}</p>
          </div>
        </div>
      </section>
      <div class="pair">
        <section class="step step-coffee">
          <h2><span class="n">2</span>${e(r.coffee.heading)}</h2>
          <p class="label">${e(r.coffee.doseLabel)}</p>
          ${big(r.coffee.dose)}
          ${notes(r.coffee.lines, true)}
        </section>
        <section class="step step-heat">
          <h2><span class="n">3</span>${e(r.heat.heading)}</h2>
          <p class="label">${e(r.heat.settingLabel)}</p>
          <p class="big level">${e(r.heat.level)}</p>
          <p class="note">${e(r.heat.stoveText)}</p>
          ${r.heat.note ? `<p class="note">${e(r.heat.note)}</p>` : ''}
        </section>
      </div>
    </div>
    <figure class="xsec">${r.water.crossSectionSvg}</figure>
  </div>
  <section class="step step-times">
    <h2><span class="n">4</span>${e(r.timings.heading)} <span class="h-note">${e(r.timings.note)}</span></h2>
    <div class="times">
      <div class="time"><p class="label">${e(r.timings.firstCoffeeLabel)}</p><p class="big">${e(r.timings.firstCoffee.text)}</p></div>
      <div class="time"><p class="label">${e(r.timings.offHeatLabel)}</p><p class="big">${e(r.timings.offHeat.text)}</p></div>
    </div>
    <h3>${e(r.timings.watchHeading)}</h3>
    <ol class="watch">${each(r.timings.watch, (line) => `<li>${e(line)}</li>`)}</ol>
  </section>
  <div class="pair pair-chart">
    <section class="step step-chart">
      <h2><span class="n">5</span>${e(r.chart.heading)}</h2>
      <p class="caption">${e(r.chart.caption)}</p>
      <figure class="chart" role="img" aria-label="${e(r.chart.alt)}">${r.chart.svg}</figure>
    </section>
    <section class="step step-expect">
      <h2><span class="n">6</span>${e(r.expect.heading)}</h2>
      <dl>${each(r.expect.rows, (row) => `<dt>${e(row.label)}</dt><dd>${e(row.value)}</dd>`)}</dl>
      ${notes(r.expect.notes)}
    </section>
  </div>
`;
}

function refusalHtml(x: NonNullable<StationCardView['refusal']>): string {
  return `
  <section class="refusal">
    <h2>${e(x.heading)}</h2>
    <p class="note">${e(x.note)}</p>
    <h3>${e(x.whyLabel)}</h3>
    <p class="reason">${e(x.reason)}</p>
    <h3>${e(x.changeLabel)}</h3>
    <p class="reason">${e(x.suggestion)}</p>
  </section>
`;
}

/**
 * The roaster's logo in a card's header, as an <img> of a data: address (an SVG in an <img>
 * runs no script and loads nothing), with its size for the layout; '' without a logo.
 */
export function brandLogoHtml(brand: BrandView | null | undefined): string {
  const logo = brand?.logo;
  if (!logo) return '';
  return `<img class="brand-logo" src="${e(logoDataUri(logo))}" alt="${e(logo.alt)}" width="${e(logo.width)}" height="${e(logo.height)}">`;
}

/**
 * The card header's attributes: `has-logo` and the logo's aspect (--logo-ratio) keep the
 * logo's width free at the right of the title (card.css).
 */
export function cardHeadAttrs(brand: BrandView | null | undefined): string {
  const logo = brand?.logo;
  if (!logo) return 'class="card-head"';
  const ratio = Number((logo.width / logo.height).toFixed(4));
  return `class="card-head has-logo" style="--logo-ratio: ${ratio}"`;
}

/** The whole station card: a recipe, or the refusal that says why, then warnings, cautions, footer. */
export function stationCardHtml(card: StationCardView): string {
  return `<article class="card station${card.refusal ? ' is-refused' : ''}">
  <header ${cardHeadAttrs(card.brand)}>
    <h1>${e(card.title)}</h1>
    <p class="sub">${e(card.subtitle)}</p>
    ${brandLogoHtml(card.brand)}
  </header>${card.recipe ? recipeHtml(card.recipe) : refusalHtml(card.refusal!)}
${warningsHtml(card.warnings)}${cautionsHtml(card.cautions)}${footerHtml(card.footer)}</article>
`;
}
