/**
 * What `tileflux system` does (registered in cli/commands/system.ts): read the system and its
 * profile, design it, write the folder and print the table.
 */
import { writeFileSync } from 'node:fs';
import { basename, dirname, join, resolve } from 'node:path';
import { TilefluxError } from '../../errors.js';
import { designSystem, type SystemDesign } from '../../drainage/systemDesign.js';
import { readProfileFile, readSystemFile, type LoadedSystem } from '../../io/system.js';
import { lateralRows, reachRows, systemSummary, writeSystemTables } from '../../io/systemFolder.js';
import { writeCharts } from '../../report/index.js';
import { profileChartSpecs } from '../../report/systemCharts.js';
import { buildSystemReportHtml } from '../../report/systemHtml.js';
import { US, type UnitSystem } from '../../units/quantity.js';
import { VERSION } from '../../version.js';
import { CAUTION, chartsLines, emit, imagesOf, parseUnits } from '../common.js';
import { writeDirAtomic } from '../../io/atomicOutput.js';
import { fixedText } from '../../units/decimal.js';

/** The options of `tileflux system`. */
export interface SystemFlags {
  profile?: string;
  out?: string;
  units?: string;
  round?: string;
  force?: boolean;
  charts?: boolean;
  images?: boolean;
  report?: boolean;
  json?: boolean;
}

/** The printed table: one line per reach and lateral group. */
function table(design: SystemDesign, units: UnitSystem): string {
  const us = units === 'us';
  const flowU = us ? 'ft3/s' : 'L/s';
  const flow = (m3s: number) => (us ? fixedText(m3s * US.cfsPerM3s, 3) : fixedText(m3s * 1000, 2));
  const dc = (mmD: number) => (us ? fixedText(mmD / US.mmPerIn, 3) : fixedText(mmD, 1));
  const dcU = us ? 'in/d' : 'mm/d';
  const area = (m2: number) =>
    us ? fixedText(m2 / 10000 / US.haPerAc, 2) : fixedText(m2 / 10000, 2);
  const areaU = us ? 'ac' : 'ha';
  const head =
    `${'pipe'.padEnd(14)} ${`area ${areaU}`.padStart(9)} ${`flow ${flowU}`.padStart(11)} ` +
    `${'needs'.padStart(8)} ${'size'.padStart(7)} ${'used'.padStart(5)} ${'grade %'.padStart(8)} ` +
    `${'min %'.padStart(6)} ${`eff. ${dcU}`.padStart(10)} ${'cut max'.padStart(8)}`;
  const needs = (d: number) =>
    us ? `${fixedText((d * 1000) / US.mmPerIn, 2)}in` : `${fixedText(d * 1000, 0)}mm`;
  const cut = (m: number | undefined) =>
    m === undefined ? '' : us ? `${fixedText(m / US.mPerFt, 1)}ft` : `${fixedText(m, 2)}m`;
  const line = (
    id: string,
    areaM2: number,
    p: SystemDesign['laterals'][number] | SystemDesign['reaches'][number],
    maxCut?: number,
  ) =>
    `${id.slice(0, 14).padEnd(14)} ${area(areaM2).padStart(9)} ${flow(p.designFlowM3s).padStart(11)} ` +
    `${needs(p.requiredDiameterM).padStart(8)} ${`${p.selected.nominal} ${p.selected.unit}`.padStart(7)} ` +
    `${`${fixedText(p.sharePercent, 0)}%`.padStart(5)} ${fixedText(p.grade * 100, 3).padStart(8)} ` +
    `${fixedText(p.minimumGrade * 100, 3).padStart(6)} ${dc(p.effectiveCoefficientMmD).padStart(10)} ${cut(maxCut).padStart(8)}`;
  return [
    head,
    ...design.reaches.map((r) => line(r.reach.id, r.reach.areaAboveM2, r, r.maxCutM)),
    ...design.laterals.map((l) => line(`${l.id} x${l.count}`, l.areaEachM2, l)),
  ].join('\n');
}

/** The profile to lay the grades on: --profile, else the system file's `profile:` (relative to it). */
export function profileOf(
  systemPath: string,
  loaded: LoadedSystem,
  option: string | undefined,
): string | undefined {
  if (option !== undefined) return option;
  return loaded.file.profile === undefined
    ? undefined
    : resolve(dirname(systemPath), loaded.file.profile);
}

/** Design the system of the file at `systemPath` and write its folder. */
export async function system(systemPath: string, o: SystemFlags): Promise<void> {
  const images = imagesOf(o);
  const units = parseUnits(o.units);
  const out = o.out;
  if (out === undefined) throw new TilefluxError('--out is required (the output folder)');
  const loaded = readSystemFile(systemPath);
  if (o.round !== undefined) {
    if (o.round !== 'up' && o.round !== 'down') {
      throw new TilefluxError(`--round expects up or down; got ${o.round}`);
    }
    loaded.settings.round = o.round;
  }
  const profilePath = profileOf(systemPath, loaded, o.profile);
  const profiles = profilePath === undefined ? undefined : readProfileFile(profilePath);
  const design = designSystem(loaded.tree, loaded.settings, profiles);
  const planName = loaded.file.name;
  const { specs, captions } = profileChartSpecs(design, loaded.settings, units, planName);
  const written: string[] = [];
  await writeDirAtomic(out, Boolean(o.force), async (dir) => {
    written.push(...writeSystemTables(dir, design, units));
    if (Object.keys(specs).length > 0 && o.charts !== false) {
      await writeCharts(dir, specs, { images });
      written.push('charts/');
    }
    if (o.report !== false) {
      writeFileSync(
        join(dir, 'report.html'),
        buildSystemReportHtml({
          planName,
          systemFile: basename(systemPath),
          profileFile: profilePath === undefined ? undefined : basename(profilePath),
          coefficientText: loaded.coefficientText,
          generatedBy: `tileflux ${VERSION}`,
          units,
          design,
          settings: loaded.settings,
          reachRows: reachRows(design),
          lateralRows: lateralRows(design),
          specs,
          captions,
        }),
      );
      written.push('report.html');
    }
    const summary = systemSummary(planName, design, loaded.settings, units, written);
    writeFileSync(join(dir, 'system.json'), JSON.stringify(summary, null, 2) + '\n');
  });
  written.push('system.json');
  emit(o.json, systemSummary(planName, design, loaded.settings, units, written), () =>
    [
      `${planName}: ${design.reaches.length} reaches on ${design.mains.length} mains, ` +
        `${design.laterals.length} lateral groups; coefficient ${
          units === 'us'
            ? `${fixedText(loaded.settings.coefficientMmD / US.mmPerIn, 3)} in/d`
            : `${fixedText(loaded.settings.coefficientMmD, 1)} mm/d`
        } (${loaded.coefficientText}), sizes rounded ${loaded.settings.round}`,
      '',
      table(design, units),
      '',
      ...(design.notes.length ? [...design.notes.map((n) => `- ${n}`), ''] : []),
      `Wrote ${out}/ (${written.join(', ')}).`,
      ...chartsLines(out, written, images),
      CAUTION + ' Trenching is dangerous: locate utilities and follow the excavation safety rules.',
    ].join('\n'),
  );
}
