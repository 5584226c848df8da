/**
 * The page every tileflux report is built on: escaping of user strings in markup and in
 * embedded JSON, inlined scripts hashed into a Content-Security-Policy that forbids every network
 * request, the style sheet, chart figures, the cautions, and the page shell (`buildHtmlPage`)
 * with vega, vega-lite and vega-embed inlined so that it opens offline.
 */
import { createHash } from 'node:crypto';
import { CHART_CAPTIONS, type ChartName } from './charts.js';
import { loadVegaBundles, type VegaBundles } from './vegaBundles.js';

export const HTML_ESCAPES: Readonly<Record<string, string>> = {
  '&': '&amp;',
  '<': '&lt;',
  '>': '&gt;',
  '"': '&quot;',
  "'": '&#39;',
};
/**
 * Escape text for HTML element content and quoted attribute values.
 *
 * @example escapeHtml('<img src=x>') // '&lt;img src=x&gt;'
 */
export function escapeHtml(text: string): string {
  return String(text).replace(/[&<>"']/g, (c) => HTML_ESCAPES[c]);
}
/**
 * JSON that is safe inside a <script> element: `<`, `>` and `&` become \u003c, \u003e and
 * \u0026 (so no "</script>" or "<!--" can appear), and the JavaScript line separators U+2028
 * and U+2029 are escaped too. JSON.parse gives back the same value.
 *
 * @example jsonForScript({ a: '</script>' }) // '{"a":"\\u003c/script\\u003e"}'
 */
export function jsonForScript(value: unknown): string {
  return JSON.stringify(value)
    .replace(/</g, '\\u003c')
    .replace(/>/g, '\\u003e')
    .replace(/&/g, '\\u0026')
    .replace(/\u2028/g, '\\u2028')
    .replace(/\u2029/g, '\\u2029');
}
/** A library's source inside <script>; refuses text that would end or confuse the element. */
export function inlineScript(source: string, name: string): string {
  if (/<\/script|<!--|<script/i.test(source)) {
    throw new Error(`${name} cannot be inlined: it contains a script tag or comment opener`);
  }
  return `<script>${source}</script>`;
}
/**
 * Content-Security-Policy of the page: nothing may be fetched, and only our own inline scripts
 * run, named by their SHA-256 hashes, so that an inline event handler slipped into the markup
 * would not run either. vega compiles its expressions with Function(), hence 'unsafe-eval'.
 */
export function contentSecurityPolicy(scripts: string[]): string {
  const hashes = scripts
    .map((s) => `'sha256-${createHash('sha256').update(s, 'utf8').digest('base64')}'`)
    .join(' ');
  return (
    `default-src 'none'; script-src ${hashes} 'unsafe-eval'; style-src 'unsafe-inline'; ` +
    "img-src data: blob:; font-src data:; connect-src 'none'; form-action 'none'; base-uri 'none'"
  );
}
/** The style of every tileflux page (reports and the explorer). */
export const PAGE_CSS = `
:root { --ink: #1b1b1b; --muted: #5a5a5a; --rule: #d4d4d4; --accent: #1f5f8b; --band: #eef3f6;
  --warn: #8c1c13; }
* { box-sizing: border-box; }
body { font: 15px/1.5 "DejaVu Sans", "Segoe UI", Roboto, Helvetica, Arial, sans-serif;
  color: var(--ink); background: #fff; max-width: 62rem; margin: 0 auto; padding: 1.5rem; }
header { border-bottom: 3px solid var(--accent); margin-bottom: 1rem; }
h1 { font-size: 1.6rem; margin: 0 0 0.3rem; }
h2 { font-size: 1.25rem; color: var(--accent); margin: 2.2rem 0 0.6rem;
  border-bottom: 1px solid var(--rule); padding-bottom: 0.2rem; }
.meta { color: var(--muted); margin: 0 0 0.8rem; }
nav ol { columns: 2; margin: 0; padding-left: 1.4rem; }
nav a { color: var(--accent); }
table { border-collapse: collapse; width: 100%; font-size: 0.86rem;
  font-variant-numeric: tabular-nums; margin: 0.5rem 0 1rem; }
caption { text-align: left; color: var(--muted); font-size: 0.85rem; padding-bottom: 0.3rem; }
th, td { padding: 0.28rem 0.5rem; border-bottom: 1px solid var(--rule); text-align: right;
  vertical-align: top; }
th:first-child, td:first-child { text-align: left; }
td.text, th.text { text-align: left; }
thead th { border-bottom: 2px solid var(--ink); font-weight: 600; }
tbody th { font-weight: normal; }
.unit { color: var(--muted); font-size: 0.85em; white-space: nowrap; }
.chg { display: block; color: var(--muted); font-size: 0.8em; }
.is-baseline { background: var(--band); }
.chart { min-height: 4rem; overflow-x: auto; }
.chart svg { max-width: 100%; height: auto; }
.chart-error { color: var(--warn); }
figure { margin: 1.6rem 0; }
figcaption { color: var(--muted); font-size: 0.88rem; margin-top: 0.3rem; }
.cautions { border-left: 4px solid var(--warn); background: #fbf3f2; padding: 0.6rem 1rem; }
.cautions li { margin: 0.3rem 0; }
tr.group th { text-align: left; font-weight: 600; color: var(--accent); padding-top: 0.7rem; }
thead th.group { text-align: center; border-bottom: 1px solid var(--rule); }
dl.glossary dt { font-weight: 600; margin-top: 0.6rem; }
dl.glossary dd { margin: 0.1rem 0 0 1.2rem; }
.scroll { overflow-x: auto; max-width: 100%; }
.ok { color: #2c6e2f; }
.bad { color: var(--warn); font-weight: 600; }
footer { margin-top: 2.5rem; color: var(--muted); font-size: 0.8rem;
  border-top: 1px solid var(--rule); padding-top: 0.5rem; }
@page { margin: 14mm; }
@media print {
  body { max-width: none; padding: 0; font-size: 10pt; }
  nav, noscript { display: none; }
  h2 { break-after: avoid; }
  figure, .cautions, table.keep { break-inside: avoid; }
  thead { display: table-header-group; }
  table.yearly { font-size: 7.5pt; }
  .scroll { overflow: visible; }
  a { color: inherit; text-decoration: none; }
}
`;
/**
 * Figure containers for charts drawn in the page, numbered in order, each with its caption
 * (the chart's name when `captions` has none).
 */
export function chartFigures(
  names: string[],
  captions: Readonly<Record<string, string | undefined>> = CHART_CAPTIONS,
): string {
  return names
    .map((name, i) => {
      const caption = captions[name as ChartName] ?? name;
      return (
        `<figure id="figure-${escapeHtml(name)}"><div class="chart" data-chart="${escapeHtml(name)}" role="img" ` +
        `aria-label="${escapeHtml(caption)}"></div>` +
        `<figcaption><strong>Figure ${i + 1}.</strong> ${escapeHtml(caption)}</figcaption></figure>`
      );
    })
    .join('\n');
}
/** What the page says when JavaScript is off: where the charts are as files. */
export const NOSCRIPT_CHARTS =
  '<noscript><p>The charts need JavaScript. Their Vega-Lite specs are in the charts folder ' +
  'beside this report, with SVG and PNG copies when the run was made with --images.</p></noscript>';
/**
 * Cautions of every design output (README, Cautions): codes, standards and a licensed
 * professional decide; trenching is dangerous.
 */
export const DESIGN_CAUTIONS = [
  'Drain design, outlet works and any wetland or water-quality determination follow local ' +
    'drainage guides, conservation practice standards and permits, and need a licensed professional.',
  'Trenching is dangerous work with its own safety rules: locate buried utilities before digging ' +
    'and follow the excavation safety rules that apply where the work is done.',
];
/** The cautions as the page's list. */
export function cautionList(items: readonly string[]): string {
  return `<ul class="cautions">${items.map((c) => `<li>${escapeHtml(c)}</li>`).join('')}</ul>`;
}
/** The cautions of every simulation page: planning estimates, then the design cautions. */
export const PLANNING_CAUTIONS = [
  'The figures are planning estimates from simplified physics: a daily water balance with a ' +
    'single water table midway between the drains, quasi-steady drain equations and simple ' +
    'nitrate models. They compare alternatives under the same assumptions and the same weather; ' +
    'they do not predict what a particular field will do in a particular year.',
  ...DESIGN_CAUTIONS,
];
/** Browser side: draw every chart container with its spec, then mark the page as ready. */
export const EMBED_SCRIPT = `(function () {
  'use strict';
  var specs = JSON.parse(document.getElementById('tileflux-chart-specs').textContent);
  var boxes = document.querySelectorAll('.chart[data-chart]');
  var jobs = [];
  Array.prototype.forEach.call(boxes, function (box) {
    var name = box.getAttribute('data-chart');
    if (!Object.prototype.hasOwnProperty.call(specs, name)) return;
    jobs.push(
      vegaEmbed(box, specs[name], { actions: false, renderer: 'svg' }).catch(function (err) {
        box.textContent = 'This chart could not be drawn: ' + (err && err.message ? err.message : err);
        box.className += ' chart-error';
        console.error(err);
      })
    );
  });
  Promise.all(jobs).then(function () {
    document.documentElement.setAttribute('data-charts', 'ready');
  });
})();`;
/** A page of the report: title, one line under it, sections of markup and the chart specs. */
export interface HtmlPage {
  title: string;
  /** Plain text under the title (escaped here). */
  meta: string;
  generatedBy: string;
  /** [id, heading, body markup] in page order; listed in the contents. */
  sections: Array<[id: string, heading: string, body: string]>;
  /** Chart specs drawn into the `.chart[data-chart]` containers by name. */
  specs: Record<string, object>;
  bundles?: VegaBundles | undefined;
}
/**
 * The self-contained page around report sections: Content-Security-Policy, style, contents,
 * the inlined vega libraries, the chart specs as JSON and the script that draws them. Every
 * report of tileflux goes through it, so they open offline and look alike.
 *
 * @example buildHtmlPage({ title: 'Plan', meta: 'a plan', generatedBy: 'tileflux', sections: [], specs: {} })
 */
export function buildHtmlPage(page: HtmlPage): string {
  const bundles = page.bundles ?? loadVegaBundles();
  const { sections, specs } = page;
  const title = escapeHtml(page.title);
  const scripts = [bundles.vega, bundles.vegaLite, bundles.vegaEmbed, EMBED_SCRIPT];
  const nav = sections.map(([id, h]) => `<li><a href="#${id}">${h}</a></li>`).join('');
  const body = sections
    .map(([id, h, content]) => `<section id="${id}">\n<h2>${h}</h2>\n${content}\n</section>`)
    .join('\n');
  return `<!DOCTYPE html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<meta http-equiv="Content-Security-Policy" content="${contentSecurityPolicy(scripts)}">
<meta name="generator" content="${escapeHtml(page.generatedBy)}">
<title>${title}</title>
<link rel="icon" href="data:,">
<style>${PAGE_CSS}</style>
</head>
<body>
<header>
<h1>${title}</h1>
<p class="meta">${escapeHtml(page.meta)}</p>
</header>
<nav aria-label="Contents"><ol>${nav}</ol></nav>
${body}
<footer>Generated by ${escapeHtml(page.generatedBy)}. Planning estimate; see the cautions above.</footer>
${inlineScript(bundles.vega, 'vega')}
${inlineScript(bundles.vegaLite, 'vega-lite')}
${inlineScript(bundles.vegaEmbed, 'vega-embed')}
<script type="application/json" id="tileflux-chart-specs">${jsonForScript(specs)}</script>
<script>${EMBED_SCRIPT}</script>
</body>
</html>
`;
}
