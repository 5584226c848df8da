/**
 * The explorer page in the browser: controls in the reader's units, the two designs side by
 * side, and a rerun of every year on each change, in a Web Worker made from this very script
 * (a Blob URL, so it works from file://) or, where workers are not available, on the page.
 * The same script is the worker: without a document it answers run requests.
 *
 * Every text from the field file is set as text (textContent, value), never as markup.
 */
import { fixed, signed } from '../../report/format.js';
import { displayUnits } from '../../report/units.js';
import type { ComparisonRow } from '../../scenarios/compare.js';
import type { PreparedField } from '../../scenarios/prepared.js';
import { US } from '../../units/quantity.js';
import {
  nitrateParameterOf,
  prepareExplorer,
  runBoth,
  settingsOf,
  settingsProblems,
  type DesignSettings,
  type ExplorerData,
  type ExplorerSettings,
} from './model.js';
import { savedFieldYaml } from './savedField.js';
import { EXPLORER_CHARTS, explorerChartSpecs, type ExplorerChart } from './charts.js';
import { readHash, writeHash } from './hashState.js';
import type { NitrateConfig } from '../../nitrate/types.js';

/** Request and answer between the page and the worker. */
type Request =
  | { type: 'init'; data: ExplorerData }
  | { type: 'run'; id: number; settings: ExplorerSettings; year: number | null };
type Answer =
  | {
      type: 'result';
      id: number;
      rows: ComparisonRow[];
      specs: Record<ExplorerChart, object>;
      year: number;
      years: number[];
    }
  | { type: 'error'; id: number; message: string };

/** vega-embed's entry point, inlined on the page as a global (not in the worker). */
type VegaEmbed = (el: Element, spec: object, opts: Record<string, unknown>) => Promise<unknown>;

