/**
 * What `tileflux explorer` does (registered in cli/commands/explorer.ts): the interactive page of
 * a field and a weather record, written atomically.
 */
import { explorerHtmlOf } from '../../explorer/page.js';
import { readFieldFile } from '../../io/field.js';
import { readWeatherFile } from '../../io/weather.js';
import { CAUTION, emit, parseUnits } from '../common.js';
import { writeFileAtomic } from '../../io/atomicOutput.js';
import { weatherReadOptions, type WeatherReadFlags } from '../weatherOptions.js';

/** The options of `tileflux explorer`. */
export interface ExplorerOptions extends WeatherReadFlags {
  weather: string;
  out?: string;
  units?: string;
  force?: boolean;
  json?: boolean;
}

/** Write the explorer page of the field file at `fieldPath`. */
export function explorer(fieldPath: string, o: ExplorerOptions): void {
  const units = parseUnits(o.units);
  const out = o.out ?? 'explorer.html';
  const field = readFieldFile(fieldPath);
  const weather = readWeatherFile(o.weather, weatherReadOptions(o));
  const html = explorerHtmlOf(field, weather.series, o.weather, units);
  writeFileAtomic(out, html, Boolean(o.force));
  emit(o.json, { written: out, bytes: Buffer.byteLength(html) }, () =>
    [`Wrote ${out}: open it in a browser (it needs no network).`, CAUTION].join('\n'),
  );
}
