/**
 * Progress on stderr for long work: a bar that appears only once the work has taken more than
 * a second and only on a terminal, so scripts and `--json` pipelines see nothing extra.
 */
import cliProgress from 'cli-progress';

export interface Progress {
  tick(label: string): void;
  stop(): void;
}

/** Start tracking `total` steps of work described by `what`. */
export function progress(total: number, what: string): Progress {
  const start = Date.now();
  let bar: cliProgress.SingleBar | undefined;
  let done = 0;
  const enabled = Boolean(process.stderr.isTTY) && !process.env.CI;
  return {
    tick(label: string) {
      if (!enabled) return;
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
