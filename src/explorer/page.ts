/**
 * The explorer page: one self-contained HTML file holding the field, its weather record and the
 * bundled engine (dist/explorer/explorer.iife.js, built by `npm run build`), which reruns both
 * designs in the browser on each change. It opens from file:// with no network: the
 * Content-Security-Policy allows only the page's own script (by its SHA-256 hash) and the
 * worker it starts from a Blob URL of that same script.
 */
import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { basename } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { WeatherSeries } from '../climate/weatherSeries.js';
import type { LoadedField } from '../io/field.js';
import { CHART_CAPTIONS } from '../report/charts.js';
import { loadVegaBundles, type VegaBundles } from '../report/vegaBundles.js';
import { EXPLORER_CHARTS } from './browser/charts.js';
import {
  chartFigures,
  cautionList,
  escapeHtml,
  jsonForScript,
  PAGE_CSS,
  PLANNING_CAUTIONS,
} from '../report/htmlPage.js';
import type { PeriodOptions } from '../scenarios/prepared.js';
import type { UnitSystem } from '../units/quantity.js';
import { VERSION } from '../version.js';
import type { ExplorerData } from './browser/model.js';
import { explorerDataOf } from './data.js';

/** Where the build puts the browser script (from src/explorer or dist/explorer alike). */
export const EXPLORER_BUNDLE = fileURLToPath(
  new URL('../../dist/explorer/explorer.iife.js', import.meta.url),
);

let cached: string | undefined;

/** The bundled browser script, read once; a missing build is a broken install. */
export function loadExplorerBundle(): string {
  if (cached === undefined) {
    try {
      cached = readFileSync(EXPLORER_BUNDLE, 'utf8');
    } catch {
      throw new Error(
        `the explorer's browser script ${EXPLORER_BUNDLE} is missing: run npm run build`,
      );
    }
  }
  return cached;
}

/**
 * No requests at all; scripts only by hash; workers only from blob: URLs (the page's own
 * script). No 'unsafe-eval': the engine compiles no code, and vega-embed draws with vega's
 * expression interpreter (its `ast` option) instead of compiling expressions with Function().
 */
function contentSecurityPolicy(scripts: string[]): string {
  const hashes = scripts
    .map((s) => `'sha256-${createHash('sha256').update(s, 'utf8').digest('base64')}'`)
    .join(' ');
  return (
    `default-src 'none'; script-src ${hashes}; worker-src blob:; style-src 'unsafe-inline'; ` +
    "img-src data: blob:; font-src data:; connect-src 'none'; form-action 'none'; base-uri 'none'"
  );
}

const EXPLORER_CSS = `
.caution-top { border-left: 4px solid var(--warn); background: #fbf3f2; padding: 0.5rem 1rem; }
fieldset { border: 1px solid var(--rule); padding: 0.6rem 1rem 0.8rem; margin: 0 0 1rem; }
legend { font-weight: 600; color: var(--accent); padding: 0 0.3rem; }
.designs { display: grid; grid-template-columns: repeat(auto-fit, minmax(19rem, 1fr)); gap: 1rem; }
.control { display: flex; flex-wrap: wrap; align-items: baseline; gap: 0.3rem 0.6rem; margin: 0.35rem 0; }
.control label { flex: 1 1 12rem; }
.control input { width: 7.5rem; }
input, select, button { font: inherit; padding: 0.25rem 0.4rem; min-height: 2.2rem; }
button { border: 1px solid var(--accent); background: #fff; color: var(--accent); border-radius: 3px;
  cursor: pointer; }
button:hover { background: var(--band); }
:focus-visible { outline: 3px solid #e0a100; outline-offset: 2px; }
table.schedule { width: auto; }
table.schedule input[type='number'] { width: 5.5rem; }
table.schedule input[type='text'] { width: 4.6rem; }
table.schedule td, table.schedule th { text-align: left; }
.note { color: var(--muted); font-size: 0.88rem; margin: 0.2rem 0; }
#status { font-weight: 600; min-height: 1.5em; }
#problems { color: var(--warn); font-weight: 600; }
.visually-hidden { position: absolute; width: 1px; height: 1px; overflow: hidden; clip: rect(0 0 0 0);
  white-space: nowrap; }
#headline td[data-design="change"] { font-weight: 600; }
.actions { display: flex; flex-wrap: wrap; gap: 0.6rem; margin: 1rem 0; }
@media print {
  fieldset { break-inside: avoid; }
  figure { break-inside: avoid; }
  .actions, button, #status { display: none; }
  input, select { border: none; padding: 0; min-height: 0; }
}
`;

