/**
 * The field file the explorer saves: the field as written, with two scenarios, A (the baseline)
 * and B, each carrying its own overrides from the field file plus the settings of the page.
 * `tileflux run` on it gives the page's numbers (same prepared period, engine and comparison).
 */
import { stringify } from 'yaml';
import type { NitrateConfig } from '../../nitrate/types.js';
import {
  designField,
  type DesignSettings,
  type DesignSource,
  type ExplorerData,
  type ExplorerSettings,
} from './model.js';

const m = (x: number) => `${x} m`;

function outletOf(rows: DesignSettings['outlet']): unknown {
  if (rows.length === 0) return 'free';
  return {
    schedule: rows.map((r) => ({ from: r.from, depth: r.depthM === null ? 'free' : m(r.depthM) })),
  };
}

/** The nitrate override of a design in the field file's form, with the page's main parameter. */
function nitrateOf(source: DesignSource, s: ExplorerSettings): Record<string, unknown> | undefined {
  if (s.nitrate === null) return undefined;
  const n = designField(source, s, s.a).nitrate as NitrateConfig;
  const own = (source.overrides.nitrate ?? {}) as Record<string, unknown>;
  if (n.model === 'fixed')
    return { ...own, model: 'fixed', concentration: `${n.concentrationMgL} mg/L` };
  if (n.model === 'rating') return { ...own, model: 'rating', a: `${n.a} mg/L` };
  if (n.model === 'pool') {
    return {
      ...own,
      model: 'pool',
      fertilizer: n.fertilizer.map((e) => ({
        date: e.date,
        amount: e.amountKgHa,
        ...(e.crops ? { crops: e.crops } : {}),
      })),
    };
  }
  return undefined;
}

function scenarioEntry(source: DesignSource, s: ExplorerSettings, d: DesignSettings) {
  const own = source.overrides;
  const f = source.field;
  const por = f.soil.drainablePorosity;
  const porosity =
    typeof por === 'number'
      ? s.porosity[0]
      : por.map((l, i) => ({ depth: m(l.depth), value: s.porosity[i] }));
  const nitrate = nitrateOf(source, s);
  const entry: Record<string, unknown> = {
    ...own,
    name: source.name,
    ...(source.description ? { description: source.description } : {}),
    soil: {
      ...((own.soil ?? {}) as object),
      conductivity: `${s.kMPerDay} m/d`,
      drainablePorosity: porosity,
    },
    drains: { ...((own.drains ?? {}) as object), depth: m(d.depthM), spacing: m(d.spacingM) },
    outlet: outletOf(d.outlet),
  };
  if (nitrate) entry.nitrate = nitrate;
  // The name and description lead, as in a file written by hand.
  const { name, description, ...rest } = entry;
  return { name, ...(description !== undefined ? { description } : {}), ...rest };
}

/**
 * The YAML text of the saved field file.
 *
 * @example savedFieldYaml(data, settingsOf(data)) // 'name: ...\nscenarios:\n  - name: conventional ...'
 */
export function savedFieldYaml(data: ExplorerData, s: ExplorerSettings): string {
  const doc = {
    ...data.baseRaw,
    scenarios: [scenarioEntry(data.a, s, s.a), scenarioEntry(data.b, s, s.b)],
  };
  const head =
    `# Saved by the tileflux explorer (${data.generatedBy}) from ${data.fieldName}.\n` +
    `# Design A (${data.a.name}) is the baseline; run it with: tileflux run THIS-FILE --weather ${data.weatherFile}\n` +
    '# Planning estimates only: local codes, practice standards, permits and a licensed professional decide.\n';
  return head + stringify(doc, { lineWidth: 0 });
}
