/**
 * Drain-system files in: SYSTEM.yaml (the tree of mains, reaches and laterals) validated and
 * checked with every problem located by file, line and column, and PROFILE.csv (ground
 * elevations along each main, `main,station_m,elevation_m` or with `_ft` columns).
 */
import { dirname, resolve } from 'node:path';
import { CsvError, parse } from 'csv-parse/sync';
import { TilefluxError } from '../errors.js';
import { drainageCoefficient } from '../drainage/drainageCoefficient.js';
import type { GroundProfile } from '../drainage/gradeLaying.js';
import { pipeSizeList } from '../drainage/pipeSizes.js';
import { designSystem, type SystemSettings } from '../drainage/systemDesign.js';
import { systemSchema, type SystemFile } from '../drainage/systemSchema.js';
import { buildSystemTree, type SystemTree } from '../drainage/systemTree.js';
import { US } from '../units/quantity.js';
import { locate, locatedIssue, readYamlMapping, type Path } from './yamlIssues.js';
import { readTextFile } from './files.js';

/** A read system: the validated file, its checked tree and the design settings. */
export interface LoadedSystem {
  file: SystemFile;
  tree: SystemTree;
  settings: SystemSettings;
  /** How the drainage coefficient was chosen, for people. */
  coefficientText: string;
  text: string;
}

/** The coefficient in mm/d and how it was chosen: a given rate or a preset of the table. */
function coefficientOf(c: SystemFile['coefficient']): { mmD: number; text: string } {
  if (typeof c === 'number') return { mmD: c, text: 'given' };
  const dc = drainageCoefficient(c);
  const inD = (x: number) => +x.toFixed(3);
  return {
    mmD: dc.mmPerDay,
    text:
      `preset ${c.soil} soil, ${c.crop} crops, ${c.inlets} inlets: ${inD(dc.lowInPerDay)}-` +
      `${inD(dc.highInPerDay)} in/d tabulated, middle taken; ${dc.source}`,
  };
}

/** "mains[0].reaches[1].grade" as a path. */
function pathOf(key: string): Path {
  return key
    .split('.')
    .flatMap((part) => part.split(/[[\]]/).filter((x) => x !== ''))
    .map((p) => (/^\d+$/.test(p) ? Number(p) : p));
}

/**
 * Parse, validate and check a system file's text.
 *
 * @example parseSystem(readFileSync('system.yaml', 'utf8'), 'system.yaml').tree.mains.length
 */
export function parseSystem(text: string, file = 'system file'): LoadedSystem {
  const src = readYamlMapping(text, file, 'name, coefficient, mains, ...');
  const parsed = systemSchema.safeParse(src.raw);
  if (!parsed.success) {
    throw new TilefluxError(locatedIssue(src, systemSchema, parsed.error.issues, src.raw), file);
  }
  const f = parsed.data;
  let tree: SystemTree;
  try {
    tree = buildSystemTree(f);
  } catch (err) {
    // The tree names the key at fault; point at it in the file.
    if (err instanceof TilefluxError && err.where !== undefined) {
      const at = locate(src.doc, src.lc, pathOf(err.where));
      throw new TilefluxError(`${at}: ${err.message}`, file);
    }
    throw err;
  }
  const coefficient = coefficientOf(f.coefficient);
  const settings: SystemSettings = {
    coefficientMmD: coefficient.mmD,
    sizes: pipeSizeList(f.sizes, 'sizes'),
    velocityMs: f.velocity,
    round: f.round,
    ...(f.outlet.invert !== undefined && { outletInvertM: f.outlet.invert }),
    ...(f.outlet.depth !== undefined && { outletDepthM: f.outlet.depth }),
    depthM: f.trench.depth,
    minimumCoverM: f.trench.minimumCover,
    maximumDepthM: f.trench.maximumDepth,
  };
  return { file: f, tree, settings, coefficientText: coefficient.text, text };
}

/** Read, validate and check a system file from disk. */
export function readSystemFile(path: string): LoadedSystem {
  return parseSystem(readTextFile(path, 'drain plan'), path);
}

type CsvRecord = { record: string[]; info: { lines: number } };

/**
 * Ground profiles from CSV text: one row per surveyed station, columns `main`, `station_m` (or
 * `station_ft`) and `elevation_m` (or `elevation_ft`), any order, stations in any order. Returns
 * the profiles by main in metres, stations increasing.
 *
 * @example parseProfile('main,station_m,elevation_m\ntrunk,0,100\ntrunk,50,100.2\n').get('trunk')
 */
