/** Located problems of a weather file and the error that carries them. */
import { SettingError, type SettingNamer } from '../../errors.js';

/** One located problem in a weather file. */
export interface WeatherProblem {
  /** Line in the file, 1 for the first line. */
  line: number;
  /** Header of the column, when the problem lies in one. */
  column?: string;
  message: string;
}

/**
 * A problem's message: text, or text written with `n` naming the reader's settings (`fill`,
 * `columns`, `station`, ...), which the CLI calls by its flags (`--fill`, ...).
 */
export type ProblemMessage = string | ((n: SettingNamer) => string);

/** A located problem whose message may name settings. */
export interface LocatedProblem {
  line: number;
  column?: string;
  message: ProblemMessage;
}

const textOf = (m: ProblemMessage, n: SettingNamer) => (typeof m === 'string' ? m : m(n));

/**
 * The first three problems as one line after the file name, each with its line and column, and
 * how many more there are.
 */
export function problemsLine(file: string, problems: readonly LocatedProblem[], n: SettingNamer) {
  const shown = problems
    .slice(0, 3)
    .map(
      (p) =>
        `line ${p.line}${p.column !== undefined ? `, column ${p.column}` : ''}: ${textOf(p.message, n)}`,
    );
  const more = problems.length > 3 ? ` (and ${problems.length - 3} more problems)` : '';
  return `${file} ${shown.join('; ')}${more}`;
}

/**
 * A weather file the reader cannot accept. The message (one line) lists the first problems;
 * `problems` holds them all, each with its line and column. Settings are named as the library
 * names them (`fill`); `messageWith` names them otherwise (the CLI: `--fill`).
 */
export class WeatherInputError extends SettingError {
  readonly problems: WeatherProblem[];
  readonly file: string;
  constructor(file: string, problems: readonly LocatedProblem[]) {
    const list = [...problems];
    super((n) => problemsLine(file, list, n));
    this.name = 'WeatherInputError';
    this.problems = list.map((p) => ({ ...p, message: textOf(p.message, (s) => s) }));
    this.file = file;
  }
}

/** Collects problems; stops collecting (but keeps counting) after a cap. */
export class Problems {
  readonly list: LocatedProblem[] = [];
  constructor(readonly file: string) {}
  add(line: number, column: string | undefined, message: ProblemMessage): void {
    if (this.list.length < 100)
      this.list.push({ line, ...(column !== undefined && { column }), message });
  }
  throwIfAny(): void {
    if (this.list.length > 0) throw new WeatherInputError(this.file, this.list);
  }
  fail(line: number, column: string | undefined, message: ProblemMessage): never {
    this.add(line, column, message);
    throw new WeatherInputError(this.file, this.list);
  }
}
