/**
 * The printed blocks of the design commands (`spacing`, `size`): each input echoed as the user
 * gave it beside the value used, and aligned "label   value" sections.
 */
import { fixedText, isDecimalNumber } from '../units/decimal.js';
import { US, type UnitSystem } from '../units/quantity.js';

/** SI input units and their US customary display: label and factor from the SI value. */
const US_ECHO: Readonly<Record<string, [label: string, factor: number]>> = {
  m: ['ft', 1 / US.mPerFt],
  'm/d': ['ft/d', 1 / US.mPerFt],
  'mm/d': ['in/d', 1 / US.mmPerIn],
  ha: ['ac', 1 / US.haPerAc],
};

/**
 * An input as the user gave it, followed by the value used when the two differ:
 * "48 in = 1.219 m", "0.5 m/d", "0.1 m (default)". `value` is in the SI `unit`; with `units`
 * 'us' the value used is shown in feet, inches per day or acres instead ("1.2 m = 3.937 ft"),
 * and an input already given in the unit shown is shown as given ("1 m/d", not "1 m/d = 1.000 m/d").
 */
export function echo(
  raw: string | undefined,
  value: number,
  unit: string,
  decimals: number,
  units: UnitSystem = 'si',
): string {
  const us = units === 'us' ? US_ECHO[unit] : undefined;
  const label = us ? us[0] : unit;
  const used = `${fixedText(us ? value * us[1] : value, decimals)} ${label}`.trim();
  if (raw === undefined) return `${used} (default)`;
  const given = raw.trim();
  if (isDecimalNumber(given)) return us ? `${given} ${unit} = ${used}` : `${given} ${unit}`.trim();
  // Given in the unit shown: nothing to convert.
  if (given.replace(/^[-+\d.eE\s]+/, '') === label) return given;
  return `${given} = ${used}`;
}

/** Sections of aligned "label   value" lines under headings, one width for all. */
export function blocks(sections: Array<[heading: string, rows: Array<[string, string]>]>): string {
  const width =
    Math.max(...sections.flatMap(([, rows]) => rows.map(([label]) => label.length))) + 3;
  return sections
    .map(([heading, rows]) =>
      [heading, ...rows.map(([label, value]) => `  ${label.padEnd(width)}${value}`)].join('\n'),
    )
    .join('\n\n');
}
