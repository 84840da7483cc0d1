import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
// in this process: the statement, its confirmation and the charts are the program's work, not the executable's
import { runCli } from './runCli.js';
import { overlappingTexts } from '../report/svgTextBoxes.js';

const dir = mkdtempSync(join(tmpdir(), 'stanchion-restraint-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

/** The sway demo with its base stiffness mean replaced (N·m/rad). */
function swayAt(k: number): string {
  return readFileSync('scenarios/sway-canopy-post.yaml', 'utf8').replace(
    /bottom: \{rotation: \{dist: lognormal, mean: [^,]+, cov: 0.4\}\}/,
    `bottom: {rotation: {dist: lognormal, mean: ${k} N m/rad, cov: 0.4}}`,
  );
}

let written = 0;
async function governingBeta(text: string): Promise<number> {
  const file = join(dir, `sway-${written++}.yaml`);
  writeFileSync(file, text);
  const a = await runCli(['assess', file, '--json', '--methods', 'form,sorm,is']);
  expect(a.status, a.stderr).toBe(0);
  return JSON.parse(a.stdout).reliability.governing.beta;
}

describe('a restraint statement that assess confirms', () => {
  const out = join(dir, 'sway');
  let r: Awaited<ReturnType<typeof runCli>>;
  let res: ReturnType<typeof JSON.parse>;
  beforeAll(async () => {
    r = await runCli(['restraint', 'scenarios/sway-canopy-post.yaml', '--json', '--out', out]);
    res = r.status === 0 ? JSON.parse(r.stdout).restraint : null;
  });

  it('on the sway demo, where FORM is unconservative at its own root, the raised requirement is confirmed by assess', async () => {
    expect(r.status, r.stderr).toBe(0);
    expect(res.method).toBe('form');
    expect(res.verified.raised_by).toBeGreaterThan(1);
    // common practice: the governing method of `assess`, run at the reported stiffness, must meet the target
    expect(await governingBeta(swayAt(res.required.bottom))).toBeGreaterThanOrEqual(res.target_beta - 0.02);
    // and at FORM's own root it does not: the raise was needed
    expect(await governingBeta(swayAt(res.verified.root_factor * 3e6))).toBeLessThan(res.target_beta);
  });

  it('states mean, CoV, 5 % fractile, design stiffness and K_d; no code check "may use" a K', async () => {
    const q = res.requirement.bottom;
    expect(q.mean).toBe(res.required.bottom);
    expect(q.cov).toBeCloseTo(0.4, 10);
    // common practice: lognormal 5 % fractile = mean / sqrt(1 + V²) · exp(−1.645 sqrt(ln(1 + V²)))
    const s = Math.sqrt(Math.log(1 + 0.16));
    expect(q.characteristic / q.mean).toBeCloseTo(Math.exp(-1.6448536 * s) / Math.sqrt(1.16), 6);
    expect(q.design).toBeLessThan(q.characteristic);
    expect(q.effective_length_factor_design).toBeGreaterThan(q.effective_length_factor);
    expect(res.sentence).toMatch(/CoV 0\.40, that is a 5 % characteristic stiffness of at least/);
    expect(res.sentence).toMatch(/K_d = \d\.\d\d there, the K to use with the other design values of the same method/);
    expect(res.sentence).not.toMatch(/may use/);
    expect(res.sentence).not.toMatch(/—/);
  });

  it('the standard α reading of EN 1990 Annex C is chosen by an option and printed', async () => {
    const t = await runCli(['restraint', 'scenarios/sway-canopy-post.yaml', '--json', '--design-alpha', 'standard']);
    expect(t.status, t.stderr).toBe(0);
    const q = JSON.parse(t.stdout).restraint.requirement.bottom;
    // EN 1990 Annex C, C.7 (from memory): α = 0.8 for the leading resistance variable
    expect(q.alpha).toBe(0.8);
    expect(JSON.parse(t.stdout).restraint.sentence).toMatch(/standard α = 0\.8/);
  });

  it('refuses an unknown --method with exit 2', async () => {
    const t = await runCli(['restraint', 'scenarios/sway-canopy-post.yaml', '--method', 'mc']);
    expect(t.status).toBe(2);
    expect(t.stderr).toMatch(/--method/);
  });

  it('the restraint charts of both demos draw no text over other text', async () => {
    const braced = join(dir, 'braced');
    const b = await runCli(['restraint', 'scenarios/braced-base-plate.yaml', '--out', braced]);
    expect(b.status, b.stderr).toBe(0);
    for (const [folder, charts] of [[out, ['restraint-curve', 'restraint-cov']], [braced, ['restraint-curve', 'restraint-contour', 'restraint-cov']]] as const) {
      for (const c of charts) {
        const svg = readFileSync(join(folder, 'charts', `${c}.svg`), 'utf8');
        expect(overlappingTexts(svg), `${folder} ${c}`).toEqual([]);
      }
    }
    const html = readFileSync(join(braced, 'report.html'), 'utf8');
    expect(html).not.toMatch(/may use/);
  });
});
