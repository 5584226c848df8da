/**
 * A whole run folder, for the CLI and library users alike: the tables and summary of
 * io/runFolder.ts, the comparison, the charts and the report.
 */
import { closeSync, openSync, writeFileSync, writeSync } from 'node:fs';
import { join } from 'node:path';
import { writeDirAtomic } from '../io/atomicOutput.js';
import {
  buildSummary,
  dailyPoolColumns,
  scenarioDailyCsvChunks,
  writeAnnualAndSummary,
  writeDailyCsv,
  type RunMeta,
} from '../io/runFolder.js';
import { toCsv } from '../io/tables.js';
import type { ComparisonRow } from '../scenarios/compare.js';
import {
  digestOf,
  type RunOutput,
  type RunPlan,
  type RunResult,
  type ScenarioDigest,
} from '../scenarios/run.js';
import { comparisonColumnsOf, comparisonOf } from '../scenarios/runComparison.js';
import type { UnitSystem } from '../units/quantity.js';
import { buildChartSpecs } from './charts.js';
import type { ChartDrawer } from './chartFiles.js';
import { writeCharts, writeReport } from './index.js';
import {
  reportCutOf,
  reportDataOf,
  reportPartOf,
  type ReportCut,
  type ScenarioReportPart,
} from './reportData.js';

/** What `writeRunFolder` writes besides the tables. */
export interface RunFolderOptions {
  /** Replace an existing tileflux output folder. */
  force?: boolean | undefined;
  charts?: boolean | undefined;
  /**
   * Draw the charts to SVG and PNG beside their Vega-Lite specs in charts/ (default true; the
   * CLI draws them only with --images, since report.html draws the specs itself).
   */
  images?: boolean | undefined;
  report?: boolean | undefined;
  /** Year of the water-table and hydrograph charts (default the wettest year). */
  chartYear?: number | undefined;
  /** Write daily.csv (default true; false for large studies). */
  daily?: boolean;
  /** The explorer page to write beside the report (explorer.html); none when absent. */
  explorerHtml?: (() => string) | undefined;
  /**
   * Draws the charts (default: in this thread). The CLI passes its chart threads'
   * (`startChartThreads`), started before the run, so vega loads while the scenarios run.
   */
  drawCharts?: ChartDrawer | undefined;
}

/** What writing a run folder returns: the summary, what was written, the comparison rows. */
export interface RunFolderResult {
  summary: ReturnType<typeof buildSummary>;
  written: string[];
  comparison: ComparisonRow[];
}

/**
 * Write a run's output folder atomically, as `tileflux run` does: daily.csv, annual.csv,
 * comparison.csv, summary.json, and unless switched off charts/ and report.html (and
 * explorer.html when its page is given). An existing folder is replaced only with `force` and
 * only when it is a tileflux output folder. Returns the summary and what was written.
 * @example await writeRunFolder(runField(field, weather), meta, 'my-run', 'si', { charts: false })
 */
export async function writeRunFolder(
  run: RunOutput,
  meta: RunMeta,
  out: string,
  units: UnitSystem,
  o: RunFolderOptions,
): Promise<RunFolderResult> {
  let result: RunFolderResult | undefined;
  await writeDirAtomic(
    out,
    Boolean(o.force),
    async (dir) => {
      if (o.daily !== false) await writeDailyCsv(join(dir, 'daily.csv'), run, units);
      result = await writeRest(dir, run, meta, units, o);
    },
    meta.inputPaths ? { inputs: meta.inputPaths } : {},
  );
  return result!;
}

/**
 * Run a planned field into its output folder, one scenario at a time: each scenario's rows of
 * daily.csv are written as soon as it is computed, and only its digest (annual rows, the daily
 * series of the report, sums; `digestOf`) is kept, so a long record of many scenarios never
 * holds every scenario's daily columns at once. The folder is the one `writeRunFolder` writes
 * for `runField`'s output, byte for byte. Returns the run as the tables read it, too.
 * @example await runToFolder(planRun(field, weather), meta, 'my-run', 'si', { charts: false })
 */
