/**
 * fitted.yaml: the user's field file with the fitted values written in place (comments, order
 * and the rest of the file kept) and a header comment with the fit statistics, so that
 * `tileflux run fitted.yaml` runs the calibrated field directly.
 */
import { isAbsolute, relative, resolve, dirname } from 'node:path';
import { parseDocument } from 'yaml';
import { fitParameter } from '../scenarios/fitParams.js';
import type { QuantityKind } from '../units/quantity.js';

/** Unit written after a fitted value, by quantity kind (undefined: a plain number). */
const WRITTEN_UNIT: Partial<Record<QuantityKind, string>> = {
  conductivity: 'm/d',
  rate: 'mm/d',
  depthMm: 'mm',
  length: 'm',
};

/** A fitted value as field-file text: four significant digits and the unit. */
export function valueText(path: string, value: number): string | number {
  const p = fitParameter(path);
  const unit = p?.kind ? WRITTEN_UNIT[p.kind] : undefined;
  const x = Number(value.toPrecision(4));
  return unit ? `${x} ${unit}` : x;
}

/**
 * The field-file text with `values` in place and `header` lines as the leading comment. A
 * nitrate observation file named relative to the field file is renamed relative to the folder
 * the fitted file goes to, so it is still found.
 * @example fittedFieldText(text, { 'soil.conductivity': 0.52 }, ['Fitted by tileflux'], 'field.yaml', 'out/fitted.yaml')
 */
export function fittedFieldText(
  text: string,
  values: Record<string, number>,
  header: string[],
  fieldPath: string,
  outPath: string,
): string {
  const doc = parseDocument(text.replace(/^\uFEFF/, ''));
  for (const [path, value] of Object.entries(values)) {
    doc.setIn(path.split('.'), valueText(path, value));
  }
  const obs = doc.getIn(['nitrate', 'observations']);
  if (typeof obs === 'string' && !isAbsolute(obs)) {
    const target = resolve(dirname(fieldPath), obs);
    doc.setIn(['nitrate', 'observations'], relative(dirname(resolve(outPath)), target));
  }
  const own = header.map((l) => ` ${l}`).join('\n');
  doc.commentBefore = doc.commentBefore ? `${own}\n\n${doc.commentBefore}` : own;
  return doc.toString({ lineWidth: 0 });
}
