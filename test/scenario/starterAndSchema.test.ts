import { readFileSync } from 'node:fs';
import { describe, expect, test } from 'vitest';
import { loadScenario } from '../../src/scenario/loadScenario.js';
import { scenarioJsonSchema } from '../../src/scenario/scenarioJsonSchema.js';
import { starterScenario } from '../../src/scenario/starterScenario.js';
import { randomVariables } from '../../src/scenario/variables.js';

describe('starter scenario', () => {
  test.each(['braced', 'sway'] as const)('%s: accepted unchanged, every top-level key explained', (frame) => {
    const text = starterScenario(frame);
    const s = loadScenario(text, `starter-${frame}.yaml`);
    expect(s.column.frame).toBe(frame);
    // common practice: 3.6 m written as a length is 3.6 m in SI
    expect(s.column.length).toBe(3.6);
    expect(randomVariables(s).length).toBeGreaterThan(5);
    expect(text.match(/#/g)!.length).toBeGreaterThan(30);
    for (const key of ['stanchion', 'title', 'column', 'loads', 'model_factor', 'strength', 'reference_period', 'target', 'correlation', 'analysis', 'display_units']) {
      expect(text).toMatch(new RegExp(`^${key}:.*#|^# .*\\n${key}:|^${key}:`, 'm'));
    }
  });
  test('sway starter has a lateral spring', () => {
    expect(loadScenario(starterScenario('sway'), 's.yaml').column.ends.lateral?.kind).toBe('random');
  });
});

describe('JSON Schema generated from the validator', () => {
  const schema = scenarioJsonSchema() as {
    properties: Record<string, { properties?: Record<string, unknown> }>;
    required: string[];
    additionalProperties: boolean;
  };
  test('names every top-level key and refuses others', () => {
    expect(Object.keys(schema.properties).sort()).toEqual(
      ['$schema', 'analysis', 'column', 'correlation', 'display_units', 'evidence', 'loads', 'model_factor', 'reference_period', 'stanchion', 'strength', 'target', 'target_beta', 'target_source', 'test_plans', 'title'].sort(),
    );
    expect(schema.required.sort()).toEqual(['column', 'loads', 'stanchion', 'strength']);
    expect(schema.additionalProperties).toBe(false);
  });
  test('quantities are strings with a pattern and a description', () => {
    const length = schema.properties['column']!.properties!['length'] as { type: string; pattern: string; description: string };
    expect(length.type).toBe('string');
    expect(new RegExp(length.pattern).test('4.2 m')).toBe(true);
    expect(new RegExp(length.pattern).test('NaN m')).toBe(false);
    expect(length.description).toMatch(/length/);
  });
  test('the committed schema file is the generated one', () => {
    const committed = JSON.parse(readFileSync(new URL('../../schema/scenario.schema.json', import.meta.url), 'utf8')) as unknown;
    expect(committed).toEqual(JSON.parse(JSON.stringify(scenarioJsonSchema())));
  });
});
