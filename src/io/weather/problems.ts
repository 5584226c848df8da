/** Located problems of a weather file and the error that carries them. */
import { TilefluxError } from '../../errors.js';

/** One located problem in a weather file. */
export interface WeatherProblem {
  /** Line in the file, 1 for the first line. */
  line: number;
  /** Header of the column, when the problem lies in one. */
  column?: string;
  message: string;
}

/**
 * A weather file the reader cannot accept. The message (one line) lists the first problems;
 * `problems` holds them all, each with its line and column.
 */
export class WeatherInputError extends TilefluxError {
  readonly problems: WeatherProblem[];
  readonly file: string;
  constructor(file: string, problems: WeatherProblem[]) {
    const shown = problems.slice(0, 3).map(locate);
    const more = problems.length > 3 ? ` (and ${problems.length - 3} more problems)` : '';
    super(`${file} ${shown.join('; ')}${more}`);
    this.name = 'WeatherInputError';
    this.problems = problems;
    this.file = file;
  }
}

function locate(p: WeatherProblem): string {
  return `line ${p.line}${p.column !== undefined ? `, column ${p.column}` : ''}: ${p.message}`;
}

/** Collects problems; stops collecting (but keeps counting) after a cap. */
export class Problems {
  readonly list: WeatherProblem[] = [];
  constructor(readonly file: string) {}
  add(line: number, column: string | undefined, message: string): void {
    if (this.list.length < 100) this.list.push({ line, column, message });
  }
  throwIfAny(): void {
    if (this.list.length > 0) throw new WeatherInputError(this.file, this.list);
  }
  fail(line: number, column: string | undefined, message: string): never {
    this.add(line, column, message);
    throw new WeatherInputError(this.file, this.list);
  }
}