export function parseProfile(text: string, file = 'profile'): Map<string, GroundProfile> {
  let records: CsvRecord[];
  try {
    records = parse(text, {
      bom: true,
      info: true,
      skip_empty_lines: true,
      trim: true,
    }) as unknown as CsvRecord[];
  } catch (err) {
    if (err instanceof CsvError) {
      throw new TilefluxError(
        `the file is not valid CSV: ${err.message.replace(/\s+/g, ' ')}`,
        file,
      );
    }
    throw err;
  }
  if (records.length === 0) throw new TilefluxError('the file is empty', file);
  const header = records[0].record.map((h) => h.toLowerCase());
  const column = (stem: string): { index: number; factor: number } => {
    for (const [suffix, factor] of [
      ['m', 1],
      ['ft', US.mPerFt],
    ] as const) {
      const index = header.indexOf(`${stem}_${suffix}`);
      if (index >= 0) return { index, factor };
    }
    throw new TilefluxError(
      `line 1: no ${stem}_m or ${stem}_ft column; the header needs main, station_m, elevation_m (or _ft)`,
      file,
    );
  };
  const mainCol = header.indexOf('main');
  if (mainCol < 0) {
    throw new TilefluxError(
      'line 1: no main column; the header needs main, station_m, elevation_m (or _ft)',
      file,
    );
  }
  const station = column('station');
  const elevation = column('elevation');
  const rows = new Map<string, Array<[number, number, number]>>();
  for (const { record, info } of records.slice(1)) {
    const line = info.lines;
    const main = record[mainCol] ?? '';
    if (main === '') throw new TilefluxError(`line ${line}: main is empty`, file);
    const num = (c: { index: number; factor: number }, name: string): number => {
      const text = record[c.index] ?? '';
      const x = Number(text);
      if (text === '' || !Number.isFinite(x)) {
        throw new TilefluxError(
          `line ${line}: ${header[c.index]} expects a number; got "${text}"`,
          file,
        );
      }
      if (name === 'station' && x < 0) {
        throw new TilefluxError(
          `line ${line}: ${header[c.index]} must be at least 0; got ${text}`,
          file,
        );
      }
      return x * c.factor;
    };
    const list = rows.get(main) ?? [];
    list.push([num(station, 'station'), num(elevation, 'elevation'), line]);
    rows.set(main, list);
  }
  const out = new Map<string, GroundProfile>();
  for (const [main, list] of rows) {
    list.sort((a, b) => a[0] - b[0]);
    for (let i = 1; i < list.length; i++) {
      if (list[i][0] === list[i - 1][0]) {
        throw new TilefluxError(
          `line ${list[i][2]}: station ${list[i][0]} m of main "${main}" is given twice (also line ${list[i - 1][2]})`,
          file,
        );
      }
    }
    if (list.length < 2) {
      throw new TilefluxError(`main "${main}" has ${list.length} station; give at least two`, file);
    }
    out.set(main, {
      stationsM: Float64Array.from(list, (r) => r[0]),
      elevationsM: Float64Array.from(list, (r) => r[1]),
    });
  }
  return out;
}

/** Read ground profiles from a CSV file. */
export function readProfileFile(path: string): Map<string, GroundProfile> {
  return parseProfile(readTextFile(path, 'profile'), path);
}

/**
 * The drain capacity (mm/d) a field's drains have when the field file names a system
 * (`drains.system`): the smallest coefficient from a lateral to the outlet, with the grades laid
 * on the system's own profile if it names one. The field's spacing must be the laterals'.
 *
 * @param systemPath  the system file, resolved
 * @param spacingM    the field's drains.spacing
 * @param where       the key for messages ("drains.system" or with the scenario)
 * @param file        the field file, for messages
 */
export function systemCapacityMmD(
  systemPath: string,
  spacingM: number,
  where: string,
  file: string,
): number {
  let loaded: LoadedSystem;
  try {
    loaded = readSystemFile(systemPath);
  } catch (err) {
    if (err instanceof TilefluxError) {
      throw new TilefluxError(`${where}: ${err.message}`, file);
    }
    throw err;
  }
  const profile =
    loaded.file.profile === undefined
      ? undefined
      : readProfileFile(resolve(dirname(systemPath), loaded.file.profile));
  const design = designSystem(loaded.tree, loaded.settings, profile);
  const spacings = [...new Set(design.laterals.map((l) => l.spacingM))];
  if (spacings.length === 0) {
    throw new TilefluxError(
      `${where}: ${systemPath} has no laterals to take the capacity from`,
      file,
    );
  }
  const off = spacings.filter((x) => Math.abs(x / spacingM - 1) > 0.01);
  if (off.length > 0) {
    throw new TilefluxError(
      `${where}: the laterals of ${systemPath} are ${spacings.join(', ')} m apart and ` +
        `drains.spacing is ${spacingM} m; give this field (or scenario) a system with its own ` +
        'spacing, or drains.capacity',
      file,
    );
  }
  return design.fieldCoefficientMmD;
}
