/**
 * What `tileflux run` does once its options are parsed (registered in cli/commands/run.ts):
 * simulate the field's scenarios and write the run folder.
 */
import { basename } from 'node:path';
import { emit, parseUnits } from '../common.js';
import { runFromFiles, runReport, writeRunFolderOf, type RunCommandOptions } from '../runShared.js';

/** Run the field file at `fieldPath` with the command's options. */
export async function run(fieldPath: string, o: RunCommandOptions): Promise<void> {
  const units = parseUnits(o.units);
  const { plan, meta, explorerHtml, stop } = runFromFiles(fieldPath, o);
  const out = o.out ?? `${basename(fieldPath).replace(/\.[^.]*$/, '')}-run`;
  const { run, summary, written, comparison } = await writeRunFolderOf(
    plan,
    meta,
    out,
    units,
    {
      ...o,
      explorerHtml: o.explorer === false ? undefined : () => explorerHtml(units),
    },
    stop,
  );
  emit(o.json, summary, () =>
    runReport(run, meta, units, out, written, comparison, o.images === true),
  );
}
