/**
 * A whole run folder, for the CLI and library users alike: the tables and summary of
 * io/runFolder.ts, the comparison, the charts and the report.
 */
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { writeDirAtomic } from '../io/atomicOutput.js';
import { buildSummary, writeRunFiles, type RunMeta } from '../io/runFolder.js';
import { toCsv } from '../io/tables.js';
import type { ComparisonRow } from '../scenarios/compare.js';
import type { RunOutput } from '../scenarios/run.js';
import { comparisonColumnsOf, comparisonOf } from '../scenarios/runComparison.js';
import type { UnitSystem } from '../units/quantity.js';
import { buildChartSpecs } from './charts.js';
import { writeCharts, writeReport } from './index.js';
import { reportDataOf } from './reportData.js';

/** What `writeRunFolder` writes besides the tables. */
export interface RunFolderOptions {
  /** Replace an existing tileflux output folder. */
  force?: boolean | undefined;
  charts?: boolean | undefined;
  report?: boolean | undefined;
  /** Year of the water-table and hydrograph charts (default the wettest year). */
  chartYear?: number | undefined;
  /** Write daily.csv (default true; false for large studies). */
  daily?: boolean;
  /** The explorer page to write beside the report (explorer.html); none when absent. */
  explorerHtml?: (() => string) | undefined;
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
): Promise<{
  summary: ReturnType<typeof buildSummary>;
  written: string[];
  comparison: ComparisonRow[];
}> {
  const comparison = comparisonOf(run);
  const chartYear = o.chartYear;
  const summary = buildSummary(run, meta, units, comparison);
  const daily = o.daily !== false;
  const written = [...(daily ? ['daily.csv'] : []), 'annual.csv', 'comparison.csv', 'summary.json'];
  await writeDirAtomic(
    out,
    Boolean(o.force),
    async (dir) => {
      await writeRunFiles(dir, run, summary, units, daily);
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
      if (o.charts === false && o.report === false) return;
      const data = reportDataOf(run, {
        fieldName: meta.fieldName,
        weatherFile: meta.weatherFile,
        weatherSource: meta.weatherSource,
        units,
        chartYear,
        comparison,
      });
      const specs = buildChartSpecs(data);
      if (o.charts !== false) {
        await writeCharts(dir, specs);
        written.push('charts/');
      }
      if (o.report !== false) {
        writeReport(dir, data, specs);
        written.push('report.html');
      }
    },
    meta.inputPaths ? { inputs: meta.inputPaths } : {},
  );
  return { summary, written, comparison };
}
