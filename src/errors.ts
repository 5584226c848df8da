/**
 * An error the user can cause and fix: bad input, a missing file, a value out of range.
 * The CLI prints its message alone (no stack trace) and exits with a non-zero code.
 * The message says what was wrong, where (file, line, column, key or option) and what is accepted.
 */
export class TilefluxError extends Error {
  readonly where?: string;
  constructor(message: string, where?: string) {
    super(where ? `${where}: ${message}` : message);
    this.name = 'TilefluxError';
    this.where = where;
  }
}

/** Throws a TilefluxError when `condition` is false. */
export function check(condition: unknown, message: string, where?: string): asserts condition {
  if (!condition) throw new TilefluxError(message, where);
}
