/**
 * Output that is never half-written and never replaces what it should not: files and folders are
 * written under a temporary name and renamed into place, an existing output is replaced only
 * with `force` and only when it is one of ours, a lock keeps two runs off one folder, and
 * temporaries are removed on Ctrl-C and repaired after a kill.
 *
 * Errors that tell the user to set `force` or choose another `out` are SettingErrors naming
 * those settings, which the CLI calls by its flags (--force, --out).
 *
 * Longer than most files: the signal clean-up, the lock and the replace rules all work on the
 * one list of temporaries in flight, so they stay together.
 */
import { randomBytes } from 'node:crypto';
import {
  existsSync,
  mkdirSync,
  readdirSync,
  readFileSync,
  renameSync,
  rmSync,
  statSync,
  unlinkSync,
  writeFileSync,
} from 'node:fs';
import { homedir } from 'node:os';
import { basename, dirname, join, resolve, sep } from 'node:path';
import { clip, SettingError, TilefluxError, type SettingNamer } from '../errors.js';
import { VERSION } from '../version.js';
import { fsErrorReason } from './files.js';

// ---------------------------------------------------------------------------------------------
// Cleaning up on SIGINT / SIGTERM / SIGHUP: temporaries being written are removed and the lock
// released, then the process ends with the usual 128 + signal number. Node runs signal handlers
// between event-loop turns, never inside synchronous code, so the two renames of a replace
// (done in one synchronous block) are never split by a caught signal; only SIGKILL or a power
// cut can land between them, and the next run to the same folder repairs that (see below).

const pending = new Set<string>();
const SIGNALS = { SIGINT: 2, SIGTERM: 15, SIGHUP: 1 } as const;
let handlersOn = false;

function onSignal(signal: keyof typeof SIGNALS): void {
  const writing = pending.size > 0;
  for (const p of pending) rmSync(p, { recursive: true, force: true });
  pending.clear();
  process.stderr.write(`tileflux: stopped by ${signal}${writing ? '; nothing was written' : ''}\n`);
  process.exit(128 + SIGNALS[signal]);
}
const handlers = Object.fromEntries(
  Object.keys(SIGNALS).map((s) => [s, () => onSignal(s as keyof typeof SIGNALS)]),
) as Record<keyof typeof SIGNALS, () => void>;

function track(path: string): void {
  pending.add(path);
  if (handlersOn) return;
  for (const s of Object.keys(SIGNALS) as Array<keyof typeof SIGNALS>) process.on(s, handlers[s]);
  handlersOn = true;
}

function untrack(path: string): void {
  pending.delete(path);
  if (pending.size > 0 || !handlersOn) return;
  for (const s of Object.keys(SIGNALS) as Array<keyof typeof SIGNALS>) process.off(s, handlers[s]);
  handlersOn = false;
}

/**
 * Test hook: `TILEFLUX_TEST_KILL_AT=<step>[:<signal>]` sends the process SIGKILL (or the signal
 * named) at that step of `writeDirAtomic`.
 */
function step(name: string): void {
  const [at, signal = 'SIGKILL'] = (process.env.TILEFLUX_TEST_KILL_AT ?? '').split(':');
  if (at === name) process.kill(process.pid, signal as NodeJS.Signals);
}

/** Whether process `pid` is running (a pid we may not signal is running too). */
function alive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (err) {
    return (err as NodeJS.ErrnoException).code === 'EPERM';
  }
}

/** A fresh folder made with the usual permissions (mode 0777 less the umask, like mkdir(1)). */
function freshDir(parent: string, prefix: string): string {
  for (;;) {
    const dir = join(parent, `${prefix}${randomBytes(4).toString('hex')}`);
    try {
      mkdirSync(dir, { mode: 0o777 });
      return dir;
    } catch (err) {
      if ((err as NodeJS.ErrnoException).code !== 'EEXIST') throw err;
    }
  }
}

/**
 * Write one file atomically (temporary name in the same folder, then rename). An existing file
 * is an error unless `force` is set, so nothing a user has is overwritten by accident.
 */
export function writeFileAtomic(path: string, content: string | Uint8Array, force = false): void {
  if (path === '') throw new TilefluxError('the output file name is empty; give a file name');
  const target = resolve(path);
  path = clip(path);
  try {
    if (existsSync(target) && !force) {
      throw new SettingError((n) => `${path} already exists; use ${n('force')} to overwrite it`);
    }
    if (existsSync(target) && statSync(target).isDirectory()) {
      throw new TilefluxError(`${path} is a folder; give a file name`);
    }
    mkdirSync(dirname(target), { recursive: true });
    const tmp = join(dirname(target), `.${basename(target)}.${process.pid}.tmp`);
    track(tmp);
    try {
      writeFileSync(tmp, content);
      renameSync(tmp, target);
    } catch (err) {
      rmSync(tmp, { force: true });
      throw err;
    } finally {
      untrack(tmp);
    }
  } catch (err) {
    const reason = fsErrorReason(err);
    if (reason !== undefined) throw new TilefluxError(`cannot write ${path}: ${reason}`);
    throw err;
  }
}

