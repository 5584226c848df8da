/**
 * User errors raised in worker threads must reach the main thread as user errors: a worker's
 * reply travels by structured clone (HTML Living Standard, "StructuredSerialize"; Node's
 * worker_threads use it for every message), which keeps an Error's message but neither its class
 * nor a custom name. Before the guard, a TilefluxError in a sweep worker surfaced as an
 * internal error.
 */
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { Piscina } from 'piscina';
import { describe, expect, it } from 'vitest';
import { SettingError, TilefluxError } from '../../src/errors.js';
import { guarded, unguarded } from '../../src/io/workerErrors.js';

const setting = new SettingError((n) => `${n('from')} 2031-01-01 lies before ${n('to')}`);

describe('user errors across a worker boundary', () => {
  it('structured clone alone loses the class and the name (the reason for the guard)', () => {
    const cloned = structuredClone(new TilefluxError('bad')) as Error;
    expect(cloned).not.toBeInstanceOf(TilefluxError);
    expect(cloned.name).toBe('Error');
  });

  it('a SettingError comes back as a SettingError that still names settings by the caller', async () => {
    const reply = structuredClone(
      guarded(() => {
        throw setting;
      })(undefined),
    );
    const err = await unguarded(Promise.resolve(reply)).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(SettingError);
    expect((err as SettingError).message).toBe('from 2031-01-01 lies before to');
    expect((err as SettingError).messageWith((s) => `--${s}`)).toBe(
      '--from 2031-01-01 lies before --to',
    );
  });

  it('a TilefluxError comes back as a TilefluxError; results and bugs pass unchanged', async () => {
    const user = structuredClone(
      guarded(() => {
        throw new TilefluxError('the weather record has no days', 'w.csv');
      })(undefined),
    );
    await expect(unguarded(Promise.resolve(user))).rejects.toThrow(
      new TilefluxError('w.csv: the weather record has no days'),
    );
    await expect(
      unguarded(Promise.resolve(structuredClone(guarded(() => [1, 2])(0)))),
    ).resolves.toEqual([1, 2]);
    expect(() =>
      guarded(() => {
        throw new RangeError('a bug');
      })(0),
    ).toThrow(RangeError);
  });

  it('through a real piscina worker (built modules in dist/)', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'tileflux-worker-'));
    const dist = (f: string) => pathToFileURL(join(process.cwd(), 'dist', f)).href;
    const file = join(dir, 'worker.mjs');
    writeFileSync(
      file,
      `import { SettingError } from '${dist('errors.js')}';\n` +
        `import { guarded } from '${dist('io/workerErrors.js')}';\n` +
        `export default guarded(() => { throw new SettingError((n) => n('samples') + ' must be at least 1'); });\n`,
    );
    const pool = new Piscina({ filename: pathToFileURL(file).href, maxThreads: 1 });
    try {
      const err = await unguarded(pool.run({})).catch((e: unknown) => e);
      expect(err).toBeInstanceOf(SettingError);
      expect((err as SettingError).messageWith((s) => `--${s}`)).toBe(
        '--samples must be at least 1',
      );
    } finally {
      await pool.destroy();
    }
  });
});
