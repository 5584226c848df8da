/**
 * Helpers shared by the tileflux notebooks (Deno kernel): Vega-Lite charts as the MIME bundle
 * Jupyter front ends render, tables as HTML with a plain-text fallback, and outlet schedules
 * written as YAML text.
 *
 * Every helper displays at once and must be awaited (`await chart(...)`), rather than returning a
 * value for the cell to show: the Deno kernel (2.9) sometimes sends a cell's last value, or a
 * display, after it has reported the cell finished, and Jupyter front ends and nbconvert then
 * drop it. Yielding to the event loop after each display lets the message go out first.
 */
import { parse } from 'yaml';
import { outletSchema, PALETTE, TilefluxError, type Field } from '../dist/index.js';
import { fixed } from '../dist/index.js';

// The report's number formats, for sentences: fixed(x, d) and signed(x, d) ("+4.1", "n/a").
export { fixed, signed } from '../dist/index.js';

/**
 * The MIME type Jupyter front ends render Vega-Lite with. JupyterLab 4 (its vega5-extension,
 * bundling Vega-Lite 5) registers the v3, v4 and v5 Vega-Lite types and no v6 type, so the
 * charts go out as v5 and use only what Vega-Lite 5 and 6 share.
 */
export const VEGA_LITE_MIME = 'application/vnd.vegalite.v5+json';
const VEGA_LITE_SCHEMA = 'https://vega.github.io/schema/vega-lite/v5.json';

/**
 * Display a MIME bundle now and give the kernel a moment to send it before the cell goes on.
 * @example await show({ 'text/plain': 'hello' })
 */
export async function show(bundle: Record<string, unknown>): Promise<void> {
  await Deno.jupyter.display(bundle, { raw: true });
  await new Promise((resolve) => setTimeout(resolve, 25));
}

/** The report's own palette for scenarios (well separated, print-safe on white). */
export { PALETTE };

/** The shared look of the notebook charts (white background, dark text, readable in print). */
export const CHART_CONFIG = {
  background: 'white',
  font: 'DejaVu Sans, Verdana, Arial, sans-serif',
  title: { fontSize: 14, anchor: 'start', subtitleColor: '#4a4a4a' },
  axis: { labelFontSize: 11, titleFontSize: 12, titleFontWeight: 'normal', gridColor: '#e2e2e2' },
  legend: { labelFontSize: 11, titleFontSize: 12, titleFontWeight: 'normal' },
  view: { stroke: null },
};

/**
 * A colour encoding that gives each scenario the same colour in every chart of a notebook.
 * @example encoding: { color: scenarioColour(['conventional', 'shallow']) }
 */
export function scenarioColour(names: readonly string[], title = 'Scenario') {
  return {
    field: 'scenario',
    type: 'nominal',
    title,
    sort: [...names],
    scale: { domain: [...names], range: names.map((_, i) => PALETTE[i % PALETTE.length]) },
  };
}

/**
 * Show a Vega-Lite spec inline. `description` is the plain-text fallback (and the chart's
 * description for screen readers): say what the chart shows.
 * @example await chart({ data: { values }, mark: 'bar', encoding: {...} }, 'Drain flow by year')
 */
export function chart(spec: Record<string, unknown>, description: string): Promise<void> {
  const full = {
    $schema: VEGA_LITE_SCHEMA,
    description,
    config: CHART_CONFIG,
    ...spec,
  };
  return show({ [VEGA_LITE_MIME]: full, 'text/plain': `[chart] ${description}` });
}

/** A column of a displayed table: the record key, its heading and, for numbers, decimals. */
export interface TableColumn {
  key: string;
  label?: string;
  decimals?: number;
}

function cellText(v: unknown, decimals: number | undefined): string {
  if (v === null || v === undefined) return '';
  return typeof v === 'number' ? fixed(v, decimals ?? 2) : String(v);
}

function escapeHtml(text: string): string {
  return text.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;');
}

/**
 * Show records as a table (HTML, with aligned plain text as the fallback). Columns default to
 * every key of the first record; numbers get `decimals` (default 2) and align right.
 * @example await table(rows, [{ key: 'year' , decimals: 0 }, { key: 'drainflow_mm', label: 'Drain flow, mm', decimals: 0 }])
 */
export function table(
  rows: ReadonlyArray<Record<string, unknown>>,
  columns?: ReadonlyArray<TableColumn>,
  caption?: string,
): Promise<void> {
  const cols = columns ?? Object.keys(rows[0] ?? {}).map((key) => ({ key }) as TableColumn);
  const heads = cols.map((c) => c.label ?? c.key);
  const cells = rows.map((r) => cols.map((c) => cellText(r[c.key], c.decimals)));
  const numeric = cols.map((c) => rows.some((r) => typeof r[c.key] === 'number'));
  const align = (j: number) => (numeric[j] ? 'right' : 'left');
  const html =
    '<table>' +
    (caption ? `<caption style="text-align:left">${escapeHtml(caption)}</caption>` : '') +
    '<thead><tr>' +
    heads.map((h, j) => `<th style="text-align:${align(j)}">${escapeHtml(h)}</th>`).join('') +
    '</tr></thead><tbody>' +
    cells
      .map(
        (row) =>
          '<tr>' +
          row.map((t, j) => `<td style="text-align:${align(j)}">${escapeHtml(t)}</td>`).join('') +
          '</tr>',
      )
      .join('') +
    '</tbody></table>';
  const widths = heads.map((h, j) => Math.max(h.length, ...cells.map((r) => r[j].length)));
  const line = (row: string[]) =>
    row.map((t, j) => (numeric[j] ? t.padStart(widths[j]) : t.padEnd(widths[j]))).join('  ');
  const text = [caption ?? '', line(heads), ...cells.map(line)].filter((l) => l !== '').join('\n');
  return show({ 'text/html': html, 'text/plain': text });
}

/**
 * An outlet schedule written as a field file writes the list under `outlet: schedule:` (YAML
 * text, one `{ from: "MM-DD", depth: 0.3 m }` entry per change, `depth: free` to free the
 * outlet), validated by tileflux's field schema. `name` says where it came from in messages.
 * @example scheduleFromYaml('- { from: "11-01", depth: 0.3 m }\n- { from: "04-01", depth: free }', 'MY_SCHEDULE')
 */
export function scheduleFromYaml(text: string, name: string): Field['outlet'] {
  let list: unknown;
  try {
    list = parse(text);
  } catch (err) {
    throw new TilefluxError(`is not valid YAML: ${String(err).split('\n')[0]}`, name);
  }
  const r = outletSchema.safeParse({ schedule: list });
  if (r.success) return r.data;
  const issue = r.error.issues[0];
  // A bad depth fails every branch of the union; the quantity branch says what is accepted.
  const inner =
    issue.code === 'invalid_union'
      ? issue.errors.flat().find((e) => e.code === 'custom' || e.code === 'invalid_format')
      : undefined;
  const [, index, key] = issue.path;
  const where =
    typeof index === 'number' ? `entry ${index + 1}${key ? ` (${String(key)})` : ''}: ` : '';
  throw new TilefluxError(
    `${where}${(inner ?? issue).message}; write one entry per change, ` +
      '- { from: "MM-DD", depth: 0.3 m } or - { from: "MM-DD", depth: free }',
    name,
  );
}

/**
 * Show Markdown text (sentences between tables and charts; console output has the same race).
 * @example await say(`**29 years** compared`)
 */
export function say(markdown: string): Promise<void> {
  return show({ 'text/markdown': markdown, 'text/plain': markdown });
}