/** Captions of the explorer's charts: the report's, which name what each chart shows. */
const EXPLORER_CAPTIONS: Record<string, string> = {
  'water-table': CHART_CAPTIONS['water-table'],
  cumulative: CHART_CAPTIONS.cumulative,
  annual: CHART_CAPTIONS.annual,
  duration: CHART_CAPTIONS.duration,
};

/** What a reader should know before using the page (shown at its top and in the README). */
export const EXPLORER_CAUTION =
  'Planning estimates from simplified physics, for comparing designs under the same weather; ' +
  'local codes, practice standards, permits and a licensed professional decide the design.';

/**
 * The explorer page for `data`; `bundle` defaults to the built browser script.
 *
 * @example writeFileAtomic('explorer.html', buildExplorerHtml(explorerDataOf(field, weather, o)))
 */
export function buildExplorerHtml(
  data: ExplorerData,
  bundle: string = loadExplorerBundle(),
  vega: VegaBundles = loadVegaBundles(),
): string {
  const scripts = [vega.vega, vega.vegaLite, vega.vegaEmbed, bundle];
  for (const [i, name] of ['vega', 'vega-lite', 'vega-embed', 'the explorer script'].entries()) {
    if (/<\/script|<!--|<script/i.test(scripts[i])) {
      throw new Error(`${name} cannot be inlined: it contains a script tag or comment opener`);
    }
  }
  const title = escapeHtml(data.title);
  const years = `${data.weather.dates[0]} to ${data.weather.dates[data.weather.dates.length - 1]}`;
  return `<!DOCTYPE html>
<html lang="en" data-state="loading">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<meta http-equiv="Content-Security-Policy" content="${contentSecurityPolicy(scripts)}">
<meta name="generator" content="${escapeHtml(data.generatedBy)}">
<title>${title}</title>
<link rel="icon" href="data:,">
<style>${PAGE_CSS}${EXPLORER_CSS}</style>
</head>
<body>
<header>
<h1>${title}</h1>
<p class="meta">${escapeHtml(data.fieldName)} \u00b7 weather ${escapeHtml(data.weatherFile)}, ${escapeHtml(years)} \u00b7 ${escapeHtml(data.generatedBy)}</p>
</header>
<main>
<p class="caution-top"><strong>Caution:</strong> ${escapeHtml(EXPLORER_CAUTION)}</p>
<p>Change a setting and both designs are run again over every year of the weather record.
Design A is the field file as given; design B is its controlled variant. Values are in
${data.units === 'us' ? 'US customary units (ft, in/h, lb N/ac)' : 'SI units (m, m/d, kg N/ha)'}.</p>
<noscript><p>The explorer needs JavaScript to run the designs.</p></noscript>
<section id="settings" aria-labelledby="settings-heading">
<h2 id="settings-heading">Settings</h2>
<div id="explorer"></div>
<ul id="problems" hidden></ul>
</section>
<section id="results" aria-labelledby="results-heading">
<h2 id="results-heading">Results</h2>
<p id="status" role="status" aria-live="polite">Loading the engine\u2026</p>
<table id="headline" class="keep"></table>
<div class="actions"><button type="button" id="save">Save field file (YAML)</button></div>
<p class="note">The saved file holds both designs as scenarios; <code>tileflux run</code> on it with the same
weather gives the figures above.</p>
</section>
<section id="charts" aria-labelledby="charts-heading">
<h2 id="charts-heading">Charts</h2>
<div class="control"><label for="chart-year">Year shown in the water-table chart (first shown: the wettest year)</label>
<select id="chart-year" data-control="chart-year"></select></div>
${chartFigures([...EXPLORER_CHARTS], EXPLORER_CAPTIONS)}
</section>
<section id="cautions" aria-labelledby="cautions-heading">
<h2 id="cautions-heading">Cautions</h2>
${cautionList(PLANNING_CAUTIONS)}
</section>
</main>
<footer>Generated by ${escapeHtml(data.generatedBy)}. Planning estimate; see the cautions above.</footer>
<script type="application/json" id="tileflux-explorer-data">${jsonForScript(data)}</script>
<script>${vega.vega}</script>
<script>${vega.vegaLite}</script>
<script>${vega.vegaEmbed}</script>
<script>${bundle}</script>
</body>
</html>
`;
}

/**
 * The explorer page of a loaded field and its weather record (`period`: the reported period of
 * the run it goes with, so its figures match).
 */
export function explorerHtmlOf(
  field: LoadedField,
  weather: WeatherSeries,
  weatherFile: string,
  units: UnitSystem,
  period: PeriodOptions = {},
): string {
  return buildExplorerHtml(
    explorerDataOf(field, weather, {
      weatherFile: basename(weatherFile),
      units,
      generatedBy: `tileflux ${VERSION}`,
      period,
    }),
  );
}
