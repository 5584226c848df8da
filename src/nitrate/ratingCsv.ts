/**
 * Reader of observed drain-flow and nitrate pairs for fitting a rating: CSV text with a header
 * row naming `date`, `flow_mm` (or `flow_in`, inches, 1 in = 25.4 mm exactly) and `no3n_mg_l`
 * (nitrate-N, mg N/L) in any order; other columns are ignored. An empty flow or concentration
 * cell means "not sampled that day": the row is skipped and counted. Anything else that is not
 * a non-negative number, an impossible or repeated date, or a ragged row is an error naming the
 * file, the line and the column, and what is accepted.
 *
 * Pure text in, arrays out: it uses csv-parse's browser build (no Node modules), so it runs in
 * the core.
 */
import { CsvError, parse } from 'csv-parse/browser/esm/sync';
import { dayNumber } from '../climate/calendar.js';
import { TilefluxError } from '../errors.js';
import { isDecimalNumber } from '../units/decimal.js';
import { US } from '../units/quantity.js';
import type { RatingPairs } from './types.js';

/**
 * Parse `date,flow_mm,no3n_mg_l` text into observed pairs.
 *
 * @param text CSV text
 * @param file name shown in error messages
 * @example readRatingPairsCsv('date,flow_mm,no3n_mg_l\n2024-04-01,2.5,14.1\n2024-04-02,,\n')
 * // { dates: ['2024-04-01'], flowMm: [2.5], concMgL: [14.1], skippedRows: 1 }
 */
export function readRatingPairsCsv(text: string, file = 'rating observations'): RatingPairs {
  let rows: Array<{ record: string[]; info: { lines: number } }>;
  try {
    rows = parse(text, {
      bom: true,
      trim: true,
      skip_empty_lines: true,
      info: true,
    }) as unknown as typeof rows;
  } catch (e) {
    if (e instanceof CsvError) {
      const line = (e as CsvError & { lines?: number }).lines;
      throw new TilefluxError(
        `${line ? `line ${line}: ` : ''}not readable as CSV (${e.message}); ` +
          'expected a header row and comma-separated rows with the same number of cells',
        file,
      );
    }
    throw e;
  }
  if (rows.length === 0) {
    throw new TilefluxError('empty file; expected a header row date,flow_mm,no3n_mg_l', file);
  }
  const header = rows[0].record.map((h) => h.toLowerCase());
  const find = (names: string[]) => header.findIndex((h) => names.includes(h));
  const iDate = find(['date']);
  const iFlowMm = find(['flow_mm']);
  const iFlowIn = find(['flow_in']);
  const iConc = find(['no3n_mg_l']);
  const missing = [
    iDate < 0 ? 'date' : '',
    iFlowMm < 0 && iFlowIn < 0 ? 'flow_mm (or flow_in)' : '',
    iConc < 0 ? 'no3n_mg_l' : '',
  ].filter(Boolean);
  if (missing.length) {
    throw new TilefluxError(
      `line ${rows[0].info.lines}: the header lacks ${missing.join(', ')}; found ` +
        `${rows[0].record.join(', ')}; expected date, flow_mm (or flow_in) and no3n_mg_l`,
      file,
    );
  }
  const iFlow = iFlowMm >= 0 ? iFlowMm : iFlowIn;
  const flowScale = iFlowMm >= 0 ? 1 : US.mmPerIn;
  const flowName = header[iFlow];

  const out: RatingPairs = { dates: [], flowMm: [], concMgL: [], skippedRows: 0 };
  const seen = new Map<string, number>();
  for (let r = 1; r < rows.length; r++) {
    const { record, info } = rows[r];
    const line = info.lines;
    const date = record[iDate];
    const where = (col: string) => `line ${line}, column ${col}`;
    if (dayNumber(date) === undefined) {
      throw new TilefluxError(
        `${where('date')}: "${date}" is not a date; expected YYYY-MM-DD, e.g. 2024-04-01`,
        file,
      );
    }
    const before = seen.get(date);
    if (before !== undefined) {
      throw new TilefluxError(`${where('date')}: ${date} repeats line ${before}`, file);
    }
    seen.set(date, line);
    const value = (i: number, col: string, unit: string): number | undefined => {
      const cell = record[i];
      if (cell === '') return undefined;
      if (!isDecimalNumber(cell) || Number(cell) < 0) {
        throw new TilefluxError(
          `${where(col)}: "${cell}" is not a number of at least 0; expected ${unit}, or an empty cell for no sample`,
          file,
        );
      }
      return Number(cell);
    };
    const flow = value(
      iFlow,
      flowName,
      iFlowMm >= 0 ? 'mm of daily drain flow' : 'inches of daily drain flow',
    );
    const conc = value(iConc, 'no3n_mg_l', 'nitrate-N in mg/L');
    if (flow === undefined || conc === undefined) {
      out.skippedRows++;
      continue;
    }
    out.dates.push(date);
    out.flowMm.push(flow * flowScale);
    out.concMgL.push(conc);
  }
  return out;
}
