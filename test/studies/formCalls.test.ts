import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { buildColumnModel } from '../../src/limitState/columnModel.js';
import { problemFromModel } from '../../src/limitState/columnRecipe.js';
import { form } from '../../src/reliability/form.js';
import { loadScenario } from '../../src/scenario/loadScenario.js';

function demoProblem(file: string) {
  const path = new URL(`../../scenarios/${file}`, import.meta.url);
  return problemFromModel(buildColumnModel(loadScenario(readFileSync(path, 'utf8'), file)));
}

describe('FORM on the demo columns: tens of calls, the same design point', () => {
  for (const file of ['braced-base-plate.yaml', 'timber-store-post.yaml', 'sway-canopy-post.yaml']) {
    it(file, () => {
      const problem = demoProblem(file);
      // common practice: plain improved HL-RF with central differences and the full restart scan as the reference search
      const reference = form(problem, { differences: 'central', curvature: false, thorough: true });
      const quick = form(problem);
      expect(quick.converged).toBe(true);
      expect(quick.calls).toBeLessThanOrEqual(100);
      expect(Math.abs(quick.beta - reference.beta)).toBeLessThan(1e-6);
      quick.alpha.forEach((a, i) => expect(Math.abs(a - reference.alpha[i])).toBeLessThan(1e-5));
      expect(reference.calls).toBeGreaterThan(5 * quick.calls);
    });
  }
});
