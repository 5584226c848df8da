/**
 * The explorer page's controls: the units the boxes show values in, small DOM helpers, a
 * labelled number box, and the controls of one design (depth, spacing, outlet schedule). Every
 * text is set as text (textContent, value), never as markup.
 */
import { US } from '../../units/quantity.js';
import type { DesignSettings, ExplorerData } from './model.js';

// ---------------------------------------------------------------------------------------------
// Units of the controls

/** How a control shows a core value: unit label, factor, step and decimals of the box. */
export interface ControlUnit {
  label: string;
  /** Core value -> shown value. */
  factor: number;
  step: string;
  decimals: number;
}

/** The units of the controls in a unit system. */
export function controlUnits(system: ExplorerData['units']) {
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
export function boxValue(x: number, u: ControlUnit): string {
  return String(Number((x * u.factor).toFixed(u.decimals)));
}

// ---------------------------------------------------------------------------------------------
// Small DOM helpers

/** An element with attributes and children (text is set as text, never as markup). */
export function el<K extends keyof HTMLElementTagNameMap>(
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
export function numberField(
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

/** The units of every kind of control. */
export type ControlUnits = ReturnType<typeof controlUnits>;

/**
 * The controls of one design: drain depth and spacing and its outlet schedule; `onChange` runs
 * after every edit (the settings `d` are changed in place).
 */
export function designBox(
  key: 'a' | 'b',
  title: string,
  d: DesignSettings,
  name: string,
  description: string,
  cu: ControlUnits,
  onChange: () => void,
): HTMLElement {
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
        onChange();
      },
      `${key}-depth`,
    ),
    numberField(
      'Drain spacing',
      cu.spacing,
      d.spacingM,
      (v) => {
        d.spacingM = v;
        onChange();
      },
      `${key}-spacing`,
    ),
  );
  box.append(outletEditor(key, d, cu.length, onChange));
  return box;
}

/**
 * The outlet schedule of one design as an editable table (rows: from MM-DD, held or free, level
 * in `length` units), with add and remove buttons; `onChange` runs after every edit.
 */
export function outletEditor(
  key: 'a' | 'b',
  d: DesignSettings,
  length: ControlUnit,
  onChange: () => void,
): HTMLElement {
  const wrap = el('div', { class: 'outlet' });
  const caption = el(
    'caption',
    {},
    `Outlet schedule of design ${key.toUpperCase()}, repeating every year (no rows: free outlet all year). Level in ${length.label} below the surface.`,
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
        el('th', { scope: 'col' }, `Level (${length.label})`),
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
          onChange();
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
          value: r.depthM === null ? '' : boxValue(r.depthM, length),
          'aria-label': `Row ${n}: level below the surface (${length.label})`,
          'data-control': `${key}-level-${n}`,
        });
        level.disabled = r.depthM === null;
        kind.addEventListener('change', () => {
          if (kind.value === 'free') r.depthM = null;
          else r.depthM = Number(level.value || boxValue(0.3, length)) / length.factor;
          draw();
          onChange();
        });
        level.addEventListener('change', () => {
          r.depthM = Number(level.value) / length.factor;
          onChange();
        });
        const remove = el(
          'button',
          { type: 'button', 'aria-label': `Remove row ${n} of design ${key.toUpperCase()}` },
          'Remove',
        );
        remove.addEventListener('click', () => {
          d.outlet.splice(i, 1);
          draw();
          onChange();
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
    onChange();
  });
  draw();
  wrap.append(table, add);
  return wrap;
}