/** The file that marks a folder as a tileflux output folder, which `force` may replace. */
export const RUN_MARKER = '.tileflux-run';

/** Whether `dir` is an output folder written by tileflux (the marker, or our summary.json). */
export function isRunFolder(dir: string): boolean {
  if (existsSync(join(dir, RUN_MARKER))) return true;
  try {
    // Folders written before the marker existed: recognise summary.json by its tool field.
    const s = JSON.parse(readFileSync(join(dir, 'summary.json'), 'utf8')) as {
      tool?: { name?: unknown };
    };
    return s.tool?.name === 'tileflux';
  } catch {
    return false;
  }
}

const within = (inner: string, outer: string) =>
  inner === outer || inner.startsWith(outer.endsWith(sep) ? outer : outer + sep);

/**
 * Why the existing `target` must not be replaced, even with `force`, or undefined when it may
 * be: only a folder tileflux wrote, and never the root, the home folder, the working folder (or
 * a folder holding it) or a folder holding one of the run's input files. The reason is written
 * with `n` naming the settings.
 */
function refusal(
  target: string,
  inputs: readonly string[],
): ((n: SettingNamer) => string) | undefined {
  const why = (n: SettingNamer) =>
    `tileflux replaces only folders it wrote itself; choose another ${n('out')}`;
  if (target === resolve('/')) return (n) => `it is the root folder; ${why(n)}`;
  if (target === resolve(homedir())) return (n) => `it is your home folder; ${why(n)}`;
  if (within(process.cwd(), target)) return (n) => `it is or holds the working folder; ${why(n)}`;
  const input = inputs.find((f) => within(resolve(f), target));
  if (input !== undefined) return (n) => `it holds the input file ${input}; ${why(n)}`;
  if (!statSync(target).isDirectory())
    return (n) => `it is a file, not a folder; choose another ${n('out')}`;
  if (!isRunFolder(target))
    return (n) =>
      `it was not written by tileflux (no ${RUN_MARKER} marker or tileflux summary.json); ${why(n)}, or remove it yourself`;
  return undefined;
}

/** Refuse an existing target unless `force` is set and it is a folder tileflux wrote. */
function mayReplace(path: string, target: string, force: boolean, inputs: readonly string[]) {
  if (!existsSync(target)) return;
  const no = refusal(target, inputs);
  if (no !== undefined) {
    throw new SettingError((n) => `will not replace output folder ${path}: ${no(n)}`);
  }
  if (!force) {
    throw new SettingError(
      (n) => `output folder ${path} already exists; use ${n('force')} to replace it`,
    );
  }
}

/** Make the folder that will hold the output, saying which part of the path is a file. */
function parentFolder(path: string, parent: string): void {
  for (let p = parent; ; p = dirname(p)) {
    if (existsSync(p)) {
      if (!statSync(p).isDirectory()) {
        throw new TilefluxError(
          `cannot write output folder ${path}: ${clip(p)} is a file, not a folder`,
        );
      }
      break;
    }
    if (dirname(p) === p) break;
  }
  mkdirSync(parent, { recursive: true });
}

/** Names kept beside the target `NAME` while it is written (all hidden, all carry the pid). */
const tmpPrefix = (name: string, pid: number) => `.${name}.tmp-${pid}-`;
const oldName = (name: string, pid: number) => `.${name}.old-${pid}`;
const lockName = (name: string) => `.${name}.lock`;

/**
 * Remove what runs that died while writing `parent/name` left behind: temporaries and locks of
 * dead processes; a previous folder moved aside (`.NAME.old-PID`, or `NAME.old-PID` from older
 * versions) goes back under the name if nothing is there, else it is removed. Temporaries of
 * older versions (`.NAME.tmp-XXXXXX`, no pid) are removed when older than an hour.
 */
export function cleanStale(parent: string, name: string): void {
  let entries: string[];
  try {
    entries = readdirSync(parent);
  } catch {
    return;
  }
  const esc = name.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
  const tmpRe = new RegExp(`^\\.${esc}\\.tmp-(\\d+)-[0-9a-f]+$`);
  const legacyTmpRe = new RegExp(`^\\.${esc}\\.tmp-[A-Za-z0-9]{6}$`);
  const oldRe = new RegExp(`^\\.?${esc}\\.old-(\\d+)$`);
  const target = join(parent, name);
  for (const e of entries) {
    const p = join(parent, e);
    const t = tmpRe.exec(e);
    const o = oldRe.exec(e);
    if (t && !alive(Number(t[1]))) rmSync(p, { recursive: true, force: true });
    else if (legacyTmpRe.test(e) && Date.now() - statSync(p).mtimeMs > 3600e3)
      rmSync(p, { recursive: true, force: true });
    else if (o && !alive(Number(o[1]))) {
      if (!existsSync(target) && isRunFolder(p)) renameSync(p, target);
      else rmSync(p, { recursive: true, force: true });
    }
  }
  const lock = join(parent, lockName(name));
  if (existsSync(lock) && !alive(Number(readFileSync(lock, 'utf8')))) rmSync(lock, { force: true });
}

