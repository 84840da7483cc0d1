/**
 * Every long loop stops soon after the Ctrl-C flag is set (runtime/interruptFlag.ts). Each test
 * sets the flag from inside the work itself, at a known call, and counts the calls made after
 * it: the loops must throw InterruptedError (or, for a sampler given a signal, stop early)
 * within their stated check interval. Self-consistency checks: common practice.
 */
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { existsSync, mkdtempSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import {
  createInterruptFlag,
  InterruptedError,
  interruptRequested,
  requestInterrupt,
  throwIfInterrupted,
  useInterruptFlag,
} from '../../src/runtime/interruptFlag.js';
import { createTemporaryRegistry, heldTemporaries, holdTemporary, useTemporaryRegistry } from '../../src/runtime/temporaryPaths.js';
import { linearSum, paraboloid } from '../../src/reliability/testProblems.js';
import type { ReliabilityProblem } from '../../src/reliability/types.js';
import { form } from '../../src/reliability/form.js';
import { sorm } from '../../src/reliability/sorm.js';
import { monteCarlo } from '../../src/reliability/monteCarlo.js';
import { symmetricEigenvalues } from '../../src/reliability/symmetricEigenvalues.js';
import { makeDistribution } from '../../src/probability/makeDistribution.js';
import { choleskyLower } from '../../src/probability/cholesky.js';
import { sobolIndices } from '../../src/sensitivity/sobol.js';
import { tornado } from '../../src/sensitivity/tornado.js';
import { conditionalBeta } from '../../src/sensitivity/conditionalBeta.js';
import { betaElasticities } from '../../src/sensitivity/elasticities.js';
import { restraintStudy } from '../../src/studies/restraintStudy.js';
import { runSweep } from '../../src/studies/runSweep.js';
import { buildCaseTable } from '../../src/studies/sweepDesign.js';
import { parseVaryOption } from '../../src/studies/varyOption.js';
import { writeOutputs } from '../../src/report/writeOutputs.js';
import { demoReportInput, demoResultJson } from '../report/fixture.js';

beforeEach(() => useInterruptFlag(createInterruptFlag()));
afterEach(() => useInterruptFlag(undefined));

/** A problem whose g sets the flag at call `at` and counts every call. */
function trippingProblem(base: ReliabilityProblem, at: number): { problem: ReliabilityProblem; calls: () => number } {
  let calls = 0;
  return {
    problem: {
      ...base,
      g: (x) => {
        if (++calls === at) requestInterrupt();
        return base.g(x);
      },
    },
    calls: () => calls,
  };
}

const normals = (d: number) => Array.from({ length: d }, () => makeDistribution({ dist: 'normal', mean: 10, sd: 1 }));
const names = (d: number) => Array.from({ length: d }, (_, i) => `x${i}`);

describe('the flag', () => {
  it('is unset, then set, and throws the named phase', () => {
    expect(interruptRequested()).toBe(false);
    expect(() => throwIfInterrupted('FORM')).not.toThrow();
    requestInterrupt();
    expect(interruptRequested()).toBe(true);
    expect(() => throwIfInterrupted('FORM')).toThrow(new InterruptedError('interrupted during FORM; nothing was written'));
  });

  it('costs nothing and never fires without a flag installed (library use)', () => {
    useInterruptFlag(undefined);
    requestInterrupt();
    expect(interruptRequested()).toBe(false);
  });
});

describe('reliability methods stop within one check interval', () => {
  it('FORM: at most 64 limit-state calls after the flag', () => {
    const t = trippingProblem(linearSum({ n: 300, beta: 3 }), 10);
    expect(() => form(t.problem)).toThrow(InterruptedError);
    expect(t.calls() - 10).toBeLessThanOrEqual(64);
  });

  it('SORM: the Hessian stops within 64 calls, the eigenvalue solver at its next row', () => {
    const base = paraboloid({ n: 20, beta: 2, kappa: 0.1 });
    const f = form(base);
    const t = trippingProblem(base, 100);
    expect(() => sorm(t.problem, f)).toThrow(/interrupted during SORM/);
    expect(t.calls() - 100).toBeLessThanOrEqual(64);
    requestInterrupt();
    expect(() => symmetricEigenvalues([[2, 1], [1, 2]])).toThrow(InterruptedError);
  });

  it('the Nataf Cholesky factor stops at its next row', () => {
    requestInterrupt();
    expect(() => choleskyLower([[1, 0.5], [0.5, 1]])).toThrow(/Nataf/);
  });

  it('Monte Carlo with a signal returns the whole chunks merged before the flag; without one it throws', async () => {
    const chunk = 16384; // MC_CHUNK_SIZE: the flag is read every 256 samples inside a chunk
    const at = chunk + 1000;
    const graceful = trippingProblem(linearSum({ n: 2, beta: 2 }), at);
    const r = await monteCarlo(graceful.problem, { samples: 10 * chunk, seed: 5, signal: new AbortController().signal });
    expect(r.stopReason).toBe('aborted');
    expect(r.samples).toBe(chunk);
    expect(graceful.calls() - at).toBeLessThanOrEqual(256);

    useInterruptFlag(createInterruptFlag());
    const strict = trippingProblem(linearSum({ n: 2, beta: 2 }), at);
    await expect(monteCarlo(strict.problem, { samples: 10 * chunk, seed: 5 })).rejects.toThrow(InterruptedError);
  });
});

describe('sensitivity studies stop', () => {
  it('Sobol: within one design row (d + 2 calls) of the flag', () => {
    const d = 5;
    let calls = 0;
    const model = (x: Float64Array) => {
      if (++calls === 50) requestInterrupt();
      return x[0] + x[1] * x[2];
    };
    expect(() => sobolIndices(names(d), normals(d), model, { seed: 1, n: 1000 })).toThrow(/interrupted during the Sobol study/);
    expect(calls - 50).toBeLessThanOrEqual(d + 2);
  });

  it('tornado, conditional β and elasticities: before the next variable', () => {
    const d = 6;
    let calls = 0;
    const tripAt3 = () => {
      if (++calls === 3) requestInterrupt();
      return 1;
    };
    expect(() => tornado(names(d), normals(d), tripAt3)).toThrow(/tornado/);
    expect(calls).toBe(4); // the pair of the variable under way, then stop

    useInterruptFlag(createInterruptFlag());
    calls = 0;
    expect(() => conditionalBeta(names(d), normals(d), tripAt3)).toThrow(/conditional β/);
    expect(calls).toBe(4);

    useInterruptFlag(createInterruptFlag());
    calls = 0;
    const moments = Array.from({ length: d }, () => ({ mean: 10, sd: 1 }));
    expect(() => betaElasticities(names(d), moments, tripAt3)).toThrow(/elasticities/);
    expect(calls).toBe(5); // β, then the four of the first variable
  });

  it('the restraint study: before the next β', () => {
    let calls = 0;
    const betaAtFactor = (factor: number) => {
      if (++calls === 4) requestInterrupt();
      return { beta: 1 + Math.log1p(factor), pf: 0.1 };
    };
    expect(() => restraintStudy({ betaAtFactor, baseStiffness: { bottom: 1e6 }, target: 3 })).toThrow(/restraint study/);
    expect(calls).toBe(4);
  });
});

describe('a sweep in this thread', () => {
  it('stops before the next case, keeps only complete journal lines and records no error', async () => {
    const stateDir = mkdtempSync(join(tmpdir(), 'stanchion-interrupt-'));
    try {
      const table = buildCaseTable({ design: 'grid', seed: 3, vary: [parseVaryOption('x=1:6:6')] });
      let ran = 0;
      const runCase = () => {
        if (++ran === 2) requestInterrupt();
        return { y: ran };
      };
      await expect(runSweep({ table, runCase, stateDir })).rejects.toThrow(/interrupted during the sweep/);
      expect(ran).toBe(2);
      const lines = readFileSync(join(stateDir, readdirSync(stateDir)[0]), 'utf8').split('\n');
      expect(lines.pop()).toBe(''); // ends with a newline: no torn line
      const rows = lines.slice(1).map((l) => JSON.parse(l) as { case: number; error?: string });
      expect(rows.map((r) => r.case)).toEqual([0, 1]);
      expect(rows.every((r) => r.error === undefined)).toBe(true);
    } finally {
      rmSync(stateDir, { recursive: true, force: true });
    }
  });

  it('a case stopped by Ctrl-C is not journalled as a failed case', async () => {
    const stateDir = mkdtempSync(join(tmpdir(), 'stanchion-interrupt-'));
    try {
      const table = buildCaseTable({ design: 'grid', seed: 3, vary: [parseVaryOption('x=1:3:3')] });
      const runCase = () => {
        requestInterrupt();
        throwIfInterrupted('FORM');
        return { y: 1 };
      };
      await expect(runSweep({ table, runCase, stateDir })).rejects.toThrow(InterruptedError);
      const journal = readFileSync(join(stateDir, readdirSync(stateDir)[0]), 'utf8');
      expect(journal.trim().split('\n')).toHaveLength(1); // the header only
    } finally {
      rmSync(stateDir, { recursive: true, force: true });
    }
  });
});

describe('the report', () => {
  it('stopped while writing leaves neither DIR nor its hidden partial folder', async () => {
    const parent = mkdtempSync(join(tmpdir(), 'stanchion-interrupt-'));
    try {
      const input = demoReportInput();
      let writes = 0;
      const { promises: fsp } = await import('node:fs');
      const writeFile = async (p: string, d: string | Uint8Array) => {
        if (++writes === 2) requestInterrupt();
        await fsp.writeFile(p, d);
      };
      const out = join(parent, 'report');
      await expect(writeOutputs(out, input, demoResultJson(input), { png: false, writeFile })).rejects.toThrow(/interrupted during the report rendering/);
      expect(writes).toBe(2);
      expect(existsSync(out)).toBe(false);
      expect(readdirSync(parent)).toEqual([]);
    } finally {
      rmSync(parent, { recursive: true, force: true });
    }
  });
});

describe('temporaries noted for a hard stop', () => {
  afterEach(() => useTemporaryRegistry(undefined));

  it('are held until released, and read back by path', () => {
    const registry = createTemporaryRegistry();
    useTemporaryRegistry(registry);
    const a = join(tmpdir(), 'a', '.report.partial-1');
    const b = join(tmpdir(), 'b', '.sweep.csv.1.tmp');
    const releaseA = holdTemporary(a);
    const releaseB = holdTemporary(b);
    expect(heldTemporaries(registry)).toEqual([a, b]);
    releaseA();
    expect(heldTemporaries(registry)).toEqual([b]);
    releaseB();
    expect(heldTemporaries(registry)).toEqual([]);
  });
});
