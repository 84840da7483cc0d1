/**
 * Worker threads and dynamic imports need JavaScript. When code runs from TypeScript sources
 * (under vitest), a `.ts` module is mapped to its compiled twin: tsc's outDir is `dist` with
 * rootDir the project root (the folder holding tsconfig.json), so
 * `<root>/src/studies/x.ts` → `<root>/dist/src/studies/x.js`.
 */
import { existsSync } from 'node:fs';
import { dirname, join, relative } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

function projectRoot(file: string): string {
  for (let dir = dirname(file); ; dir = dirname(dir)) {
    if (existsSync(join(dir, 'tsconfig.json'))) return dir;
    if (dirname(dir) === dir) throw new Error(`no tsconfig.json above ${file}`);
  }
}

/** An absolute path or file URL → file URL of the .js module to load. */
export function compiledTwin(moduleRef: string): URL {
  const file = moduleRef.startsWith('file:') ? fileURLToPath(moduleRef) : moduleRef;
  if (!file.endsWith('.ts')) return pathToFileURL(file);
  const root = projectRoot(file);
  const twin = join(root, 'dist', relative(root, file)).replace(/\.ts$/, '.js');
  if (!existsSync(twin)) throw new Error(`compiled module ${twin} not found: build first (npm run build)`);
  return pathToFileURL(twin);
}