/** Take the lock `.NAME.lock` (it holds our pid), or say which live run holds it. */
function lock(parent: string, name: string, path: string): string {
  const file = join(parent, lockName(name));
  for (let attempt = 0; ; attempt++) {
    try {
      writeFileSync(file, String(process.pid), { flag: 'wx' });
      return file;
    } catch (err) {
      if ((err as NodeJS.ErrnoException).code !== 'EEXIST' || attempt > 0) throw err;
      const pid = Number(readFileSync(file, 'utf8'));
      if (alive(pid)) {
        throw new SettingError(
          (n) =>
            `another tileflux run (process ${pid}) is writing output folder ${path}; nothing was replaced, run again when it has finished or choose another ${n('out')}`,
        );
      }
      rmSync(file, { force: true });
    }
  }
}

/**
 * Build an output folder atomically: `fill` writes into a fresh temporary folder beside the
 * target, which is moved under the name only when everything succeeded. An existing folder is
 * an error unless `force` is set, and even then only a folder tileflux wrote is replaced.
 *
 * The sequence, and what a kill at each instant leaves under the name `NAME`:
 *  1. remove what dead runs left (`cleanStale`; may move a `.NAME.old-PID` back to `NAME`);
 *  2. check `NAME` (absent, or with `force` a folder tileflux wrote)  -> old or nothing;
 *  3. make `.NAME.tmp-PID-R` and fill it, marker `.tileflux-run` last  -> old (or nothing);
 *  4. take the lock `.NAME.lock` (O_EXCL, holds the pid)                -> old;
 *  5. check `NAME` again: another run may have written it meanwhile; without `force` this run
 *     stops with an error and its result is removed, never replacing that one  -> old;
 *  6. rename `NAME` -> `.NAME.old-PID` (if it exists)                   -> old, complete, at
 *     `.NAME.old-PID` (only SIGKILL or a power cut can stop between 6 and 7; step 1 of the next
 *     run to this folder moves it back, because its pid is dead);
 *  7. rename `.NAME.tmp-PID-R` -> `NAME`                                  -> new;
 *  8. remove `.NAME.old-PID`, then the lock                               -> new.
 * A directory cannot be swapped for another in one call from Node (Linux renameat2 with
 * RENAME_EXCHANGE is not exposed), hence the repair in step 1. SIGINT, SIGTERM and SIGHUP during
 * steps 3-5 remove the temporary folder and the lock.
 */
export async function writeDirAtomic(
  path: string,
  force: boolean,
  fill: (tmpDir: string) => Promise<void> | void,
  opts: { inputs?: readonly string[] } = {},
): Promise<void> {
  if (path.trim() === '') {
    throw new SettingError((n) => `${n('out')} is empty; give the name of the output folder`);
  }
  const target = resolve(path);
  const parent = dirname(target);
  const name = basename(target);
  const inputs = opts.inputs ?? [];
  path = clip(path);
  let tmp: string | undefined;
  let made: string | undefined;
  let held: string | undefined;
  try {
    cleanStale(parent, name);
    mayReplace(path, target, force, inputs);
    parentFolder(path, parent);
    tmp = made = freshDir(parent, tmpPrefix(name, process.pid));
    track(made);
    step('temp-created');
    await fill(tmp);
    // A signal that came during the last synchronous stretch of `fill` is handled here (the
    // temporary folder removed), not lost when the handlers go once the folder is in place.
    await new Promise((r) => setImmediate(r));
    writeFileSync(join(tmp, RUN_MARKER), `tileflux ${VERSION} output folder\n`);
    step('temp-filled');
    held = lock(parent, name, path);
    track(held);
    step('locked');
    if (existsSync(target) && !force) {
      throw new SettingError(
        (n) =>
          `another run wrote output folder ${path} while this one ran; it was kept and this run's result discarded (use ${n('force')} to replace it)`,
      );
    }
    mayReplace(path, target, force, inputs);
    if (existsSync(target)) {
      const old = join(parent, oldName(name, process.pid));
      renameSync(target, old);
      step('old-moved');
      renameSync(tmp, target);
      tmp = undefined;
      step('new-in-place');
      rmSync(old, { recursive: true, force: true });
    } else {
      renameSync(tmp, target);
      tmp = undefined;
      step('new-in-place');
    }
    step('old-removed');
  } catch (err) {
    const reason = fsErrorReason(err);
    if (reason !== undefined) {
      throw new TilefluxError(`cannot write output folder ${path}: ${reason}`);
    }
    throw err;
  } finally {
    if (tmp !== undefined) rmSync(tmp, { recursive: true, force: true });
    if (made !== undefined) untrack(made);
    if (held !== undefined) {
      try {
        unlinkSync(held);
      } catch {
        // Already gone: nothing to release.
      }
      untrack(held);
    }
  }
}
