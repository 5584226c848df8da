/**
 * User errors across a worker-thread boundary. A thread's error reaches the main thread by
 * structured clone, which keeps the message but neither the class nor the name, so a
 * `TilefluxError` thrown in a worker would surface as an internal error with a stack trace, and
 * a `SettingError` would lose the CLI's flag names. A worker's task function is wrapped in
 * `guarded`, which replies with a flattened user error instead of throwing it; the pool passes
 * each reply through `unguarded`, which throws the error again as its own class. Other errors
 * (bugs) pass through unchanged.
 */
import { SettingError, TilefluxError } from '../errors.js';

/** Brackets a setting's name inside a flattened SettingError message. */
const MARK = '\u0001';

/** A user error as a worker sends it back. */
export interface WorkerFailure {
  tilefluxFailure: 'setting' | 'user';
  text: string;
}

/** `fn` that returns a user error as a WorkerFailure instead of throwing it. */
export function guarded<A, R>(fn: (task: A) => R): (task: A) => R | WorkerFailure {
  return (task) => {
    try {
      return fn(task);
    } catch (err) {
      if (err instanceof SettingError)
        return { tilefluxFailure: 'setting', text: err.messageWith((s) => MARK + s + MARK) };
      if (err instanceof TilefluxError) return { tilefluxFailure: 'user', text: err.message };
      throw err;
    }
  };
}

/** A worker's reply, or the user error it carries thrown again as its own class. */
export async function unguarded<R>(reply: Promise<unknown>): Promise<R> {
  const r = await reply;
  if (typeof r === 'object' && r !== null && 'tilefluxFailure' in r) {
    const { tilefluxFailure, text } = r as WorkerFailure;
    if (tilefluxFailure === 'setting')
      // Split at the marks, every second piece is a setting's name.
      throw new SettingError((name) =>
        text
          .split(MARK)
          .map((piece, i) => (i % 2 ? name(piece) : piece))
          .join(''),
      );
    throw new TilefluxError(text);
  }
  return r as R;
}
