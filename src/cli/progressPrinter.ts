import type { SimulationProgress } from '../reliability/types.js';

/** One self-overwriting progress line on stderr, only when stderr is a terminal. */
export function progressPrinter(stream: NodeJS.WriteStream = process.stderr) {
  const live = Boolean(stream.isTTY);
  let last = 0;
  let shown = false;
  return {
    update(method: string, p: SimulationProgress): void {
      if (!live) return;
      const now = Date.now();
      if (now - last < 200 && p.samples < p.total) return;
      last = now;
      shown = true;
      const pct = p.total > 0 ? Math.floor((100 * p.samples) / p.total) : 0;
      const cov = Number.isFinite(p.cov) ? `${(p.cov * 100).toFixed(1)} %` : '—';
      stream.write(`\r${method}: ${pct}% (${p.samples}/${p.total}) pf ${p.pf.toExponential(2)} CoV ${cov}   `);
    },
    done(): void {
      if (shown) stream.write('\r' + ' '.repeat(79) + '\r');
    },
  };
}
