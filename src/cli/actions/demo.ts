/**
 * What `tileflux demo` does (registered in cli/commands/demo.ts): the run of the bundled demo
 * field and weather into a full run folder.
 */
import { fileURLToPath } from 'node:url';
import { emit, parseUnits } from '../common.js';
import { runFromFiles, runReport, writeRunFolderOf } from '../runShared.js';

/** The bundled demo files, found relative to this module (works from a clone or an install). */
export const DEMO_FIELD = fileURLToPath(new URL('../../../data-demo/field.yaml', import.meta.url));
export const DEMO_WEATHER = fileURLToPath(
  new URL('../../../data-demo/weather.csv', import.meta.url),
);

/** The options of `tileflux demo`. */
export interface DemoOptions {
  out: string;
  units?: string;
  force?: boolean;
  json?: boolean;
  images?: boolean;
}

/** Run the demo with the command's options. */
export async function demo(o: DemoOptions): Promise<void> {
  const units = parseUnits(o.units);
  const { plan, meta, explorerHtml, stop } = runFromFiles(DEMO_FIELD, {
    weather: DEMO_WEATHER,
    units: o.units,
  });
  const { run, summary, written, comparison } = await writeRunFolderOf(
    plan,
    meta,
    o.out,
    units,
    {
      force: o.force,
      images: o.images,
      explorerHtml: () => explorerHtml(units),
    },
    stop,
  );
  emit(o.json, summary, () =>
    runReport(run, meta, units, o.out, written, comparison, o.images === true),
  );
}
