import type { SimulationProgress } from '../reliability/types.js';

/** '7 s', '2 min 05 s', '1 h 03 min': short and unambiguous. */
export function formatDuration(seconds: number): string {
  const s = Math.max(0, Math.round(seconds));
  if (s < 60) return `${s} s`;
  if (s < 3600) return `${Math.floor(s / 60)} min ${String(s % 60).padStart(2, '0')} s`;
  return `${Math.floor(s / 3600)} h ${String(Math.floor((s % 3600) / 60)).padStart(2, '0')} min`;
}

/**
 * The text of one progress line: done so far, estimate, elapsed time and, once a little of the
 * run is done, the time left at the rate so far (a run stopped early by --target-cov ends sooner).
 */
export function progressText(method: string, p: SimulationProgress, elapsedSeconds: number): string {
  const pct = p.total > 0 ? Math.floor((100 * p.samples) / p.total) : 0;
  const cov = Number.isFinite(p.cov) ? `${(p.cov * 100).toFixed(1)} %` : '—';
  const fraction = p.total > 0 ? p.samples / p.total : 0;
  const left = fraction >= 0.01 && fraction < 1 && elapsedSeconds >= 1 ? `, about ${formatDuration((elapsedSeconds * (1 - fraction)) / fraction)} left` : '';
  return `${method}: ${pct}% (${p.samples}/${p.total}) pf ${p.pf.toExponential(2)} CoV ${cov}; ${formatDuration(elapsedSeconds)} elapsed${left}`;
}

/** One self-overwriting progress line on stderr, only when stderr is a terminal. */
export function progressPrinter(stream: NodeJS.WriteStream = process.stderr, now: () => number = Date.now) {
  const live = Boolean(stream.isTTY);
  const started = now();
  let last = 0;
  let width = 0;
  return {
    update(method: string, p: SimulationProgress): void {
      if (!live) return;
      const t = now();
      if (t - last < 200 && p.samples < p.total) return;
      last = t;
      const text = progressText(method, p, (t - started) / 1000);
      // pad over a longer previous line so no stale characters remain
      stream.write(`\r${text.padEnd(width)}`);
      width = Math.max(width, text.length);
    },
    done(): void {
      if (width > 0) stream.write('\r' + ' '.repeat(width) + '\r');
    },
  };
}
