import { describe, expect, it } from 'vitest';
import { formatDuration, progressPrinter, progressText } from '../../src/cli/progressPrinter.js';

describe('the Monte Carlo progress line', () => {
  it('shows elapsed time and the time left at the rate so far', () => {
    // 25 % done in 10 s: 30 s left at the same rate
    const t = progressText('Monte Carlo', { samples: 250_000, total: 1_000_000, pf: 1.2e-4, cov: 0.18 }, 10);
    expect(t).toBe('Monte Carlo: 25% (250000/1000000) pf 1.20e-4 CoV 18.0 %; 10 s elapsed, about 30 s left');
    expect(progressText('mc', { samples: 5, total: 1000, pf: 0, cov: NaN }, 0.2)).not.toContain('left'); // too early to tell
    expect(formatDuration(125)).toBe('2 min 05 s');
    expect(formatDuration(3780)).toBe('1 h 03 min');
  });

  it('writes only to a terminal, and clears its line when done', () => {
    const written: string[] = [];
    let clock = 0;
    const tty = { isTTY: true, write: (s: string) => written.push(s) } as unknown as NodeJS.WriteStream;
    const p = progressPrinter(tty, () => clock);
    clock = 4000;
    p.update('Monte Carlo', { samples: 500, total: 1000, pf: 1e-3, cov: 0.5 });
    p.done();
    expect(written[0]).toContain('4 s elapsed, about 4 s left');
    expect(written[1].trim()).toBe('');
    const quiet: string[] = [];
    const pipe = { isTTY: false, write: (s: string) => quiet.push(s) } as unknown as NodeJS.WriteStream;
    progressPrinter(pipe).update('mc', { samples: 1, total: 2, pf: 0, cov: 1 });
    expect(quiet).toEqual([]);
  });
});
