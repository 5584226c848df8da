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

/**
 * A value as echoed in a message: at most `max` characters, the rest replaced by "..." and the
 * length, so an error about a 5 MB cell is still one readable line.
 * @example clip('x'.repeat(100), 10) // "xxxxxxx... (100 characters)"
 */
export function clip(text: string, max = 80): string {
  const oneLine = text.replace(/[\r\n]+/g, ' ');
  return oneLine.length <= max
    ? oneLine
    : `${oneLine.slice(0, max - 3)}... (${text.length} characters)`;
}
