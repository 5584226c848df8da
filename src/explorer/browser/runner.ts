/**
 * The explorer's run service: answers the page's run requests on a prepared field, in the Web
 * Worker or, where workers are not available, on the page itself.
 */
import type { ComparisonRow } from '../../scenarios/compare.js';
import type { PreparedField } from '../../scenarios/prepared.js';
import { prepareExplorer, runBoth, type ExplorerData, type ExplorerSettings } from './model.js';
import { explorerChartSpecs, type ExplorerChart } from './charts.js';

/** Request and answer between the page and the worker. */
export type Request =
  | { type: 'init'; data: ExplorerData }
  | { type: 'run'; id: number; settings: ExplorerSettings; year: number | null };
export type Answer =
  | {
      type: 'result';
      id: number;
      rows: ComparisonRow[];
      specs: Record<ExplorerChart, object>;
      year: number;
      years: number[];
    }
  | { type: 'error'; id: number; message: string };

/** Answer run requests on a prepared field (in the worker, or on the page). */
export function engine() {
  let data: ExplorerData | undefined;
  let prepared: PreparedField | undefined;
  return (req: Request): Answer | undefined => {
    if (req.type === 'init') {
      data = req.data;
      prepared = undefined;
      return undefined;
    }
    try {
      if (!data) throw new Error('no field loaded');
      prepared ??= prepareExplorer(data);
      const both = runBoth(prepared, data, req.settings);
      const charts = explorerChartSpecs(prepared, data, both.runs, both.rows, req.year);
      return {
        type: 'result',
        id: req.id,
        rows: both.rows,
        specs: charts.specs,
        year: charts.year,
        years: both.runs[0].annual.map((r) => r.year),
      };
    } catch (err) {
      return {
        type: 'error',
        id: req.id,
        message: err instanceof Error ? err.message : String(err),
      };
    }
  };
}
