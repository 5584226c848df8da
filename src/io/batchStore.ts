/**
 * The tables of a batch shard, held in an in-memory DuckDB database and written as Parquet
 * files (DuckDB's COPY ... (FORMAT parquet)). Rows are kept in manifest order whatever order the
 * jobs finish in, so a shard's files do not depend on the number of workers. Files are written
 * under a temporary name in the same folder and renamed into place.
 */
import { existsSync, renameSync, rmSync } from 'node:fs';
import { basename, dirname, join } from 'node:path';
import type { DuckDBAppender, DuckDBConnection, DuckDBInstance } from '@duckdb/node-api';
import type { BatchColumn, BatchColumnType, BatchRow, JobRows } from '../scenarios/batch.js';
import { BATCH_ANNUAL_COLUMNS, BATCH_SUMMARY_COLUMNS } from '../scenarios/batch.js';

const SQL_TYPE: Record<BatchColumnType, string> = {
  text: 'VARCHAR',
  integer: 'INTEGER',
  number: 'DOUBLE',
  boolean: 'BOOLEAN',
};

const TABLES = { annual: BATCH_ANNUAL_COLUMNS, summary: BATCH_SUMMARY_COLUMNS } as const;
type Table = keyof typeof TABLES;

/** A quoted SQL identifier or string literal. */
const ident = (s: string) => `"${s.replace(/"/g, '""')}"`;
const literal = (s: string) => `'${s.replace(/'/g, "''")}'`;

function append(a: DuckDBAppender, c: BatchColumn, v: BatchRow[string] | undefined): void {
  if (v === null || v === undefined || (typeof v === 'number' && Number.isNaN(v))) a.appendNull();
  else if (c.type === 'text') a.appendVarchar(String(v));
  else if (c.type === 'boolean') a.appendBoolean(Boolean(v));
  else if (c.type === 'integer') a.appendInteger(Number(v));
  else a.appendDouble(Number(v));
}

/** The tables of one shard: rows added job by job, written out as Parquet. */
export class BatchStore {
  /** Every statement goes through this chain: one connection, one statement at a time. */
  private queue: Promise<unknown> = Promise.resolve();

  private serial<T>(fn: () => Promise<T>): Promise<T> {
    const next = this.queue.then(fn, fn);
    this.queue = next.catch(() => undefined);
    return next;
  }

  private constructor(
    private readonly db: DuckDBInstance,
    private readonly con: DuckDBConnection,
  ) {}

  /** An empty store (an in-memory database with the annual and summary tables). */
  static async open(): Promise<BatchStore> {
    // Loaded on first use: the native library takes about 0.4 s of CPU to load, which every other
    // command (and --help) would pay if it were imported with this module.
    const { DuckDBInstance } = await import('@duckdb/node-api');
    const db = await DuckDBInstance.create(':memory:');
    const con = await db.connect();
    for (const [name, cols] of Object.entries(TABLES)) {
      // _job (manifest row) and _k (row within the job) order the rows; they are not written.
      const defs = cols.map((c) => `${ident(c.name)} ${SQL_TYPE[c.type]}`).join(', ');
      await con.run(`CREATE TABLE ${name} (_job INTEGER, _k INTEGER, ${defs})`);
    }
    return new BatchStore(db, con);
  }

  /** Add one job's rows under its manifest row index. */
  add(job: number, rows: JobRows): Promise<void> {
    return this.serial(() => this.addNow(job, rows));
  }

  private async addNow(job: number, rows: JobRows): Promise<void> {
    for (const table of Object.keys(TABLES) as Table[]) {
      const a = await this.con.createAppender(table);
      rows[table].forEach((r, k) => {
        a.appendInteger(job);
        a.appendInteger(k);
        for (const c of TABLES[table]) append(a, c, r[c.name]);
        a.endRow();
      });
      a.closeSync();
    }
  }

  /**
   * Take the rows of the jobs in `keep` (job id -> manifest row index) from a shard's earlier
   * files; returns the ids that had rows in both files.
   */
  async keepFrom(
    files: Record<Table, string>,
    keep: ReadonlyMap<string, number>,
  ): Promise<Set<string>> {
    if (keep.size === 0 || !existsSync(files.annual) || !existsSync(files.summary))
      return new Set();
    const values = [...keep].map(([id, job]) => `(${literal(id)}, ${job})`).join(', ');
    await this.con.run(
      `CREATE TEMP TABLE keep_jobs AS SELECT * FROM (VALUES ${values}) AS t(job_id, _job)`,
    );
    try {
      const found = new Set<string>();
      const count = async (table: Table) => {
        const r = await this.con.runAndReadAll(
          `SELECT DISTINCT job_id FROM read_parquet(${literal(files[table])}) WHERE job_id IN (SELECT job_id FROM keep_jobs)`,
        );
        return new Set(r.getRowObjects().map((o) => String(o.job_id)));
      };
      const inAnnual = await count('annual');
      for (const id of await count('summary')) if (inAnnual.has(id)) found.add(id);
      const ids = [...found].map(literal).join(', ');
      if (found.size === 0) return found;
      for (const table of Object.keys(TABLES) as Table[]) {
        const cols = TABLES[table].map((c) => `p.${ident(c.name)}`).join(', ');
        await this.con.run(
          `INSERT INTO ${table} SELECT k._job, (row_number() OVER (PARTITION BY p.job_id ORDER BY p.file_row_number) - 1)::INTEGER, ${cols}
           FROM read_parquet(${literal(files[table])}, file_row_number = true) p
           JOIN keep_jobs k ON k.job_id = p.job_id WHERE p.job_id IN (${ids})`,
        );
      }
      return found;
    } finally {
      await this.con.run('DROP TABLE keep_jobs');
    }
  }

  /** Number of rows of a table. */
  rows(table: Table): Promise<number> {
    return this.serial(() => this.rowsNow(table));
  }

  private async rowsNow(table: Table): Promise<number> {
    const r = await this.con.runAndReadAll(`SELECT count(*)::INTEGER AS n FROM ${table}`);
    return Number(r.getRowObjects()[0].n);
  }

  /** Write a table to a Parquet file: a temporary file beside it, then renamed into place. */
  write(table: Table, path: string): Promise<void> {
    return this.serial(() => this.writeNow(table, path));
  }

  private async writeNow(table: Table, path: string): Promise<void> {
    const tmp = join(dirname(path), `.${basename(path)}.tmp-${process.pid}`);
    const cols = TABLES[table].map((c) => ident(c.name)).join(', ');
    try {
      await this.con.run(
        `COPY (SELECT ${cols} FROM ${table} ORDER BY _job, _k) TO ${literal(tmp)} (FORMAT parquet, COMPRESSION zstd)`,
      );
      renameSync(tmp, path);
    } finally {
      rmSync(tmp, { force: true });
    }
  }

  close(): void {
    this.con.closeSync();
    this.db.closeSync();
  }
}
