import { availableParallelism } from 'node:os';
import { defineConfig } from 'vitest/config';
import { BaseSequencer, type TestSpecification } from 'vitest/node';

/**
 * The files that take tens of seconds each (measured on 2 cores). They start first so that the
 * short files fill the other workers around them, instead of one long file running alone at the
 * end. On a clean clone Vitest has no recorded durations and would order by file size, which puts
 * the longest (small files that run the CLI or a generator) late.
 */
const LONG_FILES_FIRST = [
  'test/scenario/validScenarios.test.ts',
  'test/cli/interrupt.test.ts',
  'test/cli/twoAxesCli.test.ts',
  'test/scenario/fuzz.test.ts',
  'test/cli/outputSafety.test.ts',
  'test/cli/sweepCommand.test.ts',
  'test/cli/assessCli.test.ts',
];

class LongFilesFirst extends BaseSequencer {
  override async sort(files: TestSpecification[]): Promise<TestSpecification[]> {
    const sorted = await super.sort(files);
    const rank = (spec: TestSpecification): number => {
      const i = LONG_FILES_FIRST.findIndex((name) => spec.moduleId.replaceAll('\\', '/').endsWith(name));
      return i < 0 ? LONG_FILES_FIRST.length : i;
    };
    // Array.prototype.sort is stable: the rest keep Vitest's own order
    return sorted.sort((a, b) => rank(a) - rank(b));
  }
}

export default defineConfig({
  test: {
    include: ['test/**/*.test.ts'],
    testTimeout: 60_000,
    hookTimeout: 120_000,
    pool: 'forks',
    // Vitest's default leaves one core idle in `run` mode, which on a 2-core machine means one
    // test file at a time: every core runs a file.
    maxWorkers: availableParallelism(),
    sequence: { sequencer: LongFilesFirst },
  },
});
