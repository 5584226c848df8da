/**
 * Progress on stderr for long work: a bar that appears only once the work has taken more than
 * a second and only on a terminal, so scripts and `--json` pipelines see nothing extra. Work
 * that runs unattended for hours (a batch shard under a scheduler, whose stderr is a log file)
 * can ask for `logLines`: off a terminal, one plain line at most once a minute with the count
 * done, the rate and the time left.
 */
import cliProgress from 'cli-progress';

export interface Progress {
  tick(label: string): void;
  stop(): void;
}

/** Seconds between two progress lines in a log. */
const LOG_EVERY_S = 60;

/** One log line: `what: 120/1000 done (12 %), 2.1 per s, about 7 min left`. */
export function progressLine(what: string, done: number, total: number, seconds: number): string {
  const rate = seconds > 0 ? done / seconds : 0;
  const leftS = rate > 0 ? (total - done) / rate : NaN;
  const left = !Number.isFinite(leftS)
    ? ''
    : leftS < 90
      ? `, about ${Math.ceil(leftS)} s left`
      : `, about ${Math.round(leftS / 60)} min left`;
  const pct = total > 0 ? Math.floor((100 * done) / total) : 100;
  return `${what}: ${done}/${total} done (${pct} %), ${rate.toPrecision(2)} per s${left}`;
}

/** Start tracking `total` steps of work described by `what`. */
export function progress(
  total: number,
  what: string,
  options: { logLines?: boolean } = {},
): Progress {
  const start = Date.now();
  let bar: cliProgress.SingleBar | undefined;
  let done = 0;
  const enabled = Boolean(process.stderr.isTTY) && !process.env.CI;
  let lastLog = start;
  const log = (): void => {
    const now = Date.now();
    if (now - lastLog < LOG_EVERY_S * 1000) return;
    lastLog = now;
    process.stderr.write(progressLine(what, done, total, (now - start) / 1000) + '\n');
  };
  return {
    tick(label: string) {
      if (!enabled) {
        done++;
        if (options.logLines) log();
        return;
      }
      if (!bar && Date.now() - start > 1000) {
        bar = new cliProgress.SingleBar(
          {
            stream: process.stderr,
            format: `${what} [{bar}] {value}/{total} {label}`,
            hideCursor: true,
            clearOnComplete: true,
          },
          cliProgress.Presets.shades_classic,
        );
        bar.start(total, done, { label });
      }
      bar?.update(done, { label });
      done++;
    },
    stop() {
      if (bar) {
        bar.update(total, { label: 'done' });
        bar.stop();
      }
    },
  };
}
