/** The JSON Schema of the scenario format, generated from the zod shape (never written by hand). */
import * as z from 'zod';
import { scenarioShape } from './scenarioShape.js';

export const SCENARIO_SCHEMA_ID = 'https://stanchion.invalid/schema/scenario-1.schema.json';

export function scenarioJsonSchema(): Record<string, unknown> {
  const generated = z.toJSONSchema(scenarioShape, { io: 'input', target: 'draft-2020-12', reused: 'ref' }) as Record<string, unknown>;
  return {
    $schema: generated['$schema'],
    $id: SCENARIO_SCHEMA_ID,
    title: 'stanchion scenario (format 1)',
    description:
      'A column with uncertain end restraint. Quantities are strings of a number and a unit (4.2 m, 200 GPa, 2.5 MN m/rad); any value may be a random variable {dist: ...}.',
    ...Object.fromEntries(Object.entries(generated).filter(([k]) => k !== '$schema')),
  };
}