/** Answer run requests on a prepared field (in the worker, or on the page). */
function engine() {
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

// ---------------------------------------------------------------------------------------------
// Units of the controls

interface ControlUnit {
  label: string;
  /** Core value -> shown value. */
  factor: number;
  step: string;
  decimals: number;
}

function controlUnits(system: ExplorerData['units']) {
  const us = system === 'us';
  return {
    length: us
      ? { label: 'ft', factor: 1 / US.mPerFt, step: '0.1', decimals: 2 }
      : { label: 'm', factor: 1, step: '0.05', decimals: 3 },
    spacing: us
      ? { label: 'ft', factor: 1 / US.mPerFt, step: '1', decimals: 1 }
      : { label: 'm', factor: 1, step: '0.5', decimals: 2 },
    // 1 in/h = 0.0254 m x 24 h = 0.6096 m/d.
    conductivity: us
      ? { label: 'in/h', factor: 1 / 0.6096, step: '0.05', decimals: 3 }
      : { label: 'm/d', factor: 1, step: '0.05', decimals: 3 },
    fraction: { label: 'volume fraction', factor: 1, step: '0.005', decimals: 3 },
    concentration: { label: 'mg/L', factor: 1, step: '0.5', decimals: 2 },
    load: us
      ? { label: 'lb N/ac', factor: US.lbAcPerKgHa, step: '5', decimals: 1 }
      : { label: 'kg N/ha', factor: 1, step: '5', decimals: 1 },
  } satisfies Record<string, ControlUnit>;
}

/** A number for an input box: rounded for reading, without trailing zeros. */
function boxValue(x: number, u: ControlUnit): string {
  return String(Number((x * u.factor).toFixed(u.decimals)));
}

// ---------------------------------------------------------------------------------------------
// Small DOM helpers

function el<K extends keyof HTMLElementTagNameMap>(
  tag: K,
  attrs: Record<string, string> = {},
  ...children: Array<Node | string>
): HTMLElementTagNameMap[K] {
  const e = document.createElement(tag);
  for (const [k, v] of Object.entries(attrs)) e.setAttribute(k, v);
  for (const c of children) e.append(c);
  return e;
}

let uid = 0;
const nextId = (stem: string) => `${stem}-${++uid}`;

/**
 * A labelled number box in display units; `read` converts back to the core unit. The core
 * value stays exact until the box is edited (the box shows it rounded).
 */
function numberField(
  label: string,
  u: ControlUnit,
  value: number,
  onChange: (core: number) => void,
  testId: string,
): HTMLElement {
  const id = nextId(testId);
  const input = el('input', {
    id,
    type: 'number',
    inputmode: 'decimal',
    step: 'any',
    value: boxValue(value, u),
    'data-control': testId,
  });
  input.addEventListener('change', () => onChange(Number(input.value) / u.factor));
  return el(
    'div',
    { class: 'control' },
    el('label', { for: id }, `${label} `, el('span', { class: 'unit' }, `(${u.label})`)),
    input,
  );
}

// ---------------------------------------------------------------------------------------------
// The page

const MEASURES: Array<{
  key: string;
  label: (r: ComparisonRow) => string;
  column: keyof ComparisonRow;
  change: keyof ComparisonRow | null;
  percent: keyof ComparisonRow | null;
  unit: 'water' | 'load' | 'conc' | 'days';
}> = [
  {
    key: 'drainflow',
    label: () => 'Drain flow',
    column: 'drainflow_mm',
    change: 'drainflow_change_mm',
    percent: 'drainflow_change_percent',
    unit: 'water',
  },
  {
    key: 'no3n_load',
    label: () => 'Nitrate-N load in drain flow',
    column: 'no3n_load_kg_ha',
    change: 'no3n_load_change_kg_ha',
    percent: 'no3n_load_change_percent',
    unit: 'load',
  },
  {
    key: 'fwmc',
    label: () => 'Flow-weighted nitrate-N concentration',
    column: 'fwmc_mg_l',
    change: 'fwmc_change_mg_l',
    percent: 'fwmc_change_percent',
    unit: 'conc',
  },
  {
    key: 'aeration_stress',
    label: () => 'Aeration-stress days',
    column: 'aeration_stress_days',
    change: 'aeration_stress_change_days',
    percent: null,
    unit: 'days',
  },
  {
    key: 'wet',
    label: () => 'Wet days',
    column: 'wet_days',
    change: 'wet_change_days',
    percent: null,
    unit: 'days',
  },
  {
    key: 'spring_fieldwork',
    label: (r) => `Spring fieldwork days, of ${fixed(r.spring_window_days, 0)} in the window`,
    column: 'spring_fieldwork_days',
    change: 'spring_fieldwork_change_days',
    percent: null,
    unit: 'days',
  },
  {
    key: 'fall_fieldwork',
    label: (r) => `Fall fieldwork days, of ${fixed(r.fall_window_days, 0)} in the window`,
    column: 'fall_fieldwork_days',
    change: 'fall_fieldwork_change_days',
    percent: null,
    unit: 'days',
  },
];

function startPage(source: string): void {
  const data = JSON.parse(
    document.getElementById('tileflux-explorer-data')!.textContent!,
  ) as ExplorerData;
  const cu = controlUnits(data.units);
  const du = displayUnits(data.units);
  const settings: ExplorerSettings = settingsOf(data);
  // A link with settings in its fragment reproduces that view.
  let year: number | null = null;
  const linked = readHash(location.hash, settings);
  if (linked) {
    Object.assign(settings, linked.settings);
    year = linked.year;
  }
  const root = document.getElementById('explorer')!;
  const status = document.getElementById('status')!;
  const problemsBox = document.getElementById('problems')!;

  // --- runs: in a worker when possible, else here ---
  let runId = 0;
  let shown = 0;
  let local: ReturnType<typeof engine> | undefined;
  let worker: Worker | undefined;
  const mode = () => (worker ? 'in a background worker' : 'on this page');
  const onAnswer = (a: Answer) => {
    if (a.id !== runId) return; // an older request: a newer one is on its way
    performance.mark(`tileflux-run-end-${a.id}`);
    const took = performance.measure(
      'tileflux-recompute',
      `tileflux-run-start-${a.id}`,
      `tileflux-run-end-${a.id}`,
    );
    if (a.type === 'error') {
      status.textContent = `The designs could not be run: ${a.message}`;
      document.documentElement.setAttribute('data-state', 'error');
      return;
    }
    showResults(a.rows);
    showYears(a.years, a.year);
    shown++;
    drawCharts(a.specs, shown);
    status.textContent = `Updated: ${a.rows[0].years} years of weather run for both designs in ${Math.round(took.duration)} ms, ${mode()}.`;
    document.documentElement.setAttribute('data-runs', String(shown));
    document.documentElement.setAttribute('data-state', 'ready');
  };
  const runLocally = (req: Request) => {
    local ??= engine();
    // Let the page repaint ("computing") before the run blocks it.
    setTimeout(() => {
      const a = local!(req);
      if (a) onAnswer(a);
    }, 0);
  };
  try {
    const url = URL.createObjectURL(new Blob([source], { type: 'text/javascript' }));
    worker = new Worker(url);
    worker.onmessage = (e: MessageEvent<Answer>) => onAnswer(e.data);
    worker.onerror = (e) => {
      // The worker could not start or failed: carry on without it.
      e.preventDefault();
      worker?.terminate();
      worker = undefined;
      runLocally({ type: 'init', data });
      request();
    };
    worker.postMessage({ type: 'init', data } satisfies Request);
  } catch {
    worker = undefined;
    runLocally({ type: 'init', data });
  }

  function request(): void {
    const problems = settingsProblems(data, settings);
    problemsBox.replaceChildren(...problems.map((p) => el('li', {}, p)));
    problemsBox.hidden = problems.length === 0;
    if (problems.length > 0) {
      status.textContent = 'Not run: correct the settings listed above.';
      document.documentElement.setAttribute('data-state', 'invalid');
      return;
    }
    writeHash(settings, year);
    const req: Request = {
      type: 'run',
      id: ++runId,
      settings: structuredClone(settings),
      year,
    };
    performance.mark(`tileflux-run-start-${req.id}`);
    status.textContent = 'Computing every year for both designs\u2026';
    document.documentElement.setAttribute('data-state', 'busy');
    if (worker) worker.postMessage(req);
    else runLocally(req);
  }

  // --- controls ---
  const fieldSet = el(
    'fieldset',
    { id: 'field-controls' },
    el('legend', {}, 'The field (both designs)'),
  );
  fieldSet.append(
    numberField(
      'Soil conductivity',
      cu.conductivity,
      settings.kMPerDay,
      (v) => {
        settings.kMPerDay = v;
        request();
      },
      'conductivity',
    ),
  );
  const por = data.a.field.soil.drainablePorosity;
  settings.porosity.forEach((p, i) => {
    let label = 'Drainable porosity';
    if (typeof por !== 'number') {
      const top = i === 0 ? 0 : por[i - 1].depth;
      label += `, ${boxValue(top, cu.length)} to ${boxValue(por[i].depth, cu.length)} ${cu.length.label} deep`;
    }
    fieldSet.append(
      numberField(
        label,
        cu.fraction,
        p,
        (v) => {
          settings.porosity[i] = v;
          request();
        },
        `porosity-${i + 1}`,
      ),
    );
  });
  const np = nitrateParameterOf(data.a.field.nitrate as NitrateConfig);
  if (np && settings.nitrate !== null) {
    fieldSet.append(
      numberField(
        np.label,
        cu[np.kind],
        settings.nitrate,
        (v) => {
          settings.nitrate = v;
          request();
        },
        'nitrate',
      ),
    );
  } else {
    fieldSet.append(
      el(
        'p',
        { class: 'note' },
        'The nitrate model of this field has no single main setting here; edit it in the field file.',
      ),
    );
  }

  const designBox = (
    key: 'a' | 'b',
    title: string,
    d: DesignSettings,
    name: string,
    description: string,
  ) => {
    const box = el(
      'fieldset',
      { class: 'design', id: `design-${key}` },
      el('legend', {}, `${title}: `, el('span', { class: 'name' }, name)),
    );
    if (description) box.append(el('p', { class: 'note' }, description));
    box.append(
      numberField(
        'Drain depth',
        cu.length,
        d.depthM,
        (v) => {
          d.depthM = v;
          request();
        },
        `${key}-depth`,
      ),
      numberField(
        'Drain spacing',
        cu.spacing,
        d.spacingM,
        (v) => {
          d.spacingM = v;
          request();
        },
        `${key}-spacing`,
      ),
    );
    box.append(outletEditor(key, d));
    return box;
  };

  const outletEditor = (key: 'a' | 'b', d: DesignSettings) => {
    const wrap = el('div', { class: 'outlet' });
    const caption = el(
      'caption',
      {},
      `Outlet schedule of design ${key.toUpperCase()}, repeating every year (no rows: free outlet all year). Level in ${cu.length.label} below the surface.`,
    );
    const body = el('tbody');
    const table = el(
      'table',
      { class: 'schedule', 'data-schedule': key },
      caption,
      el(
        'thead',
        {},
        el(
          'tr',
          {},
          el('th', { scope: 'col' }, 'From (MM-DD)'),
          el('th', { scope: 'col' }, 'Outlet'),
          el('th', { scope: 'col' }, `Level (${cu.length.label})`),
          el('th', { scope: 'col' }, el('span', { class: 'visually-hidden' }, 'Remove')),
        ),
      ),
      body,
    );
    const draw = () => {
      body.replaceChildren(
        ...d.outlet.map((r, i) => {
          const n = i + 1;
          const from = el('input', {
            type: 'text',
            value: r.from,
            size: '6',
            inputmode: 'numeric',
            pattern: '\\d{2}-\\d{2}',
            'aria-label': `Row ${n}: from (MM-DD)`,
            'data-control': `${key}-from-${n}`,
          });
          from.addEventListener('change', () => {
            r.from = from.value.trim();
            request();
          });
          const kind = el(
            'select',
            { 'aria-label': `Row ${n}: outlet held or free`, 'data-control': `${key}-kind-${n}` },
            el('option', { value: 'held' }, 'held at level'),
            el('option', { value: 'free' }, 'free'),
          );
          kind.value = r.depthM === null ? 'free' : 'held';
          const level = el('input', {
            type: 'number',
            step: 'any',
            inputmode: 'decimal',
            value: r.depthM === null ? '' : boxValue(r.depthM, cu.length),
            'aria-label': `Row ${n}: level below the surface (${cu.length.label})`,
            'data-control': `${key}-level-${n}`,
          });
          level.disabled = r.depthM === null;
          kind.addEventListener('change', () => {
            if (kind.value === 'free') r.depthM = null;
            else r.depthM = Number(level.value || boxValue(0.3, cu.length)) / cu.length.factor;
            draw();
            request();
          });
          level.addEventListener('change', () => {
            r.depthM = Number(level.value) / cu.length.factor;
            request();
          });
          const remove = el(
            'button',
            { type: 'button', 'aria-label': `Remove row ${n} of design ${key.toUpperCase()}` },
            'Remove',
          );
          remove.addEventListener('click', () => {
            d.outlet.splice(i, 1);
            draw();
            request();
            add.focus();
          });
          return el(
            'tr',
            {},
            el('td', {}, from),
            el('td', {}, kind),
            el('td', {}, level),
            el('td', {}, remove),
          );
        }),
      );
    };
    const add = el(
      'button',
      { type: 'button', 'data-control': `${key}-add-row` },
      `Add a row to design ${key.toUpperCase()}`,
    );
    add.addEventListener('click', () => {
      d.outlet.push({ from: '01-01', depthM: null });
      draw();
      request();
    });
    draw();
    wrap.append(table, add);
    return wrap;
  };

  root.append(
    fieldSet,
    el(
      'div',
      { class: 'designs' },
      designBox('a', 'Design A', settings.a, data.a.name, data.a.description),
      designBox('b', 'Design B', settings.b, data.b.name, data.b.description),
    ),
  );

  // --- results ---
  const results = document.getElementById('headline')!;
  function showResults(rows: ComparisonRow[]): void {
    const [a, b] = rows;
    const unit = (k: (typeof MEASURES)[number]['unit']) =>
      k === 'days' ? { factor: 1, label: 'days', decimals: 1 } : du[k];
    const perYear = (k: (typeof MEASURES)[number]['unit'], label: string) =>
      k === 'conc' ? label : `${label}/yr`;
    const head = el(
      'thead',
      {},
      el(
        'tr',
        {},
        el('th', { scope: 'col' }, 'Mean over the years'),
        el('th', { scope: 'col' }, 'A: ', el('span', { class: 'name' }, a.scenario)),
        el('th', { scope: 'col' }, 'B: ', el('span', { class: 'name' }, b.scenario)),
        el('th', { scope: 'col' }, 'Change, B against A'),
      ),
    );
    const body = el(
      'tbody',
      {},
      ...MEASURES.map((m) => {
        const u = unit(m.unit);
        const v = (r: ComparisonRow, c: keyof ComparisonRow) => {
          const x = r[c] as number | null;
          return x === null ? null : x * u.factor;
        };
        const pct = m.percent ? (b[m.percent] as number | null) : null;
        const change = m.change
          ? `${signed(v(b, m.change), u.decimals)}${m.percent ? ` (${signed(pct, 1)} %)` : ''}`
          : '';
        return el(
          'tr',
          { 'data-measure': m.key },
          el(
            'th',
            { scope: 'row' },
            `${m.label(a)} `,
            el('span', { class: 'unit' }, `(${perYear(m.unit, u.label)})`),
          ),
          el('td', { 'data-design': 'a' }, fixed(v(a, m.column), u.decimals)),
          el('td', { 'data-design': 'b' }, fixed(v(b, m.column), u.decimals)),
          el('td', { 'data-design': 'change' }, change),
        );
      }),
    );
    results.replaceChildren(
      el(
        'caption',
        {},
        `Mean annual figures over ${a.years} years of the same weather; the change is B minus A, with the percent of A.`,
      ),
      head,
      body,
    );
  }

  // --- charts: drawn on the page by vega-embed, with vega's expression interpreter (no eval) ---
  const yearBox = document.getElementById('chart-year') as HTMLSelectElement;
  yearBox.addEventListener('change', () => {
    year = Number(yearBox.value);
    request();
  });
  function showYears(years: number[], chosen: number): void {
    if (yearBox.options.length !== years.length) {
      yearBox.replaceChildren(...years.map((y) => el('option', { value: String(y) }, String(y))));
    }
    yearBox.value = String(chosen);
  }
  // One drawing at a time; specs that arrive meanwhile wait, and only the latest is drawn.
  let drawing = false;
  let next: { specs: Record<ExplorerChart, object>; run: number } | undefined;
  function drawCharts(specs: Record<ExplorerChart, object>, run: number): void {
    next = { specs, run };
    if (!drawing) void drawLatest();
  }
  async function drawLatest(): Promise<void> {
    const embed = (globalThis as { vegaEmbed?: VegaEmbed }).vegaEmbed;
    if (!embed) return;
    drawing = true;
    while (next) {
      const { specs, run } = next;
      next = undefined;
      performance.mark(`tileflux-draw-start-${run}`);
      await Promise.all(
        EXPLORER_CHARTS.map(async (name) => {
          const box = document.querySelector(`.chart[data-chart="${name}"]`);
          if (!box) return;
          try {
            await embed(box, specs[name], { actions: false, renderer: 'svg', ast: true });
            box.classList.remove('chart-error');
          } catch (err) {
            box.textContent = `This chart could not be drawn: ${err instanceof Error ? err.message : String(err)}`;
            box.classList.add('chart-error');
          }
        }),
      );
      performance.mark(`tileflux-draw-end-${run}`);
      performance.measure(
        'tileflux-draw',
        `tileflux-draw-start-${run}`,
        `tileflux-draw-end-${run}`,
      );
      if (!next) document.documentElement.setAttribute('data-charts', String(run));
    }
    drawing = false;
  }

  // --- save ---
  document.getElementById('save')!.addEventListener('click', () => {
    const text = savedFieldYaml(data, settings);
    const a = el('a', {
      href: URL.createObjectURL(new Blob([text], { type: 'application/yaml' })),
      download: 'explorer-field.yaml',
    });
    document.body.append(a);
    a.click();
    a.remove();
  });

  request();
}

// The same script runs the page (with a document) and its worker (without one).
if (typeof document === 'undefined') {
  const self = globalThis as unknown as {
    onmessage: ((e: MessageEvent<Request>) => void) | null;
    postMessage(a: Answer): void;
  };
  const answer = engine();
  self.onmessage = (e) => {
    const a = answer(e.data);
    if (a) self.postMessage(a);
  };
} else {
  const script = document.currentScript;
  const source = script ? (script.textContent ?? '') : '';
  const start = () => startPage(source);
  if (document.readyState === 'loading') document.addEventListener('DOMContentLoaded', start);
  else start();
}
