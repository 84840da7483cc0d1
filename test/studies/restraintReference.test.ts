/**
 * Without survived loads the restraint study is the unconditional one, number for number:
 * test/reference/restraint-braced-base-plate.json is the output of
 * `stanchion restraint scenarios/braced-base-plate.yaml --json` recorded before the study could
 * condition on survived loads (same code path, same seed). Check: a regression against recorded output
 * (common practice); the reference values themselves are checked elsewhere.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { runCli } from '../cli/runCli.js';

const reference = JSON.parse(readFileSync('test/reference/restraint-braced-base-plate.json', 'utf8')).restraint;

describe('the restraint study of a scenario without survived loads', () => {
  it('keeps every number of the recorded output and says it is not conditioned', async () => {
    const run = await runCli(['restraint', 'scenarios/braced-base-plate.yaml', '--json']);
    expect(run.status, run.stderr).toBe(0);
    const r = JSON.parse(run.stdout).restraint;
    expect(r.conditioned_on_survived_loads).toBe(false);
    expect(r.survived_loads).toBeUndefined();
    for (const key of Object.keys(reference)) expect(r[key], key).toEqual(reference[key]);
    // bit for bit, not just to toEqual's tolerance of none: the key numbers as text
    expect(JSON.stringify(r.required)).toBe(JSON.stringify(reference.required));
    expect(JSON.stringify(r.checks)).toBe(JSON.stringify(reference.checks));
    expect(JSON.stringify(r.curve)).toBe(JSON.stringify(reference.curve));
    expect(JSON.stringify(r.maps)).toBe(JSON.stringify(reference.maps));
    expect(r.sentence).toBe(reference.sentence);
  });
});
