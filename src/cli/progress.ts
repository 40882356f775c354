/**
 * A progress bar on stderr for long runs (many flows, a long survey, many charts), drawn only when stderr
 * is a terminal: piped or redirected output (a log file, CI, another program) never gets control
 * characters or partial lines. The bar redraws one line with a carriage return and is wiped when done,
 * so what follows prints on a clean line.
 */

export interface ProgressStream {
  readonly isTTY?: boolean;
  readonly columns?: number;
  write(text: string): unknown;
}

export interface Progress {
  /** `done` of `total` steps finished; `label` says what was just finished */
  update(done: number, total: number, label?: string): void;
  /** wipe the bar (nothing is left on the line) */
  finish(): void;
}

/** Width of the bar itself, in characters, and the narrowest terminal it is drawn in. */
const barWidth = 24;
const narrowest = 40;
/** Redraws closer together than this (ms) are skipped, except the last one. */
const redrawInterval = 50;
/** A run that finishes sooner than this (ms) shows no bar at all: a bar that flashes tells nothing. */
export const progressDelay = 300;

const silent: Progress = { update() {}, finish() {} };

/** One line: "gvf ███████░░░░░░░ 12/30 flow 100-year", cut to the terminal's width. */
export function progressLine(done: number, total: number, label: string, columns: number): string {
  const t = Math.max(1, Math.floor(total));
  const d = Math.min(t, Math.max(0, Math.floor(done)));
  const filled = Math.round((barWidth * d) / t);
  const text = `gvf ${'█'.repeat(filled)}${'░'.repeat(barWidth - filled)} ${d}/${t}${label ? ` ${label}` : ''}`;
  const limit = Math.max(narrowest, columns) - 1;
  return [...text].length > limit ? [...text].slice(0, limit).join('') : text;
}

/**
 * A progress bar writing to `stream` when it is a terminal; otherwise one that does nothing.
 * Nothing is drawn before `delay` ms have passed; `now` is the clock (tests pass their own).
 */
export function createProgress(stream: ProgressStream, options: { delay?: number; now?: () => number } = {}): Progress {
  if (stream.isTTY !== true) return silent;
  const now = options.now ?? (() => Date.now());
  const start = now();
  const delay = options.delay ?? progressDelay;
  let last = -Infinity;
  let shown = false;
  let width = 0;
  return {
    update(done, total, label = '') {
      const time = now();
      if (time - start < delay) return;
      if (done < total && time - last < redrawInterval) return;
      last = time;
      const line = progressLine(done, total, label, stream.columns ?? 80);
      const pad = Math.max(0, width - [...line].length);
      width = [...line].length;
      stream.write(`\r${line}${' '.repeat(pad)}`);
      shown = true;
    },
    finish() {
      if (!shown) return;
      stream.write(`\r${' '.repeat(width)}\r`);
      shown = false;
      width = 0;
    },
  };
}
