/**
 * The explorer page in the browser: controls in the reader's units, the two designs side by
 * side, and a rerun of every year on each change, in a Web Worker made from this very script
 * (a Blob URL, so it works from file://) or, where workers are not available, on the page.
 * The same script is the worker: without a document it answers run requests.
 *
 * Every text from the field file is set as text (textContent, value), never as markup. The
 * controls are built in controls.ts, the runs answered by runner.ts. The rest is longer than most
 * files: `startPage` is one closure that holds the page's state (settings, the latest run, the
 * worker) and wires controls, results, charts and saving to it.
 */
import { fixed, signed } from '../../report/format.js';
import { displayUnits } from '../../report/units.js';
import type { ComparisonRow } from '../../scenarios/compare.js';
import {
  nitrateParameterOf,
  settingsOf,
  settingsProblems,
  type ExplorerData,
  type ExplorerSettings,
} from './model.js';
import { savedFieldYaml } from './savedField.js';
import { EXPLORER_CHARTS, type ExplorerChart } from './charts.js';
import { readHash, writeHash } from './hashState.js';
import type { NitrateConfig } from '../../nitrate/types.js';
import { boxValue, controlUnits, designBox, el, numberField } from './controls.js';
import { engine, type Answer, type Request } from './runner.js';

/** vega-embed's entry point, inlined on the page as a global (not in the worker). */
type VegaEmbed = (el: Element, spec: object, opts: Record<string, unknown>) => Promise<unknown>;

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

  root.append(
    fieldSet,
    el(
      'div',
      { class: 'designs' },
      designBox('a', 'Design A', settings.a, data.a.name, data.a.description, cu, request),
      designBox('b', 'Design B', settings.b, data.b.name, data.b.description, cu, request),
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
