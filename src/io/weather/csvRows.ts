/**
 * A CSV reader that walks a file record by record without building an object per record, and
 * knows the line each record starts on. Fields are ranges into the text: numbers are read from
 * the characters directly and strings are cut only when asked for.
 *
 * Why not a library here: csv-parse with per-record line info read the 30-year demo record at
 * about 0.06 M rows/s, csv-parse without info at 0.3 M, d3-dsv's row parser at 0.4 M (before
 * any number is read), on this project's 2-core benchmark machine; the weather readers target
 * 1 M days/s (DEVELOPERS.md, Benchmarks). The dialect is RFC 4180 as csv-parse reads it with
 * `bom`, `trim`, `relax_column_count` and `skip_records_with_empty_values`: comma-separated,
 * fields optionally in double quotes (a doubled quote inside is one quote, quoted fields may
 * span lines), LF, CRLF or CR line ends, spaces and tabs around fields ignored, a leading
 * byte-order mark dropped, records whose fields are all empty skipped.
 *
 * Longer than most files: the record walker, the number and date readers that work on the
 * characters, and the calendar helpers they need are one hot path, kept together.
 */
import { isLeapYear } from '../../climate/calendar.js';

/** A CSV syntax error: the line it was found on and what is wrong. */
export class CsvSyntaxError extends Error {
  constructor(
    readonly line: number,
    message: string,
  ) {
    super(message);
    this.name = 'CsvSyntaxError';
  }
}

/** 10^k for k = 0..22: exact in binary64, so m / 10^k is correctly rounded for m <= 2^53. */
const POW10 = Array.from({ length: 23 }, (_, k) => Number(`1e${k}`));

const isBlank = (c: number) => c === 32 || c === 9;

/**
 * Record-by-record reader. After `next()` returns true, `line` is the line the record starts
 * on, `count` its number of fields, and field k lies in `text` from `start[k]` to `end[k]`
 * (trimmed, inside the quotes of a quoted field).
 */
export class CsvRows {
  line = 0;
  count = 0;
  start = new Int32Array(32);
  end = new Int32Array(32);
  private quoted = new Uint8Array(32);
  private pos: number;
  private lineNo = 1;
  /** Position of the next double quote and of the next LF at or after `pos` (-1: not looked). */
  private nextQuote = -1;
  private lineEnd = -1;
  /** A CR that is not followed by LF ends a line too: such texts take the character path. */
  private readonly loneCr: boolean;
  /** The month `day` last looked up: year, month, day number of its day 0, length. */
  private monthYear = NaN;
  private month = NaN;
  private monthStart = NaN;
  private monthDays = 0;

  /**
   * @param offset where to start reading (default: the start, after a byte-order mark)
   * @param firstLine the line number at `offset`
   */
  constructor(
    readonly text: string,
    offset = 0,
    firstLine = 1,
  ) {
    this.pos = offset === 0 && text.charCodeAt(0) === 0xfeff ? 1 : offset;
    this.lineNo = firstLine;
    this.loneCr = /\r(?!\n)/.test(text);
  }

  /** Move to the next record with a non-empty field; false at the end of the text. */
  next(): boolean {
    const t = this.text;
    const n = t.length;
    while (this.pos < n) {
      if (this.nextQuote < this.pos) {
        this.nextQuote = t.indexOf('"', this.pos);
        if (this.nextQuote < 0) this.nextQuote = n;
      }
      if (this.lineEnd < this.pos) {
        this.lineEnd = t.indexOf('\n', this.pos);
        if (this.lineEnd < 0) this.lineEnd = n;
      }
      const nonEmpty =
        this.nextQuote > this.lineEnd && !this.loneCr ? this.plainLine() : this.anyRecord();
      if (nonEmpty) return true;
    }
    return false;
  }

  /** A record on one line without quotes (the common case): fields found with indexOf. */
  private plainLine(): boolean {
    const t = this.text;
    let end = this.lineEnd;
    const next = end + 1;
    if (end > this.pos && t.charCodeAt(end - 1) === 13) end--;
    this.line = this.lineNo++;
    let count = 0;
    let nonEmpty = false;
    let s = this.pos;
    for (;;) {
      let comma = t.indexOf(',', s);
      if (comma < 0 || comma > end) comma = end;
      let e = comma;
      while (s < e && isBlank(t.charCodeAt(s))) s++;
      while (e > s && isBlank(t.charCodeAt(e - 1))) e--;
      if (count === this.start.length) this.grow();
      this.start[count] = s;
      this.end[count] = e;
      this.quoted[count] = 0;
      count++;
      if (e > s) nonEmpty = true;
      if (comma === end) break;
      s = comma + 1;
    }
    this.count = count;
    this.pos = next;
    return nonEmpty;
  }

