/**
 * Writes schema/scenario.schema.json (for editor completion) from the zod shape.
 * Run after building: `node dist/src/scenario/writeSchema.js [output path]` from the project root.
 */
import { renameSync, writeFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { scenarioJsonSchema } from './scenarioJsonSchema.js';

const target = resolve(process.argv[2] ?? 'schema/scenario.schema.json');
const temporary = `${target}.${process.pid}.tmp`;
writeFileSync(temporary, `${JSON.stringify(scenarioJsonSchema(), null, 2)}\n`, 'utf8');
renameSync(temporary, target); // a crash never leaves half a file
process.stderr.write(`wrote ${target}\n`);
