/**
 * `node dist/bench/run.js measurements`: the cost of updating with measurements on the structure —
 * frequency solves per second against a floor of critical-load solves (same frame), and the wall
 * time and likelihood calls of the posterior of a scenario (default scenarios/measured-shed-column.yaml).
 * Prints lines; asserts nothing.
 */
import { readFileSync } from 'node:fs';
import { criticalPhi } from '../src/mechanics/criticalLoad.js';
import { frequencyParameter } from '../src/mechanics/naturalFrequency.js';
import { loadScenario } from '../src/scenario/loadScenario.js';
import { updateScenarioWithEvidence } from '../src/studies/measurementUpdate.js';

function rate(f: (i: number) => number, n: number): number {
  let sink = 0;
  const t0 = performance.now();
  for (let i = 0; i < n; i++) sink += f(i);
  const ms = performance.now() - t0;
  if (!Number.isFinite(sink)) throw new Error('bench: non-finite result');
  return (n / ms) * 1000;
}

export function runMeasurementBench(scenarioPath: string): string[] {
  const lines: string[] = [];
  const R = (i: number) => 0.1 + (i % 97) * 0.37;
  const n = 20_000;
  const buckling = rate((i) => criticalPhi('braced', { bottom: R(i), top: R(i + 13) }), n);
  const frequency = rate((i) => frequencyParameter('braced', { bottom: R(i), top: R(i + 13) }, 1.5), n);
  lines.push(`braced critical load (exact): ${Math.round(buckling)} /s`);
  lines.push(`braced first frequency at φ = 1.5: ${Math.round(frequency)} /s (critical load / this = ${(buckling / frequency).toFixed(1)})`);
  const s = loadScenario(readFileSync(scenarioPath, 'utf8'), scenarioPath);
  const t0 = performance.now();
  const { summary } = updateScenarioWithEvidence(s, 1);
  const ms = performance.now() - t0;
  if (summary) {
    lines.push(`posterior of ${scenarioPath.split('/').pop()}: ${summary.variables.length} variables, ${summary.calls} likelihood calls, ${ms.toFixed(0)} ms wall (${((ms / summary.calls) * 1000).toFixed(1)} µs per call), max R̂ ${summary.maxRhat.toFixed(3)}, min ESS ${Math.round(summary.minEss)}`);
  }
  return lines;
}