  /** Any record, quoted fields and all line ends included: read character by character. */
  private anyRecord(): boolean {
    const t = this.text;
    const n = t.length;
    this.line = this.lineNo;
    let i = this.pos;
    let count = 0;
    let nonEmpty = false;
    for (;;) {
      let s = i;
      let c = 0;
      while (s < n && isBlank(t.charCodeAt(s))) s++;
      let e: number;
      let quoted = 0;
      if (s < n && t.charCodeAt(s) === 34) {
        quoted = 1;
        const opened = this.lineNo;
        let j = ++s;
        for (;;) {
          if (j >= n) {
            throw new CsvSyntaxError(
              opened,
              'a quoted field is never closed; close it with a double quote',
            );
          }
          c = t.charCodeAt(j);
          if (c === 34) {
            if (t.charCodeAt(j + 1) === 34) {
              j += 2;
              continue;
            }
            break;
          }
          if (c === 10 || (c === 13 && t.charCodeAt(j + 1) !== 10)) this.lineNo++;
          j++;
        }
        e = j++;
        while (j < n && isBlank(t.charCodeAt(j))) j++;
        c = j < n ? t.charCodeAt(j) : 44;
        if (c !== 44 && c !== 10 && c !== 13) {
          throw new CsvSyntaxError(
            this.lineNo,
            `text after the closing quote of field ${count + 1}; a quoted field ends at its closing quote`,
          );
        }
        i = j;
      } else {
        let j = s;
        for (; j < n; j++) {
          c = t.charCodeAt(j);
          if (c === 44 || c === 10 || c === 13) break;
          if (c === 34) {
            throw new CsvSyntaxError(
              this.lineNo,
              `a double quote inside unquoted field ${count + 1}; quote the whole field`,
            );
          }
        }
        e = j;
        while (e > s && isBlank(t.charCodeAt(e - 1))) e--;
        i = j;
      }
      if (count === this.start.length) this.grow();
      this.start[count] = s;
      this.end[count] = e;
      this.quoted[count] = quoted;
      count++;
      // As csv-parse's skip_records_with_empty_values: a quoted field of white space is empty.
      if (e > s && (!quoted || /\S/.test(t.slice(s, e)))) nonEmpty = true;
      if (i >= n) {
        this.pos = n;
        break;
      }
      c = t.charCodeAt(i);
      if (c === 44) {
        i++;
        continue;
      }
      i += c === 13 && t.charCodeAt(i + 1) === 10 ? 2 : 1;
      this.lineNo++;
      this.pos = i;
      break;
    }
    this.count = count;
    return nonEmpty;
  }

  /** The text of field k (a doubled quote inside a quoted field read as one). */
  field(k: number): string {
    const s = this.text.slice(this.start[k], this.end[k]);
    return this.quoted[k] && s.includes('"') ? s.replaceAll('""', '"') : s;
  }

  /** Every field of the record as text. */
  fields(): string[] {
    const out = new Array<string>(this.count);
    for (let k = 0; k < this.count; k++) out[k] = this.field(k);
    return out;
  }

  /** True when field k is empty. */
  isEmpty(k: number): boolean {
    return this.end[k] === this.start[k];
  }

  /**
   * Field k as a decimal number (the forms of `DECIMAL_NUMBER`, units/decimal.ts), NaN when it
   * is not one. Up to 15 significant digits without exponent are read as integer / 10^k, which is
   * correctly rounded (both exact in binary64; Clinger, 1990, "How to read floating point
   * numbers accurately", PLDI), so the result equals Number(text); other forms use Number().
   */
  number(k: number): number {
    const t = this.text;
    const s = this.start[k];
    const e = this.end[k];
    let i = s;
    let c = t.charCodeAt(i);
    const negative = c === 45;
    if (negative || c === 43) i++;
    let mantissa = 0;
    let digits = 0;
    let decimals = 0;
    for (; i < e; i++) {
      c = t.charCodeAt(i) - 48;
      if (c < 0 || c > 9) break;
      mantissa = mantissa * 10 + c;
      digits++;
    }
    if (i < e && t.charCodeAt(i) === 46) {
      for (i++; i < e; i++) {
        c = t.charCodeAt(i) - 48;
        if (c < 0 || c > 9) break;
        mantissa = mantissa * 10 + c;
        digits++;
        decimals++;
      }
    }
    if (digits === 0) return NaN;
    if (i < e) {
      c = t.charCodeAt(i);
      if (c !== 101 && c !== 69) return NaN;
      i++;
      c = t.charCodeAt(i);
      if (c === 43 || c === 45) i++;
      const expStart = i;
      for (; i < e; i++) {
        c = t.charCodeAt(i) - 48;
        if (c < 0 || c > 9) return NaN;
      }
      return i > expStart ? Number(t.slice(s, e)) : NaN;
    }
    if (digits > 15) return Number(t.slice(s, e));
    const x = decimals === 0 ? mantissa : mantissa / POW10[decimals];
    return negative ? -x : x;
  }

