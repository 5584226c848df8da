/**
 * Batch manifests: a CSV with one job per row (`id`, `field`, `weather`, optional `scenarios`,
 * optional field-key columns such as `drains.spacing`), read into jobs with every problem
 * located by manifest line and column.
 *
 * Two checks, both before anything runs. `readManifest` checks the manifest itself for every
 * row (header, ids, empty required cells, column names), so every shard of a batch gives the
 * same verdict. `loadJob` then checks one row against its files: the field file with the row's
 * changes validated by the field schema, the scenario names, and that the weather file exists.
 * The weather file's content is read only when the job runs.
 */
import { readTextFile } from './files.js';
import { createHash } from 'node:crypto';
import { statSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import { parse as parseYaml } from 'yaml';
import { clip, TilefluxError } from '../errors.js';
import { scenariosOf } from '../scenarios/run.js';
import { fieldKeyProblem, readFieldFile, type FieldOverride, type LoadedField } from './field.js';
import { CsvRows, CsvSyntaxError } from './weather/csvRows.js';

/** The manifest's own columns; any other column names a field-file key. */
export const MANIFEST_COLUMNS = ['id', 'field', 'weather', 'scenarios'] as const;
const REQUIRED = ['id', 'field', 'weather'] as const;

/** Separator of the scenario names in the `scenarios` cell. */
export const SCENARIO_SEPARATOR = ';';

/** One row of a manifest. */
export interface ManifestJob {
  /** 0-based row index (shards take rows by it) and the line the row starts on. */
  index: number;
  line: number;
  id: string;
  /** The cells as written, and the paths resolved against the manifest's folder. */
  field: string;
  weather: string;
  fieldPath: string;
  weatherPath: string;
  /** Scenario names to run (all of the field's when absent). */
  scenarios?: string[];
  /** Changes to the field file's base, from the field-key columns. */
  overrides: FieldOverride[];
  /** Hash of what the row asks for (its cells), to tell whether a recorded result still fits. */
  sha256: string;
}

export interface Manifest {
  file: string;
  /** 1-based column number of each header name. */
  columns: Record<string, number>;
  jobs: ManifestJob[];
}

/** "jobs.csv: line 4, column 2 (field)" */
function cellAt(file: string, line: number, column: number, name: string): string {
  return `${file}: line ${line}, column ${column} (${name})`;
}

/**
 * Read and check a manifest: the header names `id`, `field` and `weather` (and optionally
 * `scenarios` and field keys such as `drains.spacing`), every row has an id, a field and a
 * weather cell, ids are unique. Cells of field-key columns are read as YAML values ("18 m",
 * 0.05, [corn, soybean]); an empty cell leaves the field file's value.
 */
export function readManifest(path: string): Manifest {
  const text = readTextFile(path, 'manifest');
  const file = path;
  const dir = dirname(resolve(path));
  const rows = new CsvRows(text);
  try {
    if (!rows.next()) {
      throw new TilefluxError(
        `the manifest is empty; it needs a header line ${REQUIRED.join(',')} and one row per job`,
        file,
      );
    }
    const header = rows.fields();
    const headerLine = rows.line;
    const col = new Map<string, number>();
    header.forEach((name, k) => {
      const where = cellAt(file, headerLine, k + 1, name || 'empty');
      if (name === '') throw new TilefluxError('a column has no name', where);
      if (col.has(name)) throw new TilefluxError(`column "${name}" appears twice`, where);
      col.set(name, k);
    });
    for (const r of REQUIRED) {
      if (!col.has(r))
        throw new TilefluxError(
          `line ${headerLine}: the header has no "${r}" column; a manifest needs ${REQUIRED.join(', ')} (and may have scenarios and field keys such as drains.spacing); got ${header.join(', ')}`,
          file,
        );
    }
    const keyColumns: Array<{ k: number; name: string; path: string[] }> = [];
    for (const [name, k] of col) {
      if ((MANIFEST_COLUMNS as readonly string[]).includes(name)) continue;
      const where = cellAt(file, headerLine, k + 1, name);
      const path = name.split('.');
      const problem = path.some((p) => p === '')
        ? `"${name}" is not a field-file key (keys are joined by single dots, e.g. drains.spacing)`
        : fieldKeyProblem(path);
      if (problem !== undefined)
        throw new TilefluxError(
          `${problem}; a column is ${MANIFEST_COLUMNS.join(', ')} or a field-file key`,
          where,
        );
      keyColumns.push({ k, name, path });
    }
    for (const a of keyColumns) {
      const b = keyColumns.find((x) => x !== a && a.path.every((p, i) => x.path[i] === p));
      if (b !== undefined)
        throw new TilefluxError(
          `column "${a.name}" holds column "${b.name}"; give one of them`,
          cellAt(file, headerLine, b.k + 1, b.name),
        );
    }

    const jobs: ManifestJob[] = [];
    const ids = new Map<string, number>();
    while (rows.next()) {
      const line = rows.line;
      const cells = rows.fields();
      if (cells.length > header.length)
        throw new TilefluxError(
          `line ${line}: ${cells.length} cells, more than the header's ${header.length} columns`,
          file,
        );
      const cell = (name: string) => {
        const k = col.get(name);
        return k === undefined ? '' : (cells[k] ?? '');
      };
      const where = (name: string) => cellAt(file, line, col.get(name)! + 1, name);
      for (const r of REQUIRED) {
        if (cell(r) === '') throw new TilefluxError(`the ${r} cell is empty`, where(r));
      }
      const id = cell('id');
      if (/[\p{Cc}]/u.test(id) || id.length > 200)
        throw new TilefluxError(
          `the id "${clip(id)}" must be at most 200 characters, without control characters`,
          where('id'),
        );
      const twice = ids.get(id);
      if (twice !== undefined)
        throw new TilefluxError(
          `the id "${clip(id)}" is already used on line ${twice}; ids must be unique`,
          where('id'),
        );
      ids.set(id, line);
      let scenarios: string[] | undefined;
      if (cell('scenarios') !== '') {
        scenarios = cell('scenarios')
          .split(SCENARIO_SEPARATOR)
          .map((s) => s.trim());
        if (scenarios.some((s) => s === ''))
          throw new TilefluxError(
            `an empty scenario name in "${clip(cell('scenarios'))}"; separate names with ${SCENARIO_SEPARATOR}, e.g. conventional${SCENARIO_SEPARATOR}controlled`,
            where('scenarios'),
          );
      }
      const overrides: FieldOverride[] = [];
      for (const c of keyColumns) {
        const raw = cells[c.k] ?? '';
        if (raw === '') continue;
        const at = cellAt(file, line, c.k + 1, c.name);
        let value: unknown;
        try {
          value = parseYaml(raw);
        } catch {
          throw new TilefluxError(
            `cannot read "${clip(raw)}" as a value (a quantity such as 18 m, a number or a YAML list)`,
            at,
          );
        }
        overrides.push({ path: c.path, value, where: at });
      }
      const definition = JSON.stringify([
        id,
        cell('field'),
        cell('weather'),
        scenarios ?? null,
        overrides.map((o) => [o.path.join('.'), o.value]),
      ]);
      jobs.push({
        index: jobs.length,
        line,
        id,
        field: cell('field'),
        weather: cell('weather'),
        fieldPath: resolve(dir, cell('field')),
        weatherPath: resolve(dir, cell('weather')),
        ...(scenarios && { scenarios }),
        overrides,
        sha256: createHash('sha256').update(definition).digest('hex'),
      });
    }
    return { file, columns: Object.fromEntries([...col].map(([n, k]) => [n, k + 1])), jobs };
  } catch (err) {
    if (err instanceof CsvSyntaxError)
      throw new TilefluxError(`line ${err.line}: ${err.message}`, file);
    throw err;
  }
}

/** Loaded fields by file and changes, so rows that share both share one parse. */
export type FieldCache = Map<string, LoadedField>;

/**
 * Check one manifest row against its files and load its field: the field file read and
 * validated with the row's changes, the scenario names among the field's, and the weather file
 * present. Errors name the manifest line and column.
 */
export function loadJob(m: Manifest, job: ManifestJob, cache: FieldCache = new Map()): LoadedField {
  const where = (name: string) => cellAt(m.file, job.line, m.columns[name], name);
  const isFile = (p: string) => {
    try {
      return statSync(p).isFile();
    } catch {
      return false;
    }
  };
  if (!isFile(job.fieldPath))
    throw new TilefluxError(`no such field file (looked for ${job.fieldPath})`, where('field'));
  if (!isFile(job.weatherPath))
    throw new TilefluxError(
      `no such weather file (looked for ${job.weatherPath})`,
      where('weather'),
    );
  const key = JSON.stringify([job.fieldPath, job.overrides.map((o) => [o.path, o.value])]);
  let field = cache.get(key);
  if (field === undefined) {
    try {
      field = readFieldFile(job.fieldPath, job.overrides);
    } catch (err) {
      // A problem inside the field file: say which job met it.
      if (err instanceof TilefluxError && !err.message.startsWith(m.file))
        throw new TilefluxError(err.message, `${where('field')}, job ${clip(job.id)}`);
      throw err;
    }
    cache.set(key, field);
  }
  if (job.scenarios !== undefined) {
    const names = scenariosOf(field).map((s) => s.name);
    const unknown = job.scenarios.find((s) => !names.includes(s));
    if (unknown !== undefined)
      throw new TilefluxError(
        `scenario "${clip(unknown)}" is not in ${job.field}; it has ${names.join(', ')}`,
        where('scenarios'),
      );
  }
  return field;
}