export async function runToFolder(
  plan: RunPlan,
  meta: RunMeta,
  out: string,
  units: UnitSystem,
  o: RunFolderOptions,
): Promise<RunFolderResult & { run: RunResult }> {
  let result: (RunFolderResult & { run: RunResult }) | undefined;
  await writeDirAtomic(
    out,
    Boolean(o.force),
    async (dir) => {
      const daily = o.daily === false ? undefined : openSync(join(dir, 'daily.csv'), 'w');
      const pool = dailyPoolColumns(plan.specs);
      const scenarios: ScenarioDigest[] = [];
      // The report's part of each scenario, cut while its daily columns are at hand.
      const report = !(o.charts === false && o.report === false);
      const parts: ScenarioReportPart[] = [];
      let cut: ReportCut | undefined;
      // Let a SIGINT or SIGTERM be handled (and the temporary folder removed) between scenarios
      // and between pieces of daily.csv, not only once the whole run is done.
      const yieldToSignals = () => new Promise((r) => setImmediate(r));
      try {
        for (let k = 0; k < plan.specs.length; k++) {
          await yieldToSignals();
          // Views of the working columns: written and digested before the next scenario runs.
          const s = plan.scenario(k, { views: true });
          if (daily !== undefined) {
            for (const chunk of scenarioDailyCsvChunks(plan.run.forcing, s, units, {
              header: k === 0,
              pool,
            })) {
              writeSync(daily, chunk);
              await yieldToSignals();
            }
          }
          if (report) {
            cut ??= reportCutOf(plan.run, s, o.chartYear);
            parts.push(reportPartOf(plan.run.forcing.dates, s, cut));
          }
          scenarios.push(digestOf(s));
        }
      } finally {
        if (daily !== undefined) closeSync(daily);
      }
      const band = plan.seepageBandSteps(scenarios.map((s) => s.annual));
      let step = band.next();
      while (!step.done) {
        await yieldToSignals();
        step = band.next();
      }
      const seepageBand = step.value;
      const run: RunResult = { ...plan.run, scenarios, ...(seepageBand && { seepageBand }) };
      result = { ...(await writeRest(dir, run, meta, units, o, parts)), run };
    },
    meta.inputPaths ? { inputs: meta.inputPaths } : {},
  );
  return result!;
}

/** Everything of a run folder but daily.csv, into the temporary folder `dir`. */
async function writeRest(
  dir: string,
  run: RunResult,
  meta: RunMeta,
  units: UnitSystem,
  o: RunFolderOptions,
  parts?: ScenarioReportPart[],
): Promise<RunFolderResult> {
  const comparison = comparisonOf(run);
  const summary = buildSummary(run, meta, units, comparison);
  const written = [
    ...(o.daily !== false ? ['daily.csv'] : []),
    'annual.csv',
    'comparison.csv',
    'summary.json',
  ];
  writeAnnualAndSummary(dir, run, summary, units);
  writeFileSync(
    join(dir, 'comparison.csv'),
    toCsv(
      comparison.map((r) =>
        Object.fromEntries(
          comparisonColumnsOf(run).map((k) => [
            k,
            (r as Record<string, unknown>)[k] as string | number,
          ]),
        ),
      ),
      units,
    ),
  );
  if (o.explorerHtml) {
    writeFileSync(join(dir, 'explorer.html'), o.explorerHtml());
    written.push('explorer.html');
  }
  if (o.charts === false && o.report === false) return { summary, written, comparison };
  const data = reportDataOf(run, {
    fieldName: meta.fieldName,
    weatherFile: meta.weatherFile,
    weatherSource: meta.weatherSource,
    units,
    chartYear: o.chartYear,
    comparison,
    ...(parts && { parts }),
  });
  const specs = buildChartSpecs(data);
  // The charts are drawn (on the chart threads, when there are some) while the report is written.
  const charts =
    o.charts !== false
      ? writeCharts(dir, specs, { images: o.images, draw: o.drawCharts })
      : undefined;
  try {
    if (o.report !== false) writeReport(dir, data, specs);
  } catch (err) {
    // Nothing may still be writing charts when the caller removes the half-written folder.
    await charts?.catch(() => undefined);
    throw err;
  }
  if (charts) {
    await charts;
    written.push('charts/');
  }
  if (o.report !== false) written.push('report.html');
  return { summary, written, comparison };
}