  /** Field k as a day number (days since 1970-01-01) if it is a real date YYYY-MM-DD, else NaN. */
  isoDay(k: number): number {
    const t = this.text;
    const s = this.start[k];
    if (this.end[k] - s !== 10 || t.charCodeAt(s + 4) !== 45 || t.charCodeAt(s + 7) !== 45) {
      return NaN;
    }
    return this.day(this.digitsAt(s, 4), this.digitsAt(s + 5, 2), this.digitsAt(s + 8, 2));
  }

  /** Field k as a day number if it is a real date YYYYMMDD (8 digits), else NaN. */
  compactDay(k: number): number {
    const s = this.start[k];
    if (this.end[k] - s !== 8) return NaN;
    return this.day(this.digitsAt(s, 4), this.digitsAt(s + 4, 2), this.digitsAt(s + 6, 2));
  }

  /** civilDay with the month of the previous call remembered (rows come month by month). */
  private day(y: number, m: number, d: number): number {
    if (y !== this.monthYear || m !== this.month) {
      const start = civilDay(y, m, 1) - 1;
      if (Number.isNaN(start)) return NaN;
      this.monthStart = start;
      this.monthYear = y;
      this.month = m;
      this.monthDays = m === 2 && isLeapYear(y) ? 29 : DAYS_IN_MONTH[m];
    }
    return d >= 1 && d <= this.monthDays ? this.monthStart + d : NaN;
  }

  /** The whole number written by `count` digits at `at`, NaN if one is not a digit. */
  private digitsAt(at: number, count: number): number {
    let x = 0;
    for (let i = at; i < at + count; i++) {
      const c = this.text.charCodeAt(i) - 48;
      if (c < 0 || c > 9) return NaN;
      x = x * 10 + c;
    }
    return x;
  }

  private grow(): void {
    const size = this.start.length * 2;
    const start = new Int32Array(size);
    const end = new Int32Array(size);
    const quoted = new Uint8Array(size);
    start.set(this.start);
    end.set(this.end);
    quoted.set(this.quoted);
    this.start = start;
    this.end = end;
    this.quoted = quoted;
  }
}

const DAYS_IN_MONTH = [0, 31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31];

/**
 * Day number (days since 1970-01-01, proleptic Gregorian) of a year, month and day, or NaN when
 * they are not a real date. Arithmetic after Hinnant's `days_from_civil` (from memory), checked
 * against the Date-based calendar in the tests.
 */
export function civilDay(y: number, m: number, d: number): number {
  if (!(m >= 1 && m <= 12 && d >= 1)) return NaN;
  if (d > (m === 2 && isLeapYear(y) ? 29 : DAYS_IN_MONTH[m])) return NaN;
  const yy = m <= 2 ? y - 1 : y;
  const era = Math.floor(yy / 400);
  const yoe = yy - era * 400;
  const doy = Math.floor((153 * (m + (m > 2 ? -3 : 9)) + 2) / 5) + d - 1;
  const doe = yoe * 365 + Math.floor(yoe / 4) - Math.floor(yoe / 100) + doy;
  return era * 146097 + doe - 719468;
}

/**
 * ISO dates of `count` consecutive days from day number `first`, built by counting days up
 * (no Date object per day).
 */
export function isoDateRun(first: number, count: number): string[] {
  const out = new Array<string>(count);
  if (count === 0) return out;
  const t = new Date(first * 86_400_000);
  let y = t.getUTCFullYear();
  let m = t.getUTCMonth() + 1;
  let d = t.getUTCDate();
  let prefix = `${String(y).padStart(4, '0')}-${m < 10 ? '0' : ''}${m}-`;
  let length = m === 2 && isLeapYear(y) ? 29 : DAYS_IN_MONTH[m];
  for (let i = 0; i < count; i++) {
    out[i] = prefix + (d < 10 ? '0' : '') + d;
    if (++d > length) {
      d = 1;
      if (++m > 12) {
        m = 1;
        y++;
      }
      prefix = `${String(y).padStart(4, '0')}-${m < 10 ? '0' : ''}${m}-`;
      length = m === 2 && isLeapYear(y) ? 29 : DAYS_IN_MONTH[m];
    }
  }
  return out;
}
