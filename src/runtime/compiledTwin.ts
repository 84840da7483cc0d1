/**
 * Where the compiled .js of a module lives. Running from dist/ the twin is a sibling; under
 * vitest import.meta.url points at src/...ts, whose compiled twin is dist/src/...js
 * (tsc outDir 'dist', rootDir '.'; `npm test` builds before it tests).
 */
import { existsSync } from 'node:fs';
import { dirname, join, relative } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

/** URL of the compiled `fileName` (e.g. 'samplingWorker.js') next to the module at `moduleUrl`. */
export function compiledTwin(moduleUrl: string, fileName: string): URL {
  const here = fileURLToPath(moduleUrl);
  if (here.endsWith('.js')) return new URL(fileName, moduleUrl);
  const root = projectRoot(dirname(here));
  return pathToFileURL(join(root, 'dist', relative(root, dirname(here)), fileName));
}

/** An absolute path or file URL of a module (.ts or .js) → file URL of the .js to load. */
export function compiledModule(moduleRef: string): URL {
  const file = moduleRef.startsWith('file:') ? fileURLToPath(moduleRef) : moduleRef;
  if (!file.endsWith('.ts')) return pathToFileURL(file);
  const root = projectRoot(dirname(file));
  return requireCompiled(pathToFileURL(join(root, 'dist', relative(root, file)).replace(/\.ts$/, '.js')));
}

/** Throws a plain Error telling how to build when the compiled file is missing. */
export function requireCompiled(url: URL): URL {
  if (!existsSync(fileURLToPath(url))) {
    throw new Error(`compiled file ${fileURLToPath(url)} is missing: run \`npm run build\` first`);
  }
  return url;
}

/** An absolute path or a file URL → a URL string that import() accepts. */
export function importableUrl(pathOrUrl: string): string {
  return pathOrUrl.startsWith('file:') ? pathOrUrl : pathToFileURL(pathOrUrl).href;
}

function projectRoot(start: string): string {
  let dir = start;
  for (;;) {
    if (existsSync(join(dir, 'tsconfig.json'))) return dir;
    const up = dirname(dir);
    if (up === dir) throw new Error(`no tsconfig.json above ${start}`);
    dir = up;
  }
}
