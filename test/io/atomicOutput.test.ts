/**
 * The safe writers' refusals name the library's settings (`force`, `out`); the CLI calls them
 * by its flags (--force, --out), as test/cli/outputSafety.test.ts checks on the command line.
 */
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { cliMessage } from '../../src/cli/common.js';
import { SettingError } from '../../src/errors.js';
import { writeDirAtomic, writeFileAtomic } from '../../src/io/atomicOutput.js';

const dir = mkdtempSync(join(tmpdir(), 'tileflux-atomic-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

/** The error `fn` throws (sync or async), or fails the test when it throws none. */
async function errorOf(fn: () => unknown): Promise<SettingError> {
  try {
    await fn();
  } catch (err) {
    expect(err).toBeInstanceOf(SettingError);
    return err as SettingError;
  }
  throw new Error('expected an error');
}

describe('safe output errors name settings, the CLI its flags', () => {
  it('an existing file without force', async () => {
    const file = join(dir, 'kept.csv');
    writeFileSync(file, 'mine\n');
    const err = await errorOf(() => writeFileAtomic(file, 'new\n'));
    expect(err.message).toBe(`${file} already exists; use force to overwrite it`);
    expect(cliMessage(err)).toBe(`${file} already exists; use --force to overwrite it`);
  });

  it('an empty output folder name', async () => {
    const err = await errorOf(() => writeDirAtomic('', true, () => {}));
    expect(err.message).toBe('out is empty; give the name of the output folder');
    expect(cliMessage(err)).toBe('--out is empty; give the name of the output folder');
  });

  it('an existing folder tileflux did not write, even with force', async () => {
    const theirs = join(dir, 'theirs');
    mkdirSync(theirs);
    const err = await errorOf(() => writeDirAtomic(theirs, true, () => {}));
    expect(err.message).toMatch(
      /; tileflux replaces only folders it wrote itself; choose another out, or remove it yourself$/,
    );
    expect(cliMessage(err)).toMatch(/; choose another --out, or remove it yourself$/);
  });

  it('an existing folder tileflux wrote, without force', async () => {
    const ours = join(dir, 'ours');
    await writeDirAtomic(ours, false, (tmp) => writeFileSync(join(tmp, 'a.csv'), 'x\n'));
    const err = await errorOf(() => writeDirAtomic(ours, false, () => {}));
    expect(err.message).toBe(`output folder ${ours} already exists; use force to replace it`);
    expect(cliMessage(err)).toBe(`output folder ${ours} already exists; use --force to replace it`);
  });
});
