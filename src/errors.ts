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
    if (where !== undefined) this.where = where;
  }
}

/** How a message calls a setting: the library uses the setting's own name, the CLI its flag. */
export type SettingNamer = (setting: string) => string;

/**
 * A user error about settings of a library call (`from`, `only`, `params`, ...). The core writes
 * the message once with `name(setting)` wherever a setting is named; `message` calls each
 * setting by its own name, and `messageWith` lets an edge call it as its users know it (the CLI
 * passes its flags, so `tileflux run` says "--from 2031-01-01 lies outside ...").
 * @example new SettingError((n) => `${n('from')} 2031-01-01 lies outside the record`).message
 *   // "from 2031-01-01 lies outside the record"
 */
export class SettingError extends TilefluxError {
  private readonly compose: (name: SettingNamer) => string;
  constructor(compose: (name: SettingNamer) => string) {
    super(compose((setting) => setting));
    this.name = 'SettingError';
    this.compose = compose;
  }
  messageWith(name: SettingNamer): string {
    return this.compose(name);
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
